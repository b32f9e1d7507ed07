package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.archive.TestRuns;
import org.loadstone.report.CsvExport;

class RunCommandsTest {
  @TempDir Path dir;
  private String out;
  private String err;

  private int run(String... args) {
    PrintStream so = System.out;
    PrintStream se = System.err;
    ByteArrayOutputStream o = new ByteArrayOutputStream();
    ByteArrayOutputStream e = new ByteArrayOutputStream();
    try {
      System.setOut(new PrintStream(o, true, StandardCharsets.UTF_8));
      System.setErr(new PrintStream(e, true, StandardCharsets.UTF_8));
      return LoadstoneCommand.run(args);
    } finally {
      System.setOut(so);
      System.setErr(se);
      out = o.toString(StandardCharsets.UTF_8);
      err = e.toString(StandardCharsets.UTF_8);
    }
  }

  private JsonNode lastJson() throws IOException {
    List<String> lines = out.lines().toList();
    return new ObjectMapper().readTree(lines.get(lines.size() - 1));
  }

  private Path runCsv() {
    Path p = dir.resolve("FO-9.csv");
    CsvExport.write(TestRuns.bend(60, 460), p, ',', '.');
    return p;
  }

  @Test
  void analyzePrintsATableAndJson() throws IOException {
    Path csv = runCsv();
    assertThat(run("analyze", csv.toString(), "--json")).isEqualTo(0);
    assertThat(err).contains("peak force").contains("stiffness"); // the table, beside the JSON
    JsonNode j = lastJson();
    assertThat(j.get("peak_N").asDouble()).isEqualTo(460.0);
    // the synthetic curve rises at 60 N/mm by construction
    assertThat(j.get("stiffness_N_per_mm").asDouble()).isCloseTo(60.0, within(0.3));
    assertThat(j.get("break_index").isNull()).isFalse();
    assertThat(j.get("flexural_modulus_MPa").isNull()).isTrue(); // a bare CSV has no geometry

    assertThat(run("analyze", csv.toString(), "--stiffness-from-n", "50",
        "--stiffness-to-n", "200", "--json")).isEqualTo(0);
    assertThat(lastJson().get("stiffness_N_per_mm").asDouble()).isCloseTo(60.0, within(1e-6));
  }

  @Test
  void analyzeRefusesHalfABoundAndAMissingRun() {
    assertThat(run("analyze", runCsv().toString(), "--stiffness-from-n", "50"))
        .isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(err).contains("give both or neither");
    assertThat(run("analyze", dir.resolve("nope.csv").toString()))
        .isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(err).contains("no run").contains("nope.csv");
  }

  @Test
  void importWritesAPlainCsvThatAnalyzeReads() throws IOException {
    // 0,2 kN = 200 N, 1500 ms = 1.5 s (hand-computed)
    Path src = dir.resolve("other.csv");
    Files.writeString(src, "Zeit [ms];Kraft [kN];Weg [mm]\n0;0,0;0,0\n500;0,1;0,5\n"
        + "1000;0,2;1,0\n1500;0,05;1,5\n");
    Path plain = dir.resolve("plain.csv");
    assertThat(run("import", src.toString(), "--map", "time=Zeit [ms],force=2,position=Weg [mm]",
        "--decimal", ",", "--out", plain.toString(), "--json")).isEqualTo(0);
    JsonNode j = lastJson();
    assertThat(j.get("sample_count").asInt()).isEqualTo(4);
    assertThat(j.get("force_range_N").get(1).asDouble()).isEqualTo(200.0);
    assertThat(j.get("time_range_s").get(1).asDouble()).isEqualTo(1.5);
    assertThat(run("analyze", plain.toString(), "--json")).isEqualTo(0);
    assertThat(lastJson().get("peak_N").asDouble()).isEqualTo(200.0);
    assertThat(lastJson().get("peak_time_s").asDouble()).isEqualTo(1.0);

    assertThat(run("import", src.toString(), "--map", "time=1,force=2", "--force-unit", "kips"))
        .isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(err).contains("unknown force unit 'kips'");
    // the core says what would fix it; the command line adds its option
    Path out2 = dir.resolve("plain2.csv");
    assertThat(run("import", src.toString(), "--map", "time=Zeit [ms],force=2,position=Weg [mm]",
        "--out", out2.toString())).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(err).contains("'0,0' is not a number")
        .contains("read it with a decimal comma. (--decimal ',')");
  }

  @Test
  void exportAndReport() throws IOException {
    Path csv = runCsv();
    Path x = dir.resolve("sheet.csv");
    assertThat(run("export", csv.toString(), "--out", x.toString(), "--delimiter", ";",
        "--decimal", ",")).isEqualTo(0);
    assertThat(Files.readAllLines(x).get(0)).startsWith("time_s;force_N;");
    assertThat(run("export", csv.toString(), "--out", dir.resolve("bad.csv").toString(),
        "--delimiter", ",", "--decimal", ",")).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    Path pdf = dir.resolve("r.pdf");
    assertThat(run("report", csv.toString(), "--out", pdf.toString())).isEqualTo(0);
    assertThat(new String(Files.readAllBytes(pdf), 0, 5, StandardCharsets.ISO_8859_1))
        .isEqualTo("%PDF-");
    assertThat(run("report", csv.toString(), "--out", pdf.toString()))
        .isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(err).contains("already exists");
  }
}
