package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.HangGuard;
import org.loadstone.archive.ArchiveIndex;
import org.loadstone.archive.FinishCause;

/**
 * Ctrl-C in {@code record}: a real JVM is interrupted (SIGINT) while it records on the simulated
 * frame; the run so far is stored, printed on standard output, and the exit code is the
 * documented 130. Waits on counted samples in the journal, never on time. The simulated cell
 * only carries dead weights (nothing to break), so however slowly a busy machine reaches the
 * interrupt, no break can end the run first.
 */
class RecordInterruptTest {
  @TempDir Path dir;

  @Test
  @Timeout(HangGuard.TEST_S)
  void ctrlCStoresThePrintsTheRunAndExits130() throws Exception {
    Path arc = dir.resolve("runs");
    String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
    Process p = new ProcessBuilder(java, "-cp", System.getProperty("java.class.path"),
        "org.loadstone.Main", "record", "--port", "sim", "--scenario", "dead-weight", "--rate-hz",
        "1000", "--manual-start", "--specimen", "cut-short", "--archive", arc.toString())
        .redirectOutput(dir.resolve("out.txt").toFile())
        .redirectError(dir.resolve("err.txt").toFile())
        .start();
    try {
      RecordCommandTest.awaitJournalSamples(arc, 2000);
      Process kill = new ProcessBuilder("kill", "-INT", Long.toString(p.pid())).start();
      assertThat(kill.waitFor(HangGuard.S, TimeUnit.SECONDS)).isTrue();
      if (!p.waitFor(HangGuard.S, TimeUnit.SECONDS)) {
        throw new AssertionError("record did not end after Ctrl-C; its threads:\n"
            + threadsOf(p) + "\nstderr:\n" + Files.readString(dir.resolve("err.txt")));
      }
    } finally {
      p.destroyForcibly();
    }
    String out = Files.readString(dir.resolve("out.txt"), StandardCharsets.UTF_8);
    String err = Files.readString(dir.resolve("err.txt"), StandardCharsets.UTF_8);
    assertThat(p.exitValue()).as(err).isEqualTo(130); // 128 + SIGINT, as shells report it
    List<ArchiveIndex.Entry> runs = ArchiveIndex.scan(arc).entries();
    assertThat(runs).hasSize(1);
    assertThat(runs.get(0).metadata().cause()).isEqualTo(FinishCause.MANUAL);
    assertThat(out).as(err).contains("run " + runs.get(0).metadata().runId() + ": manual",
        runs.get(0).csv().toString());
  }

  /** The thread dump of a live process (what it waits on), for a failure message. */
  private static String threadsOf(Process p) throws Exception {
    String jcmd = Path.of(System.getProperty("java.home"), "bin", "jcmd").toString();
    Process dump = new ProcessBuilder(jcmd, Long.toString(p.pid()), "Thread.print")
        .redirectErrorStream(true).start();
    String text = new String(dump.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
    dump.waitFor(HangGuard.S, TimeUnit.SECONDS);
    return text;
  }
}
