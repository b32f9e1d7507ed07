package org.loadstone.ui;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicReference;
import javafx.scene.Scene;
import javafx.scene.control.Label;
import javafx.scene.control.TextField;
import javafx.scene.layout.VBox;
import javafx.stage.Stage;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.loadstone.HangGuard;
import org.loadstone.device.SimSetup;
import org.loadstone.units.SlowWork;
import org.testfx.api.FxRobot;
import org.testfx.framework.junit5.ApplicationExtension;
import org.testfx.framework.junit5.Start;
import org.testfx.util.WaitForAsyncUtils;

/**
 * The console's window thread never does the slow work — opening the port, waiting for threads
 * to end, reading and analysing runs, writing reports: the core announces such work ({@link
 * SlowWork}) and the window thread is guarded here, so the proof holds on any machine, however
 * busy, without measuring time.
 */
@ExtendWith(ApplicationExtension.class)
class WindowThreadTest {
  private LivePane live;
  private ArchivePane archive;
  private Path folder;
  private CompletableFuture<Void> connected;

  @Start
  void start(Stage stage) throws Exception {
    SlowWork.clearSeen();
    SlowWork.guard(Thread.currentThread(), what -> { });
    Path home = Files.createTempDirectory("loadstone-window");
    folder = home.resolve("runs");
    live = new LivePane(DefaultDevice.simulated(new SimSetup("brittle", 3, 1000, false, 1),
        folder, home, null));
    archive = new ArchivePane(folder);
    stage.setScene(new Scene(new VBox(live.root(), archive.root()), 1100, 900));
    stage.show();
    connected = live.connect(); // returns at once: the port opens on the link thread
  }

  @AfterEach
  void stop() throws Exception {
    SlowWork.unguard();
    WaitForAsyncUtils.asyncFx(() -> live.disconnect()).get(HangGuard.S, TimeUnit.SECONDS)
        .get(HangGuard.S, TimeUnit.SECONDS);
  }

  @Test
  void connectRunFinishDisconnectArchiveAndReportLeaveTheWindowThreadFree(FxRobot robot)
      throws Exception {
    connected.get(HangGuard.S, TimeUnit.SECONDS);
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> live.feed() != null && !live.feed().taring());
    robot.interact(() -> {
      robot.lookup("#specimen-field").queryAs(TextField.class).setText("W-01");
      robot.lookup("#group-field").queryAs(TextField.class).setText("foam");
      robot.lookup("#mass-field").queryAs(TextField.class).setText("40");
      live.run().arm();
    });
    // the run stops at the break, is stored and analysed, and its figures are shown
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> live.runResult().getText().startsWith("run "));
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> robot.lookup("#figure-peak").tryQuery().isPresent());
    // disconnect and connect again from the window thread
    AtomicReference<CompletableFuture<Void>> link = new AtomicReference<>();
    robot.interact(() -> link.set(live.disconnect()));
    link.get().get(HangGuard.S, TimeUnit.SECONDS);
    robot.interact(() -> link.set(live.connect()));
    link.get().get(HangGuard.S, TimeUnit.SECONDS);
    // the archive: read, analysed, and a report written
    robot.interact(archive::reload);
    Label status = robot.lookup("#archive-status").queryAs(Label.class);
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> status.getText().contains("runs counted"));
    // the run is on the simulated cell's nominal scale: let it in, pick it, write its report
    robot.interact(() -> archive.include(org.loadstone.study.LeftOut.Kind.UNCALIBRATED).fire());
    @SuppressWarnings("unchecked")
    javafx.scene.control.TableView<Object> runs =
        robot.lookup("#archive-runs").queryAs(javafx.scene.control.TableView.class);
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> !runs.getItems().isEmpty());
    robot.interact(() -> {
      runs.getSelectionModel().select(0);
      robot.lookup("#archive-report").queryAs(javafx.scene.control.Button.class).fire();
    });
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> status.getText().startsWith("report written") || status.getText().startsWith("no report"));
    assertThat(status.getText()).startsWith("report written");
    WaitForAsyncUtils.waitForFxEvents();
    assertThat(SlowWork.seen()).as("slow work done on the window thread").isEmpty();
  }

  @Test
  void theGuardSeesSlowWorkDoneOnTheWindowThread(FxRobot robot) throws Exception {
    connected.get(HangGuard.S, TimeUnit.SECONDS);
    // what the console did before the port was opened on a thread of its own
    robot.interact(() -> new SimSetup("brittle", 3, 1000, false, 1).openTransport().close());
    assertThat(SlowWork.seen()).containsExactly("opening the port");
  }
}
