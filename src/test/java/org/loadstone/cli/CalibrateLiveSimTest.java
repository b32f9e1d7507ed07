package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import org.apache.commons.math3.stat.regression.SimpleRegression;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.calibration.CalibrationStatus;
import org.loadstone.calibration.CheckWeightResult;
import org.loadstone.calibration.CheckWeights;
import org.loadstone.device.SimSetup;
import org.loadstone.sim.LoadCell;
import org.loadstone.sim.SimTruth;

/**
 * Live calibration and check-weight verification against the built-in simulator, driven through
 * the prompts with answers on standard input; the simulator's ground truth is the reference.
 */
class CalibrateLiveSimTest {
  @TempDir static Path dir;
  static CliRun calibration;
  static Path calFile;
  /** The simulated cell of the dead-weight scenario, seed 1 (the defaults of the command). */
  static final SimTruth TRUTH = new SimSetup("dead-weight", 1, 80, false, 1).buildFrame().truth();

  @BeforeAll
  static void calibrateTheSimulatedCell() {
    // one answer per step: zero, 10, 20, (29.5 typed instead of 30), 40, 50, then down 40 … 0;
    // at the 10 kg step an unreadable answer first, which must be asked again
    String answers = "\n" + "ten kilos\n\n" + "\n" + "25 kg + 4.5 kg\n" + "\n\n" + "\n\n\n\n\n";
    calibration = CliRun.run(answers, "calibrate", "--port", "sim", "--cell", "sim-cell",
        "--loads", "10 kg, 20 kg, 30 kg, 40 kg, 50 kg", "--descending", "--sim-speed", "40",
        "--gravity-m-per-s2", Double.toString(TRUTH.gravity_m_per_s2()), "--air-density-kg-per-m3", "0",
        "--full-scale-n", Double.toString(TRUTH.loadCell().capacity_N()),
        "--out", dir.toString(), "--id", "sim-cal", "--operator", "tester", "--json");
    calFile = dir.resolve("sim-cal.json");
  }

  @Test
  void recoversTheSimulatedSensitivityAndNonLinearity() throws Exception {
    assertThat(calibration.exit()).as(calibration.toString()).isZero();
    JsonNode j = calibration.lastJson();
    LoadCell cell = TRUTH.loadCell();
    // non-linearity against the best straight line of the ascending points cannot exceed the
    // simulator's terminal-line figure; the expected value is the largest deviation of the
    // model's noise-free curve from its least-squares line (Commons Math SimpleRegression)
    double g = TRUTH.gravity_m_per_s2();
    SimpleRegression reg = new SimpleRegression(true);
    double[] up_kg = {0, 10, 20, 29.5, 40, 50};
    for (double m : up_kg) {
      reg.addData(m * g, cell.idealCounts(m * g) - cell.idealCounts(0));
    }
    double worst = 0;
    for (double m : up_kg) {
      worst = Math.max(worst, Math.abs(cell.idealCounts(m * g) - cell.idealCounts(0)
          - reg.predict(m * g)));
    }
    // the simulator's own sensitivity (its ground truth) over the loads used: the slope of the
    // least-squares line through the model's noise-free readings, within 0.02 % (the loads span
    // half the 1 kN cell, where its curvature lifts the slope 0.06 % above the terminal line's)
    assertThat(j.get("sensitivity_counts_per_N").asDouble())
        .isCloseTo(reg.getSlope(), within(0.0002 * reg.getSlope()));
    assertThat(j.get("sensitivity_counts_per_N").asDouble())
        .isCloseTo(cell.countsPerN(), within(0.001 * cell.countsPerN()));
    double expectedPct = 100 * worst / reg.getSlope() / cell.capacity_N();
    double nonlin = j.get("nonlinearity_pct_fs").asDouble();
    assertThat(nonlin).isLessThanOrEqualTo(cell.nonLinearity_pctFS());
    assertThat(nonlin).isCloseTo(expectedPct, within(0.002));
    // the simulated cell has no hysteresis: up and down readings agree to the settling residue
    assertThat(j.get("hysteresis_pct_fs").asDouble()).isLessThan(0.005);
  }

  @Test
  void promptsShowLiveLinesAndAskAgainAfterABadAnswer() {
    // with --json the prompts go to standard error, and the live status line (rewritten with
    // a carriage return) only to a terminal, which a captured standard error is not
    String out = calibration.err();
    assertThat(out).contains("place 20 kg (sum of weights allowed, e.g. '1 kg + 500 g'), then"
        + " press Enter", "remove all weights (zero point)", "cannot read 'ten kilos'",
        "29.5 kg now on the simulated cell", "captured 20 kg").doesNotContain("\r");
    assertThat(out.split("\\[2/11\\]", -1)).hasSize(3);
    assertThat(calibration.out().strip()).doesNotContain("\n").startsWith("{");
  }

  @Test
  void savesTheCalibrationAndItsPointsWithTheMassActuallyPlaced() throws Exception {
    assertThat(calibration.exit()).as(calibration.toString()).isZero();
    CalibrationStatus st = CalibrationStatus.check(calFile, null, LocalDate.now());
    assertThat(st.ok()).as(st.warning()).isTrue();
    assertThat(st.document().cellId()).isEqualTo("sim-cell");
    assertThat(st.document().points()).hasSize(11);
    List<String> csv = Files.readAllLines(dir.resolve("sim-cal.points.csv"),
        StandardCharsets.UTF_8);
    assertThat(csv).anyMatch(l -> l.startsWith("29500.0,") && l.contains(",up,1,"));
    assertThat(csv).noneMatch(l -> l.startsWith("30000.0,") && l.contains(",up,"));
    assertThat(calibration.lastJson().get("calibration_sha256").asText())
        .isEqualTo(st.document().contentSha256());
  }

  @Test
  void checkWeightPassesWhenTheRightWeightIsPlaced() throws Exception {
    CliRun r = CliRun.run("\n\n", "verify", "--port", "sim", "--cal", calFile.toString(),
        "--mass-g", "20000", "--sim-speed", "40", "--json");
    assertThat(r.exit()).as(r.toString()).isZero();
    JsonNode j = r.lastJson();
    // the force of 20 kg is m·g (no air buoyancy in this calibration's force model)
    assertThat(j.get("expected_N").asDouble())
        .isCloseTo(20 * TRUTH.gravity_m_per_s2(), within(1e-9));
    assertThat(j.get("indicated_N").asDouble()).isCloseTo(20 * TRUTH.gravity_m_per_s2(),
        within(0.002 * 20 * TRUTH.gravity_m_per_s2()));
    assertThat(j.get("pass").asBoolean()).isTrue();
    assertThat(j.get("mass_g").asDouble()).isEqualTo(20000);
    assertThat(j.get("tolerance_pct").asDouble()).isEqualTo(1.0);
    assertThat(r.err()).contains("tare", "place the check weight of 20 kg", "PASS");
    List<CheckWeightResult> log = CheckWeights.readLog(calFile);
    assertThat(log.get(log.size() - 1).pass()).isTrue();
  }

  @Test
  void checkWeightFailsWhenTheClaimedMassIsWrong() throws Exception {
    int before = CheckWeights.readLog(calFile).size();
    CliRun r = CliRun.run("\n\n", "verify", "--port", "sim", "--cal", calFile.toString(),
        "--mass-g", "21000", "--sim-placed-g", "20000", "--sim-speed", "40", "--json");
    assertThat(r.exit()).as(r.toString()).isEqualTo(VerifyCommand.EXIT_FAILED);
    JsonNode j = r.lastJson();
    assertThat(j.get("pass").asBoolean()).isFalse();
    // 20 kg read against a claimed 21 kg: (20/21 − 1) × 100 = −4.76 %
    assertThat(j.get("error_pct").asDouble()).isCloseTo((20.0 / 21 - 1) * 100, within(0.1));
    assertThat(r.err()).contains("FAIL");
    List<CheckWeightResult> log = CheckWeights.readLog(calFile);
    assertThat(log).hasSize(before + 1);
    assertThat(log.get(before).pass()).isFalse();
    assertThat(log.get(before).mass_kg()).isEqualTo(21.0);
    // on the simulated frame it is a rehearsal: logged so, and never the cell's last check
    assertThat(log.get(before).rehearsal()).isTrue();
    assertThat(j.get("rehearsal").asBoolean()).isTrue();
    assertThat(java.nio.file.Files.readAllLines(CheckWeights.logFile(calFile)).get(before))
        .contains("\"rehearsal\":true");
    assertThat(CheckWeights.lastCheck(calFile).map(c -> c.time()))
        .isEqualTo(log.subList(0, before).stream().filter(c -> !c.rehearsal())
            .reduce((a, b) -> b).map(c -> c.time()));
    assertThat(org.loadstone.acquire.ScaleChoice.fromCalibration(calFile,
        java.time.LocalDate.now()).warnings()).noneMatch(w -> w.contains("FAILED"));
  }

  @Test
  void aReadingThatNeverSettlesTimesOutWithAClearMessage() {
    // the simulated converter's noise (~39 counts RMS at 80 samples/s) can never meet a 1-count
    // SD limit, so every step times out; the operator waits once more, then quits
    CliRun r = CliRun.run("\nr\nq\n", "calibrate", "--port", "sim", "--cell", "c1", "--loads",
        "1 kg, 2 kg", "--max-sd-counts", "1", "--timeout-s", "2", "--sim-speed", "40",
        "--out", dir.resolve("never").toString());
    assertThat(r.exit()).as(r.toString()).isEqualTo(CalibrateCommand.EXIT_STOPPED);
    String msg = "series 1, up: remove all weights (zero point): reading did not settle within"
        + " 2.0 s: sd=";
    assertThat(r.out().split(java.util.regex.Pattern.quote(msg), -1)).hasSize(3);
    assertThat(r.out()).contains("(limit 1.00)", "check for vibration", "r = wait again, q = quit",
        "Stopped: 0 reading(s) discarded, nothing fitted or saved.");
    assertThat(dir.resolve("never")).doesNotExist();
  }

  @Test
  void afterATimeOutTheOperatorWaitsAgainOrSkipsTheStep() throws Exception {
    // the simulated hanger settles with a 0.2 s time constant, so a load step is still moving
    // after 1.3 s (time-out) but settled in the second wait; the zero step settles at once
    Path save = dir.resolve("skip");
    CliRun r = CliRun.run("\n" + "\nr\n" + "\ns\n" + "\nr\n", "calibrate", "--port", "sim",
        "--cell", "c1", "--loads", "1 kg, 2 kg, 5 kg", "--window-s", "0.5", "--max-drift-counts-per-s",
        "200", "--timeout-s", "1.3", "--sim-speed", "40", "--out", save.toString(), "--id",
        "k", "--operator", "tester", "--json");
    assertThat(r.exit()).as(r.toString()).isZero();
    assertThat(r.err()).contains("series 1, up: weights totalling 1.0 kg on the cell: reading"
        + " did not settle within 1.3 s", "r = wait again, s = skip this step, q = quit",
        "step skipped", "captured 5 kg");
    var doc = org.loadstone.calibration.CalibrationFiles.readCalibration(save.resolve("k.json"));
    assertThat(doc.points()).extracting(p -> p.mass_kg()).containsExactly(0.0, 1.0, 5.0);
    assertThat(doc.description()).contains("1 step(s) skipped");
  }

  @Test
  void theCommandFollowsTheSessionsRuleOnARepeatedLoad() {
    // the walk's rules are CalibrationSession's: 2 kg typed at the 1 kg step, then the planned
    // 2 kg is refused as a repeat with the session's own words, before any weight is placed
    CliRun r = CliRun.run("\n" + "2 kg\n" + "\n" + "q\n", "calibrate", "--port", "sim",
        "--cell", "c1", "--loads", "1 kg, 2 kg, 5 kg", "--window-s", "0.5", "--max-drift-counts-per-s", "200",
        "--sim-speed", "40");
    assertThat(r.exit()).as(r.toString()).isEqualTo(CalibrateCommand.EXIT_STOPPED);
    assertThat(r.out()).contains("captured 2 kg", "series 1, up: weights totalling 2.0 kg on the"
        + " cell: 2 kg was already read in this series and direction",
        "Stopped: 2 reading(s) discarded");
    // the refused 2 kg was never placed nor read a second time
    assertThat(r.out().split("2 kg now on the simulated cell", -1)).hasSize(2);
    assertThat(r.out().split("captured 2 kg", -1)).hasSize(2);
  }

  @Test
  void refusesASimulatedScenarioWithoutWeightsAndAnExistingCalibrationId() {
    CliRun scen = CliRun.run("\n", "calibrate", "--port", "sim", "--scenario", "panel-foam",
        "--cell", "c1", "--loads", "1 kg, 2 kg");
    assertThat(scen.exit()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(scen.err()).contains("--scenario panel-foam has no weights to place");
    CliRun exists = CliRun.run("\n", "calibrate", "--port", "sim", "--cell", "c1", "--loads",
        "1 kg, 2 kg", "--out", dir.toString(), "--id", "sim-cal");
    assertThat(exists.exit()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(exists.err()).contains("sim-cal.json exists and is never overwritten",
        "'sim-cal-2'");
    assertThat(exists.out()).doesNotContain("Calibrating");
  }

  @Test
  void badLoadsAreRefusedBeforeTheDeviceIsOpened() {
    for (String[] c : List.of(
        new String[] {"abc, 2 kg", "--loads, weight 1: mass 'abc': cannot read 'abc'"},
        new String[] {"1 kg, -2 kg", "--loads, weight 2: mass '-2 kg'"},
        new String[] {"1 kg, 1000 g, 2 kg", "'1000 g' is listed twice"},
        new String[] {"2 kg", "at least two loads"})) {
      CliRun r = CliRun.run("", "calibrate", "--port", "/dev/no-such-port", "--cell", "c1",
          "--loads", c[0]);
      assertThat(r.exit()).as(r.toString()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
      assertThat(r.err()).contains(c[1]).doesNotContain("no-such-port");
    }
  }

  @Test
  void malformedCalibrationFileIsNamedWithItsField(@TempDir Path tmp) throws Exception {
    Path bad = tmp.resolve("bad.json");
    String text = Files.readString(CalibrateOfflineCommandTest.EXAMPLE_CAL);
    Files.writeString(bad, text.replaceFirst("\"valid_until\" : \"[0-9-]+\"",
        "\"valid_until\" : \"next year\""));
    CliRun r = CliRun.run("\n\n", "verify", "--port", "sim", "--cal", bad.toString(),
        "--mass-g", "2000", "--sim-speed", "40");
    assertThat(r.exit()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(r.err()).contains(bad.toString(), "field 'valid_until'", "yyyy-mm-dd");
    assertThat(CheckWeights.logFile(bad)).doesNotExist();
    CliRun neg = CliRun.run("", "verify", "--cal", bad.toString(), "--mass-g", "-5");
    assertThat(neg.exit()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(neg.err()).contains("--mass-g -5.0 is invalid");
  }
}
