package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.stat.descriptive.DescriptiveStatistics;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.archive.RunMetadata;
import org.loadstone.archive.RunWriter;
import org.loadstone.archive.StoredRun;
import org.loadstone.archive.TestRuns;

/**
 * An archive where some runs cannot be read (a sidecar that is not JSON, run files damaged in
 * several ways, a run file missing): {@code runs}, {@code compare}, {@code report --group} and
 * {@code report RUN} name each with its reason, and the readable runs still count, with the
 * figures Commons Math gives for them alone.
 */
class UnreadableRunsTest {
  private static final double[] FOAM = {455, 470, 462};
  private static final double[] BALSA = {610, 640, 625};

  @TempDir Path dir;

  /** The damaged runs' CSV texts, each of which must leave the others counted. */
  private static final List<String> BAD_CSVS = List.of(
      "this is not a run file\n\u0000\u0001\u0002",
      "time_s,force_N,position_mm,raw_counts,raw_position,seq\n",
      "time_s,force_N,position_mm,raw_counts,raw_position,seq\n0.0,1.0,0.0,1,0,0\n",
      "time_s,force_N,position_mm,raw_counts,raw_position,seq\n0.0,1.0,0.0,1,0,0\n"
          + "1.0,NaN,0.1,2,1,1\n0.5,3.0,0.2,3,2,2\n",
      "time_s,force_N,position_mm,raw_counts,raw_position,seq\n0.0,1.0,0.0,1,0,0\n"
          + "0.0,2.0,0.0,2,0,1\n0.0,3.0,0.0,3,0,2\n0.0,2.0,0.0,4,0,3\n",
      "time_s,force_N,position_mm,raw_counts,raw_position,seq\n0.0,0.0,0.0,0,0,0\n"
          + "1.0,0.0,0.0,0,0,1\n2.0,0.0,0.0,0,0,2\n3.0,0.0,0.0,0,0,3\n");

  private Path archive() throws Exception {
    Path arc = Files.createDirectories(dir.resolve("runs"));
    int minute = 0;
    for (int i = 0; i < FOAM.length; i++) {
      store(arc, minute++, "foam-" + i, "foam", FOAM[i]);
      store(arc, minute++, "balsa-" + i, "balsa", BALSA[i]);
    }
    for (int i = 0; i < BAD_CSVS.size(); i++) {
      StoredRun bad = store(arc, minute++, "damaged-" + i, i % 2 == 0 ? "foam" : "balsa", 500);
      Files.delete(bad.csv());
      Files.writeString(bad.csv(), BAD_CSVS.get(i));
    }
    StoredRun gone = store(arc, minute++, "no-samples", "foam", 500);
    Files.delete(gone.csv());
    Files.writeString(arc.resolve("20261202T095900.000Z-garbled.json"), "{ \"run_id\": ");
    return arc;
  }

  private static StoredRun store(Path arc, int minute, String specimen, String group,
      double peak_N) {
    RunMetadata m = TestRuns.meta(specimen, group, TestRuns.panel(), 50.0).toBuilder()
        .runId(String.format("20261202T10%02d00.000Z-%s", minute, specimen))
        .startedAt(Instant.parse("2026-12-02T10:00:00Z").plusSeconds(60L * minute))
        .build();
    return RunWriter.write(arc, m, TestRuns.bend(60, peak_N));
  }

  @Test
  void compareCountsTheReadableRunsAndListsEveryOtherWithItsReason() throws Exception {
    Path arc = archive();
    CliRun r = CliRun.run("", "compare", "--archive", arc.toString(), "--metric", "peak",
        "--json");
    assertThat(r.exit()).as(r.toString()).isZero();
    JsonNode j = r.lastJson();
    check(j.get("groups").get("foam"), FOAM);
    check(j.get("groups").get("balsa"), BALSA);
    List<String> left = new ArrayList<>();
    j.get("left_out").forEach(l -> left.add(l.get("run_id").asText() + " "
        + l.get("reason").asText()));
    assertThat(left).hasSize(BAD_CSVS.size() + 2);
    assertThat(left).allSatisfy(l -> assertThat(l).contains("cannot be read or analysed"));
    assertThat(left).anySatisfy(l -> assertThat(l).contains("garbled.json"));
    assertThat(left).anySatisfy(l -> assertThat(l).contains("no-samples"));
    for (int i = 0; i < BAD_CSVS.size(); i++) {
      String id = "damaged-" + i;
      assertThat(left).anySatisfy(l -> assertThat(l).contains(id));
      assertThat(r.err()).contains("left out: ").contains(id); // the text, beside the JSON
    }
  }

  @Test
  void runsReportAndAnalyzeNameEachUnreadableRun() throws Exception {
    Path arc = archive();
    CliRun runs = CliRun.run("", "runs", "--archive", arc.toString(), "--json");
    assertThat(runs.exit()).as(runs.toString()).isZero();
    assertThat(runs.err()).contains("garbled.json").contains("no-samples")
        .contains("is missing");
    // the sidecar, the missing samples file, and the three samples files the reader refuses:
    // not a run file (0), a NaN force (3), time not increasing (4); the others read but cannot
    // be analysed (header only, one sample, no force), which compare says
    assertThat(runs.lastJson().get("unreadable")).hasSize(5);
    for (int i : new int[] {0, 3, 4}) {
      assertThat(runs.err()).contains("damaged-" + i + " cannot be read: run file");
    }
    for (int i : new int[] {1, 2, 5}) {
      assertThat(runs.err()).doesNotContain("damaged-" + i + " cannot be read");
    }

    CliRun group = CliRun.run("", "report", "--archive", arc.toString(), "--group",
        "foam,balsa", "--out", dir.resolve("g.pdf").toString());
    assertThat(group.exit()).as(group.toString()).isZero();
    assertThat(group.out()).contains("garbled.json").contains("no-samples")
        .contains("damaged-0").contains("damaged-" + (BAD_CSVS.size() - 1));

    CliRun one = CliRun.run("", "report", "--archive", arc.toString(),
        "20261202T095900.000Z-garbled", "--out", dir.resolve("r.pdf").toString());
    assertThat(one.exit()).as(one.toString()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(one.err()).contains("cannot be read").contains("garbled.json")
        .doesNotContain("no run '");

    CliRun analyze = CliRun.run("", "analyze", "--archive", arc.toString(), "damaged-0");
    assertThat(analyze.exit()).as(analyze.toString()).isNotEqualTo(0)
        .isNotEqualTo(LoadstoneCommand.EXIT_INTERNAL);
  }

  @Test
  void analyzeRefusesACalibrationChangedSinceItWasSavedUnlessAccepted() throws Exception {
    Path arc = Files.createDirectories(dir.resolve("demo"));
    String run = "20261204T181011.533Z-foam-01";
    for (String ext : List.of(".csv", ".json")) {
      Files.copy(Path.of("sample-runs", run + ext), arc.resolve(run + ext));
    }
    Path cal = dir.resolve("changed.json");
    String text = Files.readString(Path.of("calibration/shelf-rig-1kN-2026-12-03.json"));
    // one coefficient edited by hand: the stored content hash no longer matches
    Files.writeString(cal, text.replace("4300.676022299151", "4400.676022299151"));

    CliRun refused = CliRun.run("", "analyze", "--archive", arc.toString(), run, "--cal",
        cal.toString());
    assertThat(refused.exit()).as(refused.toString())
        .isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(refused.err()).contains("changed since it was saved")
        .contains("--accept-changed-calibration");

    CliRun accepted = CliRun.run("", "analyze", "--archive", arc.toString(), run, "--cal",
        cal.toString(), "--accept-changed-calibration", "--json");
    assertThat(accepted.exit()).as(accepted.toString()).isZero();
    assertThat(accepted.err()).contains("warning: Calibration").contains("changed since");
    assertThat(accepted.lastJson().get("warnings").get(0).asText())
        .contains("changed since it was saved");

    CliRun intact = CliRun.run("", "analyze", "--archive", arc.toString(), run, "--cal",
        "calibration/shelf-rig-1kN-2026-12-03.json", "--json");
    assertThat(intact.exit()).as(intact.toString()).isZero();
    assertThat(intact.out() + intact.err()).doesNotContain("changed since");
  }

  /** n and mean of a group against Commons Math's DescriptiveStatistics on the true peaks. */
  private static void check(JsonNode g, double[] peaks) {
    DescriptiveStatistics s = new DescriptiveStatistics(peaks);
    assertThat(g.get("n").asInt()).isEqualTo(peaks.length);
    assertThat(g.get("mean").asDouble()).isCloseTo(s.getMean(), within(1e-9));
    assertThat(g.get("sd").asDouble()).isCloseTo(s.getStandardDeviation(), within(1e-9));
  }
}
