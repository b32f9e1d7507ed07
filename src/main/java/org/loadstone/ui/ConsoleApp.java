package org.loadstone.ui;

import javafx.application.Application;
import javafx.scene.Scene;
import javafx.stage.Stage;

/** The JavaFX application: one window with the live pane. */
public final class ConsoleApp extends Application {
  private static volatile ConsoleConfig config;
  private LivePane live;

  /** Sets what the next launched console connects to. */
  public static void configure(ConsoleConfig c) {
    config = c;
  }

  static ConsoleConfig config() {
    ConsoleConfig c = config;
    if (c == null) {
      c = DefaultDevice.simulated();
      config = c;
    }
    return c;
  }

  @Override
  public void start(Stage stage) {
    live = new LivePane(config());
    Scene scene = new Scene(live.root(), 1280, 760);
    scene.getStylesheets().add(
        ConsoleApp.class.getResource("/org/loadstone/ui/console.css").toExternalForm());
    live.installKeys(scene);
    stage.setTitle("Loadstone — live");
    stage.setScene(scene);
    stage.setMinWidth(900);
    stage.setMinHeight(560);
    stage.show();
    live.root().requestFocus(); // so the Z, P, A and S keys work from the start
    live.connect();
  }

  @Override
  public void stop() {
    if (live != null) {
      live.disconnect();
    }
  }
}
