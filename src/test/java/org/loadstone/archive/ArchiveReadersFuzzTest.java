package org.loadstone.archive;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.Size;
import net.jqwik.api.lifecycle.AfterContainer;
import net.jqwik.api.lifecycle.BeforeContainer;
import org.loadstone.units.Fuzz;

/**
 * Fuzzing of the archive's readers with damaged copies of real files (a run from the demo
 * archive, its sidecar, a journal, an archive index) and with random bytes: each gives a correct
 * result or the project's own exception with a plain message, and nothing else escapes. Where
 * there is a reference the result is held to it: the fast run reader to the strict one, a
 * recovered journal to the samples written, the archive index to a full scan of the files.
 */
class ArchiveReadersFuzzTest {
  private static final String RUN = "20261204T181011.533Z-foam-01";
  private static final int JOURNAL_RECORDS = 200;

  private static Path dir;
  private static byte[] runCsv;
  private static byte[] sidecar;
  private static byte[] journal;
  private static Path archive;
  private static byte[] index;

  @BeforeContainer
  static void corpus() throws Exception {
    dir = Fuzz.tempDir("archive");
    // the demo run's first 300 lines: a real file in the writer's format, small enough to
    // damage and read a thousand times
    List<String> lines = Files.readAllLines(Path.of("sample-runs", RUN + ".csv"));
    runCsv = (String.join("\n", lines.subList(0, 300)) + "\n").getBytes(StandardCharsets.UTF_8);
    sidecar = Files.readAllBytes(Path.of("sample-runs", RUN + ".json"));
    Path jarc = Files.createDirectories(dir.resolve("journal-source"));
    try (FileChannel ch = JournalFormat.create(jarc, RunFixtures.startMetadata("fz", true))) {
      ByteBuffer b = ByteBuffer.allocate(JOURNAL_RECORDS * JournalFormat.RECORD_BYTES);
      for (long i = 0; i < JOURNAL_RECORDS; i++) {
        long t = 5_000_000L + i * 1000;
        JournalFormat.putRecord(b, 100 + i, (int) (i & 0xFFFF), t, t, counts(i), true,
            (int) (3 * i));
      }
      b.flip();
      ch.write(b);
    }
    journal = Files.readAllBytes(JournalFormat.journalFile(jarc, "fz"));
    archive = Files.createDirectories(dir.resolve("archive"));
    for (String name : List.of("20261204T181011.533Z-foam-01", "20261204T181024.715Z-foam-02",
        "20261204T181107.589Z-balsa-01")) {
      for (String ext : List.of(".csv", ".json")) {
        Files.copy(Path.of("sample-runs", name + ext), archive.resolve(name + ext));
      }
    }
    ArchiveIndex.load(archive);
    index = Files.readAllBytes(RunIndex.file(archive));
  }

  @AfterContainer
  static void clean() {
    Fuzz.delete(dir);
  }

  private static int counts(long i) {
    return (int) (18_000 + 37 * i);
  }

  @Property(tries = 200, seed = "140601")
  void runCsvTheFastReaderAgreesWithTheStrictOneOrLeavesItToIt(@ForAll long seed) {
    Fuzz.eachCopy(runCsv, seed, dir.resolve("run.csv"), f -> {
      RunData fast = Fuzz.readOrRefuse(() -> RunCsvFast.read(f));
      RunData strict = Fuzz.readOrRefuse(() -> RunReader.readStrict(f));
      if (fast != null) {
        assertThat(strict).as("the fast reader took a file the strict one refuses").isNotNull();
        RunRoundTripTest.assertSameData(strict, fast);
      }
      RunData either = Fuzz.readOrRefuse(() -> RunReader.readSamples(f));
      assertThat(either == null).isEqualTo(strict == null);
    });
  }

  /** Found by the long run: nineteen digits past 2^63 were read by the fast reader as negative. */
  @Example
  void nineteenDigitsPastTheLongRangeKeepTheirSign() throws Exception {
    Path f = Fuzz.write(dir.resolve("big.csv"), ("time_s,force_N,position_mm,raw_counts,"
        + "raw_position,seq\n0.0,9223372036854775808,0.0,1,0,0\n"
        + "0.1,9999999999999999999.5,0.1,2,1,1\n").getBytes(StandardCharsets.UTF_8));
    RunData fast = RunCsvFast.read(f);
    assertThat(fast).isNotNull();
    RunRoundTripTest.assertSameData(RunReader.readStrict(f), fast);
    // Double.parseDouble is the reference for the decimal conversion
    assertThat(fast.force_N()).containsExactly(Double.parseDouble("9223372036854775808"),
        Double.parseDouble("9999999999999999999.5"));
  }

  @Property(tries = 200, seed = "140602")
  void sidecarReadsOrIsRefused(@ForAll long seed) {
    Fuzz.eachCopy(sidecar, seed, dir.resolve("side.json"), f -> {
      RunMetadata m = Fuzz.readOrRefuse(() -> RunReader.readMetadata(f));
      if (m != null) {
        assertThat(m.runId()).isNotBlank();
        assertThat(m.startedAt()).isNotNull();
      }
    });
  }

  @Property(tries = 60, seed = "140603")
  void randomBytesAreRefusedByEveryArchiveReader(@ForAll @Size(max = 600) byte[] noise) {
    Path csv = Fuzz.write(dir.resolve("noise.csv"), noise);
    Path json = Fuzz.write(dir.resolve("noise.json"), noise);
    Path jr = Fuzz.write(dir.resolve("noise.journal"), noise);
    Fuzz.readOrRefuse(() -> RunReader.readSamples(csv));
    Fuzz.readOrRefuse(() -> RunReader.readMetadata(json));
    Fuzz.readOrRefuse(() -> JournalRecovery.readJournal(jr));
  }

  @Property(tries = 120, seed = "140604")
  void journalKeepsOnlySamplesThatWereWritten(@ForAll long seed) {
    List<Integer> written = new ArrayList<>();
    for (long i = 0; i < JOURNAL_RECORDS; i++) {
      written.add(counts(i));
    }
    Fuzz.eachCopy(journal, seed, dir.resolve("damaged.journal"), f -> {
      JournalContents c = Fuzz.readOrRefuse(() -> JournalRecovery.readJournal(f));
      if (c != null) {
        // every record kept has a CRC over its bytes, so its counts are ones written, in order
        int from = 0;
        for (int r : c.data().rawCounts()) {
          int at = written.subList(from, written.size()).indexOf(r);
          assertThat(at).as("recovered counts %d were never written (or out of order)", r)
              .isNotNegative();
          from += at + 1;
        }
      }
    });
  }

  @Property(tries = 25, seed = "140605")
  void recoveryOfADamagedJournalStoresARunOrSetsTheJournalAside(@ForAll long seed) {
    Path arc = dir.resolve("recover-" + Long.toHexString(seed));
    try {
      Fuzz.write(JournalFormat.journalFile(arc, "fz"), Fuzz.mutate(journal, seed));
      List<String> notices = new ArrayList<>();
      List<StoredRun> runs = Fuzz.readOrRefuse(() -> JournalRecovery.recoverAll(arc,
          notices::add));
      if (runs != null) {
        for (StoredRun r : runs) {
          assertThat(Fuzz.readOrRefuse(() -> RunReader.read(r.json()))).isNotNull();
        }
      }
    } finally {
      Fuzz.delete(arc);
    }
  }

  @Property(tries = 25, seed = "140606")
  void aDamagedArchiveIndexGivesWhatTheFilesSay(@ForAll long seed) throws Exception {
    Path arc = dir.resolve("index-" + Long.toHexString(seed));
    try {
      Files.createDirectories(arc);
      try (var s = Files.list(archive)) {
        for (Path p : s.filter(p -> p.toString().endsWith(".csv")
            || p.toString().endsWith(".json")).toList()) {
          Files.copy(p, arc.resolve(p.getFileName()));
        }
      }
      Fuzz.write(RunIndex.file(arc), Fuzz.mutate(index, seed));
      ArchiveIndex fromIndex = Fuzz.readOrRefuse(() -> ArchiveIndex.load(arc));
      assertThat(fromIndex).as("an index is never needed: the files are there").isNotNull();
      ArchiveIndex reference = ArchiveIndex.scan(arc);
      assertThat(fromIndex.entries()).isEqualTo(reference.entries());
      assertThat(fromIndex.problems()).isEqualTo(reference.problems());
    } finally {
      Fuzz.delete(arc);
    }
  }
}
