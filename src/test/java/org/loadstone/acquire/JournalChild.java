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
 * <p>Arguments: archive folder, run id, and optionally the rate in samples/s (default 1000) and
 * a counter file: the number of samples put is stored there (a shared file mapping, which a
 * SIGKILL does not undo) after every batch, so the parent knows exactly how many the "device"
 * had delivered when the process died.
 */
public final class JournalChild {
  private JournalChild() {}

  public static void main(String[] args) {
    Path archive = Path.of(args[0]);
    long rate = args.length > 2 ? Long.parseLong(args[2]) : 1000;
    // at least 32 s of samples (262 s at 1 kHz): a writer starved on a busy machine loses nothing
    SampleRing ring = new SampleRing((int) Math.max(1 << 18, Long.highestOneBit(rate * 32) << 1));
    JournalWriter w = JournalWriter.start(archive, RunFixtures.startMetadata(args[1], false),
        ring.cursorAtEnd());
    java.nio.MappedByteBuffer counter = args.length > 3 ? map(Path.of(args[3])) : null;
    long t0 = System.nanoTime();
    long put = 0;
    long lastPrint = 0;
    while (true) {
      long elapsedUs = TimeUnit.NANOSECONDS.toMicros(System.nanoTime() - t0);
      long elapsedMs = elapsedUs / 1000;
      if (elapsedMs > 600_000) {
        System.exit(3);
      }
      long due = elapsedUs * rate / 1_000_000;
      while (put < due) { // the rate's samples per elapsed time
        JournalSamples.put(ring, put++);
      }
      if (counter != null) {
        counter.putLong(0, put);
      }
      if (elapsedMs - lastPrint >= 20) {
        lastPrint = elapsedMs;
        System.out.println("put " + put + " durable " + w.samplesDurable());
        System.out.flush();
      }
      LockSupport.parkNanos(500_000);
    }
  }

  private static java.nio.MappedByteBuffer map(Path file) {
    try (java.nio.channels.FileChannel ch = java.nio.channels.FileChannel.open(file,
        java.nio.file.StandardOpenOption.CREATE, java.nio.file.StandardOpenOption.READ,
        java.nio.file.StandardOpenOption.WRITE)) {
      return ch.map(java.nio.channels.FileChannel.MapMode.READ_WRITE, 0, 8);
    } catch (java.io.IOException e) {
      throw new java.io.UncheckedIOException(e);
    }
  }
}
