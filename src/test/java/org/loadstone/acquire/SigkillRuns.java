package org.loadstone.acquire;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.TimeUnit;
import org.loadstone.HangGuard;
import org.loadstone.archive.JournalFormat;
import org.loadstone.archive.JournalRecovery;
import org.loadstone.archive.Run;
import org.loadstone.archive.RunReader;
import org.loadstone.archive.StoredRun;

/**
 * A journalling child process ({@link JournalChild}) killed with SIGKILL, and its run recovered:
 * shared by {@code SigkillLossTest} and the bench profile's fault run.
 */
public final class SigkillRuns {
  private SigkillRuns() {}

  /**
   * Kills one child after it reports {@code durable} samples on the disk, recovers its journal
   * and checks it bit for bit.
   *
   * @return delivered (exact, from the child's shared counter), recovered, reported durable
   */
  public static long[] killAndRecover(Path archive, int rate, long durable, String id) throws Exception {
    Path counter = archive.resolve(id + ".count");
    String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
    Process p = new ProcessBuilder(java, "-cp", System.getProperty("java.class.path"),
        JournalChild.class.getName(), archive.toString(), id, Integer.toString(rate),
        counter.toString()).redirectError(ProcessBuilder.Redirect.INHERIT).start();
    long reported = 0;
    try (BufferedReader r = new BufferedReader(
        new InputStreamReader(p.getInputStream(), StandardCharsets.UTF_8))) {
      String line;
      while (reported < durable && (line = r.readLine()) != null) { // a count, not a time
        reported = Long.parseLong(line.split(" ")[3]);
      }
      p.destroyForcibly(); // SIGKILL: no shutdown hooks, no last write
      assertThat(p.waitFor(HangGuard.S, TimeUnit.SECONDS)).isTrue();
    }
    long delivered = ByteBuffer.wrap(Files.readAllBytes(counter)).getLong();
    Files.delete(counter);
    List<StoredRun> runs = JournalRecovery.recoverAll(archive, m -> { });
    assertThat(runs).hasSize(1);
    Run run = RunReader.read(runs.get(0).csv());
    int kept = run.data().size();
    assertThat(kept).isGreaterThanOrEqualTo((int) reported).isLessThanOrEqualTo((int) delivered);
    for (int i = 0; i < kept; i++) { // bit for bit, from the first sample, no gap
      if (run.data().rawCounts()[i] != JournalSamples.counts(i)
          || run.data().seq()[i] != JournalSamples.seq(i)
          || run.data().rawPosition()[i] != JournalSamples.position(i)) {
        throw new AssertionError("recovered sample " + i + " differs from the one sent");
      }
    }
    assertThat(JournalFormat.journalFile(archive, id)).doesNotExist();
    Files.delete(runs.get(0).csv());
    Files.delete(runs.get(0).json());
    return new long[] {delivered, kept, reported};
  }

  public static String describe(int rate, long[] f) {
    return String.format(Locale.ROOT, "SIGKILL at %d samples/s: %d delivered, %d recovered"
        + " bit for bit, %.2f ms lost (%d reported durable before the kill)", rate, f[0], f[1],
        (f[0] - f[1]) * 1000.0 / rate, f[2]);
  }

}
