package org.loadstone.ui;

import org.loadstone.HangGuard;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicReference;
import javafx.scene.Scene;
import javafx.scene.control.Label;
import javafx.scene.control.TextArea;
import javafx.scene.control.TextField;
import javafx.stage.Stage;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.loadstone.acquire.DeviceReader;
import org.loadstone.acquire.SampleRing;
import org.loadstone.calibration.CalibrationFiles;
import org.loadstone.device.SimSetup;
import org.loadstone.sim.SimTruth;
import org.testfx.api.FxRobot;
import org.testfx.framework.junit5.ApplicationExtension;
import org.testfx.framework.junit5.Start;
import org.testfx.util.WaitForAsyncUtils;

/**
 * Calibrating in the console, in a real JavaFX scene (headless Monocle), on the simulated
 * dead-weight rig, which puts each planned mass on its cell; the simulator's ground truth is the
 * reference.
 */
@ExtendWith(ApplicationExtension.class)
class CalibratePaneTest {
  /** An HX711-class converter at 80 samples/s, run 20 times faster than real time. */
  private static final SimSetup RIG = new SimSetup("dead-weight", 1, 80, false, 20);
  private final AtomicReference<Path> used = new AtomicReference<>();
  private DeviceReader reader;
  private CalibratePane pane;
  private Path dir;

  @Start
  void start(Stage stage) throws Exception {
    dir = Files.createTempDirectory("loadstone-cal");
    reader = new DeviceReader(RIG.openTransport(), new SampleRing(1 << 20));
    reader.start();
    pane = new CalibratePane(() -> reader, used::set);
    Scene scene = new Scene(pane.root(), 1200, 760);
    scene.getStylesheets().add(
        CalibratePane.class.getResource("/org/loadstone/ui/console.css").toExternalForm());
    pane.installKeys(scene, () -> true);
    stage.setScene(scene);
    stage.show();
  }

  @AfterEach
  void stop() {
    WaitForAsyncUtils.asyncFx(() -> pane.close());
    reader.close();
  }

  @Test
  void walksThePlanFitsTheSimulatedSensitivityAndSavesIt(FxRobot robot) throws Exception {
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> reader.identity().isPresent());
    robot.interact(() -> {
      text(robot, "#cal-cell").setText("sim-cell");
      text(robot, "#cal-loads").setText("10 kg, 20 kg, 30 kg, 40 kg");
      text(robot, "#cal-folder").setText(dir.toString());
    });
    robot.clickOn("#cal-start");
    Label step = robot.lookup("#cal-step").queryAs(Label.class);
    Label message = robot.lookup("#cal-message").queryAs(Label.class);
    for (int i = 1; i <= 5; i++) {
      int n = i;
      WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
          () -> step.getText().startsWith("[" + n + "/5]"));
      if (n == 1) {
        // the session's rule, as on the command line: a zero step cannot be skipped
        assertThat(robot.lookup("#cal-skip").queryButton().isDisabled()).isTrue();
      }
      if (n == 3) {
        robot.clickOn("#cal-skip"); // 20 kg skipped: the session allows it for a load step
        WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> step.getText().startsWith("[4/5]"));
        continue;
      }
      if (n == 4) {
        // 10 kg was read already in this series, going up: the session refuses the repeat
        robot.interact(() -> text(robot, "#cal-placed").setText("10 kg"));
        robot.clickOn("#cal-step").type(javafx.scene.input.KeyCode.C);
        WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
            () -> message.getText().contains("already read in this series and direction"));
        assertThat(step.getText()).startsWith("[4/5]");
        robot.interact(() -> text(robot, "#cal-placed").clear());
      }
      robot.clickOn("#cal-step").type(javafx.scene.input.KeyCode.C); // capture once steady
      WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
          () -> !step.getText().startsWith("[" + n + "/5]"));
    }
    assertThat(step.getText()).isEqualTo("all readings taken: 4 points, 1 step(s) skipped");
    TextArea result = robot.lookup("#cal-result").queryAs(TextArea.class);
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> !result.getText().isEmpty());
    String fit = result.getText();
    // the simulator's own sensitivity (its ground truth) over the loads used, within 0.02 %: the
    // slope of the least-squares line through the model's noise-free readings (Commons Math
    // SimpleRegression; the loads span 40 % of the 1 kN cell, whose curvature lifts the slope
    // there), divided by the conventional air buoyancy factor 1 − 1.2/8000 the console applies
    // (standard gravity as the simulator's)
    SimTruth truth = RIG.buildFrame().truth();
    org.apache.commons.math3.stat.regression.SimpleRegression reg =
        new org.apache.commons.math3.stat.regression.SimpleRegression(true);
    for (double kg : new double[] {0, 10, 30, 40}) {
      double f = kg * truth.gravity_m_per_s2();
      reg.addData(f, truth.loadCell().idealCounts(f));
    }
    double expected = reg.getSlope() / (1 - 1.2 / 8000);
    java.util.regex.Matcher m =
        java.util.regex.Pattern.compile("Sensitivity ([0-9.]+) counts/N").matcher(fit);
    assertThat(m.find()).as(fit).isTrue();
    assertThat(Double.parseDouble(m.group(1))).isCloseTo(expected, within(0.0002 * expected));

    robot.clickOn("#cal-save");
    Path file = CalibrationFiles.fileFor(dir, "sim-cell-" + java.time.LocalDate.now());
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> Files.exists(file));
    assertThat(dir.resolve(file.getFileName().toString().replace(".json", ".points.csv")))
        .exists();
    assertThat(CalibrationFiles.readCalibration(file).cellId()).isEqualTo("sim-cell");
    robot.clickOn("#cal-use");
    WaitForAsyncUtils.waitForFxEvents();
    assertThat(used.get()).isEqualTo(file);
  }

  @Test
  void aPlanThatCannotBeReadIsRefusedWithTheReason(FxRobot robot) {
    robot.interact(() -> {
      text(robot, "#cal-cell").setText("sim-cell");
      text(robot, "#cal-loads").setText("10 kg, ten kilos");
    });
    robot.clickOn("#cal-start");
    WaitForAsyncUtils.waitForFxEvents();
    assertThat(robot.lookup("#cal-message").queryAs(Label.class).getText())
        .contains("weight 2").contains("ten kilos");
    assertThat(robot.lookup("#cal-step").queryAs(Label.class).getText())
        .isEqualTo("set the plan, then Start");
  }

  private static TextField text(FxRobot robot, String id) {
    return robot.lookup(id).queryAs(TextField.class);
  }
}
