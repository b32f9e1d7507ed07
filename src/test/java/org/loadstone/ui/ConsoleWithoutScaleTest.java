package org.loadstone.ui;

import org.loadstone.HangGuard;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
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

/**
 * The console on a device with no calibration and no nominal sensitivity (a real board as the
 * console sees one, played by the simulator's bytes): the live view shows counts, and arming is
 * refused by the run set-up's scale policy, with where in the console to fix it.
 */
@ExtendWith(ApplicationExtension.class)
class ConsoleWithoutScaleTest {
  private LivePane pane;
  private Path archive;

  @Start
  void start(Stage stage) throws Exception {
    Path home = Files.createTempDirectory("loadstone-home");
    archive = home.resolve("runs");
    SimSetup sim = new SimSetup("brittle", 3, 1000, false, 1);
    pane = new LivePane(new ConsoleConfig("/dev/ttyTEST", sim::openTransport, null, null, null,
        null, archive, Map.of(), home));
    stage.setScene(new Scene(pane.root(), 1100, 700));
    stage.show();
    // a specimen id, as an operator types before arming (an empty one is refused)
    ((javafx.scene.control.TextField) pane.root().lookup("#specimen-field")).setText("cal-00");
    pane.connect().get(HangGuard.S, TimeUnit.SECONDS);
  }

  @AfterEach
  void stop() throws Exception {
    WaitForAsyncUtils.asyncFx(() -> pane.disconnect()).get(HangGuard.S, TimeUnit.SECONDS)
        .get(HangGuard.S, TimeUnit.SECONDS);
  }

  @Test
  void armingIsRefusedUntilACalibrationIsChosen(FxRobot robot) throws Exception {
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> !pane.feed().taring());
    assertThat(robot.lookup("#device-line").queryAs(Label.class).getText())
        .contains("no calibration chosen");
    robot.clickOn("#arm-button");
    WaitForAsyncUtils.waitForFxEvents();
    assertThat(pane.runResult().getText())
        .startsWith("no calibration is chosen for /dev/ttyTEST")
        .contains("(in the console: Calibrate tab");
    assertThat(robot.lookup("#run-state").queryAs(Label.class).getText()).isEqualTo("NOT ARMED");
    assertThat(Files.exists(archive) ? Files.list(archive).count() : 0L).isZero();
  }
}
