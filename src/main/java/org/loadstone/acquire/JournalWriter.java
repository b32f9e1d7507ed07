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
 * <p>A disk that fills (or any other write failure) does not stop the writer: from the first
 * record that could not be written on, records are held in memory, in order, and written again
 * every {@value #RETRY_MS} ms, so the journal catches up as soon as space returns ({@link
 * #diskFault()} keeps the first failure; {@link #samplesHeld()} counts what waits in memory). A
 * record cut by the failure is completed by the held bytes, so the file stays one stream of
 * records.
 *
 * <p>Use: {@link #start}, then at the end of the run {@link #finish()}, store the run (with the
 * held records first written by {@link #writeHeld()} or copied elsewhere by {@link
 * #copyTo}), then {@link #discard()}. If the program ends first, the journal stays for {@code
 * JournalRecovery}.
 */
public final class JournalWriter implements AutoCloseable {
  /** Longest time between forces while samples arrive, ms. */
  public static final long FORCE_INTERVAL_MS = 50;
  /** Poll period when the ring has nothing new, ms. */
  public static final long POLL_MS = 2;
  /** How often records held in memory are tried again on the disk, ms. */
  public static final long RETRY_MS = 500;
  /** How often the room left on the disk is looked at while the run records, ms. */
  public static final long WATCH_MS = 1000;
  private static final int BATCH = 4096;

  private final Path file;
  private volatile String runId;
  private final JournalSink channel;
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
  private volatile IOException diskFault;
  private volatile long faultIndex = -1;
  private final HeldRecords held = new HeldRecords(Runtime.getRuntime().maxMemory() / 4);
  private volatile long fileBytes;
  private volatile boolean unforced;
  private long retryAt_ns;
  private long watchAt_ns;
  private long headerBytes;
  private java.util.function.LongSupplier freeBytes = () -> -1;
  private volatile String spaceWarning;

  /**
   * @param clock_ns the writer's clock in ns ({@link System#nanoTime} outside tests)
   */
  JournalWriter(Path file, JournalSink channel, SampleRing.Cursor cursor, LongSupplier clock_ns) {
    this.file = file;
    this.channel = channel;
    this.cursor = cursor;
    this.clock_ns = clock_ns;
    this.lastForce_ns = clock_ns.getAsLong();
    this.watchAt_ns = lastForce_ns;
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
    // room for how the run ends, taken now while the disk has it (JournalRunStore fills it in)
    org.loadstone.archive.JournalEnd.reserve(j.file());
    JournalWriter w = new JournalWriter(j.file(), JournalSink.of(j.channel()), cursor, System::nanoTime);
    w.runId = j.startInfo().runId();
    try {
      w.headerBytes = j.channel().position();
    } catch (IOException e) {
      w.headerBytes = JournalFormat.header(j.startInfo()).length;
    }
    Path folder = j.file().getParent();
    w.freeBytes = () -> DiskSpace.usable(folder);
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
    return f != null ? java.util.Optional.of("journal " + file + " stopped: " + f.getMessage())
        : diskFault();
  }

  /**
   * @return the first failure to write the journal (e.g. "No space left on device") and the
   *     sample it happened at, or empty when every write succeeded; stays set after the journal
   *     caught up
   */
  public java.util.Optional<String> diskFault() {
    IOException e = diskFault;
    return e == null ? java.util.Optional.empty() : java.util.Optional.of("journal " + file
        + " could not be written from sample " + faultIndex + " on (" + reason(e) + ")");
  }

  /** @return ring index of the first record the disk refused, or -1 when none was refused */
  public long faultIndex() {
    return diskFault == null ? -1 : faultIndex;
  }

  /** @return records waiting in memory for the disk */
  public long samplesHeld() {
    return (fileBytes + held.bytes()) / JournalFormat.RECORD_BYTES - written;
  }

  /** @return records dropped because memory for held records ran out */
  public long samplesLostInMemory() {
    return held.lost();
  }

  /**
   * @return a warning, once the room left on the disk is less than storing what is recorded
   *     needs ({@link DiskSpace#shortFall}); null while there is room
   */
  public String spaceWarning() {
    return spaceWarning;
  }

  private static String reason(IOException e) {
    return e instanceof java.nio.file.FileSystemException f && f.getReason() != null
        ? f.getReason() : String.valueOf(e.getMessage());
  }

  private void loop() {
    try {
      int n;
      while ((n = pass()) >= 0) {
        if (n == 0) {
          LockSupport.parkNanos(TimeUnit.MILLISECONDS.toNanos(POLL_MS));
        }
      }
    } catch (RuntimeException e) {
      failure = e; // reported by problem() and finish(); the ring and its reader are unaffected
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
  int pass() {
    if (stopRequested && target < 0) {
      target = cursor.position() + cursor.available();
    }
    long first = cursor.position();
    int n = cursor.drain(this::append, BATCH);
    if (n > 0) {
      buf.flip();
      if (held.isEmpty()) {
        put(buf, first);
      }
      if (buf.hasRemaining()) {
        held.hold(buf);
      }
      buf.clear();
    }
    lost = cursor.lost();
    long now = clock_ns.getAsLong();
    boolean done = target >= 0 && cursor.position() >= target;
    if (!held.isEmpty() && now - retryAt_ns >= 0) {
      retryAt_ns = now + TimeUnit.MILLISECONDS.toNanos(RETRY_MS);
      writeHeldNow();
    }
    if (held.isEmpty() && (written > durable || unforced)
        && (done || now - lastForce_ns >= forceInterval_ns)) {
      lastForce_ns = now;
      forceNow();
    }
    if (now - watchAt_ns >= 0 && spaceWarning == null) {
      watchAt_ns = now + TimeUnit.MILLISECONDS.toNanos(WATCH_MS);
      spaceWarning = DiskSpace.shortFall(freeBytes.getAsLong(), written + samplesHeld());
    }
    return done ? -1 : n;
  }

  /** Writes {@code b} to the file; on a failure leaves the rest in {@code b}. */
  private void put(ByteBuffer b, long firstIndex) {
    int start = b.position();
    try {
      channel.write(b);
    } catch (IOException e) {
      if (diskFault == null) {
        faultIndex = firstIndex + (b.position() - start) / JournalFormat.RECORD_BYTES;
        diskFault = e;
      }
    } finally {
      fileBytes += b.position() - start;
      written = fileBytes / JournalFormat.RECORD_BYTES;
    }
  }

  /** Writes what is held, in order, and forces it; stops at the first failure. */
  private void writeHeldNow() {
    if (held.writeThrough(b -> put(b, -1))) {
      forceNow();
    }
  }

  private void forceNow() {
    long w = written;
    try {
      channel.force();
      durable = w;
      unforced = false;
    } catch (IOException e) {
      unforced = true; // tried again with the next records or at the finish
      if (diskFault == null) {
        faultIndex = -1;
        diskFault = e;
      }
    }
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
   * Writes every sample in the ring at the time of the call to the journal or, where the disk
   * refuses it, to memory ({@link #samplesHeld()}), and forces what is in the file. Waits for the
   * writer thread (not for the device).
   *
   * @throws LoadstoneException when the writer thread itself failed (a fault of the program);
   *     the journal keeps what reached it
   */
  public void finish() {
    stop();
    Exception f = failure;
    if (f != null) {
      throw new LoadstoneException("journal " + file + " could not be written: " + f
          + "; the " + written + " samples that reached it are kept there and become a run at"
          + " the next start", f);
    }
    writeHeld();
    finished = true;
  }

  /**
   * After {@link #finish()}: tries again to write the records held in memory, and forces the
   * file.
   *
   * @return whether the journal now holds every record
   */
  public boolean writeHeld() {
    if (thread.isAlive()) {
      throw new IllegalStateException("finish the journal before writing what it holds");
    }
    writeHeldNow();
    return held.isEmpty() && !unforced;
  }

  /**
   * After {@link #finish()}: appends the journal's records, then those held in memory, to
   * another journal whose header is written already (a second location when this disk stays
   * full).
   *
   * @param target open for writing, positioned after its header
   * @throws IOException when this journal cannot be read or the target cannot be written
   */
  public void copyTo(FileChannel target) throws IOException {
    if (thread.isAlive()) {
      throw new IllegalStateException("finish the journal before copying it");
    }
    HeldRecords.copyRange(file, headerBytes, headerBytes + fileBytes, target);
    held.copyTo(target);
    target.force(true);
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
    closeChannel();
    try {
      Files.deleteIfExists(file);
      org.loadstone.archive.JournalEnd.delete(file);
    } catch (IOException e) {
      throw new LoadstoneException("journal " + file + " cannot be removed: " + e.getMessage()
          + ": delete it by hand, or it will be recovered as a second copy of the run", e);
    }
  }

  /** Stops writing and closes the journal, keeping the file (it is recovered at next start). */
  @Override
  public void close() {
    stop();
    closeChannel();
  }

  private void closeChannel() {
    try {
      channel.close();
    } catch (IOException e) {
      // what reached the file stays; nothing more is written to it
    }
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
