package org.loadstone.ui;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.TimeUnit;
import java.util.function.BooleanSupplier;
import javafx.application.Platform;
import javafx.embed.swing.SwingFXUtils;
import javafx.event.Event;
import javafx.scene.Scene;
import javafx.scene.control.Label;
import javafx.scene.control.TabPane;
import javafx.scene.input.KeyCode;
import javafx.scene.input.KeyEvent;
import javafx.scene.layout.VBox;
import javafx.stage.Stage;
import javax.imageio.ImageIO;
import org.loadstone.acquire.StationStatus;
import org.loadstone.device.SimSetup;

/**
 * The README's screenshots, taken from the real console on the simulated frame (run by
 * {@code .ci/screenshots} under a virtual display): the Live workspace after a panel broke, the
 * Calibrate workspace, the Archive workspace on the demo runs in the light look, and the state
 * band in each of its states. Not a test: it checks nothing, it only shows.
 *
 * <p>Usage: {@code ScreenTour OUT_FOLDER DEMO_ARCHIVE}
 */
public final class ScreenTour {
  private ScreenTour() {}

  static final int WIDTH = 1280;
  static final int HEIGHT = 800;

  public static void main(String[] args) throws Exception {
    Path out = Path.of(args[0]);
    Path demo = Path.of(args[1]);
    Files.createDirectories(out);
    Path home = Files.createTempDirectory("loadstone-tour");
    Files.writeString(home.resolve("safety-acknowledged"), "shown in the README\n");
    Path archive = home.resolve("runs");
    Files.createDirectories(archive);
    try (var files = Files.list(demo)) {
      for (Path f : (Iterable<Path>) files::iterator) {
        if (Files.isRegularFile(f)) {
          Files.copy(f, archive.resolve(f.getFileName()));
        }
      }
    }
    ConsoleApp.configure(DefaultDevice.simulated(new SimSetup("panel-foam", 7, 80, false, 3),
        archive, home));
    CompletableFuture<Void> started = new CompletableFuture<>();
    Platform.startup(() -> started.complete(null));
    started.get(60, TimeUnit.SECONDS);
    Stage[] stage = new Stage[1];
    ConsoleApp app = new ConsoleApp();
    FxPulse pulse = new FxPulse();
    pulse.phase("connect (window shown, port opened, first samples)");
    fx(() -> {
      stage[0] = new Stage();
      app.start(stage[0]);
      stage[0].setWidth(WIDTH);
      stage[0].setHeight(HEIGHT);
    });
    Scene scene = stage[0].getScene();
    TabPane tabs = (TabPane) scene.lookup(".console-tabs");

    // Live: a foam panel loaded to its break, the figures shown
    waitFor("live samples", () -> text(scene, "#health-line").contains("samples/s"));
    pulse.phase("live, idle");
    waitFor("the zero", () -> !text(scene, "#raw-value").contains("zeroing"));
    pulse.phase("a run: armed, recorded, stored, figures read back");
    fx(() -> {
      ((javafx.scene.control.TextField) scene.lookup("#specimen-field")).setText("foam-06");
      ((javafx.scene.control.TextField) scene.lookup("#group-field")).setText("foam");
      scene.getRoot().requestFocus();
      Event.fireEvent(scene.getRoot(), new KeyEvent(KeyEvent.KEY_PRESSED, "a", "a", KeyCode.A,
          false, false, false, false));
    });
    waitFor("the break", () -> text(scene, "#run-state").startsWith("STORED"));
    Thread.sleep(1500); // the post-run figures are read back from the archive (a picture only)
    pulse.phase("screenshot");
    shoot(scene, out.resolve("live.png"));

    fx(() -> tabs.getSelectionModel().select(1));
    Thread.sleep(800);
    shoot(scene, out.resolve("calibrate.png"));

    pulse.phase("archive: 15 runs read and drawn, look changed");
    fx(() -> {
      tabs.getSelectionModel().select(2);
      ((javafx.scene.control.Button) scene.lookup("#look-theme")).fire(); // the light look
    });
    waitFor("the archive", () -> text(scene, "#archive-status").contains("counted"));
    fx(() -> ((javafx.scene.control.CheckBox) scene.lookup("#archive-include-uncalibrated"))
        .fire()); // the demo runs used the simulated cell's nominal scale
    Thread.sleep(1500);
    pulse.phase("screenshot");
    shoot(scene, out.resolve("archive-light.png"));
    pulse.phase("a group report written (PDF)");
    fx(() -> ((javafx.scene.control.Button) scene.lookup("#archive-report")).fire());
    waitFor("the report", () -> text(scene, "#archive-status").startsWith("report written")
        || text(scene, "#archive-status").startsWith("no report"));
    System.out.println(text(scene, "#archive-status"));
    pulse.phase("disconnect");
    java.lang.reflect.Field f = ConsoleApp.class.getDeclaredField("live");
    f.setAccessible(true);
    LivePane live = (LivePane) f.get(app);
    CompletableFuture<?>[] closed = new CompletableFuture<?>[1];
    fx(() -> closed[0] = live.disconnect());
    closed[0].get(60, TimeUnit.SECONDS);
    Thread.sleep(300);
    pulse.phase("connect again");
    fx(live::connect);
    waitFor("live samples again", () -> text(scene, "#health-line").contains("samples/s"));
    pulse.phase("screenshot");

    // the state band in each state, in the dark look
    fx(() -> {
      ((javafx.scene.control.Button) scene.lookup("#look-theme")).fire();
      Stage bands = new Stage();
      VBox all = new VBox(4);
      all.getStyleClass().add("console");
      for (StationStatus.View v : states()) {
        StateBand b = new StateBand(new javafx.scene.layout.HBox());
        b.show(v);
        all.getChildren().add(b.node());
      }
      Scene s = new Scene(all, 900, -1);
      new Look(null).install(s);
      bands.setScene(s);
      bands.show();
      stage[0].setUserData(s);
    });
    Thread.sleep(800);
    shoot((Scene) stage[0].getUserData(), out.resolve("state-band.png"));
    pulse.close();
    System.out.println(pulse.table());
    Files.writeString(Path.of("target/fx-stalls.md"), pulse.table());
    fx(() -> app.stop());
    Platform.exit();
    System.exit(0);
  }

  /** One view per state the band shows, as {@code StationStatus.of} words them. */
  static List<StationStatus.View> states() {
    long now = 10_000_000_000L;
    StationStatus.Stream live = new StationStatus.Stream(StationStatus.Link.LIVE, null, 5000,
        now, now, 80);
    java.util.List<StationStatus.View> v = new java.util.ArrayList<>();
    v.add(StationStatus.of(live, StationStatus.Run.NONE));
    v.add(StationStatus.of(live, new StationStatus.Run(StationStatus.Phase.ARMED, null, null, 5)));
    v.add(StationStatus.of(live, new StationStatus.Run(StationStatus.Phase.RECORDING, null, null,
        5)));
    v.add(StationStatus.of(live, new StationStatus.Run(StationStatus.Phase.STORED,
        org.loadstone.archive.FinishCause.BREAK, null, 5)));
    v.add(StationStatus.of(live, new StationStatus.Run(StationStatus.Phase.STORED,
        org.loadstone.archive.FinishCause.OVERLOAD, null, 5)));
    v.add(StationStatus.of(new StationStatus.Stream(StationStatus.Link.LIVE, null, 5000,
        now - 3_000_000_000L, now, 80), StationStatus.Run.NONE));
    v.add(StationStatus.of(new StationStatus.Stream(StationStatus.Link.LOST, "the port closed",
        5000, now, now, 80), StationStatus.Run.NONE));
    return v;
  }

  private static String text(Scene s, String id) {
    Label[] l = new Label[1];
    String[] t = new String[1];
    fx(() -> {
      l[0] = (Label) s.lookup(id);
      t[0] = l[0] == null ? "" : l[0].getText();
    });
    return t[0];
  }

  private static void waitFor(String what, BooleanSupplier done) throws InterruptedException {
    for (int i = 0; i < 1800; i++) {
      if (done.getAsBoolean()) {
        return;
      }
      Thread.sleep(100);
    }
    throw new IllegalStateException("the tour waited three minutes for " + what);
  }

  private static void shoot(Scene s, Path file) throws IOException {
    BufferedImage[] img = new BufferedImage[1];
    fx(() -> img[0] = SwingFXUtils.fromFXImage(s.snapshot(null), null));
    BufferedImage rgb = new BufferedImage(img[0].getWidth(), img[0].getHeight(),
        BufferedImage.TYPE_INT_RGB);
    rgb.getGraphics().drawImage(img[0], 0, 0, null);
    ImageIO.write(rgb, "png", file.toFile());
    System.out.println(file + " " + Files.size(file) / 1024 + " KB");
  }

  private static void fx(Runnable r) {
    CompletableFuture<Void> done = new CompletableFuture<>();
    Platform.runLater(() -> {
      try {
        r.run();
        done.complete(null);
      } catch (Throwable t) {
        done.completeExceptionally(t);
      }
    });
    try {
      done.get(60, TimeUnit.SECONDS);
    } catch (Exception e) {
      throw new IllegalStateException(e);
    }
  }
}
