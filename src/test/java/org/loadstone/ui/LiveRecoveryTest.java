package org.loadstone.ui;

import org.loadstone.HangGuard;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import javafx.scene.Scene;
import javafx.stage.Stage;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.loadstone.acquire.JournalWriter;
import org.loadstone.acquire.SampleRing;
import org.loadstone.archive.RunFixtures;
import org.loadstone.archive.RunReader;
import org.loadstone.device.SimSetup;
import org.testfx.framework.junit5.ApplicationExtension;
import org.testfx.framework.junit5.Start;
import org.testfx.util.WaitForAsyncUtils;

/** The console stores, at start, a run whose journal a killed console left behind. */
@ExtendWith(ApplicationExtension.class)
class LiveRecoveryTest {
  private LivePane pane;
  private Path archive;

  @Start
  void start(Stage stage) throws Exception {
    Path home = Files.createTempDirectory("loadstone-home");
    archive = home.resolve("runs");
    Files.createDirectories(archive);
    // a run killed before it was stored: its journal holds 3000 samples and nothing else
    SampleRing ring = new SampleRing(1 << 14);
    JournalWriter w = JournalWriter.start(archive, RunFixtures.startMetadata("killed-07", false),
        ring.cursorAtEnd());
    for (int i = 0; i < 3000; i++) {
      ring.put(i, i * 1000L, i * 1000L, 8000 + i, true, i * 7);
    }
    w.finish(); // durable on disk; the journal is never discarded, as after a kill
    assertThat(w.file()).exists();

    ConsoleConfig config = DefaultDevice.simulated(new SimSetup("brittle", 3, 1000, false, 1),
        archive, home, 1e-9);
    pane = new LivePane(config);
    stage.setScene(new Scene(pane.root(), 1100, 700));
    stage.show();
  }

  @AfterEach
  void stop() throws Exception {
    WaitForAsyncUtils.asyncFx(() -> pane.disconnect()).get(HangGuard.S, TimeUnit.SECONDS)
        .get(HangGuard.S, TimeUnit.SECONDS);
  }

  @Test
  void aJournalLeftByAKilledRunIsStoredAndNamed() throws Exception {
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> !pane.run().recovering());
    WaitForAsyncUtils.waitForFxEvents();
    Path csv;
    try (var files = Files.list(archive)) {
      csv = files.filter(f -> f.getFileName().toString().endsWith(".csv")).findFirst()
          .orElseThrow();
    }
    assertThat(pane.runResult().getText()).contains("recovered")
        .contains(csv.getFileName().toString());
    var run = RunReader.read(csv);
    assertThat(run.metadata().runId()).startsWith("killed-07");
    assertThat(run.data().size()).isEqualTo(3000); // every journalled sample
  }
}
