package org.loadstone.archive;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.List;
import java.util.zip.CRC32C;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.files.FakeDisk;
import org.loadstone.units.LoadstoneException;

class JournalRecoveryTest {
  @TempDir Path archive;
  private final List<String> notices = new ArrayList<>();

  /** Deterministic sample i: what a device at 1000 samples/s with a position channel sends. */
  static int counts(long i) {
    return (int) (812 + 37 * i + ((i * 2654435761L) & 0x3FF) - 512);
  }

  private Path journal(String id, boolean curved, int records) throws IOException {
    try (FileChannel ch = JournalFormat.create(archive, RunFixtures.startMetadata(id, curved))) {
      ByteBuffer b = ByteBuffer.allocate(records * JournalFormat.RECORD_BYTES);
      for (long i = 0; i < records; i++) {
        long t = 5_000_000L + i * 1000;
        JournalFormat.putRecord(b, 100 + i, (int) ((65530 + i) & 0xFFFF), t & 0xFFFF_FFFFL, t,
            counts(i), true, (int) (-400 + 3 * i));
      }
      b.flip();
      ch.write(b);
    }
    return JournalFormat.journalFile(archive, id);
  }

  @Test
  void crc32cIsTheCastagnoliCheckValue() {
    // RFC 3720 (iSCSI) CRC32C; catalogue check value of "123456789" is 0xE3069283
    CRC32C c = new CRC32C();
    c.update("123456789".getBytes(StandardCharsets.US_ASCII));
    assertThat(c.getValue()).isEqualTo(0xE3069283L);
  }

  @Test
  void journalCutMidRecordKeepsEveryCompleteRecord() throws Exception {
    Path j = journal("j1", false, 500);
    long size = Files.size(j);
    try (FileChannel ch = FileChannel.open(j, StandardOpenOption.WRITE)) {
      ch.truncate(size - JournalFormat.RECORD_BYTES / 2); // the last write was torn
    }
    List<StoredRun> runs = JournalRecovery.recoverAll(archive, notices::add);
    assertThat(runs).hasSize(1);
    Run r = RunReader.read(runs.get(0).csv());
    RunData d = r.data();
    assertThat(d.size()).isEqualTo(499);
    for (int i = 0; i < 499; i++) {
      assertThat(d.rawCounts()[i]).isEqualTo(counts(i));
      assertThat(d.rawPosition()[i]).isEqualTo(-400 + 3 * i);
      assertThat(d.seq()[i]).isEqualTo((65530 + i) & 0xFFFF);
      assertThat(d.time_s()[i]).isEqualTo(i * 1000 / 1e6);
      // nominal 8590 counts/N and zero 812 from the header: F = (counts - zero) / k
      assertThat(d.force_N()[i]).isEqualTo((counts(i) - 812.0) / 8590.0);
      assertThat(d.position_mm()[i]).isEqualTo((-400 + 3 * i) / 400.0);
    }
    RunMetadata m = r.metadata();
    assertThat(m.cause()).isEqualTo(FinishCause.RECOVERED);
    assertThat(m.runId()).isEqualTo("j1");
    assertThat(m.specimen()).isEqualTo("Foam core 3");
    assertThat(m.breakIndex()).isNull();
    assertThat(m.dropped()).isZero(); // seq wrapped 65535 -> 0 without a gap
    assertThat(m.warnings()).anyMatch(w -> w.contains("22 bytes of an incomplete record"));
    assertThat(j).doesNotExist();
    assertThat(notices).singleElement().asString().contains("recovered").contains("499 samples");
  }

  @Test
  void corruptLastRecordIsLeftOutAndCurvedScalesAreInverted() throws Exception {
    Path j = journal("j2", true, 50);
    byte[] all = Files.readAllBytes(j);
    all[all.length - 10] ^= 0x40; // a bit flipped in the last record
    Files.write(j, all);
    Run r = RunReader.read(JournalRecovery.recoverAll(archive, notices::add).get(0).json());
    assertThat(r.data().size()).isEqualTo(49);
    // the header's scale: counts = 3 + 8590.25 F - 0.0031 F^2; check P(F) gives back the counts
    for (int i = 0; i < 49; i++) {
      double f = r.data().force_N()[i];
      double net = counts(i) - 812.0;
      if (f >= 0) {
        assertThat(3 + 8590.25 * f - 0.0031 * f * f).isCloseTo(net, org.assertj.core.data.Offset
            .offset(1e-6));
      } else {
        // below the calibrated range (0…500 N) the force follows the tangent at 0 N:
        // P(0) = 3 counts, P'(0) = 8590.25 counts/N (documented on CountsToForce)
        assertThat(f).isCloseTo((net - 3) / 8590.25, org.assertj.core.data.Offset.offset(1e-12));
      }
    }
  }

  @Test
  void emptyJournalBecomesAnEmptyRunAndSeqGapsCountAsDropped() throws Exception {
    journal("j3", false, 0);
    Path j4;
    try (FileChannel ch = JournalFormat.create(archive, RunFixtures.startMetadata("j4", false))) {
      ByteBuffer b = ByteBuffer.allocate(3 * JournalFormat.RECORD_BYTES);
      JournalFormat.putRecord(b, 0, 10, 0, 0, 1, false, 0);
      JournalFormat.putRecord(b, 1, 11, 1000, 1000, 2, false, 0);
      JournalFormat.putRecord(b, 5, 17, 7000, 7000, 3, false, 0); // journal missed 3, device 5
      b.flip();
      ch.write(b);
      j4 = JournalFormat.journalFile(archive, "j4");
    }
    List<StoredRun> runs = JournalRecovery.recoverAll(archive, notices::add);
    assertThat(runs).hasSize(2);
    assertThat(RunReader.read(runs.get(0).csv()).data().size()).isZero();
    Run r4 = RunReader.read(runs.get(1).csv());
    assertThat(r4.data().hasPosition()).isFalse();
    assertThat(r4.metadata().dropped()).isEqualTo(5);
    assertThat(r4.metadata().warnings()).anyMatch(w -> w.contains("3 samples were missed"));
    assertThat(j4).doesNotExist();
  }

  @Test
  void unreadableHeaderIsMovedAsideNeverDeleted() throws Exception {
    Files.createDirectories(JournalFormat.journalDir(archive));
    Path bad = JournalFormat.journalFile(archive, "j5");
    byte[] content = "{\"journal_format\":1,\"run_id\":\"j5\",\"start".getBytes(StandardCharsets.UTF_8);
    Files.write(bad, content);
    Path bad2 = JournalFormat.journalFile(archive, "j6");
    Files.writeString(bad2, "{\"journal_format\":1,\"run_id\":\"j6\"}\n"); // no scale etc.
    Path bad3 = JournalFormat.journalFile(archive, "j0");
    byte[] good = JournalFormat.header(RunFixtures.startMetadata("j0", false));
    Files.write(bad3, new String(good, StandardCharsets.UTF_8)
        .replace("\"run_id\":\"j0\"", "\"run_id\":\"../../escape\"")
        .getBytes(StandardCharsets.UTF_8));
    assertThat(JournalRecovery.recoverAll(archive, notices::add)).isEmpty();
    assertThat(archive.getParent().resolve("escape.csv")).doesNotExist();
    assertThat(JournalFormat.damagedDir(archive).resolve("j0.journal")).exists();
    assertThat(notices.remove(0)).contains("'../../escape' is not a safe file name");
    Path moved = JournalFormat.damagedDir(archive).resolve("j5.journal");
    assertThat(moved).exists();
    assertThat(Files.readAllBytes(moved)).isEqualTo(content);
    assertThat(JournalFormat.damagedDir(archive).resolve("j6.journal")).exists();
    assertThat(bad).doesNotExist();
    assertThat(notices).hasSize(2);
    assertThat(notices.get(0)).contains("j5.journal").contains("unreadable header")
        .contains("header line is incomplete").contains("moved to " + moved);
    assertThat(notices.get(1)).contains("j6.journal").contains("is missing");
  }

  @Test
  void writeFailureDuringRecoveryKeepsTheJournalAndSaysSo() throws Exception {
    Path j = journal("j7", false, 2000);
    byte[] before = Files.readAllBytes(j);
    FakeDisk full = FakeDisk.create().bytesLeft(4096);
    assertThatThrownBy(() -> JournalRecovery.recoverAll(full.path(archive), notices::add))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("could not be recovered")
        .hasMessageContaining("No space left on device")
        .hasMessageContaining("journals are kept");
    assertThat(Files.readAllBytes(j)).isEqualTo(before);
    assertThat(archive.resolve("j7.csv")).doesNotExist();
    // next start, disk space freed: recovered
    assertThat(JournalRecovery.recoverAll(archive, notices::add)).hasSize(1);
    assertThat(j).doesNotExist();
  }

  @Test
  void journalOfARunStoredInFullIsRemovedAndAHalfStoredOneGetsANewId() throws Exception {
    Path j = journal("j8", false, 10);
    JournalContents c = JournalRecovery.readJournal(j);
    RunWriter.write(archive, RunFixtures.startMetadata("j8", false), c.data());
    assertThat(JournalRecovery.recoverAll(archive, notices::add)).isEmpty();
    assertThat(j).doesNotExist();
    assertThat(notices.get(0)).contains("already stored in full");

    Path j9 = journal("j9", false, 10);
    Files.writeString(archive.resolve("j9.csv"), "partial");
    List<StoredRun> runs = JournalRecovery.recoverAll(archive, notices::add);
    assertThat(runs.get(0).csv()).isEqualTo(archive.resolve("j9-2.csv"));
    assertThat(Files.readString(archive.resolve("j9.csv"))).isEqualTo("partial");
    assertThat(j9).doesNotExist();
  }

  @Test
  void headerIsOneLineWithEverythingButTheEndOfTheRun() throws Exception {
    RunMetadata full = RunFixtures.fullMetadata("j10");
    String line = new String(JournalFormat.header(full), StandardCharsets.UTF_8);
    assertThat(line).endsWith("}\n").containsOnlyOnce("\n").startsWith("{\"journal_format\":1,")
        .contains("\"scale_spec\":{").contains("\"zero_offset_counts\":-1234.5")
        .doesNotContain("\"cause\"").doesNotContain("break_index").doesNotContain("break_time_s")
        .doesNotContain("peak_before_break_N").doesNotContain("drop_at_break_pct");
    try (FileChannel ch = JournalFormat.create(archive, full)) {
      ByteBuffer b = ByteBuffer.allocate(JournalFormat.RECORD_BYTES);
      JournalFormat.putRecord(b, 0, 1, 0, 0, 10_000, true, 4);
      b.flip();
      ch.write(b);
    }
    RunMetadata got = RunReader.read(JournalRecovery.recoverAll(archive, notices::add).get(0)
        .json()).metadata();
    List<String> warnings = new ArrayList<>(full.warnings());
    warnings.add(got.warnings().get(got.warnings().size() - 1));
    RunMetadata expected = RunMetadata.builder()
        .runId(full.runId())
        .startedAt(full.startedAt())
        .specimen(full.specimen())
        .group(full.group())
        .tags(full.tags())
        .operator(full.operator())
        .notes(full.notes())
        .mass_g(full.mass_g())
        .geometry(full.geometry())
        .testType(full.testType())
        .device(full.device())
        .sampleRate_Hz(full.sampleRate_Hz())
        .calibrationId(full.calibrationId())
        .calibrationSha256(full.calibrationSha256())
        .scale(full.scale())
        .scaleSpec(full.scaleSpec())
        .zeroOffset_counts(full.zeroOffset_counts())
        .dropped(full.dropped())
        .checksumErrors(full.checksumErrors())
        .cause(FinishCause.RECOVERED)
        .pretrigger_s(full.pretrigger_s())
        .startThreshold_N(full.startThreshold_N())
        .checkWeight(full.checkWeight())
        .warnings(warnings)
        .softwareVersion(full.softwareVersion())
        .extra(full.extra())
        .build();
    assertThat(got).isEqualTo(expected);
    assertThat(warnings.get(warnings.size() - 1)).contains("recovered from journal j10.journal");
  }

  @Test
  void noJournalFolderMeansNothingToDo() {
    assertThat(JournalRecovery.recoverAll(archive.resolve("none"), notices::add)).isEmpty();
    assertThat(notices).isEmpty();
  }
}
