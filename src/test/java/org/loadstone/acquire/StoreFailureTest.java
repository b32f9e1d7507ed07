package org.loadstone.acquire;

import org.loadstone.HangGuard;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.archive.FinishCause;
import org.loadstone.archive.JournalFormat;
import org.loadstone.archive.JournalRecovery;
import org.loadstone.archive.RunReader;
import org.loadstone.archive.StoredRun;
import org.loadstone.device.SimSetup;
import org.loadstone.device.SimTransport;

/** A failure while the run is stored ends the run-control thread with a reason, journal kept. */
@Tag("fault")
class StoreFailureTest {
  @TempDir Path archive;

  @Test
  @Timeout(HangGuard.TEST_S)
  void outOfMemoryWhileStoringEndsWithAMessageAndKeepsTheJournal() throws Exception {
    SimSetup setup = new SimSetup("ductile", 3, 1000, false, 4);
    SimTransport t = setup.openTransport();
    DeviceReader reader = new DeviceReader(t, new SampleRing(1 << 20));
    reader.start();
    double zero = Tare.counts(reader, 100, HangGuard.MS);
    // the seam stands for the store running out of heap half-way through
    JournalRunStore store = new JournalRunStore(archive, (dir, journal, last, meta) -> {
      throw new OutOfMemoryError("Java heap space");
    });
    List<String> failed = new CopyOnWriteArrayList<>();
    Recorder rec = new Recorder(reader, ForceScale.linear(setup.nominalCountsPerN(), "n"), zero,
        RunSettings.DEFAULTS, RecorderSimTest.template("oom", 1000), store,
        new Recorder.Listener() {
          @Override
          public void onFailed(String why) {
            failed.add(why);
          }
        });
    rec.startNow();
    while (reader.samplesAccepted() < 2000) {
      Thread.sleep(5);
    }
    t.pullCable(); // ends the run (device lost), which stores it
    assertThat(rec.await(HangGuard.S, TimeUnit.SECONDS)).isEmpty();
    reader.close();
    assertThat(rec.ended()).as("the run-control thread is done, not spinning").isTrue();
    Path journal = JournalFormat.journalFile(archive, "test-oom");
    assertThat(rec.failure()).hasValueSatisfying(m -> assertThat(m)
        .contains("run test-oom was not stored")
        .contains("ran out of memory")
        .contains(journal.toString()));
    assertThat(failed).containsExactly(rec.failure().orElseThrow());
    assertThat(journal).exists();
    assertThat(archive.resolve("test-oom.csv")).doesNotExist();
    // the kept journal becomes the run at the next start
    List<StoredRun> recovered = JournalRecovery.recoverAll(archive, m -> { });
    assertThat(recovered).hasSize(1);
    // with the cause the run ended with (the cable pulled), kept beside the journal when the
    // run was finished (archive.JournalEnd)
    assertThat(RunReader.read(recovered.get(0).csv()).metadata().cause())
        .isEqualTo(FinishCause.DEVICE_LOST);
    assertThat(RunReader.read(recovered.get(0).csv()).data().size()).isGreaterThanOrEqualTo(2000);
    assertThat(Files.exists(journal)).isFalse();
  }
}
