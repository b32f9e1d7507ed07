package org.loadstone.acquire;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.HangGuard;
import org.loadstone.archive.FinishCause;
import org.loadstone.archive.Geometry;
import org.loadstone.archive.JournalFormat;
import org.loadstone.archive.JournalRecovery;
import org.loadstone.archive.JournalStream;
import org.loadstone.archive.Run;
import org.loadstone.archive.RunReader;
import org.loadstone.archive.StoredRun;
import org.loadstone.device.SimSetup;
import org.loadstone.files.FakeDisk;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Setting;

/**
 * A disk that is full before the run, fills during it, or fills while the run is stored (a fake
 * file system over a real folder with a set number of bytes left, {@link FakeDisk}). The oracle
 * is the device's own stream: every sample the ring received from the run's first to its last
 * is in the stored run, in order, bit for bit; and each message's counts are the stored ones.
 */
@Tag("fault")
class DiskFullTest {
  private static final Clock CLOCK =
      Clock.fixed(Instant.parse("2026-12-04T09:00:00Z"), ZoneOffset.UTC);
  /** Retry period of the store in these tests, ms: short, since the test frees the space. */
  private static final long RETRY_MS = 20;

  @TempDir Path real;
  @TempDir Path secondDir;

  @Test
  @Timeout(HangGuard.TEST_S)
  void aDiskWithoutRoomForTheRunIsRefusedBeforeTheZeroAndTheArming() {
    SimSetup sim = new SimSetup("brittle", 5, 1000, false, 1);
    RunSettings limited = RunSettings.builder().maxSeconds(60).ratedCapacity_N(500).build();
    // the journal record (44 bytes, JournalFormat) and the longest CSV line (3 × 24 + 2 × 11 + 5
    // digits, 5 commas, 1 line end) per sample, a quarter more and 16 MiB: our own margin
    long perSample = 44 + (3 * 24 + 2 * 11 + 5 + 5 + 1);
    long need60 = (long) Math.ceil(1000 * (60 + 0.5 + 1.0) * perSample * 1.25) + (16L << 20);
    assertThat(DiskSpace.bytesForRun(1000, limited)).isEqualTo(need60);
    long needOpen = (long) Math.ceil(1000 * (600 + 1.0) * perSample * 1.25) + (16L << 20);
    // room for a minute's run, not for one planned at ten minutes (no time limit)
    FakeDisk disk = FakeDisk.create().bytesLeft((need60 + needOpen) / 2);
    Path archive = disk.path(real);
    DeviceReader reader = new DeviceReader(sim.openTransport(), new SampleRing(1 << 20));
    reader.start();
    try {
      RunSetup setup = new RunSetup(reader, archive, sim, Map.of(), CLOCK);
      List<String> said = new CopyOnWriteArrayList<>();
      ScaleChoice scale = ScalePolicy.choose(null, null, sim, LocalDate.now());
      assertThatThrownBy(() -> setup.prepare(request(scale, RunSettings.builder()), said::add))
          .isInstanceOf(LoadstoneException.class)
          .hasMessageContaining("the disk holding the archive " + archive)
          .hasMessageContaining("10 minutes (it has no time limit)")
          .hasMessageContaining("free space on it")
          .satisfies(e -> assertThat(((LoadstoneException) e).settings())
              .contains(Setting.ARCHIVE_FOLDER, Setting.TIME_LIMIT));
      assertThat(said).as("refused before the zero").isEmpty();
      // with a time limit the run fits, and is prepared
      RunSetup.Prepared p = setup.prepare(request(scale, RunSettings.builder().maxSeconds(60)),
          said::add);
      assertThat(p.settings().maxSeconds()).isEqualTo(60);
    } finally {
      reader.close();
    }
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  void aDiskThatFillsDuringTheRunEndsItAndKeepsEverySampleInMemoryUntilSpaceReturns()
      throws Exception {
    FakeDisk disk = FakeDisk.create();
    Running r = startFillingRun(disk, null);
    assertThat(r.waiting.await(HangGuard.S, TimeUnit.SECONDS)).isTrue();
    assertThat(r.notices.get(r.notices.size() - 1)).contains("is full").contains(
        "more are held in memory; they are written, and the run stored, as soon as space is freed");
    // watched during the run: the room left (under 92 kB) was too little to store it, said once
    assertThat(r.notices).filteredOn(n -> n.startsWith("the disk holding the archive has "))
        .hasSize(1).allSatisfy(n -> assertThat(n).contains("free space on it now"));
    disk.bytesLeft(Long.MAX_VALUE); // space is freed
    Recorder.Result res = r.rec.await(HangGuard.S, TimeUnit.SECONDS).orElseThrow(
        () -> new AssertionError(r.rec.failure().orElse("no result")));
    r.reader.close();
    assertThat(res.cause()).isEqualTo(FinishCause.DISK_FULL);
    Run run = RunReader.read(res.stored().csv());
    assertThat(run.metadata().cause()).isEqualTo(FinishCause.DISK_FULL);
    long first = r.first.get();
    assertEveryRingSample(r.reader.ring(), first, run);
    String note = diskNote(run);
    int n = run.data().size();
    assertThat(note).contains("all " + n + " samples were kept, ").contains(" of them held in"
        + " memory until space was freed");
    assertThat(held(note)).isPositive().isLessThan(n);
    assertThat(Files.list(JournalFormat.journalDir(real)).filter(f -> f.toString()
        .endsWith(".journal")).count()).as("journal removed once stored").isZero();
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  void givingUpTheWaitSaysExactlyWhatTheJournalHoldsAndWhatIsLost() throws Exception {
    FakeDisk disk = FakeDisk.create();
    Running r = startFillingRun(disk, null);
    assertThat(r.waiting.await(HangGuard.S, TimeUnit.SECONDS)).isTrue();
    r.rec.stop(); // Ctrl-C while the run waits for space
    assertThat(r.rec.await(HangGuard.S, TimeUnit.SECONDS)).isEmpty();
    r.reader.close();
    String why = r.rec.failure().orElseThrow();
    java.util.regex.Matcher m = java.util.regex.Pattern.compile("holds the first (\\d+) samples,"
        + " which become a run at the next start; the last (\\d+) samples, held in memory, are"
        + " lost").matcher(why);
    assertThat(m.find()).as(why).isTrue();
    disk.bytesLeft(Long.MAX_VALUE);
    List<StoredRun> recovered = JournalRecovery.recoverAll(disk.path(real), x -> { });
    assertThat(recovered).hasSize(1);
    // the message's count is the journal's, exactly
    assertThat(RunReader.read(recovered.get(0).csv()).data().size())
        .isEqualTo(Integer.parseInt(m.group(1)));
    assertThat(Integer.parseInt(m.group(2))).isPositive();
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  void withASecondLocationTheRunIsStoredThereWhileTheArchiveDiskStaysFull() throws Exception {
    FakeDisk disk = FakeDisk.create();
    Running r = startFillingRun(disk, secondDir);
    Recorder.Result res = r.rec.await(HangGuard.S, TimeUnit.SECONDS).orElseThrow(
        () -> new AssertionError(r.rec.failure().orElse("no result")));
    r.reader.close();
    assertThat(res.cause()).isEqualTo(FinishCause.DISK_FULL);
    assertThat(res.stored().csv().getParent()).isEqualTo(secondDir);
    Run run = RunReader.read(res.stored().csv());
    assertEveryRingSample(r.reader.ring(), r.first.get(), run);
    assertThat(run.metadata().warnings()).anySatisfy(w -> assertThat(w)
        .isEqualTo("stored in the second location " + secondDir + " because the disk holding"
            + " the archive " + disk.path(real) + " was full"));
    assertThat(diskNote(run)).contains("all " + run.data().size() + " samples were kept");
    assertThat(Files.list(JournalFormat.journalDir(real)).filter(f -> f.toString()
        .endsWith(".journal")).count()).as("the full disk's journal removed").isZero();
    assertThat(Files.list(JournalFormat.journalDir(secondDir)).filter(f -> f.toString()
        .endsWith(".journal")).count()).isZero();
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  void aDiskThatFillsWhileTheRunIsStoredKeepsItsCauseAndBreak() throws Exception {
    SimSetup setup = new SimSetup("brittle", 5, 1000, false, 8);
    DeviceReader reader = new DeviceReader(setup.openTransport(), new SampleRing(1 << 20));
    reader.start();
    FakeDisk disk = FakeDisk.create();
    AtomicBoolean filled = new AtomicBoolean();
    JournalRunStore store = new JournalRunStore(disk.path(real), null, (dir, j, last, meta) -> {
      if (filled.compareAndSet(false, true)) {
        disk.bytesLeft(0); // the disk fills just as the run files are written
      }
      return JournalStream.store(dir, j, last, meta);
    }, RETRY_MS);
    CountDownLatch waiting = new CountDownLatch(1);
    List<String> notices = new CopyOnWriteArrayList<>();
    double zero = Tare.counts(reader, 200, HangGuard.MS);
    Recorder rec = new Recorder(reader, ForceScale.linear(setup.nominalCountsPerN(), "nominal"),
        zero, RunSettings.builder().startThreshold_N(5).pretrigger_s(0.3).ratedCapacity_N(500)
            .build(), RecorderSimTest.template("save", 1000), store, new Recorder.Listener() {
              @Override
              public void onWarning(String text) {
                notices.add(text);
                if (text.contains("is stored as soon as space is freed")) {
                  waiting.countDown();
                }
              }
            });
    rec.arm();
    assertThat(waiting.await(HangGuard.S, TimeUnit.SECONDS)).isTrue();
    assertThat(notices.get(notices.size() - 1)).contains("(all ").contains(" samples, in its"
        + " journal ");
    disk.bytesLeft(Long.MAX_VALUE);
    Recorder.Result res = rec.await(HangGuard.S, TimeUnit.SECONDS).orElseThrow(
        () -> new AssertionError(rec.failure().orElse("no result")));
    reader.close();
    Run run = RunReader.read(res.stored().csv());
    assertThat(run.metadata().cause()).isEqualTo(FinishCause.BREAK);
    assertThat(run.metadata().breakIndex()).isNotNull();
    assertThat(run.metadata().warnings())
        .noneSatisfy(w -> assertThat(w).contains("recovered"))
        .anySatisfy(w -> assertThat(w).isEqualTo("the disk holding the archive was full when the"
            + " run was stored; it was stored once there was room, with all "
            + run.data().size() + " samples"));
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  void aDiskThatFilledBeforeTheTriggerSendsTheWholeRunToTheSecondLocation() throws Exception {
    SimSetup setup = new SimSetup("ductile", 3, 1000, false, 4);
    DeviceReader reader = new DeviceReader(setup.openTransport(), new SampleRing(1 << 20));
    reader.start();
    double zero = Tare.counts(reader, 100, HangGuard.MS);
    FakeDisk disk = FakeDisk.create().bytesLeft(0); // filled between the arming and the load
    JournalRunStore store = new JournalRunStore(disk.path(real), secondDir, JournalStream::store,
        RETRY_MS);
    java.util.concurrent.atomic.AtomicLong first = new java.util.concurrent.atomic.AtomicLong();
    Recorder rec = new Recorder(reader, ForceScale.linear(setup.nominalCountsPerN(), "nominal"),
        zero, RunSettings.builder().ratedCapacity_N(500).maxSeconds(3).build(),
        RecorderSimTest.template("early", 1000), store, new Recorder.Listener() {
          @Override
          public void onStarted(RunControl.Started s) {
            first.set(s.firstIndex());
          }
        });
    rec.startNow();
    Recorder.Result res = rec.await(HangGuard.S, TimeUnit.SECONDS).orElseThrow(
        () -> new AssertionError(rec.failure().orElse("no result")));
    reader.close();
    assertThat(res.stored().csv().getParent()).isEqualTo(secondDir);
    Run run = RunReader.read(res.stored().csv());
    assertThat(run.metadata().cause()).isEqualTo(FinishCause.TIME_LIMIT);
    assertEveryRingSample(reader.ring(), first.get(), run);
    assertThat(run.metadata().warnings()).anySatisfy(w -> assertThat(w)
        .startsWith("the run's journal could not be made in the archive " + disk.path(real))
        .contains("No space left on device")
        .endsWith("so the run was recorded and stored in the second location " + secondDir));
  }

  @Test
  void theWatchWarnsOnlyWhenTheRoomLeftCannotStoreWhatIsRecorded() {
    // storing n samples needs their CSV lines (105 bytes at most), a quarter more, and 4 MiB
    long n = 100_000;
    long need = (long) Math.ceil(n * 105 * 1.25) + (4L << 20);
    assertThat(DiskSpace.shortFall(need, n)).isNull();
    assertThat(DiskSpace.shortFall(need - 1, n)).contains("storing the 100000 samples");
    assertThat(DiskSpace.shortFall(-1, n)).as("a disk that does not say").isNull();
  }

  // --- helpers ---------------------------------------------------------------------------------

  private static RunSetup.Request request(ScaleChoice scale, RunSettings.Builder settings) {
    return new RunSetup.Request(new RunTemplate("panel-1", "foam", List.of(), "", "", null,
        Geometry.NONE, org.loadstone.archive.TestType.THREE_POINT_BEND), scale, null, settings,
        null, null, false, "test");
  }

  /** A run recording at 1 kS/s on a disk that has room for its journal's first ~2 000 samples. */
  private record Running(DeviceReader reader, Recorder rec, CountDownLatch waiting,
      List<String> notices, java.util.concurrent.atomic.AtomicLong first) {}

  private Running startFillingRun(FakeDisk disk, Path second) throws Exception {
    SimSetup setup = new SimSetup("ductile", 3, 1000, false, 4);
    DeviceReader reader = new DeviceReader(setup.openTransport(), new SampleRing(1 << 20));
    reader.start();
    double zero = Tare.counts(reader, 100, HangGuard.MS);
    // the room kept at the arming (given back uncounted: this disk frees nothing), then the
    // journal's header, the room kept for how the run ends, and 2000 samples
    disk.bytesLeft(KeptRoom.BYTES + 4096
        + org.loadstone.archive.JournalEnd.RESERVE_BYTES + 2000L * JournalFormat.RECORD_BYTES);
    JournalRunStore store = new JournalRunStore(disk.path(real), second, JournalStream::store,
        RETRY_MS);
    CountDownLatch waiting = new CountDownLatch(1);
    List<String> notices = new CopyOnWriteArrayList<>();
    java.util.concurrent.atomic.AtomicLong first = new java.util.concurrent.atomic.AtomicLong();
    Recorder rec = new Recorder(reader, ForceScale.linear(setup.nominalCountsPerN(), "nominal"),
        zero, RunSettings.builder().ratedCapacity_N(500).build(),
        RecorderSimTest.template("full", 1000), store, new Recorder.Listener() {
          @Override
          public void onStarted(RunControl.Started s) {
            first.set(s.firstIndex());
          }

          @Override
          public void onWarning(String text) {
            notices.add(text);
            if (text.contains("as soon as space is freed")) {
              waiting.countDown();
            }
          }
        });
    rec.startNow();
    return new Running(reader, rec, waiting, notices, first);
  }

  /** Every sample the device sent from the run's first on is in the run, in order, bit for bit. */
  static void assertEveryRingSample(SampleRing ring, long first, Run run) {
    int n = run.data().size();
    assertThat(n).isGreaterThan(2000); // more than the journal took before the disk filled
    SampleRing.Cursor c = ring.cursorAt(first);
    int[] k = {0};
    int[] mismatches = {0};
    c.drain((i, seq, dev, tUs, counts, hp, pos) -> {
      if (k[0] < n) {
        if (run.data().seq()[k[0]] != seq || run.data().rawCounts()[k[0]] != counts) {
          mismatches[0]++;
        }
        k[0]++;
      }
    }, n);
    assertThat(k[0]).isEqualTo(n);
    assertThat(mismatches[0]).isZero();
  }

  private static String diskNote(Run run) {
    return run.metadata().warnings().stream()
        .filter(w -> w.startsWith("the disk holding the archive filled during the run"))
        .findFirst().orElseThrow(() -> new AssertionError(run.metadata().warnings()));
  }

  private static long held(String note) {
    java.util.regex.Matcher m = java.util.regex.Pattern.compile(", (\\d+) of them held")
        .matcher(note);
    assertThat(m.find()).as(note).isTrue();
    return Long.parseLong(m.group(1));
  }
}
