package org.loadstone.ui;

import javafx.application.Application;
import javafx.scene.Scene;
import javafx.scene.control.Tab;
import javafx.scene.control.TabPane;
import javafx.stage.Stage;

/** The JavaFX application: one window with the live pane, calibration and archive review as tabs. */
public final class ConsoleApp extends Application {
  private static volatile ConsoleConfig config;
  private LivePane live;
  private CalibratePane calibrate;

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
    // slow work on the window's thread freezes the readout at the press: report any that slips in
    org.loadstone.units.SlowWork.guard(Thread.currentThread(),
        what -> System.err.println("console: " + what + " ran on the window's thread"));
    ConsoleConfig c = config();
    live = new LivePane(c);
    ArchivePane archive = new ArchivePane(c.archive());
    calibrate = new CalibratePane(live::reader, file -> live.useCalibration(file));
    Tab liveTab = new Tab("Live", live.root());
    Tab calibrateTab = new Tab("Calibrate", calibrate.root());
    Tab archiveTab = new Tab("Archive", archive.root());
    liveTab.setId("live-tab");
    calibrateTab.setId("calibrate-tab");
    archiveTab.setId("archive-tab");
    TabPane tabs = new TabPane(liveTab, calibrateTab, archiveTab);
    tabs.setTabClosingPolicy(TabPane.TabClosingPolicy.UNAVAILABLE);
    tabs.getStyleClass().add("console-tabs");
    archiveTab.setOnSelectionChanged(e -> {
      if (archiveTab.isSelected()) {
        archive.reload(); // runs stored since it was last looked at
      }
    });
    Look look = new Look(c.home()); // dark or light and the text size, as last chosen
    Scene scene = new Scene(look.withControls(tabs), 1280, 800);
    look.install(scene);
    live.installKeys(scene, liveTab::isSelected);
    calibrate.installKeys(scene, calibrateTab::isSelected);
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
    org.loadstone.units.SlowWork.unguard(); // the window is closing: waiting is fine now
    if (calibrate != null) {
      calibrate.close();
    }
    if (live != null) {
      try {
        // the device is told to stop streaming and a run in progress is stored before exit
        live.disconnect().get(30, java.util.concurrent.TimeUnit.SECONDS);
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
      } catch (java.util.concurrent.ExecutionException
          | java.util.concurrent.TimeoutException e) {
        System.err.println("console: the device did not close cleanly: " + e.getMessage());
      }
    }
  }
}
