package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.apache.commons.math3.distribution.TDistribution;
import org.apache.commons.math3.stat.descriptive.DescriptiveStatistics;
import org.apache.commons.math3.stat.inference.TTest;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.archive.FinishCause;
import org.loadstone.archive.RunData;
import org.loadstone.archive.RunMetadata;
import org.loadstone.archive.RunWriter;
import org.loadstone.archive.ScaleSpec;
import org.loadstone.archive.TestRuns;

/**
 * {@code compare} on an archive with a manual run, an uncalibrated run and an imported run: the
 * three are left out with their reasons, and the statistics are those of the remaining runs,
 * recomputed here with Apache Commons Math 3.6.1 as the reference.
 */
class CompareLeftOutTest {
  private static final double[] FOAM = {455, 470, 462, 448};
  private static final double[] BALSA = {610, 640, 625, 618};
  private static final double MANUAL_FOAM = 120;
  private static final double NOMINAL_BALSA = 900;
  private static final double IMPORTED_FOAM = 0.66; // kN values read as N: a unit mix-up

  @TempDir Path dir;

  private Path archive() throws Exception {
    Path arc = Files.createDirectories(dir.resolve("runs"));
    for (int i = 0; i < FOAM.length; i++) {
      run(arc, i, "foam-" + (i + 1), "foam", FinishCause.BREAK, true, FOAM[i]);
      run(arc, 10 + i, "balsa-" + (i + 1), "balsa", FinishCause.BREAK, true, BALSA[i]);
    }
    run(arc, 20, "foam-stopped", "foam", FinishCause.MANUAL, true, MANUAL_FOAM);
    run(arc, 21, "balsa-nominal", "balsa", FinishCause.BREAK, false, NOMINAL_BALSA);
    // the imported run comes in through the import command, as a lab would bring it
    RunData d = TestRuns.bend(0.1, IMPORTED_FOAM);
    StringBuilder csv = new StringBuilder("t,force,travel\n");
    for (int i = 0; i < d.size(); i++) {
      csv.append(String.format(Locale.ROOT, "%s,%s,%s%n", d.time_s()[i], d.force_N()[i],
          d.position_mm()[i]));
    }
    Path file = Files.writeString(dir.resolve("legacy.csv"), csv);
    RecordCommandTest.Outcome imp = RecordCommandTest.run("import", file.toString(), "--map",
        "time=t,force=force,position=travel", "--specimen", "foam-legacy", "--group", "foam",
        "--archive", arc.toString());
    assertThat(imp.exit()).as(imp.err()).isZero();
    return arc;
  }

  private static void run(Path arc, int minute, String specimen, String group, FinishCause cause,
      boolean calibrated, double peak_N) {
    RunMetadata.Builder b = TestRuns.meta(specimen, group, TestRuns.panel(), 50.0).toBuilder()
        .runId(String.format("20261202T09%02d00.000Z-%s", minute, specimen))
        .startedAt(Instant.parse("2026-12-02T09:00:00Z").plusSeconds(60L * minute))
        .cause(cause);
    if (!calibrated) {
      b.calibrationId(null).calibrationSha256(null).scale("nominal 8590 counts/N")
          .scaleSpec(ScaleSpec.nominal(8590));
    }
    RunWriter.write(arc, b.build(), TestRuns.bend(60, peak_N));
  }

  @Test
  void manualUncalibratedAndImportedRunsAreLeftOutAndTheRestAgreeWithCommonsMath()
      throws Exception {
    Path arc = archive();
    RecordCommandTest.Outcome o = RecordCommandTest.run("compare", "--archive", arc.toString(),
        "--metric", "peak", "--json");
    assertThat(o.exit()).as(o.err()).isZero();
    JsonNode j = o.json();
    List<String> ids = new ArrayList<>();
    List<String> reasons = new ArrayList<>();
    j.get("left_out").forEach(l -> {
      ids.add(l.get("run_id").asText());
      reasons.add(l.get("kinds").get(0).asText() + ": " + l.get("reason").asText());
    });
    assertThat(ids).hasSize(3);
    assertThat(ids.get(0)).endsWith("-foam-stopped");
    assertThat(ids.get(1)).endsWith("-balsa-nominal");
    assertThat(ids.get(2)).contains("foam-legacy");
    assertThat(reasons.get(0)).startsWith("manual: stopped by the operator");
    assertThat(reasons.get(1)).startsWith("uncalibrated: force from a nominal scale");
    assertThat(reasons.get(2)).startsWith("imported: imported from another program's file");
    assertThat(o.err()).contains("left out: " + ids.get(0))
        .contains("3 runs left out (1 uncalibrated, 1 imported, 1 manual)")
        .contains("--include uncalibrated,imported,manual");

    check(j.get("groups").get("foam"), FOAM);
    check(j.get("groups").get("balsa"), BALSA);
    // reference: Commons Math TTest.tTest, two-sided Welch t-test (unequal variances)
    assertThat(j.get("test").asText()).isEqualTo("welch_t");
    assertThat(j.get("p_value").asDouble())
        .isCloseTo(new TTest().tTest(FOAM, BALSA), within(1e-12));
    assertThat(j.get("outliers")).isEmpty();
    assertThat(j.get("advice").get("current_n").asInt()).isEqualTo(4);

    // counted on request, the three join their groups
    RecordCommandTest.Outcome all = RecordCommandTest.run("compare", "--archive", arc.toString(),
        "--metric", "peak", "--include", "manual,uncalibrated,imported", "--json");
    assertThat(all.exit()).as(all.err()).isZero();
    assertThat(all.json().get("left_out")).isEmpty();
    check(all.json().get("groups").get("foam"), new double[] {455, 470, 462, 448, MANUAL_FOAM,
        IMPORTED_FOAM});
    check(all.json().get("groups").get("balsa"), new double[] {610, 640, 625, 618,
        NOMINAL_BALSA});
  }

  /** n, mean, SD and the 95 % CI of a group against Commons Math on the expected peaks. */
  private static void check(JsonNode g, double[] peaks) {
    // reference: Commons Math DescriptiveStatistics (mean, n − 1 standard deviation) and the
    // Student t quantile of TDistribution for the interval mean ± t(0.975, n − 1)·SD/√n
    DescriptiveStatistics s = new DescriptiveStatistics(peaks);
    double half = new TDistribution(peaks.length - 1).inverseCumulativeProbability(0.975)
        * s.getStandardDeviation() / Math.sqrt(peaks.length);
    assertThat(g.get("n").asInt()).isEqualTo(peaks.length);
    assertThat(g.get("mean").asDouble()).isCloseTo(s.getMean(), within(1e-9));
    assertThat(g.get("sd").asDouble()).isCloseTo(s.getStandardDeviation(), within(1e-9));
    assertThat(g.get("ci95_low").asDouble()).isCloseTo(s.getMean() - half, within(1e-6));
    assertThat(g.get("ci95_high").asDouble()).isCloseTo(s.getMean() + half, within(1e-6));
  }
}
