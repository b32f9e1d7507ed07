package org.loadstone.archive;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.units.LoadstoneException;

class RunRoundTripTest {
  @TempDir Path tmp;

  static void assertSameData(RunData a, RunData b) {
    assertThat(b.time_s()).containsExactly(a.time_s());
    assertThat(b.force_N()).containsExactly(a.force_N());
    assertThat(b.rawCounts()).containsExactly(a.rawCounts());
    assertThat(b.seq()).containsExactly(a.seq());
    assertThat(b.hasPosition()).isEqualTo(a.hasPosition());
    if (a.hasPosition()) {
      assertThat(b.position_mm()).containsExactly(a.position_mm());
      assertThat(b.rawPosition()).containsExactly(a.rawPosition());
    }
  }

  @Test
  void randomRunsReadBackBitForBit() {
    // seed fixed so a failure can be replayed; Double.toString/parseDouble round-trip exactly
    // (Java SE API: Double.toString gives the shortest decimal that uniquely distinguishes)
    long seed = 20261202L;
    for (int i = 0; i < 12; i++) {
      RunData d = RunFixtures.randomData(seed + i, 3 + i * 137, i % 3 != 0);
      RunMetadata m = RunFixtures.fullMetadata("rt-" + i);
      RunWriter.write(tmp, m, d);
      for (Path via : List.of(tmp.resolve("rt-" + i + ".csv"), tmp.resolve("rt-" + i + ".json"),
          tmp.resolve("rt-" + i))) {
        Run r = RunReader.read(via);
        assertThat(r.metadata()).as("seed %d", seed + i).isEqualTo(m);
        assertSameData(d, r.data());
        assertThat(r.csv()).isEqualTo(tmp.resolve("rt-" + i + ".csv"));
      }
    }
  }

  @Test
  void numbersDoNotFollowTheDefaultLocale() throws Exception {
    java.util.Locale before = java.util.Locale.getDefault();
    try {
      java.util.Locale.setDefault(java.util.Locale.GERMANY); // decimal comma
      RunData d = new RunData(new double[] {0.0, 0.0125}, new double[] {1234.5, -0.5},
          new double[] {0.25, 0.5}, new int[] {1, 2}, new int[] {100, 200}, new int[] {0, 1});
      RunWriter.write(tmp, RunFixtures.startMetadata("rt-de", false), d);
      assertThat(Files.readAllLines(tmp.resolve("rt-de.csv")))
          .containsExactly(RunCsv.HEADER_TEXT, "0.0,1234.5,0.25,1,100,0",
              "0.0125,-0.5,0.5,2,200,1");
      assertThat(Files.readString(tmp.resolve("rt-de.json"))).contains("\"sample_rate_hz\" : 1000.0")
          .contains("\"zero_offset_counts\" : 812.0");
      assertSameData(d, RunReader.read(tmp.resolve("rt-de")).data());
    } finally {
      java.util.Locale.setDefault(before);
    }
  }

  @Test
  void minimalMetadataRoundTripsWithNullsAndDefaults() {
    RunMetadata m = RunFixtures.startMetadata("rt-min", false);
    RunWriter.write(tmp, m, RunFixtures.randomData(1, 0, false));
    Run r = RunReader.read(tmp.resolve("rt-min"));
    assertThat(r.metadata()).isEqualTo(m);
    assertThat(r.data().size()).isZero();
  }

  @Test
  void sidecarUsesTheDocumentedSnakeCaseNamesAndKeepsUnknownFields() throws Exception {
    RunWriter.write(tmp, RunFixtures.fullMetadata("rt-json"), RunFixtures.randomData(2, 5, true));
    JsonNode j = new ObjectMapper().readTree(tmp.resolve("rt-json.json").toFile());
    List<String> names = new ArrayList<>();
    j.fieldNames().forEachRemaining(names::add);
    assertThat(names).containsExactly("run_id", "started_at", "specimen", "group", "tags",
        "operator", "notes", "mass_g", "geometry", "test_type", "device", "sample_rate_hz",
        "sample_rate_source", "calibration_id", "calibration_sha256", "scale", "scale_spec", "zero_offset_counts",
        "dropped", "checksum_errors", "cause", "break_index", "break_time_s",
        "peak_before_break_N", "drop_at_break_pct", "pretrigger_s", "start_threshold_N",
        "return_to_zero_N", "check_weight", "warnings", "software_version", "humidity_pct", "rig");
    assertThat(j.get("started_at").asText()).isEqualTo("2026-12-02T18:12:33.417Z");
    assertThat(j.get("cause").asText()).isEqualTo("break");
    assertThat(j.get("test_type").asText()).isEqualTo("three-point");
    assertThat(j.get("geometry").get("span_mm").asDouble()).isEqualTo(200.0);
    assertThat(j.get("geometry").get("load_span_mm").isNull()).isTrue();
    assertThat(j.get("scale_spec").get("response_coefficients").get(1).asDouble())
        .isEqualTo(8590.25);
    assertThat(j.get("scale_spec").get("valid_to_N").asDouble()).isEqualTo(500.0);
    assertThat(j.get("rig").get("fixtures").get(0).asText()).isEqualTo("rollers-10mm");
    assertThat(j.get("sample_rate_source").asText()).isEqualTo("device-clock");
    assertThat(j.get("return_to_zero_N").asDouble()).isEqualTo(-0.042);
  }

  @Test
  void returnToZeroAndRateSourceRoundTripAndOlderSidecarsReadAsUnknown() throws Exception {
    RunMetadata m = RunFixtures.fullMetadata("rt-rtz");
    RunWriter.write(tmp, m, RunFixtures.randomData(3, 4, false));
    RunMetadata back = RunReader.readMetadata(tmp.resolve("rt-rtz.json"));
    assertThat(back.returnToZero_N()).isEqualTo(-0.042);
    assertThat(back.sampleRateSource()).isEqualTo("device-clock");
    // a sidecar written before these fields existed: both read as unknown (null)
    Path old = tmp.resolve("old");
    Files.createDirectories(old);
    RunWriter.write(old, m.toBuilder().returnToZero_N(null).sampleRateSource(null).build(),
        RunFixtures.randomData(3, 4, false));
    Path json = old.resolve("rt-rtz.json");
    com.fasterxml.jackson.databind.node.ObjectNode tree =
        (com.fasterxml.jackson.databind.node.ObjectNode) new ObjectMapper().readTree(json.toFile());
    tree.remove("return_to_zero_N");
    tree.remove("sample_rate_source");
    Files.delete(json);
    Files.writeString(json, tree.toString());
    RunMetadata older = RunReader.readMetadata(json);
    assertThat(older.returnToZero_N()).isNull();
    assertThat(older.sampleRateSource()).isNull();
    assertThat(older.extra()).doesNotContainKeys("return_to_zero_N", "sample_rate_source");
  }

  @Test
  void unknownCsvColumnsAreToleratedAndOrderDoesNotMatter() throws Exception {
    RunWriter.write(tmp, RunFixtures.startMetadata("rt-cols", false),
        RunFixtures.randomData(1, 1, false));
    Files.writeString(tmp.resolve("rt-cols.csv"),
        "seq,comment,time_s,raw_counts,force_N\n7,hello,0.5,812,0.0\n8,,0.75,900,0.01\n");
    RunData d = RunReader.read(tmp.resolve("rt-cols.csv")).data();
    assertThat(d.time_s()).containsExactly(0.5, 0.75);
    assertThat(d.seq()).containsExactly(7, 8);
    assertThat(d.hasPosition()).isFalse();
  }

  private Path runWithCsv(String id, String csv) throws Exception {
    RunWriter.write(tmp, RunFixtures.startMetadata(id, false), RunFixtures.randomData(1, 1, true));
    Path p = tmp.resolve(id + ".csv");
    Files.writeString(p, csv);
    return p;
  }

  private static final String HEAD = "time_s,force_N,position_mm,raw_counts,raw_position,seq\n";

  @Test
  void nanCellIsRefusedNamingFileLineAndColumn() throws Exception {
    Path p = runWithCsv("bad1", HEAD + "0.0,1.0,,5,,1\n0.1,NaN,,6,,2\n");
    assertThatThrownBy(() -> RunReader.read(p)).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining(p.toString()).hasMessageContaining("line 3")
        .hasMessageContaining("column 2 (force_N)").hasMessageContaining("'NaN'");
  }

  @Test
  void missingCellIsRefusedNamingTheLine() throws Exception {
    Path p = runWithCsv("bad2", HEAD + "0.0,1.0,,5,,1\n0.1,2.0,,6\n");
    assertThatThrownBy(() -> RunReader.read(p)).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining(p.toString()).hasMessageContaining("line 3")
        .hasMessageContaining("4 cells where the header has 6");
    Path q = runWithCsv("bad3", HEAD + "0.0,,,5,,1\n");
    assertThatThrownBy(() -> RunReader.read(q)).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("line 2, column 2 (force_N): the cell is empty");
  }

  @Test
  void blankLinesAreSkippedAndLineNumbersStayPhysical() throws Exception {
    Path p = runWithCsv("bad10", HEAD + "0.0,1,,5,,1\n\n0.1,x,,5,,2\n");
    assertThatThrownBy(() -> RunReader.read(p)).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("line 4, column 2 (force_N)");
    Path q = runWithCsv("ok10", HEAD + "0.0,1,,5,,1\r\n\r\n0.1,2,,6,,2\r\n");
    assertThat(RunReader.read(q).data().force_N()).containsExactly(1.0, 2.0);
  }

  @Test
  void timeOutOfOrderIsRefused() throws Exception {
    Path p = runWithCsv("bad4", HEAD + "0.0,1,,5,,1\n0.2,1,,5,,2\n0.2,1,,5,,3\n");
    assertThatThrownBy(() -> RunReader.read(p)).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("line 4, column 1 (time_s)")
        .hasMessageContaining("not after the previous line's 0.2 s");
  }

  @Test
  void positionOnSomeLinesOnlyAndBadIntegersAreRefused() throws Exception {
    Path p = runWithCsv("bad5", HEAD + "0.0,1,0.5,5,200,1\n0.1,1,,5,,2\n");
    assertThatThrownBy(() -> RunReader.read(p)).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("line 3, column 3 (position_mm)");
    Path q = runWithCsv("bad6", HEAD + "0.0,1,,5.5,,1\n");
    assertThatThrownBy(() -> RunReader.read(q)).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("line 2, column 4 (raw_counts)")
        .hasMessageContaining("not a whole number");
    Path r = runWithCsv("bad7", HEAD + "0.0,1,,5,,70000\n");
    assertThatThrownBy(() -> RunReader.read(r)).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("column 6 (seq)");
    Path s = runWithCsv("bad8", "time_s,raw_counts,seq\n0,1,2\n");
    assertThatThrownBy(() -> RunReader.read(s)).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("line 1: column 'force_N' is missing");
  }

  @Test
  void badSidecarFieldsAreNamed() throws Exception {
    RunWriter.write(tmp, RunFixtures.fullMetadata("bad9"), RunFixtures.randomData(1, 3, true));
    Path j = tmp.resolve("bad9.json");
    String text = Files.readString(j);
    Files.writeString(j, text.replace("\"mass_g\" : 186.4", "\"mass_g\" : \"heavy\""));
    assertThatThrownBy(() -> RunReader.read(j)).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining(j.toString()).hasMessageContaining("field 'mass_g'");
    Files.writeString(j, text.replace("\"cause\" : \"break\"", "\"cause\" : \"gremlins\""));
    assertThatThrownBy(() -> RunReader.read(j)).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("field 'cause'").hasMessageContaining("gremlins");
    Files.writeString(j, text.replace("\"run_id\" : \"bad9\",", ""));
    assertThatThrownBy(() -> RunReader.read(j)).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("field 'run_id' is missing");
    Files.writeString(j, text.replace("\"break_index\" : 2", "\"break_index\" : 99"));
    assertThatThrownBy(() -> RunReader.read(j)).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("break_index").hasMessageContaining("only 3 samples");
    Files.writeString(j, text.substring(0, 40));
    assertThatThrownBy(() -> RunReader.read(j)).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("not valid JSON");
    Files.delete(j);
    assertThatThrownBy(() -> RunReader.read(tmp.resolve("bad9.csv")))
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("does not exist");
  }
}
