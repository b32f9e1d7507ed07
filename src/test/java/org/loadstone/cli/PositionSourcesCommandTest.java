package org.loadstone.cli;

import org.loadstone.HangGuard;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import org.assertj.core.data.Offset;
import org.assertj.core.data.Percentage;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.study.FrameProfile;
import org.loadstone.archive.Run;
import org.loadstone.archive.RunReader;
import org.loadstone.device.SimSetup;
import org.loadstone.sim.SimTruth;

/**
 * Re-analysis of stored runs: frame compliance measured on a rigid block and removed, another
 * calibration applied to the raw counts, and positions from an imported table or a crosshead
 * rate — checked against the simulator's ground truth.
 */
@Timeout(HangGuard.TEST_S)
class PositionSourcesCommandTest {
  @TempDir static Path tmp;
  static Path archive;
  static String panelRun;

  @BeforeAll
  static void record() throws Exception {
    archive = tmp.resolve("runs");
    RecordCommandTest.Outcome r = RecordCommandTest.run("record", "--port", "sim", "--scenario",
        "panel-balsa", "--seed", "5", "--rate-hz", "1000", "--sim-speed", "10", "--specimen", "b5",
        "--group", "balsa", "--archive", archive.toString(), "--json");
    assertThat(r.exit()).as(r.err()).isZero();
    panelRun = r.json().get("run_id").asText();
  }

  static JsonNode analyze(String... extra) throws Exception {
    String[] args = new String[4 + extra.length];
    args[0] = "analyze";
    args[1] = panelRun;
    args[2] = "--archive=" + archive;
    args[3] = "--json";
    System.arraycopy(extra, 0, args, 4, extra.length);
    RecordCommandTest.Outcome o = RecordCommandTest.run(args);
    assertThat(o.exit()).as(o.err()).isZero();
    return o.json();
  }

  @Test
  void frameComplianceMeasuredOnARigidBlockAndRemoved() throws Exception {
    RecordCommandTest.Outcome block = RecordCommandTest.run("record", "--port", "sim",
        "--scenario", "rigid-block", "--rate-hz", "1000", "--sim-speed", "10", "--specimen",
        "block", "--archive", archive.toString(), "--json");
    String blockId = block.json().get("run_id").asText();
    Path frames = tmp.resolve("frames");
    RecordCommandTest.Outcome f = RecordCommandTest.run("frame", blockId, "--archive",
        archive.toString(), "--id", "sim-frame", "--out", frames.toString());
    assertThat(f.exit()).as(f.err()).isZero();
    FrameProfile p = FrameProfile.read(frames.resolve("sim-frame.json"));
    SimTruth blockTruth = new SimSetup("rigid-block", 1, 1000, false, 1).buildFrame().truth();
    // a block against the frame: two springs in series, 1/k = 1/k_frame + 1/k_block (common
    // practice); the block is practically rigid, so this is the frame's stiffness
    assertThat(p.frameStiffness_N_per_mm())
        .isCloseTo(blockTruth.systemStiffness_N_per_mm(), Percentage.withPercentage(1));

    SimTruth panel = new SimSetup("panel-balsa", 5, 1000, false, 1).buildFrame().truth();
    double raw = analyze().get("stiffness_N_per_mm").asDouble();
    double corrected = analyze("--frame", frames.resolve("sim-frame.json").toString())
        .get("stiffness_N_per_mm").asDouble();
    // uncorrected, the slope is the panel and frame in series; corrected, it is the panel alone
    assertThat(raw).isCloseTo(panel.systemStiffness_N_per_mm(), Percentage.withPercentage(1));
    assertThat(corrected).isCloseTo(panel.specimen().stiffness_N_per_mm(),
        Percentage.withPercentage(0.5));
    RecordCommandTest.Outcome again = RecordCommandTest.run("frame", blockId, "--archive",
        archive.toString(), "--id", "sim-frame", "--out", frames.toString());
    assertThat(again.err()).contains("already exists");
  }

  @Test
  void anotherCalibrationIsAppliedToTheRawCountsWithoutTouchingTheRun() throws Exception {
    Path cal = Path.of(System.getProperty("loadstone.projectDir", "."), "calibration",
        "shelf-rig-500N-2026-12-02.json");
    Path csv = archive.resolve(panelRun + ".csv");
    byte[] before = Files.readAllBytes(csv);
    JsonNode nominal = analyze();
    JsonNode recal = analyze("--cal", cal.toString());
    assertThat(recal.get("calibration_id").asText()).isEqualTo("shelf-rig-500N-2026-12-02");
    // force = net counts / sensitivity: the peak scales with the ratio of the sensitivities
    double kNominal = new SimSetup("panel-balsa", 5, 1000, false, 1).nominalCountsPerN();
    Run stored = RunReader.read(csv);
    double kCal = org.loadstone.calibration.CalibrationFiles.readCalibration(cal).fit()
        .coefficients().get(1);
    assertThat(recal.get("peak_N").asDouble()).isCloseTo(
        nominal.get("peak_N").asDouble() * kNominal / kCal, Percentage.withPercentage(0.5));
    assertThat(Files.readAllBytes(csv)).isEqualTo(before);
    assertThat(stored.metadata().calibrationId()).isNull();
  }

  @Test
  void positionFromAVideoTableIsAlignedByTheBreak() throws Exception {
    Run r = RunReader.read(archive.resolve(panelRun + ".csv"));
    // a video tracking export of the mid-span: every 20th sample (50 frames/s), on its own clock
    // 3.217 s ahead, in cm. The mid-span deflection is the crosshead travel less the frame's
    // stretch F/k_frame, so it jumps back when the panel breaks — the change alignment looks for
    SimTruth panel = new SimSetup("panel-balsa", 5, 1000, false, 1).buildFrame().truth();
    StringBuilder t = new StringBuilder("frame;t [s];y [cm]\n");
    double[] time = r.data().time_s();
    double[] x = r.data().position_mm();
    double[] f = r.data().force_N();
    for (int i = 0; i < time.length; i += 20) {
      double deflection_mm = x[i] - f[i] / panel.frameStiffness_N_per_mm();
      t.append(String.format(Locale.ROOT, "%d;%s;%s%n", i / 20,
          String.valueOf(time[i] + 3.217).replace('.', ','),
          String.valueOf(deflection_mm / 10).replace('.', ',')));
    }
    Path table = Files.writeString(tmp.resolve("track.csv"), t.toString());
    JsonNode fromTable = analyze("--position-table", table.toString(), "--table-map",
        "time=t [s],position=y [cm]", "--table-length-unit", "cm", "--table-decimal", ",");
    String derived = fromTable.get("derived").get(0).asText();
    assertThat(derived).contains("aligned by the break");
    // the offset is recovered within one and a half periods of the coarser record, the 50
    // frame/s table: where the break falls between two frames depends on when the simulated
    // press was started (it waits for the arming), and errors of 23–25 ms were seen
    double offset = Double.parseDouble(derived.replaceAll(".*run time ([-+][0-9.]+) s.*", "$1"));
    assertThat(offset).isCloseTo(3.217, Offset.offset(0.030));
    // the specimen's own deflection gives the specimen's own stiffness
    assertThat(fromTable.get("stiffness_N_per_mm").asDouble())
        .isCloseTo(panel.specimen().stiffness_N_per_mm(), Percentage.withPercentage(1));
  }

  @Test
  void constantCrossheadRateGivesPositionFromTime() throws Exception {
    SimTruth panel = new SimSetup("panel-balsa", 5, 1000, false, 1).buildFrame().truth();
    double rate = panel.crossheadRate_mm_per_s() * 60;
    JsonNode j = analyze("--crosshead-rate-mm-per-min", Double.toString(rate));
    // position = rate × time since the first sample
    assertThat(j.get("displacement_at_peak_mm").asDouble()).isCloseTo(
        panel.crossheadRate_mm_per_s() * j.get("peak_time_s").asDouble(), Offset.offset(1e-6));
  }
}
