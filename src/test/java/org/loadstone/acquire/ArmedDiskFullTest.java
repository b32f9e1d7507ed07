package org.loadstone.acquire;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicLong;
import java.util.stream.Stream;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.HangGuard;
import org.loadstone.archive.FinishCause;
import org.loadstone.archive.JournalFormat;
import org.loadstone.archive.JournalStream;
import org.loadstone.archive.Run;
import org.loadstone.archive.RunReader;
import org.loadstone.device.SimSetup;
import org.loadstone.files.FakeDisk;
import org.loadstone.units.LoadstoneException;

/**
 * A disk that fills between the arming and the load, with no second location: the room kept at
 * the arming ({@link JournalRunStore#keepRoom}) takes the run's journal, the samples the disk
 * then refuses are held in memory, and the run is stored once room returns, every sample the
 * device sent from the run's first to its last, bit for bit (the oracle: the device's stream in
 * the ring). A disk with no room at the arming refuses the arming, before the specimen is
 * loaded. The disk is {@link FakeDisk}, which gives a deleted file's bytes back.
 */
@Tag("fault")
class ArmedDiskFullTest {
  @TempDir Path real;

  @TempDir Path secondDir;

  /** A run armed on a disk that fills right after the arming, waiting for room to be stored. */
  private record Armed(DeviceReader reader, Recorder rec, JournalRunStore store, FakeDisk disk,
      AtomicLong first) {}

  private Armed armedThenFull() throws Exception {
    SimSetup setup = new SimSetup("ductile", 3, 1000, false, 4);
    DeviceReader reader = new DeviceReader(setup.openTransport(), new SampleRing(1 << 20));
    reader.start();
    double zero = Tare.counts(reader, 100, HangGuard.MS);
    FakeDisk disk = FakeDisk.create().freeingOnDelete();
    JournalRunStore store = new JournalRunStore(disk.path(real), null, JournalStream::store, 20);
    CountDownLatch waiting = new CountDownLatch(1);
    AtomicLong first = new AtomicLong();
    Recorder rec = new Recorder(reader, ForceScale.linear(setup.nominalCountsPerN(), "nominal"),
        zero, RunSettings.builder().startThreshold_N(5).ratedCapacity_N(500).build(),
        RecorderSimTest.template("armed", 1000), store, new Recorder.Listener() {
          @Override
          public void onStarted(RunControl.Started s) {
            first.set(s.firstIndex());
          }

          @Override
          public void onWarning(String text) {
            if (text.contains("as soon as space is freed")) {
              waiting.countDown();
            }
          }
        });
    store.keepRoom(); // the arming keeps its room (Recorder.arm asks again: kept already)
    disk.bytesLeft(0); // then another program fills the disk before the load comes on
    rec.arm();
    assertThat(waiting.await(HangGuard.S, TimeUnit.SECONDS)).as("waits for room").isTrue();
    return new Armed(reader, rec, store, disk, first);
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  void aDiskThatFillsBetweenTheArmingAndTheLoadLosesNoSample() throws Exception {
    Armed a = armedThenFull();
    a.disk().bytesLeft(Long.MAX_VALUE); // space is freed
    Run run = stored(a);
    assertThat(run.metadata().warnings()).anySatisfy(w -> assertThat(w)
        .contains("all " + run.data().size() + " samples were kept"));
    assertThat(keptRoomFiles()).as("the kept room was given to the journal").isZero();
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  void aSecondLocationChosenWhileTheRunWaitsTakesTheWholeRun() throws Exception {
    Armed a = armedThenFull();
    a.store().useSecondLocation(secondDir); // chosen by the operator while it waits (console)
    Run run = stored(a);
    assertThat(run.csv().getParent()).isEqualTo(secondDir);
    assertThat(run.metadata().warnings()).anySatisfy(w -> assertThat(w)
        .isEqualTo("stored in the second location " + secondDir + " because the disk holding"
            + " the archive " + a.disk().path(real) + " was full"));
  }

  /** The stored run: cause disk-full, every sample the device sent, bit for bit. */
  private static Run stored(Armed a) throws Exception {
    Recorder.Result res = a.rec().await(HangGuard.S, TimeUnit.SECONDS).orElseThrow(
        () -> new AssertionError(a.rec().failure().orElse("no result")));
    a.reader().close();
    assertThat(res.cause()).isEqualTo(FinishCause.DISK_FULL);
    Run run = RunReader.read(res.stored().csv());
    int n = run.data().size();
    // the kept room took the journal and its first samples; the rest waited in memory
    String note = run.metadata().warnings().stream()
        .filter(w -> w.startsWith("the disk holding the archive filled during the run"))
        .findFirst().orElseThrow(() -> new AssertionError(run.metadata().warnings()));
    java.util.regex.Matcher held = java.util.regex.Pattern.compile(", (\\d+) of them held in"
        + " memory").matcher(note);
    assertThat(held.find()).as(note).isTrue();
    assertThat(Long.parseLong(held.group(1))).isPositive().isLessThan(n);
    // every sample the device sent from the run's first to its last, bit for bit
    DiskFullTest.assertEveryRingSample(a.reader().ring(), a.first().get(), run);
    return run;
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  void aDiskWithNoRoomAtTheArmingRefusesItBeforeTheLoad() throws Exception {
    SimSetup setup = new SimSetup("ductile", 3, 1000, false, 4);
    DeviceReader reader = new DeviceReader(setup.openTransport(), new SampleRing(1 << 20));
    reader.start();
    try {
      FakeDisk disk = FakeDisk.create().freeingOnDelete();
      Path archive = disk.path(real);
      JournalRunStore store = new JournalRunStore(archive, null, JournalStream::store, 20);
      store.checkWritable();
      disk.bytesLeft(KeptRoom.BYTES / 2);
      Recorder rec = new Recorder(reader, ForceScale.linear(setup.nominalCountsPerN(), "n"), 0,
          RunSettings.builder().ratedCapacity_N(500).build(),
          RecorderSimTest.template("refused", 1000), store, null);
      assertThatThrownBy(rec::arm).isInstanceOf(LoadstoneException.class)
          .hasMessageContaining("the disk holding the archive " + archive)
          .hasMessageContaining("free space on it, or set a second location")
          .hasMessageContaining("before loading the specimen");
      assertThat(keptRoomFiles()).isZero();
      assertThat(rec.ended()).as("never armed: no thread").isFalse();
    } finally {
      reader.close();
    }
  }

  private long keptRoomFiles() throws Exception {
    Path jdir = JournalFormat.journalDir(real);
    if (!Files.isDirectory(jdir)) {
      return 0;
    }
    try (Stream<Path> s = Files.list(jdir)) {
      return s.filter(p -> p.getFileName().toString().endsWith(".kept")).count();
    }
  }
}
