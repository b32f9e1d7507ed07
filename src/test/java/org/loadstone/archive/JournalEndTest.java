package org.loadstone.archive;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.files.FakeDisk;

/**
 * How a run ended, kept beside its journal ({@link JournalEnd}): written in place on a disk that
 * has no room left (the fake disk refuses any new byte, as a full one does), and read back by
 * recovery, which restores the cause, the break and the run's last sample. The truth is what the
 * test wrote: the records' own ring indices and the break it gave.
 */
class JournalEndTest {
  @TempDir Path real;
  private final List<String> notices = new ArrayList<>();

  /** A journal of ring samples 100…100+records−1, with room for its end reserved. */
  private static Path journal(Path archive, String id, int records) throws IOException {
    try (FileChannel ch = JournalFormat.create(archive, RunFixtures.startMetadata(id, false))) {
      ByteBuffer b = ByteBuffer.allocate(records * JournalFormat.RECORD_BYTES);
      for (long i = 0; i < records; i++) {
        long t = 5_000_000L + i * 1000;
        JournalFormat.putRecord(b, 100 + i, (int) i, t & 0xFFFF_FFFFL, t,
            JournalRecoveryTest.counts(i), false, 0);
      }
      b.flip();
      while (b.hasRemaining()) {
        ch.write(b);
      }
    }
    Path j = JournalFormat.journalFile(archive, id);
    assertThat(JournalEnd.reserve(j)).isTrue();
    return j;
  }

  private static RunMetadata ended(String id, Integer breakIndex) {
    return RunFixtures.startMetadata(id, false).toBuilder().cause(FinishCause.BREAK)
        .breakIndex(breakIndex).breakTime_s(breakIndex == null ? null : breakIndex / 1000.0)
        .peakBeforeBreak_N(412.5).dropAtBreak_pct(63.0).returnToZero_N(0.4)
        .warnings(List.of("the disk holding the archive was full when the run was stored"))
        .build();
  }

  @Test
  void theEndIsWrittenOnAFullDiskAndRecoveryRestoresCauseBreakAndLastSample() throws Exception {
    FakeDisk disk = FakeDisk.create();
    Path archive = disk.path(real);
    Path j = journal(archive, "end1", 600);
    disk.bytesLeft(0); // full: no new byte can be written
    assertThatThrownBy(() -> Files.writeString(archive.resolve("probe.txt"), "x"))
        .isInstanceOf(IOException.class).hasMessageContaining("No space left");

    // the run's last sample is ring index 549 (the journal also took 50 after it)
    assertThat(JournalEnd.write(j, ended("end1", 300), 549)).isTrue();
    disk.bytesLeft(Long.MAX_VALUE); // the next start, with room

    List<StoredRun> runs = JournalRecovery.recoverAll(archive, notices::add);
    assertThat(runs).hasSize(1);
    Run r = RunReader.read(runs.get(0).csv());
    assertThat(r.data().size()).isEqualTo(450); // ring samples 100…549
    assertThat(r.data().rawCounts()[449]).isEqualTo(JournalRecoveryTest.counts(449));
    RunMetadata m = r.metadata();
    assertThat(m.cause()).isEqualTo(FinishCause.BREAK);
    assertThat(m.breakIndex()).isEqualTo(300);
    assertThat(m.breakTime_s()).isEqualTo(0.3);
    assertThat(m.peakBeforeBreak_N()).isEqualTo(412.5);
    assertThat(m.dropAtBreak_pct()).isEqualTo(63.0);
    assertThat(m.returnToZero_N()).isEqualTo(0.4);
    assertThat(m.warnings()).contains("the disk holding the archive was full when the run was"
        + " stored").anySatisfy(w -> assertThat(w).contains("while the run was being stored")
        .contains("450 samples kept"));
    assertThat(j).doesNotExist();
    assertThat(JournalEnd.file(j)).doesNotExist();
  }

  @Test
  void aBreakPastTheSamplesTheJournalHoldsIsLeftOutWithTheReason() throws Exception {
    Path j = journal(real, "end2", 200); // the rest was held in memory when the program died
    assertThat(JournalEnd.write(j, ended("end2", 350), 499)).isTrue();
    Run r = RunReader.read(JournalRecovery.recoverAll(real, notices::add).get(0).csv());
    assertThat(r.data().size()).isEqualTo(200);
    assertThat(r.metadata().cause()).isEqualTo(FinishCause.BREAK);
    assertThat(r.metadata().breakIndex()).isNull();
    assertThat(r.metadata().warnings()).anySatisfy(w -> assertThat(w)
        .contains("break (sample 350) lies past the last sample the journal holds (199)"));
  }

  @Test
  void anEndTornOrNeverWrittenRecoversTheRunAsBefore() throws Exception {
    Path torn = journal(real, "end3", 100);
    Path none = journal(real, "end4", 100);
    // a write cut short: the start of the object over the spaces, never a whole object
    try (FileChannel ch = FileChannel.open(JournalEnd.file(torn),
        java.nio.file.StandardOpenOption.WRITE)) {
      ch.write(ByteBuffer.wrap("{\"cause\":\"break\",\"break_index\":4".getBytes()), 0);
    }
    List<StoredRun> runs = JournalRecovery.recoverAll(real, notices::add);
    assertThat(runs).hasSize(2);
    for (StoredRun s : runs) {
      Run r = RunReader.read(s.csv());
      assertThat(r.metadata().cause()).isEqualTo(FinishCause.RECOVERED);
      assertThat(r.data().size()).isEqualTo(100);
      assertThat(r.metadata().warnings()).anySatisfy(w -> assertThat(w)
          .contains("why the run ended, and its break if it had one, were not kept"));
    }
    assertThat(JournalEnd.file(none)).doesNotExist();
  }
}
