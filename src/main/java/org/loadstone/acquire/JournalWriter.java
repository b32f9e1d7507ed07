package org.loadstone.acquire;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.locks.LockSupport;
import java.util.function.LongSupplier;
import org.loadstone.archive.JournalFormat;
import org.loadstone.archive.RunMetadata;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * Writes a run's raw samples to its journal ({@link JournalFormat}) as they arrive, on its own
 * thread, reading the {@link SampleRing} through its own cursor, so the device reader never
 * waits on the disk. If the disk is slower than the device for longer than the ring holds, the
 * journal misses samples (counted in {@link #samplesLost()}); the reader is never slowed.
 *
 * <p>Durability: the thread polls the cursor every {@value #POLL_MS} ms, appends what is
 * waiting, and calls {@link FileChannel#force(boolean) force(false)} (fdatasync, which also
 * makes the new file length durable) whenever unforced records exist and at least {@value
 * #FORCE_INTERVAL_MS} ms have passed since the previous force began. A sample is therefore on
 * the disk about {@value #FORCE_INTERVAL_MS} ms + one poll + one force after it reached the
 * ring, inside the 100 ms the design allows on an ordinary disk.
 *
 * <p>Use: {@link #start}, then at the end of the run {@link #finish()}, store the run, then
 * {@link #discard()}. If the program ends first, the journal stays for {@code
 * JournalRecovery}.
 */
public final class JournalWriter implements AutoCloseable {
  /** Longest time between forces while samples arrive, ms. */
  public static final long FORCE_INTERVAL_MS = 50;
  /** Poll period when the ring has nothing new, ms. */
  public static final long POLL_MS = 2;
  private static final int BATCH = 4096;

  /** Where records go; a file channel outside tests. */
  interface Sink extends java.io.Closeable {
    void write(ByteBuffer records) throws IOException;

    void force() throws IOException;
  }

  private static Sink of(FileChannel ch) {
    return new Sink() {
      @Override
      public void write(ByteBuffer records) throws IOException {
        while (records.hasRemaining()) {
          ch.write(records);
        }
      }

      @Override
      public void force() throws IOException {
        ch.force(false);
      }

      @Override
      public void close() throws IOException {
        ch.close();
      }
    };
  }

  private final Path file;
  private volatile String runId;
  private final Sink channel;
  private final SampleRing.Cursor cursor;
  private final Thread thread;
  private final LongSupplier clock_ns;
  private final long forceInterval_ns = TimeUnit.MILLISECONDS.toNanos(FORCE_INTERVAL_MS);
  private long lastForce_ns;
  private long target = -1;
  private final ByteBuffer buf = ByteBuffer.allocate(BATCH * JournalFormat.RECORD_BYTES);
  private volatile boolean stopRequested;
  private volatile boolean finished;
  private volatile long written;
  private volatile long durable;
  private volatile long lost;
  private volatile Exception failure;

  /**
   * @param clock_ns the writer's clock in ns ({@link System#nanoTime} outside tests)
   */
  JournalWriter(Path file, Sink channel, SampleRing.Cursor cursor, LongSupplier clock_ns) {
    this.file = file;
    this.channel = channel;
    this.cursor = cursor;
    this.clock_ns = clock_ns;
    this.lastForce_ns = clock_ns.getAsLong();
    this.thread = new Thread(this::loop, "loadstone-journal-" + file.getFileName());
    this.thread.setDaemon(true);
  }

  /** Starts the thread of a writer made with the package-private constructor (tests). */
  JournalWriter begin() {
    thread.start();
    return this;
  }

  /**
   * Creates {@code <archive>/.journal/<run-id>.journal}, writes and forces its header, and starts
   * the writer thread.
   *
   * @param archiveDir the archive folder (created if missing)
   * @param startInfo the run as known at its start; cause and break fields are ignored
   * @param cursor where the run's samples begin (e.g. {@link SampleRing#cursorBack} for the
   *     pre-trigger history); from now on used only by the writer thread
   * @throws LoadstoneException when the journal cannot be created (the run should not start)
   */
  public static JournalWriter start(Path archiveDir, RunMetadata startInfo,
      SampleRing.Cursor cursor) {
    Precondition.notNull(cursor, "cursor");
    JournalFormat.Opened j = JournalFormat.open(archiveDir, startInfo);
    JournalWriter w = new JournalWriter(j.file(), of(j.channel()), cursor, System::nanoTime);
    w.runId = j.startInfo().runId();
    return w.begin();
  }

  /**
   * @return the id the run got: the one asked for, or {@code id-n} when another run or program
   *     held that one at the start
   */
  public String runId() {
    return runId;
  }

  /** @return the journal file */
  public Path file() {
    return file;
  }

  /** @return records handed to the operating system */
  public long samplesWritten() {
    return written;
  }

  /** @return records known to be on the disk (forced) */
  public long samplesDurable() {
    return durable;
  }

  /** @return samples the journal missed because it fell more than a ring behind */
  public long samplesLost() {
    return lost;
  }

  /**
   * @return why the journal stopped writing (e.g. "No space left on device"), or empty while it
   *     is healthy; once set, no more samples reach the journal
   */
  public java.util.Optional<String> problem() {
    Exception f = failure;
    return f == null ? java.util.Optional.empty()
        : java.util.Optional.of("journal " + file + " stopped: " + f.getMessage());
  }

  private void loop() {
    try {
      int n;
      while ((n = pass()) >= 0) {
        if (n == 0) {
          LockSupport.parkNanos(TimeUnit.MILLISECONDS.toNanos(POLL_MS));
        }
      }
    } catch (IOException | RuntimeException e) {
      failure = e; // reported by problem() and finish(); the ring and its reader are unaffected
    } finally {
      try {
        channel.close();
      } catch (IOException e) {
        if (failure == null) {
          failure = e;
        }
      }
    }
  }

  /**
   * One pass of the writer thread: appends what waits in the ring (at most one batch), and forces
   * the file when unforced records exist and {@value #FORCE_INTERVAL_MS} ms have passed on the
   * clock since the previous force, or when a requested stop has written everything. Tests call
   * it directly with an injected clock instead of starting the thread.
   *
   * @return samples appended, or -1 once a requested stop is complete
   */
  int pass() throws IOException {
    if (stopRequested && target < 0) {
      target = cursor.position() + cursor.available();
    }
    int n = cursor.drain(this::append, BATCH);
    if (n > 0) {
      buf.flip();
      channel.write(buf);
      buf.clear();
      written += n;
    }
    lost = cursor.lost();
    long now = clock_ns.getAsLong();
    boolean done = target >= 0 && cursor.position() >= target;
    if (written > durable && (done || now - lastForce_ns >= forceInterval_ns)) {
      long w = written;
      lastForce_ns = now;
      channel.force();
      durable = w;
    }
    return done ? -1 : n;
  }

  /** Asks a writer whose thread was never started (tests) to finish at the next {@link #pass}. */
  void requestStop() {
    stopRequested = true;
  }

  private void append(long index, int seq, long deviceUs, long timeUs, int counts,
      boolean hasPosition, int position) {
    JournalFormat.putRecord(buf, index, seq, deviceUs, timeUs, counts, hasPosition, position);
  }

  /**
   * Writes every sample in the ring at the time of the call, forces it to the disk and closes
   * the journal. Waits for the writer thread (not for the device).
   *
   * @throws LoadstoneException when writing the journal failed at any point (e.g. disk full); the
   *     journal keeps what reached the disk
   */
  public void finish() {
    stop();
    Exception f = failure;
    if (f != null) {
      throw new LoadstoneException("journal " + file + " could not be written: " + f.getMessage()
          + ": free disk space; the samples that reached it are kept and the run can still be"
          + " stored from memory", f);
    }
    finished = true;
  }

  /**
   * Deletes the journal once its run is stored.
   *
   * @throws IllegalStateException when {@link #finish()} has not completed
   * @throws LoadstoneException when the file cannot be removed
   */
  public void discard() {
    if (!finished) {
      throw new IllegalStateException("finish the journal before discarding it");
    }
    try {
      Files.deleteIfExists(file);
    } catch (IOException e) {
      throw new LoadstoneException("journal " + file + " cannot be removed: " + e.getMessage()
          + ": delete it by hand, or it will be recovered as a second copy of the run", e);
    }
  }

  /** Stops writing and closes the journal, keeping the file (it is recovered at next start). */
  @Override
  public void close() {
    stop();
  }

  private void stop() {
    stopRequested = true;
    LockSupport.unpark(thread);
    boolean interrupted = false;
    while (thread.isAlive()) {
      try {
        thread.join();
      } catch (InterruptedException e) {
        interrupted = true;
      }
    }
    if (interrupted) {
      Thread.currentThread().interrupt();
    }
  }
}
