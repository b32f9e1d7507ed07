package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.ObjectReader;
import com.networknt.schema.Error;
import com.networknt.schema.Schema;
import com.networknt.schema.SchemaRegistry;
import com.networknt.schema.SpecificationVersion;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.TreeSet;
import java.util.stream.Stream;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.units.SoftwareVersion;
import picocli.CommandLine;

/**
 * Every command with {@code --json} on the demo archive (copied) and the simulator: standard
 * output is exactly one JSON document (RFC 8259, parsed whole by Jackson with trailing tokens
 * refused) or, for {@code monitor}, JSON Lines; each document validates against its command's
 * schema file (JSON Schema 2020-12, checked by the networknt validator) and names its schema and
 * the software version. The text for a person is on standard error.
 */
class JsonEveryCommandTest {
  static final Path PROJECT = Path.of(System.getProperty("loadstone.projectDir", "."));
  private static final ObjectReader WHOLE = new ObjectMapper().readerFor(JsonNode.class)
      .with(DeserializationFeature.FAIL_ON_TRAILING_TOKENS);
  private static final SchemaRegistry SCHEMAS =
      SchemaRegistry.withDefaultDialect(SpecificationVersion.DRAFT_2020_12);

  @TempDir static Path tmp;
  static Path archive;
  static final Set<String> covered = new TreeSet<>();

  @BeforeAll
  static void copyTheDemoArchive() throws Exception {
    archive = tmp.resolve("runs");
    Files.createDirectories(archive);
    try (Stream<Path> s = Files.list(PROJECT.resolve("sample-runs"))) {
      for (Path p : s.filter(f -> f.toString().endsWith(".csv")
          || f.toString().endsWith(".json")).toList()) {
        Files.copy(p, archive.resolve(p.getFileName()));
      }
    }
  }

  /** Runs one command with --json; returns its one document after every check. */
  static JsonNode document(String command, String answers, String... args) throws Exception {
    CliRun r = run(command, answers, args);
    JsonNode doc = WHOLE.readValue(r.out());
    checkDocument(command, doc);
    return doc;
  }

  private static CliRun run(String command, String answers, String... args) {
    List<String> all = new ArrayList<>(List.of(command));
    all.addAll(List.of(args));
    all.add("--json");
    CliRun r = CliRun.run(answers, all.toArray(new String[0]));
    assertThat(r.exit()).as(r.toString()).isZero();
    covered.add(command);
    return r;
  }

  private static void checkDocument(String command, JsonNode doc) throws Exception {
    assertThat(doc.isObject()).as(command).isTrue();
    // the envelope every document carries
    assertThat(doc.path("schema").path("name").asText()).isEqualTo("loadstone-" + command);
    assertThat(doc.path("schema").path("version").asInt()).isEqualTo(JsonDocument.Kind.VERSION);
    assertThat(doc.path("version").asText()).isEqualTo(SoftwareVersion.get());
    List<Error> errors = schema(command).validate(doc);
    assertThat(errors).as(command + " document " + doc + " against its schema").isEmpty();
  }

  static Schema schema(String command) throws Exception {
    try (InputStream in = JsonDocument.class.getResourceAsStream(
        "schema/" + command + ".schema.json")) {
      assertThat(in).as("schema file of " + command).isNotNull();
      return SCHEMAS.getSchema(in);
    }
  }

  @Test
  void theVersionIsTheBuildsNotAPlaceholder() {
    // Maven resource filtering fills it from the project version (common practice: x.y.z[-…])
    assertThat(SoftwareVersion.get()).matches("[0-9]+\\.[0-9]+\\.[0-9]+.*");
  }

  @Test
  void portsListsTheSimulatedFrame() throws Exception {
    JsonNode d = document("ports", "");
    assertThat(d.get("ports").findValuesAsText("port")).contains("sim");
  }

  @Test
  void monitorStreamsJsonLinesEndingWithTheTotals() throws Exception {
    CliRun r = run("monitor", "", "--port", "sim", "--duration-s", "0.5");
    String[] lines = r.out().split("\n");
    assertThat(lines.length).isGreaterThan(1);
    long samples = 0;
    for (String line : lines) {
      JsonNode d = WHOLE.readValue(line);
      checkDocument("monitor", d);
      if (d.get("record").asText().equals("sample")) {
        samples++;
      }
    }
    JsonNode totals = WHOLE.readValue(lines[lines.length - 1]);
    assertThat(totals.get("record").asText()).isEqualTo("totals");
    // every sample received is shown, one line each
    assertThat(totals.get("sample_count").asLong()).isEqualTo(samples);
    assertThat(r.err()).contains("# device");
  }

  @Test
  void simulateRecordAndTheArchiveCommands() throws Exception {
    Path bytes = tmp.resolve("stream.txt");
    JsonNode sim = document("simulate", "", "--out", bytes.toString(), "--duration-s", "1",
        "--unpaced");
    // 1 s at the default 80 samples/s, plus the identity line
    assertThat(Files.readAllLines(bytes)).hasSize((int) sim.get("sample_count").asLong() + 1);

    JsonNode rec = document("record", "", "--port", "sim", "--scenario", "panel-foam",
        "--sim-speed", "50", "--specimen", "foam-json", "--group", "foam", "--archive",
        archive.toString());
    assertThat(Path.of(rec.get("csv_file").asText())).exists();
    assertThat(rec.get("analysis").get("run_id").asText()).isEqualTo(rec.get("run_id").asText());

    JsonNode runs = document("runs", "", "--archive", archive.toString());
    long sidecars;
    try (Stream<Path> s = Files.list(archive)) {
      sidecars = s.filter(f -> f.toString().endsWith(".json")).count();
    }
    assertThat(runs.get("run_count").asLong()).isEqualTo(sidecars);
    assertThat(runs.get("runs").findValuesAsText("run_id")).contains(rec.get("run_id").asText());

    String foam1 = "20261204T181011.533Z-foam-01";
    JsonNode an = document("analyze", "", foam1, "--archive", archive.toString());
    assertThat(an.get("run_id").asText()).isEqualTo(foam1);
    assertThat(an.get("sample_count").asLong())
        .isEqualTo(Files.readAllLines(archive.resolve(foam1 + ".csv")).size() - 1L);

    JsonNode cmp = document("compare", "", "--archive", archive.toString(), "--metric", "peak");
    assertThat(cmp.get("counted").size() + cmp.get("left_out").size())
        .isEqualTo(runs.get("run_count").asInt());

    Path exported = tmp.resolve("foam1.csv");
    JsonNode ex = document("export", "", foam1, "--archive", archive.toString(), "--out",
        exported.toString());
    assertThat(Files.readAllLines(exported)).hasSize(ex.get("sample_count").asInt() + 1);

    JsonNode imp = document("import", "", exported.toString(), "--map",
        "time=1,force=2,position=3", "--archive", archive.toString(), "--group", "elsewhere");
    assertThat(imp.get("sample_count").asInt()).isEqualTo(ex.get("sample_count").asInt());

    Path pdf = tmp.resolve("foam1.pdf");
    JsonNode rep = document("report", "", foam1, "--archive", archive.toString(), "--out",
        pdf.toString());
    assertThat(pdf).exists();
    assertThat(rep.get("pdf_file").asText()).isEqualTo(pdf.toString());

    Path frames = tmp.resolve("frames");
    JsonNode fr = document("frame", "", foam1, "--archive", archive.toString(), "--id", "bench",
        "--out", frames.toString());
    assertThat(Path.of(fr.get("profile_file").asText())).exists();
  }

  @Test
  void amendRetireAndConfig() throws Exception {
    String board5 = "20261204T181239.452Z-board-05";
    JsonNode am = document("amend", "", board5, "--archive", archive.toString(), "--mass-g",
        "30.5", "--reason", "weighed again");
    assertThat(am.get("amendment_count").asInt()).isEqualTo(1);
    assertThat(am.get("changes").get(0).get("field").asText()).isEqualTo("mass_g");
    JsonNode re = document("retire", "", board5, "--archive", archive.toString(), "--reason",
        "cracked before the test");
    assertThat(re.get("retired").asBoolean()).isTrue();
    assertThat(re.get("amendment_count").asInt()).isEqualTo(2);
    JsonNode cfg = document("config", "");
    assertThat(cfg.get("settings").findValuesAsText("key")).contains("archive", "port");
  }

  @Test
  void calibrateThenVerifyOnTheSimulator() throws Exception {
    Path cals = tmp.resolve("cals");
    JsonNode cal = document("calibrate", "", "--points",
        PROJECT.resolve("calibration/shelf-rig-1kN-2026-12-03.points.csv").toString(),
        "--cell", "shelf-rig-1kN", "--out", cals.toString(), "--id", "json-cal");
    assertThat(cal.get("calibration_file").asText())
        .isEqualTo(cals.resolve("json-cal.json").toString());
    CliRun r = CliRun.run("\n\n", "verify", "--port", "sim", "--cal",
        cals.resolve("json-cal.json").toString(), "--mass-g", "20000", "--sim-speed", "40",
        "--json");
    // a pass (0) or a fail (1) both give the document; the prompts are on standard error
    assertThat(r.exit()).as(r.toString()).isIn(0, VerifyCommand.EXIT_FAILED);
    covered.add("verify");
    JsonNode v = WHOLE.readValue(r.out());
    checkDocument("verify", v);
    assertThat(v.get("calibration_sha256").asText())
        .isEqualTo(cal.get("calibration_sha256").asText());
    assertThat(r.err()).contains("place the check weight");
  }

  @Test
  void trackAFolderOfImages() throws Exception {
    // a dark square moving down 1 px a frame on a light ground, 12 numbered PNGs at 10 frames/s
    Path folder = Files.createDirectories(tmp.resolve("clip"));
    for (int k = 0; k < 12; k++) {
      java.awt.image.BufferedImage img = new java.awt.image.BufferedImage(80, 80,
          java.awt.image.BufferedImage.TYPE_BYTE_GRAY);
      java.awt.Graphics2D g = img.createGraphics();
      g.setColor(java.awt.Color.WHITE);
      g.fillRect(0, 0, 80, 80);
      g.setColor(java.awt.Color.BLACK);
      g.fillRect(34, 20 + k, 12, 12);
      g.setColor(java.awt.Color.GRAY);
      g.fillRect(30, 24 + k, 4, 4);
      g.dispose();
      javax.imageio.ImageIO.write(img, "png",
          folder.resolve(String.format(Locale.ROOT, "frame-%04d.png", k)).toFile());
    }
    Path table = tmp.resolve("tracked.csv");
    JsonNode tr = document("track", "", folder.toString(), "--point", "40,26", "--scale",
        "10,70 70,70 = 60 mm", "--frame-rate-hz", "10", "--out", table.toString());
    assertThat(Path.of(tr.get("table_file").asText())).isEqualTo(table).exists();
    assertThat(tr.get("frame_count").asInt()).isEqualTo(12);
    assertThat(tr.get("run_id").isNull()).isTrue();
  }

  @Test
  void everyCommandButTheWindowHasJsonAndASchema() throws Exception {
    CommandLine cl = new CommandLine(new LoadstoneCommand());
    Set<String> commands = new TreeSet<>();
    for (String name : cl.getSubcommands().keySet()) {
      if (name.equals("console") || name.equals("help") || name.equals("generate-completion")) {
        continue; // a window, the help text and a shell script: nothing to script
      }
      commands.add(name);
      assertThat(cl.getSubcommands().get(name).getCommandSpec().findOption("--json"))
          .as(name + " --json").isNotNull();
      assertThat(JsonDocument.class.getResource("schema/" + name + ".schema.json"))
          .as(name + " schema file").isNotNull();
    }
    Set<String> kinds = new TreeSet<>();
    for (JsonDocument.Kind k : JsonDocument.Kind.values()) {
      kinds.add(k.name().toLowerCase(Locale.ROOT));
    }
    assertThat(kinds).isEqualTo(commands);
  }

  @Test
  void humanTextGoesToStandardErrorWithJson() throws Exception {
    CliRun r = run("analyze", "", "20261204T181011.533Z-foam-01", "--archive",
        archive.toString());
    assertThat(r.err()).contains("peak force", "stiffness");
    assertThat(WHOLE.<JsonNode>readValue(r.out()).isObject()).isTrue();
  }

  @Test
  void aSchemaRefusesADocumentWithAFieldOutsideTheVocabulary() throws Exception {
    // the check can fail: an unknown field or a missing one is an error
    JsonNode ok = new ObjectMapper().readTree("{\"schema\":{\"name\":\"loadstone-export\","
        + "\"version\":1},\"version\":\"1.0.0\",\"run_id\":\"r\",\"sample_count\":3,"
        + "\"out_file\":\"x.csv\"}");
    assertThat(schema("export").validate(ok)).isEmpty();
    JsonNode extra = ((com.fasterxml.jackson.databind.node.ObjectNode) ok.deepCopy())
        .put("samples", 3);
    assertThat(schema("export").validate(extra)).isNotEmpty();
    JsonNode missing = ((com.fasterxml.jackson.databind.node.ObjectNode) ok.deepCopy())
        .without("sample_count");
    assertThat(schema("export").validate(missing)).isNotEmpty();
  }

  @Test
  void eachFieldNameMeansOneThingInEverySchema() throws Exception {
    // one vocabulary: a field shared by several schemas has one type wherever it appears, and
    // the names the commands used before for the same things are gone
    java.util.Map<String, Set<String>> types = new java.util.TreeMap<>();
    for (JsonDocument.Kind k : JsonDocument.Kind.values()) {
      try (InputStream in = JsonDocument.class.getResourceAsStream(k.resource())) {
        collect(new ObjectMapper().readTree(in), types);
      }
    }
    for (String name : List.of("sample_count", "run_id", "notes", "calibration_sha256",
        "dropped", "checksum_errors", "specimen", "group")) {
      assertThat(types.get(name)).as(name).hasSize(1);
    }
    assertThat(types).doesNotContainKeys("samples", "rows", "content_sha256", "note",
        "break_drop_pct", "csv", "json");
  }

  private static void collect(JsonNode node, java.util.Map<String, Set<String>> types) {
    JsonNode props = node.get("properties");
    if (props != null) {
      props.fields().forEachRemaining(e -> {
        // the base type; a field may be null where the figure does not apply
        String t = e.getValue().path("type").toString().replace(",\"null\"", "")
            .replace("[", "").replace("]", "");
        types.computeIfAbsent(e.getKey(), x -> new TreeSet<>()).add(t);
      });
    }
    node.elements().forEachRemaining(c -> collect(c, types));
  }

  @AfterAll
  static void everyCommandWasRun() {
    Set<String> kinds = new TreeSet<>();
    for (JsonDocument.Kind k : JsonDocument.Kind.values()) {
      kinds.add(k.name().toLowerCase(Locale.ROOT));
    }
    assertThat(covered).as("commands run with --json").isEqualTo(kinds);
  }
}
