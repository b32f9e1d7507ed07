package org.loadstone.ui;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import javafx.scene.Scene;
import javafx.scene.control.TextField;
import javafx.scene.input.KeyCode;
import javafx.stage.Stage;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.loadstone.HangGuard;
import org.loadstone.acquire.StationStatus;
import org.loadstone.device.SimSetup;
import org.testfx.api.FxRobot;
import org.testfx.framework.junit5.ApplicationExtension;
import org.testfx.framework.junit5.Start;
import org.testfx.util.WaitForAsyncUtils;

/** The run form at the press: ids one after another, nothing retyped after a restart. */
@ExtendWith(ApplicationExtension.class)
class RunFormTest {
  private LivePane pane;
  private ConsoleConfig config;

  @Start
  void start(Stage stage) throws Exception {
    Path home = Files.createTempDirectory("loadstone-form");
    config = DefaultDevice.simulated(new SimSetup("brittle", 3, 1000, false, 4),
        home.resolve("runs"), home, null);
    pane = new LivePane(config);
    Scene scene = new Scene(pane.root(), 1100, 700);
    pane.installKeys(scene);
    stage.setScene(scene);
    stage.show();
    pane.connect().get(HangGuard.S, TimeUnit.SECONDS);
  }

  @AfterEach
  void stop() throws Exception {
    WaitForAsyncUtils.asyncFx(() -> pane.disconnect()).get(HangGuard.S, TimeUnit.SECONDS)
        .get(HangGuard.S, TimeUnit.SECONDS);
  }

  private static TextField field(FxRobot robot, String id) {
    return robot.lookup("#" + id).queryAs(TextField.class);
  }

  @Test
  void anEmptyIdIsRefusedAtTheFieldInsteadOfAMadeUpOne(FxRobot robot) throws Exception {
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> !pane.feed().taring());
    robot.interact(() -> pane.root().requestFocus());
    robot.type(KeyCode.A);
    WaitForAsyncUtils.waitForFxEvents();
    assertThat(pane.runResult().getText()).contains("type the specimen's id");
    assertThat(pane.run().status().phase()).isEqualTo(StationStatus.Phase.NONE);
    assertThat(field(robot, "specimen-field").isFocused()).as("the cursor waits in the id field")
        .isTrue();
  }

  @Test
  void afterARunTheNextIdIsFilledInARepeatIsNotedAndTheFormSurvivesARestart(FxRobot robot)
      throws Exception {
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> !pane.feed().taring());
    robot.interact(() -> {
      field(robot, "specimen-field").setText("P-07");
      field(robot, "group-field").setText("foam");
      field(robot, "mass-field").setText("40,5");
      field(robot, "span-field").setText("200");
      pane.run().arm();
    });
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> pane.runResult().getText().startsWith("run "));
    WaitForAsyncUtils.waitForFxEvents();
    assertThat(field(robot, "specimen-field").getText()).isEqualTo("P-08");

    // a console started again on the same home carries on with the batch
    Path home = config.home();
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> "P-08".equals(new FormMemory(home).last().get("specimen")));
    java.util.Map<String, String> restored = WaitForAsyncUtils.asyncFx(
        () -> new LivePane(config).run().form().values()).get(HangGuard.S, TimeUnit.SECONDS);
    assertThat(restored).containsEntry("specimen", "P-08").containsEntry("group", "foam")
        .containsEntry("mass_g", "40,5").containsEntry("span_mm", "200")
        .containsEntry("test_type", "three-point");

    // the same id again: armed, with a note that it was tested before
    robot.interact(() -> {
      field(robot, "specimen-field").setText("P-07");
      pane.run().arm();
    });
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> pane.runResult().getText().contains("was tested before"));
    assertThat(pane.runResult().getText()).contains("P-07").contains("stored beside it");
    robot.interact(() -> pane.run().stop());
  }
}
