package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.loadstone.HangGuard;
import org.loadstone.archive.FinishCause;
import org.loadstone.archive.Run;
import org.loadstone.archive.RunReader;

/**
 * {@code record} on a real small file system (a tmpfs mounted for the test): refused before the
 * zero when the run cannot fit, and a disk that fills during the run ends it with cause
 * {@code disk-full}, exit code 4, every sample kept and the message saying how many. Mounting
 * needs root; elsewhere the test is skipped with the reason ({@code DiskFullTest} covers the
 * same rules on an injected file system everywhere).
 */
@Tag("fault")
class RecordOnAFullDiskTest {
  private Path mount;

  private Path mountTmpfs(String size) throws Exception {
    mount = Files.createTempDirectory("loadstone-small-disk");
    Process p = new ProcessBuilder("mount", "-t", "tmpfs", "-o", "size=" + size, "tmpfs",
        mount.toString()).redirectErrorStream(true).start();
    String said = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
    boolean done = p.waitFor(HangGuard.S, TimeUnit.SECONDS) && p.exitValue() == 0;
    if (!done) {
      Files.deleteIfExists(mount);
      mount = null;
    }
    Assumptions.assumeTrue(done, "cannot mount a small file system here (needs root): " + said);
    return mount;
  }

  @AfterEach
  void unmount() throws Exception {
    if (mount != null) {
      new ProcessBuilder("umount", mount.toString()).inheritIO().start()
          .waitFor(HangGuard.S, TimeUnit.SECONDS);
      Files.deleteIfExists(mount);
    }
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  void aDiskTooSmallForTheRunIsRefusedBeforeTheZero() throws Exception {
    Path disk = mountTmpfs("2m");
    RecordCommandTest.Outcome r = RecordCommandTest.run("record", "--port", "sim", "--scenario",
        "panel-foam", "--rate-hz", "1000", "--specimen", "small", "--archive", disk.toString());
    assertThat(r.exit()).as(r.err()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(r.err()).contains("the disk holding the archive " + disk).contains("needs")
        .contains("--archive").contains("--max-duration-s").doesNotContain("zeroing")
        .doesNotContain("\tat ");
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  void aDiskThatFillsDuringTheRunEndsItAsDiskFullAndKeepsEverySample() throws Exception {
    Path disk = mountTmpfs("40m");
    CountDownLatch waiting = new CountDownLatch(1);
    StringWriter e = new StringWriter();
    PrintWriter err = new PrintWriter(e, true) {
      @Override
      public void println(String x) {
        super.println(x);
        if (x.contains("as soon as space is freed")) {
          waiting.countDown();
        }
      }
    };
    StringWriter o = new StringWriter();
    AtomicInteger exit = new AtomicInteger(-1);
    Thread rec = new Thread(() -> exit.set(LoadstoneCommand.run(new PrintWriter(o, true), err,
        "record", "--port", "sim", "--scenario", "panel-foam", "--seed", "3", "--rate-hz", "1000",
        "--specimen", "filling", "--manual-start", "--max-duration-s", "30", "--archive",
        disk.toString(), "--json")));
    rec.start();
    RecordCommandTest.awaitJournalSamples(disk, 1000, rec::isAlive, e::toString); // counted
    Path filler = disk.resolve("filler.bin");
    try (OutputStream out = Files.newOutputStream(filler)) {
      byte[] mb = new byte[1 << 20];
      while (true) {
        out.write(mb); // until the disk is full
      }
    } catch (IOException full) {
      // as intended
    }
    assertThat(waiting.await(HangGuard.S, TimeUnit.SECONDS)).as(e.toString()).isTrue();
    Files.delete(filler); // space is freed: the held samples are written and the run stored
    rec.join(HangGuard.MS);
    assertThat(exit.get()).as(e.toString()).isEqualTo(LoadstoneCommand.EXIT_DISK_FULL);
    RecordCommandTest.Outcome r = new RecordCommandTest.Outcome(exit.get(), o.toString(),
        e.toString());
    assertThat(r.json().get("cause").asText()).isEqualTo("disk-full");
    Run run = RunReader.read(Path.of(r.json().get("csv_file").asText()));
    assertThat(run.metadata().cause()).isEqualTo(FinishCause.DISK_FULL);
    int n = run.data().size();
    assertThat(r.err()).contains("all " + n + " samples were kept").doesNotContain("\tat ");
    int[] seq = run.data().seq();
    for (int i = 1; i < n; i++) { // nothing missing between what the journal and memory held
      assertThat(seq[i]).as("sample %d", i).isEqualTo((seq[i - 1] + 1) & 0xFFFF);
    }
  }
}
