package org.loadstone.ui;

import org.loadstone.HangGuard;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import javafx.scene.Scene;
import javafx.scene.control.Label;
import javafx.stage.Stage;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.loadstone.device.SimSetup;
import org.testfx.api.FxRobot;
import org.testfx.framework.junit5.ApplicationExtension;
import org.testfx.framework.junit5.Start;
import org.testfx.util.WaitForAsyncUtils;

/** The live window in a real JavaFX scene (headless Monocle), on the simulated frame. */
@ExtendWith(ApplicationExtension.class)
class LivePaneTest {
  private LivePane pane;
  private Path home;
  private Path archive;

  @Start
  void start(Stage stage) throws Exception {
    home = Files.createTempDirectory("loadstone-home");
    SimSetup sim = new SimSetup("brittle", 3, 1000, false, 1);
    archive = home.resolve("runs");
    // a zero check so strict that the noise between two tares passes it: every run warns
    ConsoleConfig config = DefaultDevice.simulated(sim, archive, home, 1e-9);
    pane = new LivePane(config);
    Scene scene = new Scene(pane.root(), 1100, 700);
    scene.getStylesheets().add(
        LivePane.class.getResource("/org/loadstone/ui/console.css").toExternalForm());
    pane.installKeys(scene);
    stage.setScene(scene);
    stage.show();
    // a specimen id, as an operator types before arming (an empty one is refused)
    ((javafx.scene.control.TextField) pane.root().lookup("#specimen-field")).setText("gui-00");
    pane.connect().get(HangGuard.S, TimeUnit.SECONDS);
  }

  @AfterEach
  void stop() throws Exception {
    WaitForAsyncUtils.asyncFx(() -> pane.disconnect()).get(HangGuard.S, TimeUnit.SECONDS)
        .get(HangGuard.S, TimeUnit.SECONDS);
  }

  @Test
  void showsLiveForceAndDrawsTheCurve(FxRobot robot) throws Exception {
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> pane.chart().pointCount() > 20);
    Label force = robot.lookup("#force-value").queryAs(Label.class);
    assertThat(force.getText()).matches("-?[0-9]+(\\.[0-9]+)?");
    Label health = robot.lookup("#health-line").queryAs(Label.class);
    assertThat(health.getText()).contains("dropped 0").contains("checksum errors 0");
    Label peak = robot.lookup("#peak-value").queryAs(Label.class);
    assertThat(peak.getText()).startsWith("peak ").endsWith(" N");
  }

  @Test
  void safetyNoticeShownUntilAcknowledged(FxRobot robot) {
    assertThat(robot.lookup("#safety-banner").tryQuery()).isPresent();
    assertThat(robot.lookup("#safety-text").queryAs(Label.class).getText())
        .contains("eye protection").contains("rated capacity");
    robot.clickOn("#safety-ack");
    WaitForAsyncUtils.waitForFxEvents();
    assertThat(robot.lookup("#safety-banner").tryQuery()).isEmpty();
    assertThat(new SafetyNotice(home).needed()).isFalse();
  }

  @Test
  void zeroOnConnectFindsTheCellsZeroOffset(FxRobot robot) throws Exception {
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> pane.chart().pointCount() > 5);
    // before the crosshead closes the gap the cell is unloaded, so the tare is its zero offset
    // plus the simulated amplifier's warm-up and drift over the first 20 samples (its own truth)
    var frame = new SimSetup("brittle", 3, 1000, false, 1).buildFrame();
    for (int i = 0; i < 20; i++) {
      frame.next();
    }
    double expected = frame.truth().loadCell().zeroOffset_counts() + frame.lastZeroShift_counts();
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> !pane.feed().taring());
    assertThat(pane.feed().zeroCounts()).isCloseTo(expected, org.assertj.core.data.Offset.offset(50.0));
    robot.type(javafx.scene.input.KeyCode.Z);
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> !pane.feed().taring());
  }

  @Test
  void armedRunStopsAtTheBreakAndIsStored(FxRobot robot) throws Exception {
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> !pane.feed().taring());
    // the simulated specimen is loaded from about 1 s and breaks after about 11 s of device
    // time (real time here, so a busy machine still arms before the break)
    robot.interact(() -> {
      robot.lookup("#specimen-field").queryAs(javafx.scene.control.TextField.class).setText("gui-01");
      robot.lookup("#group-field").queryAs(javafx.scene.control.TextField.class).setText("test");
      robot.lookup("#mass-field").queryAs(javafx.scene.control.TextField.class).setText("37,5");
      robot.lookup("#span-field").queryAs(javafx.scene.control.TextField.class).setText("200");
      robot.lookup("#width-field").queryAs(javafx.scene.control.TextField.class).setText("50");
      robot.lookup("#depth-field").queryAs(javafx.scene.control.TextField.class).setText("12");
    });
    robot.clickOn("#specimen-field").type(javafx.scene.input.KeyCode.ENTER); // Enter arms
    // no look at the passing states (armed, recording): a busy machine may pass them unseen;
    // the stored run named in the result line is the proof that Enter armed
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> pane.runResult().getText().startsWith("run "));
    assertThat(pane.runResult().getText()).contains(": break").contains("gui-01");
    java.nio.file.Path csv;
    try (var files = java.nio.file.Files.list(archive)) {
      csv = files.filter(f -> f.getFileName().toString().endsWith("gui-01.csv")).findFirst()
          .orElseThrow();
    }
    // the post-run figures are the archive's analysis of the stored run
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> robot.lookup("#figure-stiffness").tryQuery().isPresent());
    // the wait looks from this thread while the FX thread may still be adding the other figures
    // in the same step: let that step finish before reading them
    WaitForAsyncUtils.waitForFxEvents();
    var run = org.loadstone.archive.RunReader.read(csv);
    var m = org.loadstone.study.RunMetrics.of(run.metadata(), run.data());
    assertThat(robot.lookup("#figure-peak").queryAs(Label.class).getText())
        .isEqualTo(RunFigures.fmt(m.analysis().peakForce_N(), "N"));
    assertThat(robot.lookup("#figure-stiffness").queryAs(Label.class).getText())
        .isEqualTo(RunFigures.fmt(m.analysis().stiffness_N_per_mm().getAsDouble(), "N/mm"));
    assertThat(robot.lookup("#figure-energy").queryAs(Label.class).getText())
        .isEqualTo(RunFigures.fmt(m.analysis().energyToBreak_J().getAsDouble(), "J"));
    assertThat(run.metadata().mass_g()).isEqualTo(37.5);
    assertThat(robot.lookup("#figure-per-gram").queryAs(Label.class).getText())
        .isEqualTo(RunFigures.fmt(m.analysis().peakForce_N() / 37.5, "N/g"));
    assertThat(run.metadata().geometry().span_mm()).isEqualTo(200.0);
    assertThat(run.metadata().testType()).isEqualTo(org.loadstone.archive.TestType.THREE_POINT_BEND);
    // flexural stress at peak 3PL/(2bd²) (ASTM D790), from the sizes typed
    double sigma = 3 * m.analysis().peakForce_N() * 200 / (2 * 50 * 12.0 * 12.0);
    assertThat(m.flexuralStressAtPeak_MPa().getAsDouble())
        .isCloseTo(sigma, org.assertj.core.data.Offset.offset(1e-9));
    assertThat(robot.lookup("#figure-flexural-stress").queryAs(Label.class).getText())
        .isEqualTo(RunFigures.fmt(sigma, "MPa"));
  }

  @Test
  void plotsForceAgainstCrossheadTravelOnX(FxRobot robot) throws Exception {
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> pane.chart().pointCount() > 20);
    assertThat(pane.chart().xAxis()).isEqualTo(ForceChart.TIME);
    robot.clickOn("#force-chart");
    robot.type(javafx.scene.input.KeyCode.X);
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> pane.chart().xAxis().equals(ForceChart.TRAVEL) && pane.chart().pointCount() > 5);
    assertThat(robot.lookup("#plot-axis-button").queryAs(javafx.scene.control.Button.class)
        .getText()).contains("time");
  }

  @Test
  void aCalibrationChosenInTheConsoleScalesTheForceAndTheNextRun(FxRobot robot) throws Exception {
    Path file = Path.of("calibration", "shelf-rig-500N-2026-12-02.json");
    var choice = org.loadstone.acquire.ScaleChoice.fromCalibration(file, java.time.LocalDate.now());
    robot.interact(() -> pane.useCalibration(file));
    assertThat(robot.lookup("#device-line").queryAs(Label.class).getText())
        .contains(choice.description());
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> !pane.feed().taring());
    robot.clickOn("#arm-button");
    // the calibration's warnings are shown once the run is set up (zeroed and armed): the
    // example calibration is of a 500 N cell; the simulated frame reports its 1 kN cell
    String mismatch = "calibration " + choice.calibrationId()
        + " was made for load cell shelf-rig-500N but the device reports cell shelf-rig-1kN";
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> pane.runResult().getText().contains(mismatch));
    // the brittle specimen loads and breaks by itself (whatever the calibration makes of it)
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> pane.runResult().getText().startsWith("run "));
    try (var files = Files.list(archive)) {
      Path json = files.filter(f -> f.toString().endsWith(".json")).findFirst().orElseThrow();
      var meta = org.loadstone.archive.RunReader.readMetadata(json);
      assertThat(meta.calibrationId()).isEqualTo(choice.calibrationId());
      // the console's runs are set up by the same service as the command line's: the rate the
      // device stated, the zero check against the connect-time tare, the simulated specimen's
      // sizes where none were typed
      assertThat(meta.sampleRateSource()).isEqualTo("identity");
      assertThat(meta.sampleRate_Hz()).isEqualTo(1000.0);
      assertThat(meta.warnings()).anySatisfy(w -> assertThat(w).startsWith("zero check: "));
      var bar = new SimSetup("brittle", 3, 1000, false, 1).buildFrame().truth().specimen().beam();
      assertThat(meta.geometry().span_mm()).isEqualTo(bar.span_mm());
      assertThat(meta.geometry().depth_mm()).isEqualTo(bar.depth_mm());
      assertThat(meta.notes()).contains(org.loadstone.acquire.SimulatedSpecimen.NOTE);
    }
  }

  @Test
  void aSizeOrMassThatIsNotANumberIsRefusedBeforeArming(FxRobot robot) throws Exception {
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> !pane.feed().taring());
    refusedBeforeArming(robot, "#depth-field", "-12", "depth '-12'", "mm");
    refusedBeforeArming(robot, "#depth-field", "", null, null);
    refusedBeforeArming(robot, "#mass-field", "41.2g", "mass '41.2g'", "grams");
  }

  /** Fires a key at the window, as the keyboard would, on the JavaFX thread. */
  private void press(javafx.scene.input.KeyCode code) {
    javafx.event.Event.fireEvent(pane.root(), new javafx.scene.input.KeyEvent(
        javafx.scene.input.KeyEvent.KEY_PRESSED, "", "", code, false, false, false, false));
  }

  private String runState(FxRobot robot) {
    return robot.lookup("#run-state").queryAs(Label.class).getText();
  }

  /**
   * Whether a run was armed: armed now or any state after it (recording, the tail, finishing,
   * stored), so a wait polled late on a busy machine does not miss a run that went on.
   */
  private boolean armedOrLater(FxRobot robot) {
    String state = runState(robot);
    return !state.equals("ARMING…") && !state.equals("NOT ARMED")
        || pane.runResult().getText().startsWith("run ");
  }

  @Test
  void armPressedWhileZeroingIsQueuedAndArmsOnceTheZeroIsDone(FxRobot robot) throws Exception {
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> !pane.feed().taring());
    // a zero and A in the same step on the JavaFX thread: A certainly lands while zeroing
    String[] seen = new String[2];
    robot.interact(() -> {
      pane.feed().tare(2000);
      press(javafx.scene.input.KeyCode.A);
      seen[0] = org.loadstone.acquire.StationStatus.of(new org.loadstone.acquire.StationStatus
          .Stream(org.loadstone.acquire.StationStatus.Link.LIVE, null, 1, 0, 0, 0),
          pane.run().status()).words();
      seen[1] = String.valueOf(pane.feed().taring());
    });
    assertThat(seen[1]).isEqualTo("true");
    assertThat(seen[0]).isEqualTo("ARMING…");
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> armedOrLater(robot));
    assertThat(pane.feed().taring()).isFalse();
  }

  @Test
  void keysActAfterTheSafetyBanner(FxRobot robot) throws Exception {
    robot.clickOn("#safety-ack");
    WaitForAsyncUtils.waitForFxEvents();
    robot.type(javafx.scene.input.KeyCode.A); // the keyboard, to whatever has the focus
    WaitForAsyncUtils.waitForFxEvents();
    var specimen = robot.lookup("#specimen-field").queryAs(javafx.scene.control.TextField.class);
    assertThat(specimen.getText()).isEqualTo("gui-00"); // not typed into the specimen field
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> armedOrLater(robot));
  }

  @Test
  void zeroAndClearPeakAreRefusedWhileARunIsArmedAndEscStops(FxRobot robot) throws Exception {
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> !pane.feed().taring());
    robot.clickOn("#arm-button");
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> runState(robot).startsWith("ARMED") || runState(robot).equals("RECORDING"));
    boolean[] taring = new boolean[1];
    String[] result = new String[2];
    robot.interact(() -> {
      press(javafx.scene.input.KeyCode.Z);
      taring[0] = pane.feed().taring();
      result[0] = pane.runResult().getText();
      press(javafx.scene.input.KeyCode.P);
      result[1] = pane.runResult().getText();
    });
    assertThat(taring[0]).isFalse(); // the zero the run is measured from stays
    assertThat(result[0]).contains("zero refused").contains("stop it first");
    assertThat(result[1]).contains("clear peak refused");
    // Esc stops from anywhere, even from inside a text field
    robot.clickOn("#group-field").type(javafx.scene.input.KeyCode.ESCAPE);
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> !runState(robot).startsWith("ARMED")
        && !runState(robot).equals("RECORDING") && !runState(robot).startsWith("BREAK"));
  }

  @Test
  void aStoppedStreamShowsNoDataAndAStateBandFitsAt1024x640(FxRobot robot) throws Exception {
    WaitForAsyncUtils.waitFor(10, TimeUnit.SECONDS, () -> pane.reader().lastArrivalNanos() > 0);
    String[] seen = new String[4];
    robot.interact(() -> {
      long last = pane.reader().lastArrivalNanos();
      pane.refresh(last + 1_000_000_000L); // the injected clock: one second without a sample
      seen[0] = runState(robot);
      seen[1] = String.valueOf(robot.lookup("#force-value").queryAs(Label.class)
          .getStyleClass().contains("stale"));
      seen[2] = robot.lookup("#health-line").queryAs(Label.class).getText();
      seen[3] = pane.band().tone().name();
    });
    assertThat(seen[0]).isEqualTo("NO DATA");
    assertThat(seen[1]).isEqualTo("true");
    assertThat(seen[2]).startsWith("0.0 samples/s");
    assertThat(seen[3]).isEqualTo("FAULT");
    // the band, the state and arm/stop stay in view at 1024×640, safety banner shown
    robot.interact(() -> {
      pane.root().getScene().getWindow().setWidth(1024);
      pane.root().getScene().getWindow().setHeight(640);
    });
    WaitForAsyncUtils.waitForFxEvents();
    javafx.scene.Scene scene = pane.root().getScene();
    for (String id : new String[] {"#run-state", "#arm-button", "#stop-button", "#state-band"}) {
      javafx.geometry.Bounds b = robot.lookup(id).query().localToScene(
          robot.lookup(id).query().getBoundsInLocal());
      assertThat(b.getMinX()).as(id).isGreaterThanOrEqualTo(0);
      assertThat(b.getMinY()).as(id).isGreaterThanOrEqualTo(0);
      assertThat(b.getMaxX()).as(id).isLessThanOrEqualTo(scene.getWidth() + 0.5);
      assertThat(b.getMaxY()).as(id).isLessThanOrEqualTo(scene.getHeight() + 0.5);
    }
  }

  /** Types {@code text} into a field and arms: refused with a message naming the field. */
  private void refusedBeforeArming(FxRobot robot, String field, String text, String names,
      String unit) {
    robot.interact(() -> robot.lookup(field)
        .queryAs(javafx.scene.control.TextField.class).setText(text));
    if (names == null) {
      return; // cleared, for the next case
    }
    robot.clickOn("#arm-button");
    WaitForAsyncUtils.waitForFxEvents();
    assertThat(pane.runResult().getText()).contains(names).contains(unit);
    assertThat(robot.lookup("#run-state").queryAs(Label.class).getText()).isEqualTo("NOT ARMED");
  }
}
