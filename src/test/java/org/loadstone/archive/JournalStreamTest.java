package org.loadstone.archive;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.FilterOutputStream;
import java.io.IOException;
import java.io.StringWriter;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Storing a run by streaming its journal, against the path that reads it all first. */
class JournalStreamTest {
  @TempDir Path archive;
  @TempDir Path other;

  private Path journal(String id, int records, boolean position) throws IOException {
    try (FileChannel ch = JournalFormat.create(archive, RunFixtures.startMetadata(id, false))) {
      ByteBuffer b = ByteBuffer.allocate(records * JournalFormat.RECORD_BYTES);
      for (long i = 0; i < records; i++) {
        long t = 7_000_000L + i * 20; // 50 kS/s
        JournalFormat.putRecord(b, 40 + i, (int) ((65000 + i) & 0xFFFF), t & 0xFFFF_FFFFL, t,
            JournalRecoveryTest.counts(i), position, (int) (12 + 5 * i));
      }
      b.flip();
      while (b.hasRemaining()) {
        ch.write(b);
      }
    }
    return JournalFormat.journalFile(archive, id);
  }

  private static RunMetadata finalMeta(String id, int breakIndex) {
    return RunFixtures.startMetadata(id, false).toBuilder().cause(FinishCause.BREAK)
        .breakIndex(breakIndex).build();
  }

  @Test
  void streamedRunEqualsTheRunBuiltInMemoryByteForByte() throws IOException {
    for (boolean position : new boolean[] {true, false}) {
      String id = position ? "s-pos" : "s-nopos";
      Path j = journal(id, 100_003, position); // more than one read block and one write buffer
      JournalStream.Stored s = JournalStream.store(archive, j, Long.MAX_VALUE, finalMeta(id, 9));
      assertThat(s.samples()).isEqualTo(100_003);
      RunData inMemory = JournalRecovery.readJournal(j).data();
      StoredRun ref = RunWriter.write(other, finalMeta(id, 9), inMemory);
      assertThat(Files.mismatch(s.files().csv(), ref.csv())).isEqualTo(-1L);
      assertThat(Files.readString(s.files().json())).isEqualTo(Files.readString(ref.json()));
      assertThat(j).as("the journal is the caller's to remove").exists();
    }
  }

  @Test
  void theRunEndsAtTheLastIndexGiven() throws IOException {
    Path j = journal("cut", 500, true);
    JournalStream.Stored s = JournalStream.store(archive, j, 40 + 299, finalMeta("cut", 5));
    RunData d = RunReader.read(s.files().csv()).data();
    assertThat(d.size()).isEqualTo(300);
    assertThat(d.rawCounts()[299]).isEqualTo(JournalRecoveryTest.counts(299));
  }

  @Test
  void linesAreTheLinesCommonsCsvPrints() throws IOException {
    // the reference: Commons CSV's RFC 4180 printer over the same strings
    RunData d = RunFixtures.randomData(77, 2000, true);
    RunData noPos = RunFixtures.randomData(78, 50, false);
    for (RunData x : new RunData[] {d, noPos}) {
      StringWriter ref = new StringWriter();
      CSVPrinter p = new CSVPrinter(ref, CSVFormat.DEFAULT.builder()
          .setHeader(RunCsv.HEADER.toArray(String[]::new)).setRecordSeparator("\n").get());
      for (int i = 0; i < x.size(); i++) {
        boolean pos = x.hasPosition();
        p.printRecord(Double.toString(x.time_s()[i]), Double.toString(x.force_N()[i]),
            pos ? Double.toString(x.position_mm()[i]) : "", Integer.toString(x.rawCounts()[i]),
            pos ? Integer.toString(x.rawPosition()[i]) : "", Integer.toString(x.seq()[i]));
      }
      p.flush();
      java.io.ByteArrayOutputStream out = new java.io.ByteArrayOutputStream();
      RunCsv.write(x, out, "ref");
      assertThat(out.toString(java.nio.charset.StandardCharsets.US_ASCII))
          .isEqualTo(ref.toString());
    }
  }

  @Test
  void runningOutOfMemoryWhileWritingPublishesNothingAndKeepsTheJournal() throws IOException {
    Path j = journal("oom", 20_000, true);
    byte[] before = Files.readAllBytes(j);
    // the sample file's stream fails the way a full heap would, half-way through the CSV
    java.util.function.UnaryOperator<java.io.OutputStream> failing =
        out -> new FilterOutputStream(out) {
          long written;

          @Override
          public void write(byte[] b, int off, int len) throws IOException {
            written += len;
            if (written > 300_000) {
              throw new OutOfMemoryError("Java heap space");
            }
            out.write(b, off, len);
          }
        };
    assertThatThrownBy(() -> JournalStream.store(failing, archive, j, Long.MAX_VALUE,
        finalMeta("oom", 3))).isInstanceOf(OutOfMemoryError.class);
    try (Stream<Path> files = Files.list(archive)) {
      assertThat(files.filter(Files::isRegularFile)).as("no run file, no temporary").isEmpty();
    }
    assertThat(Files.readAllBytes(j)).isEqualTo(before);
    // and the journal still becomes the whole run
    assertThat(JournalRecovery.recoverAll(archive, m -> { })).hasSize(1);
    assertThat(RunReader.read(archive.resolve("oom.csv")).data().size()).isEqualTo(20_000);
  }
}
