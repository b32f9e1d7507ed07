package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Function;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import picocli.CommandLine;

/**
 * Bad command lines and bad files, run through the real entry point ({@link
 * LoadstoneCommand#run}): each ends with exit code 2 (bad input, never 70, the internal-error
 * code) and a message that names the thing and what to do, with no stack trace and no library
 * class or setting name. The cases are those found by hand (issue 14, item 6) plus every decimal
 * option of every command given a value that is not a finite number, and every ranged option
 * given a value outside its range.
 */
class BadCommandLinesTest {
  private static final Path CALIBRATION = Path.of("calibration/shelf-rig-1kN-2026-12-03.json");
  private static final Path POINTS = Path.of("calibration/shelf-rig-1kN-2026-12-03.points.csv");
  private static final String RUN = "20261204T181011.533Z-foam-01";

  @TempDir static Path dir;
  static Path arc;

  @BeforeAll
  static void files() throws Exception {
    arc = Files.createDirectories(dir.resolve("arc"));
    for (String ext : List.of(".csv", ".json")) {
      Files.copy(Path.of("sample-runs", RUN + ext), arc.resolve(RUN + ext));
    }
    Files.writeString(dir.resolve("null-cal.json"), "null\n");
    Files.writeString(dir.resolve("comma-cal.json"), "{\"id\": \"x\",}\n");
    Files.writeString(dir.resolve("import-1e400.csv"), "time,force\n0,1\n0.1,1e400\n0.2,3\n");
    List<String> pts = new ArrayList<>(Files.readAllLines(POINTS));
    String[] row = pts.get(3).split(",", -1);
    row[1] = "1e308";
    pts.set(3, String.join(",", row));
    Files.write(dir.resolve("points-1e308.csv"), pts);
    Files.writeString(dir.resolve("table-quote.csv"), "time,pos\n0,0\n\"0.1,1\n0.2,2\n");
    Files.writeString(dir.resolve("table-ok.csv"), "time,pos\n0,0\n0.1,1\n0.2,2\n");
    Files.write(dir.resolve("latin1.csv"),
        "time,Kraft in N\n0,1\n0.1,2\n".replace("a", "ä").getBytes(StandardCharsets.ISO_8859_1));
    Files.writeString(dir.resolve("big-cell.csv"),
        "time,force\n0,1\n0.1," + "x".repeat(10_000_000) + "\n");
    Files.writeString(dir.resolve("a-regular-file"), "not a port\n");
  }

  /** One bad command line: what it is, the arguments, and words the message must contain. */
  record Case(String what, Function<Path, String[]> args, List<String> says) {
    @Override
    public String toString() {
      return what;
    }
  }

  private static Case c(String what, Function<Path, String[]> args, String... says) {
    return new Case(what, args, List.of(says));
  }

  static Stream<Case> cases() {
    return Stream.of(
        c("calibration file holding null", d -> a("analyze", "--archive", arc, RUN, "--cal",
            d.resolve("null-cal.json")), "null-cal.json", "correct the file"),
        c("calibration file with a trailing comma", d -> a("analyze", "--archive", arc, RUN,
            "--cal", d.resolve("comma-cal.json")), "comma-cal.json", "line 1"),
        c("import cell 1e400", d -> a("import", d.resolve("import-1e400.csv"), "--map",
            "time=time,force=force", "--specimen", "x", "--archive", d.resolve("a1")),
            "'1e400'", "line 3"),
        c("points counts 1e308", d -> a("calibrate", "--points", d.resolve("points-1e308.csv"),
            "--cell", "c1", "--out", d.resolve("cal1")), "'1e308'", "line 4", "counts"),
        c("position table with an unterminated quote", d -> a("analyze", "--archive", arc, RUN,
            "--position-table", d.resolve("table-quote.csv")), "table-quote.csv", "quote"),
        c("--baud 0", d -> a("monitor", "--port", "sim", "--baud", "0", "--duration-s", "1"),
            "--baud", "300"),
        c("--baud negative", d -> a("monitor", "--port", "sim", "--baud", "-5", "--duration-s",
            "1"), "--baud", "-5"),
        c("group name with a line break", d -> a("report", "--archive", arc, "--group",
            "fo\nam", "--out", d.resolve("g.pdf")), "'fo\\nam'", "the groups there are"),
        c("import column number past the integers", d -> a("import",
            d.resolve("import-1e400.csv"), "--map", "time=9999999999,force=2", "--specimen", "x",
            "--archive", d.resolve("a5")), "9999999999", "does not exist"),
        c("position-table column number past the integers", d -> a("analyze", "--archive", arc,
            RUN, "--position-table", d.resolve("table-ok.csv"), "--table-map",
            "time=99999999999,position=2"), "99999999999"),
        c("import not in UTF-8", d -> a("import", d.resolve("latin1.csv"), "--map",
            "time=1,force=2", "--specimen", "x", "--archive", d.resolve("a2")), "UTF-8",
            "latin1.csv"),
        c("10 MB bad cell", d -> a("import", d.resolve("big-cell.csv"), "--map",
            "time=time,force=force", "--specimen", "x", "--archive", d.resolve("a3")),
            "10000000 characters"),
        c("--zero-samples 0", d -> a("record", "--port", "sim", "--zero-samples", "0",
            "--archive", d.resolve("a4"), "--specimen", "s"), "--zero-samples"),
        c("--zero-samples -5", d -> a("record", "--port", "sim", "--zero-samples", "-5",
            "--archive", d.resolve("a4"), "--specimen", "s"), "--zero-samples"),
        c("simulate --duration-s Infinity", d -> a("simulate", "--duration-s", "Infinity",
            "--unpaced", "--out", d.resolve("s1.txt")), "--duration-s", "finite"),
        c("simulate --duration-s 1e400", d -> a("simulate", "--duration-s", "1e400", "--unpaced",
            "--out", d.resolve("s2.txt")), "--duration-s", "finite"),
        c("simulate --duration-s 0", d -> a("simulate", "--duration-s", "0", "--unpaced", "--out",
            d.resolve("s3.txt")), "--duration-s", "above 0"),
        c("an ordinary file as --port", d -> a("monitor", "--port",
            d.resolve("a-regular-file").toAbsolutePath(), "--duration-s", "1"),
            "not a serial port", "--port"),
        c("a folder as --port", d -> a("monitor", "--port", d.toAbsolutePath(), "--duration-s",
            "1"), "not a serial port"),
        c("a decimal comma in an option", d -> a("compare", "--archive", arc, "--target-pct",
            "12,5"), "--target-pct", "not a number", "a point, not a comma"),
        c("compare --target-pct NaN", d -> a("compare", "--archive", arc, "--target-pct",
            "NaN"), "--target-pct", "finite"));
  }

  private static String[] a(Object... parts) {
    return Stream.of(parts).map(String::valueOf).toArray(String[]::new);
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("cases")
  void refusedWithAMessageNotAStackTrace(Case c) {
    CliRun r = CliRun.run("", c.args().apply(dir));
    assertThat(r.exit()).as(r.toString()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    String message = message(r.err());
    for (String s : c.says()) {
      assertThat(message).as(r.toString()).contains(s);
    }
    plain(r);
    assertThat(message).as("not a 'check the cable' for something that is no cable")
        .doesNotContain("check the cable");
  }

  /** Every decimal option of every command refuses what is not a finite number while parsing. */
  @Test
  void everyDecimalOptionRefusesWhatIsNotAFiniteNumber() {
    CommandLine cl = new CommandLine(new LoadstoneCommand());
    int tried = 0;
    for (CommandLine sub : cl.getSubcommands().values()) {
      for (CommandLine.Model.OptionSpec o : sub.getCommandSpec().options()) {
        if (o.type() != double.class && o.type() != Double.class) {
          continue;
        }
        for (String bad : List.of("NaN", "1e400")) {
          CliRun r = CliRun.run("", sub.getCommandName(), o.longestName(), bad);
          assertThat(r.exit()).as(sub.getCommandName() + " " + o.longestName() + " " + bad + "\n"
              + r).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
          assertThat(message(r.err())).contains(o.longestName()).contains("number");
          plain(r);
          tried++;
        }
      }
    }
    assertThat(tried).as("decimal options tried").isGreaterThan(100);
  }

  /** Every option with a range refuses a value just outside it, before anything runs. */
  @Test
  void everyRangedOptionRefusesAValueOutsideItsRange() {
    CommandLine cl = new CommandLine(new LoadstoneCommand());
    List<String> ranged = OptionRules.rangedOptions(cl);
    assertThat(ranged).as("every range in the table belongs to some command")
        .extracting(s -> s.split(" ")[1]).containsAll(OptionRules.RANGES.keySet().stream()
            .map(k -> k.substring(k.lastIndexOf(' ') + 1)).toList());
    for (String co : ranged) {
      String[] parts = co.split(" ");
      CommandLine.Model.OptionSpec o = cl.getSubcommands().get(parts[0]).getCommandSpec()
          .findOption(parts[1]);
      OptionRules.Range range = OptionRules.RANGES.getOrDefault(co,
          OptionRules.RANGES.get(parts[1]));
      boolean whole = o.type() == int.class || o.type() == Integer.class;
      double below = range.minOpen() ? range.min() : range.min() - 1;
      double above = whole ? range.max() + 1 : range.max() * 1.5;
      for (double bad : new double[] {below, above}) {
        String text = whole ? String.valueOf((long) bad) : String.valueOf(bad);
        List<String> line = new ArrayList<>(required(cl.getSubcommands().get(parts[0])));
        line.add(0, parts[0]);
        line.add(parts[1]);
        line.add(text);
        CliRun r = CliRun.run("", line.toArray(String[]::new));
        assertThat(r.exit()).as(co + " " + text + "\n" + r)
            .isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
        assertThat(message(r.err())).contains(parts[1]).contains("out of range");
        plain(r);
      }
    }
  }

  /**
   * @return placeholder values for a command's required options and parameters, so that the
   *     line parses and the range check is reached
   */
  private static List<String> required(CommandLine sub) {
    List<String> out = new ArrayList<>();
    for (CommandLine.Model.OptionSpec o : sub.getCommandSpec().requiredArgs().stream()
        .filter(CommandLine.Model.OptionSpec.class::isInstance)
        .map(CommandLine.Model.OptionSpec.class::cast).toList()) {
      out.add(o.longestName());
      out.add("1");
    }
    for (CommandLine.Model.PositionalParamSpec p :
        sub.getCommandSpec().positionalParameters()) {
      if (p.required()) {
        out.add("1");
      }
    }
    return out;
  }

  /** A specimen and group name holding a line break still gives a run report. */
  @Test
  void aRunWhoseNamesHoldLineBreaksIsReported() throws Exception {
    Path a = dir.resolve("arc-names");
    Files.writeString(dir.resolve("ok.csv"), "time,force\n0,1\n0.1,5\n0.2,9\n0.3,2\n");
    CliRun imp = CliRun.run("", "import", dir.resolve("ok.csv").toString(), "--map",
        "time=time,force=force", "--specimen", "pan\nel", "--group", "fo\nam", "--archive",
        a.toString(), "--json");
    assertThat(imp.exit()).as(imp.toString()).isZero();
    String id = Path.of(imp.lastJson().get("csv_file").asText()).getFileName().toString()
        .replaceFirst("\\.csv$", "");
    Path pdf = dir.resolve("names.pdf");
    CliRun r = CliRun.run("", "report", "--archive", a.toString(), id, "--out", pdf.toString());
    assertThat(r.exit()).as(r.toString()).isZero();
    assertThat(Files.size(pdf)).isGreaterThan(1000);
  }

  /** A byte-order mark before UTF-8 text is accepted by every reader alike. */
  @Test
  void aByteOrderMarkIsAcceptedByEveryReader() throws Exception {
    byte[] bom = {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF};
    Path runCsv = withBom(arc.resolve(RUN + ".csv"), dir.resolve("bom-run.csv"), bom);
    Path points = withBom(POINTS, dir.resolve("bom-points.csv"), bom);
    Path cal = withBom(CALIBRATION, dir.resolve("bom-cal.json"), bom);
    Path table = dir.resolve("bom-table.csv");
    Files.write(table, concat(bom, "time,pos\n0,0\n10,1\n20,2\n30,3\n".getBytes(
        StandardCharsets.UTF_8)));
    Path imp = dir.resolve("bom-import.csv");
    Files.write(imp, concat(bom, "time,force\n0,1\n0.1,5\n0.2,9\n0.3,2\n".getBytes(
        StandardCharsets.UTF_8)));
    Path bomArc = Files.createDirectories(dir.resolve("bom-archive"));
    Files.copy(arc.resolve(RUN + ".csv"), bomArc.resolve(RUN + ".csv"));
    withBom(arc.resolve(RUN + ".json"), bomArc.resolve(RUN + ".json"), bom);
    Path frame = dir.resolve("bom-frame.json");
    Files.write(frame, concat(bom, ("{\"id\": \"bench-press\", \"description\": \"\", "
        + "\"frame_stiffness_N_per_mm\": 48500.0, \"measured_from_run\": \"r\", "
        + "\"measured_at\": \"2026-12-03T22:10:00Z\"}\n").getBytes(StandardCharsets.UTF_8)));
    List<String[]> lines = List.of(
        a("analyze", "--archive", bomArc, RUN, "--frame", frame),
        a("analyze", runCsv),
        a("calibrate", "--points", points, "--cell", "c1", "--out", dir.resolve("bom-cal-out")),
        a("analyze", "--archive", arc, RUN, "--cal", cal),
        a("analyze", "--archive", arc, RUN, "--position-table", table, "--table-offset-s",
            "0"),
        a("import", imp, "--map", "time=time,force=force", "--specimen", "b", "--archive",
            dir.resolve("bom-arc")));
    for (String[] line : lines) {
      CliRun r = CliRun.run("", line);
      assertThat(r.exit()).as(String.join(" ", line) + "\n" + r).isZero();
    }
  }

  private static Path withBom(Path from, Path to, byte[] bom) throws Exception {
    return Files.write(to, concat(bom, Files.readAllBytes(from)));
  }

  private static byte[] concat(byte[] a, byte[] b) {
    byte[] out = new byte[a.length + b.length];
    System.arraycopy(a, 0, out, 0, a.length);
    System.arraycopy(b, 0, out, a.length, b.length);
    return out;
  }

  /** @return the error output before picocli's usage text, if any */
  static String message(String err) {
    int usage = err.indexOf("\nUsage:");
    return usage < 0 ? err : err.substring(0, usage);
  }

  /** No stack trace, no library class, setting or decoder words, and nothing huge. */
  static void plain(CliRun r) {
    String m = message(r.err());
    assertThat(r.exit()).as(r.toString()).isNotEqualTo(LoadstoneCommand.EXIT_INTERNAL);
    assertThat(m).as(r.toString()).doesNotContain("\tat ", "internal error", "Exception",
        "org.apache", "com.fasterxml", "java.", "Input length", "Feature", "ALLOW_",
        "Unexpected character", "JsonToken");
    assertThat(m.length()).as("message length").isLessThan(2000);
  }
}
