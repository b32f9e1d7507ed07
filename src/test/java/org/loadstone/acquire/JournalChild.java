package org.loadstone.acquire;

import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.locks.LockSupport;
import org.loadstone.archive.RunFixtures;

/**
 * A program the kill test starts in its own JVM: it feeds a ring at 1000 samples/s (as the device
 * reader would), journals it with a {@link JournalWriter}, and prints {@code put <n> durable <d>}
 * every 20 ms until it is killed (or after 10 min, as a safety net).
 *
 * <p>Arguments: archive folder, run id.
 */
public final class JournalChild {
  private JournalChild() {}

  public static void main(String[] args) {
    Path archive = Path.of(args[0]);
    SampleRing ring = new SampleRing(1 << 18); // 262 s at 1 kHz: a starved writer loses nothing
    JournalWriter w = JournalWriter.start(archive, RunFixtures.startMetadata(args[1], false),
        ring.cursorAtEnd());
    long t0 = System.nanoTime();
    long put = 0;
    long lastPrint = 0;
    while (true) {
      long elapsedMs = TimeUnit.NANOSECONDS.toMillis(System.nanoTime() - t0);
      if (elapsedMs > 600_000) {
        System.exit(3);
      }
      while (put < elapsedMs) { // 1 sample per ms of elapsed time
        JournalSamples.put(ring, put++);
      }
      if (elapsedMs - lastPrint >= 20) {
        lastPrint = elapsedMs;
        System.out.println("put " + put + " durable " + w.samplesDurable());
        System.out.flush();
      }
      LockSupport.parkNanos(500_000);
    }
  }
}
