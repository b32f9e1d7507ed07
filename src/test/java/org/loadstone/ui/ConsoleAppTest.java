package org.loadstone.ui;

import org.loadstone.HangGuard;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import javafx.scene.control.Label;
import javafx.scene.control.TabPane;
import javafx.scene.input.KeyCode;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.loadstone.device.SimSetup;
import org.testfx.api.FxRobot;
import org.testfx.api.FxToolkit;
import org.testfx.util.WaitForAsyncUtils;

/** The whole console window: the Live and Archive tabs, and where the one-key commands act. */
class ConsoleAppTest extends FxRobot {
  private Path home;
  private javafx.application.Application app;

  @BeforeEach
  void open() throws Exception {
    home = Files.createTempDirectory("loadstone-console");
    ConsoleApp.configure(DefaultDevice.simulated(new SimSetup("brittle", 3, 1000, false, 2),
        home.resolve("runs"), home));
    FxToolkit.registerPrimaryStage();
    app = FxToolkit.setupApplication(ConsoleApp::new);
  }

  @AfterEach
  void close() throws Exception {
    FxToolkit.cleanupApplication(app);
    FxToolkit.cleanupStages();
  }

  private static javafx.scene.control.Tab tab(TabPane tabs, String id) {
    return tabs.getTabs().stream().filter(t -> id.equals(t.getId())).findFirst().orElseThrow();
  }

  @Test
  void oneKeyCommandsActOnTheLiveTabOnly() throws Exception {
    TabPane tabs = lookup(".console-tabs").queryAs(TabPane.class);
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> lookup("#health-line").queryAs(Label.class).getText().contains("samples/s"));
    interact(() -> tabs.getSelectionModel().select(tab(tabs, "archive-tab")));
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> lookup("#archive-status").queryAs(Label.class).getText().startsWith("no runs yet"));
    clickOn("#archive-status").type(KeyCode.A); // on the Archive tab: not a command
    WaitForAsyncUtils.waitForFxEvents();
    interact(() -> tabs.getSelectionModel().select(tab(tabs, "live-tab")));
    Label state = lookup("#run-state").queryAs(Label.class);
    assertThat(state.getText()).isEqualTo("NOT ARMED");
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> !lookup("#raw-value").queryAs(Label.class).getText().contains("zeroing"));
    interact(() -> lookup("#specimen-field").queryAs(javafx.scene.control.TextField.class)
        .setText("app-01"));
    clickOn("#force-value").type(KeyCode.A); // on the Live tab: arm
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> !state.getText().equals("NOT ARMED"));
    type(KeyCode.S);
    // stopped while armed or while recording: either nothing was stored, or a manual run was
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> {
      String text = lookup("#run-result").queryAs(Label.class).getText();
      return text.contains("no run stored") || text.contains(": manual");
    });
  }
}
