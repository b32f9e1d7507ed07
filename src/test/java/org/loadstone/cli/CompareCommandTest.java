package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.stat.inference.OneWayAnova;
import org.apache.commons.math3.stat.inference.TTest;
import org.junit.jupiter.api.Test;
import org.loadstone.archive.Run;
import org.loadstone.archive.RunReader;

/**
 * {@code runs} and {@code compare} on the shipped demo archive. Its runs were recorded on the
 * simulated cell's nominal scale, so {@code --include uncalibrated} lets them count.
 */
class CompareCommandTest {
  static final Path SAMPLES =
      Path.of(System.getProperty("loadstone.projectDir", "."), "sample-runs");

  static double[] peaks(String group) throws Exception {
    List<Double> v = new ArrayList<>();
    try (var s = java.nio.file.Files.list(SAMPLES)) {
      for (Path p : s.filter(f -> f.toString().endsWith(".json")).toList()) {
        Run r = RunReader.read(p);
        if (r.metadata().group().equals(group)) {
          double max = Double.NEGATIVE_INFINITY;
          for (double f : r.data().force_N()) {
            max = Math.max(max, f);
          }
          v.add(max);
        }
      }
    }
    return v.stream().mapToDouble(Double::doubleValue).toArray();
  }

  @Test
  void threeGroupsOfPeakForceAgreeWithCommonsMathAnova() throws Exception {
    RecordCommandTest.Outcome o = RecordCommandTest.run("compare", "--archive",
        SAMPLES.toString(), "--metric", "peak", "--include", "uncalibrated", "--json");
    assertThat(o.exit()).as(o.err()).isZero();
    JsonNode j = o.json();
    assertThat(j.get("test").asText()).isEqualTo("one_way_anova");
    for (String g : List.of("foam", "balsa", "board")) {
      JsonNode s = j.get("groups").get(g);
      assertThat(s.get("n").asInt()).isEqualTo(5);
      for (String k : List.of("mean", "sd", "cv_pct", "ci95_low", "ci95_high")) {
        assertThat(s.get(k).isNumber()).as(g + " " + k).isTrue();
      }
      // the group mean is the mean of the runs' peak forces read straight from their CSVs
      assertThat(s.get("mean").asDouble()).isCloseTo(
          java.util.Arrays.stream(peaks(g)).average().orElseThrow(),
          org.assertj.core.data.Offset.offset(1e-9));
    }
    // reference: Apache Commons Math OneWayAnova on the same peak forces
    double p = new OneWayAnova().anovaPValue(List.of(peaks("balsa"), peaks("board"),
        peaks("foam")));
    // Commons Math forms p as 1 − CDF(F), which keeps only absolute precision (~1e-16) for a p
    // this small (~1e-14), so the check is absolute
    assertThat(j.get("p_value").asDouble()).isCloseTo(p, org.assertj.core.data.Offset.offset(1e-15));
    assertThat(o.err()).contains("one-way ANOVA").contains("larger than the scatter");
  }

  @Test
  void twoGroupsUseWelchAsCommonsMathDoes() throws Exception {
    RecordCommandTest.Outcome o = RecordCommandTest.run("compare", "--archive",
        SAMPLES.toString(), "--metric", "peak", "--group", "foam,board", "--include",
        "uncalibrated", "--json");
    JsonNode j = o.json();
    assertThat(j.get("test").asText()).isEqualTo("welch_t");
    // reference: Commons Math TTest.tTest (unequal variances, Welch–Satterthwaite)
    double p = new TTest().tTest(peaks("foam"), peaks("board"));
    assertThat(j.get("p_value").asDouble()).isCloseTo(p, org.assertj.core.data.Percentage.withPercentage(1e-6));
  }

  @Test
  void oneGroupIsComparedWithTheOthersAndAnUnknownOneIsRefused() throws Exception {
    RecordCommandTest.Outcome o = RecordCommandTest.run("compare", "--archive",
        SAMPLES.toString(), "--group", "board", "--include", "uncalibrated", "--json");
    assertThat(o.exit()).as(o.err()).isZero();
    assertThat(o.json().get("groups").fieldNames()).toIterable()
        .containsExactly("board", "balsa", "foam");
    RecordCommandTest.Outcome oak = RecordCommandTest.run("compare", "--archive",
        SAMPLES.toString(), "--group", "foam,oak");
    assertThat(oak.exit()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(oak.err()).contains("no runs of group 'oak'")
        .contains("the groups there are balsa, board, foam");
    RecordCommandTest.Outcome m = RecordCommandTest.run("compare", "--archive",
        SAMPLES.toString(), "--metric", "strength");
    assertThat(m.err()).contains("unknown metric").contains("specific-peak");
  }

  @Test
  void runsListsAndFilters() throws Exception {
    RecordCommandTest.Outcome o = RecordCommandTest.run("runs", "--archive", SAMPLES.toString(),
        "--group", "balsa", "--cause", "break", "--json");
    assertThat(o.exit()).isZero();
    assertThat(o.json().get("run_count").asInt()).isEqualTo(5);
    assertThat(o.json().get("runs")).hasSize(5);
    RecordCommandTest.Outcome bad = RecordCommandTest.run("runs", "--archive",
        SAMPLES.toString(), "--from", "yesterday");
    assertThat(bad.err()).contains("YYYY-MM-DD");
  }
}
