package org.loadstone.archive;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.files.FakeDisk;
import org.loadstone.units.LoadstoneException;

class RunWriterTest {
  @TempDir Path tmp;
  @TempDir Path scratch;

  private static List<String> names(Path dir) throws IOException {
    try (Stream<Path> s = Files.list(dir)) {
      return s.map(p -> p.getFileName().toString()).sorted().toList();
    }
  }

  @Test
  void writesTheHeaderExactlyAndEmptyPositionCellsWithoutPosition() throws Exception {
    Path archive = tmp.resolve("archive/sub"); // missing: created
    RunData d = new RunData(new double[] {0.0, 0.0125}, new double[] {-0.25, 1.0E-5}, null,
        new int[] {812, 898}, null, new int[] {65535, 0});
    StoredRun s = RunWriter.write(archive, RunFixtures.startMetadata("r1", false), d);
    assertThat(s.csv()).isEqualTo(archive.resolve("r1.csv"));
    assertThat(s.json()).isEqualTo(archive.resolve("r1.json"));
    // exact text: Double.toString forms (Java SE API, Double.toString), "\n" line ends
    assertThat(Files.readString(s.csv())).isEqualTo(
        "time_s,force_N,position_mm,raw_counts,raw_position,seq\n"
            + "0.0,-0.25,,812,,65535\n"
            + "0.0125,1.0E-5,,898,,0\n");
    assertThat(names(archive)).containsExactly("r1.csv", "r1.json");
  }

  @Test
  void neverOverwritesAnExistingRun() throws Exception {
    RunData d = RunFixtures.randomData(7, 20, true);
    RunMetadata m = RunFixtures.fullMetadata("r2");
    RunWriter.write(tmp, m, d);
    byte[] csvBefore = Files.readAllBytes(tmp.resolve("r2.csv"));
    byte[] jsonBefore = Files.readAllBytes(tmp.resolve("r2.json"));
    RunData other = RunFixtures.randomData(8, 5, false);
    assertThatThrownBy(() -> RunWriter.write(tmp, m, other))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("r2.csv already exists")
        .hasMessageContaining("never overwritten")
        .hasMessageContaining("r2-2");
    assertThat(Files.readAllBytes(tmp.resolve("r2.csv"))).isEqualTo(csvBefore);
    assertThat(Files.readAllBytes(tmp.resolve("r2.json"))).isEqualTo(jsonBefore);
    assertThat(names(tmp)).containsExactly("r2.csv", "r2.json");
  }

  @Test
  void withoutHardLinksTheFallbackAlsoNeverOverwrites() throws Exception {
    FakeDisk stick = FakeDisk.create().withoutLinks(); // as a FAT or exFAT stick
    RunData d = RunFixtures.randomData(9, 50, true);
    RunWriter.write(stick.path(tmp), RunFixtures.fullMetadata("r8"), d);
    assertThat(stick.linksRefused()).isEqualTo(2);
    RunRoundTripTest.assertSameData(d, RunReader.read(tmp.resolve("r8.csv")).data());
    assertThat(names(tmp)).containsExactly("r8.csv", "r8.json");
    byte[] before = Files.readAllBytes(tmp.resolve("r8.csv"));
    assertThatThrownBy(() -> RunWriter.write(stick.path(tmp), RunFixtures.fullMetadata("r8"), d))
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("already exists");
    assertThat(Files.readAllBytes(tmp.resolve("r8.csv"))).isEqualTo(before);
    assertThat(names(tmp)).containsExactly("r8.csv", "r8.json");
  }

  @Test
  void aSidecarAloneAlsoBlocksTheId() throws Exception {
    Files.writeString(tmp.resolve("r3.json"), "{\"keep\":true}");
    assertThatThrownBy(() -> RunWriter.write(tmp, RunFixtures.startMetadata("r3", false),
        RunFixtures.randomData(1, 3, false)))
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("r3.json already exists");
    assertThat(Files.readString(tmp.resolve("r3.json"))).isEqualTo("{\"keep\":true}");
    assertThat(names(tmp)).containsExactly("r3.json");
  }

  @Test
  void leavesNoTemporaryFilesAfterManyWrites() throws Exception {
    for (int i = 0; i < 20; i++) {
      RunWriter.write(tmp, RunFixtures.startMetadata("run-" + i, false),
          RunFixtures.randomData(i, 100, i % 2 == 0));
    }
    assertThat(names(tmp)).hasSize(40).allMatch(n -> n.matches("run-\\d+\\.(csv|json)"));
  }

  @Test
  void unwritableArchiveFolderNamesTheFolderAndTheFix() throws Exception {
    // the test may run as root, which ignores permissions; a folder below a regular file cannot
    // be created by anyone
    Path afile = Files.writeString(tmp.resolve("afile"), "not a folder");
    Path archive = afile.resolve("sub");
    assertThatThrownBy(() -> RunWriter.write(archive, RunFixtures.startMetadata("r4", false),
        RunFixtures.randomData(1, 3, false)))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("archive folder " + archive)
        .hasMessageContaining("choose a folder you may write to");
  }

  @Test
  void diskFullMidWriteRemovesThePartialFileKeepsTheJournalAndSaysSo() throws Exception {
    RunMetadata m = RunFixtures.startMetadata("r5", false);
    try (FileChannel j = JournalFormat.create(tmp, m)) {
      ByteBuffer b = ByteBuffer.allocate(JournalFormat.RECORD_BYTES);
      JournalFormat.putRecord(b, 0, 1, 1000, 1000, 812, false, 0);
      b.flip();
      j.write(b);
    }
    byte[] journalBefore = Files.readAllBytes(JournalFormat.journalFile(tmp, "r5"));
    RunData big = RunFixtures.randomData(3, 20_000, true);
    FakeDisk nearlyFull = FakeDisk.create().bytesLeft(100_000);
    assertThatThrownBy(() -> RunWriter.write(nearlyFull.path(tmp), m, big))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("run file " + tmp.resolve("r5.csv") + " cannot be written")
        .hasMessageContaining("No space left on device")
        .hasMessageContaining("free space")
        .hasMessageContaining("journal");
    assertThat(names(tmp)).containsExactly(".journal");
    assertThat(Files.readAllBytes(JournalFormat.journalFile(tmp, "r5"))).isEqualTo(journalBefore);

    // the sidecar failing (after the CSV temporary file was complete) is cleaned up the same way
    long csvBytes = Files.size(RunWriter.write(scratch, m, big).csv());
    FakeDisk fullAtTheSidecar = FakeDisk.create().bytesLeft(csvBytes + 10);
    assertThatThrownBy(() -> RunWriter.write(fullAtTheSidecar.path(tmp), m, big))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("run file " + tmp.resolve("r5.json") + " cannot be written");
    assertThat(names(tmp)).containsExactly(".journal");
  }

  @Test
  void refusesNonFiniteForceAndTimeOutOfOrderBeforeWritingAnything() {
    RunData nan = new RunData(new double[] {0, 1}, new double[] {0, Double.NaN}, null,
        new int[] {1, 2}, null, new int[] {0, 1});
    assertThatThrownBy(() -> RunWriter.write(tmp, RunFixtures.startMetadata("r6", false), nan))
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("force_N of sample 1 is NaN");
    RunData back = new RunData(new double[] {0, 1, 1}, new double[] {0, 0, 0}, null,
        new int[] {1, 2, 3}, null, new int[] {0, 1, 2});
    assertThatThrownBy(() -> RunWriter.write(tmp, RunFixtures.startMetadata("r6", false), back))
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("time_s of sample 2");
    assertThat(tmp.resolve("r6.csv")).doesNotExist();
  }

  @Test
  void refusesNonFiniteMetadataNumbersThatJsonCannotHold() {
    RunMetadata ok = RunFixtures.startMetadata("r9", false);
    RunMetadata nanRate = RunMetadata.builder()
        .runId("r9")
        .startedAt(ok.startedAt())
        .specimen(ok.specimen())
        .sampleRate_Hz(Double.NaN)
        .scaleSpec(ok.scaleSpec())
        .zeroOffset_counts(0)
        .dropped(0)
        .checksumErrors(0)
        .cause(FinishCause.MANUAL)
        .pretrigger_s(0)
        .extra(java.util.Map.of("rig", java.util.Map.of("temp_C", Double.POSITIVE_INFINITY)))
        .build();
    assertThatThrownBy(() -> RunWriter.write(tmp, nanRate, RunFixtures.randomData(1, 2, false)))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("field 'sample_rate_hz' is NaN");
    assertThat(tmp.resolve("r9.csv")).doesNotExist();
    assertThat(tmp.resolve("r9.json")).doesNotExist();
  }

  @Test
  void refusesRunIdsThatAreNotSafeStems() {
    assertThatThrownBy(() -> RunWriter.write(tmp, RunFixtures.startMetadata("../evil", false),
        RunFixtures.randomData(1, 2, false))).isInstanceOf(IllegalArgumentException.class);
    assertThat(tmp.getParent().resolve("evil.csv")).doesNotExist();
  }

  @Test
  void sidecarIsUtf8Json() throws Exception {
    StoredRun s = RunWriter.write(tmp, RunFixtures.fullMetadata("r7"),
        RunFixtures.randomData(1, 4, true));
    String text = new String(Files.readAllBytes(s.json()), StandardCharsets.UTF_8);
    assertThat(text).startsWith("{").contains("\"run_id\" : \"r7\"").endsWith("}\n");
  }
}
