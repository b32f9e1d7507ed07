package org.loadstone.acquire;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.zip.CRC32C;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.HangGuard;
import org.loadstone.archive.FinishCause;
import org.loadstone.archive.JournalRecovery;
import org.loadstone.archive.Run;
import org.loadstone.archive.RunReader;
import org.loadstone.archive.StoredRun;

/**
 * A program killed (SIGKILL: no shutdown hook, no last write) while its finished run waits for
 * room on a full disk: at the next start the run is recovered as it ended, with its cause, its
 * break and exactly its samples, bit for bit. The oracle is the child's own report of the run it
 * was storing, taken from the device's stream in its ring (seq and counts of every sample).
 */
@Tag("fault")
class SaveWaitKillTest {
  @TempDir Path archive;

  @Test
  @Timeout(HangGuard.TEST_S)
  void aRunKilledWhileWaitingForRoomIsRecoveredWithItsCauseBreakAndSamples() throws Exception {
    String javaBin = Path.of(System.getProperty("java.home"), "bin", "java").toString();
    Process p = new ProcessBuilder(javaBin, "-cp", System.getProperty("java.class.path"),
        SaveWaitChild.class.getName(), archive.toString())
        .redirectError(ProcessBuilder.Redirect.INHERIT).start();
    String[] ended = null;
    boolean waiting = false;
    try (BufferedReader r = new BufferedReader(
        new InputStreamReader(p.getInputStream(), StandardCharsets.UTF_8))) {
      // by the child's own words, not by time: the run ended, then the store waits for room
      for (String line; !waiting && (line = r.readLine()) != null; ) {
        if (line.startsWith("ended ")) {
          ended = line.split(" ");
        }
        waiting = line.equals("waiting");
      }
    } finally {
      p.destroyForcibly(); // SIGKILL on Linux
      assertThat(p.waitFor(HangGuard.S, TimeUnit.SECONDS)).isTrue();
    }
    assertThat(waiting).as("the child reached the wait for room").isTrue();
    assertThat(ended).as("the child said how its run ended").isNotNull();
    // "ended cause <c> break <i> samples <n> crc <x>"
    FinishCause cause = FinishCause.parse(ended[2]);
    // the simulated brittle specimen breaks (the simulator's scenario): the run ends at a break
    assertThat(cause).isEqualTo(FinishCause.BREAK);
    int breakIndex = Integer.parseInt(ended[4]);
    int samples = Integer.parseInt(ended[6]);
    long crc = Long.parseLong(ended[8]);

    List<StoredRun> runs = JournalRecovery.recoverAll(archive, n -> { });
    assertThat(runs).hasSize(1);
    Run run = RunReader.read(runs.get(0).csv());
    assertThat(run.metadata().cause()).isEqualTo(FinishCause.BREAK);
    assertThat(run.metadata().breakIndex()).isEqualTo(breakIndex);
    assertThat(run.data().size()).isEqualTo(samples);
    CRC32C c = new CRC32C();
    ByteBuffer b = ByteBuffer.allocate(8);
    for (int i = 0; i < samples; i++) {
      b.clear();
      b.putInt(run.data().seq()[i]).putInt(run.data().rawCounts()[i]);
      c.update(b.array(), 0, 8);
    }
    assertThat(c.getValue()).as("every sample, bit for bit").isEqualTo(crc);
    assertThat(run.metadata().warnings()).anySatisfy(w -> assertThat(w)
        .contains("the program ended while the run was being stored"));
  }
}
