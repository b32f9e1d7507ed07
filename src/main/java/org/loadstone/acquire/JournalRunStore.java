package org.loadstone.acquire;

import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.loadstone.archive.FinishCause;
import org.loadstone.archive.JournalEnd;
import org.loadstone.archive.JournalFormat;
import org.loadstone.archive.JournalRecovery;
import org.loadstone.archive.JournalStream;
import org.loadstone.archive.RunMetadata;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * The archive's run store: samples go to an append-only journal as they arrive (forced to disk at
 * least every 100 ms); at the finish the journal is streamed into the run files (CSV + JSON,
 * {@link JournalStream}, with a heap that does not grow with the run), and only then is the
 * journal removed; if storing fails, out of memory included, the journal stays. If the program
 * dies first, {@link JournalRecovery} rebuilds the run at the next start.
 *
 * <p>A full disk: samples the journal could not take are held in memory ({@link
 * JournalWriter}); the run ends with cause {@code disk-full} (its break kept, if it had one) and
 * is stored as soon as the disk has room again, or in the second location when one is set. A
 * disk that fills while the run files are written is waited for the same way; the run keeps its
 * cause and break. Every message says where the samples are.
 */
public final class JournalRunStore implements RunStore {
  /** Turns a finished journal into run files; a seam for tests that make storing fail. */
  interface RunFiles {
    JournalStream.Stored store(Path archiveDir, Path journal, long lastIndex, RunMetadata meta);
  }

  private final Path archiveDir;
  private volatile Path second;
  private final RunFiles files;
  private final long retry_ms;
  private final KeptRoom room;

  /** @param archiveDir the archive folder */
  public JournalRunStore(Path archiveDir) {
    this(archiveDir, (Path) null);
  }

  /**
   * @param archiveDir the archive folder
   * @param second where runs go when the archive's disk is full (another disk), or null
   */
  public JournalRunStore(Path archiveDir, Path second) {
    this(archiveDir, second, JournalStream::store, JournalWriter.RETRY_MS);
  }

  JournalRunStore(Path archiveDir, RunFiles files) {
    this(archiveDir, null, files, JournalWriter.RETRY_MS);
  }

  JournalRunStore(Path archiveDir, Path second, RunFiles files, long retry_ms) {
    this.archiveDir = Precondition.notNull(archiveDir, "archiveDir");
    this.second = second;
    this.room = new KeptRoom(archiveDir);
    this.files = files;
    this.retry_ms = retry_ms;
  }

  /**
   * Sets where runs go when the archive's disk is full, also while a run waits for room to be
   * stored: the waiting run is then stored there at the next try, every sample the journal and
   * memory hold, and runs that begin later record there when the archive cannot take their
   * journal.
   *
   * @param where a folder on another disk, or null for none
   */
  public void useSecondLocation(Path where) {
    second = where;
  }

  /** @return where runs go when the archive's disk is full, or null */
  public Path secondLocation() {
    return second;
  }

  /**
   * Makes sure runs can be written here before a run starts: creates the folder and its journal
   * folder and writes and removes a probe file.
   *
   * @throws org.loadstone.units.LoadstoneException naming the folder and the fix
   */
  public void checkWritable() {
    Path jdir = JournalFormat.journalDir(archiveDir);
    try {
      Files.createDirectories(jdir);
      Path probe = Files.createTempFile(jdir, "probe", ".tmp");
      Files.delete(probe);
    } catch (IOException | RuntimeException e) {
      throw new LoadstoneException("cannot write runs to the archive folder "
          + archiveDir + " (" + e.getMessage() + "): choose another archive folder, or fix "
          + "this one's permissions and free space", e, org.loadstone.units.Setting.ARCHIVE_FOLDER);
    }
  }

  /**
   * Keeps {@value KeptRoom#BYTES} bytes on the archive's disk from the arming ({@link KeptRoom}),
   * given back just before the run's journal is made: a disk that fills between the arming and
   * the load still takes the journal, and the run's samples are then held in memory until room
   * returns, as when the disk fills during a run.
   *
   * @throws LoadstoneException when the disk has no room for it and no second location is set:
   *     the arming is refused, before the specimen is loaded
   */
  @Override
  public void keepRoom() {
    room.keep(second != null);
  }

  @Override
  public void releaseRoom() {
    room.release();
  }

  @Override
  public Recording begin(RunMetadata start, SampleRing ring, long firstIndex) {
    releaseRoom(); // the room kept from the arming is the journal's now
    JournalWriter journal;
    try {
      journal = JournalWriter.start(archiveDir, start, ring.cursorAt(firstIndex));
    } catch (LoadstoneException e) {
      Path there = second;
      if (there == null) {
        throw e;
      }
      // the archive's disk filled before the run began: the whole run goes to the second location
      String why = "the run's journal could not be made in the archive " + archiveDir + " ("
          + (e.getCause() != null ? e.getCause().getMessage() : e.getMessage()) + "), so the"
          + " run was recorded and stored in the second location " + there;
      return elsewhere(new JournalRunStore(there, null, files, retry_ms)
          .begin(start, ring, firstIndex), why);
    }
    return new Recording() {
      @Override
      public long durableSamples() {
        return journal.samplesDurable();
      }

      @Override
      public Optional<String> diskFault() {
        return journal.diskFault();
      }

      @Override
      public String spaceWarning() {
        return journal.spaceWarning();
      }

      @Override
      public Stored finish(long lastIndex, RunMetadata meta) {
        return finish(lastIndex, meta, Waiting.NONE);
      }

      @Override
      public Stored finish(long lastIndex, RunMetadata meta, Waiting waiting) {
        journal.finish();
        // the journal settled the id: another station may have held the one asked for
        return new Finish(journal, start.toBuilder().runId(journal.runId()).build(),
            meta.toBuilder().runId(journal.runId()).build(), firstIndex, lastIndex, waiting)
            .run();
      }
    };
  }

  /** A run recorded in the second location, with the reason added to its warnings. */
  private static Recording elsewhere(Recording there, String why) {
    return new Recording() {
      @Override
      public long durableSamples() {
        return there.durableSamples();
      }

      @Override
      public Optional<String> diskFault() {
        return there.diskFault();
      }

      @Override
      public String spaceWarning() {
        return there.spaceWarning();
      }

      @Override
      public Stored finish(long lastIndex, RunMetadata meta) {
        return finish(lastIndex, meta, Waiting.NONE);
      }

      @Override
      public Stored finish(long lastIndex, RunMetadata meta, Waiting waiting) {
        List<String> w = new ArrayList<>(meta.warnings());
        w.add(why);
        return there.finish(lastIndex, meta.withWarnings(w), waiting);
      }
    };
  }

  /** Storing one finished run, waiting for room when the disk is full. */
  private final class Finish {
    private final JournalWriter journal;
    private final RunMetadata start;
    private final long lastIndex;
    private final Waiting waiting;
    private final Optional<String> fault;
    /** samples of the run (first to last index) that reached the journal or memory */
    private final long samples;
    /** of those, held in memory when the run ended */
    private final long held;
    private RunMetadata meta;
    private String secondFailed;
    private Path failedAt;
    private boolean told;
    /** whether how the run ended is kept beside the journal ({@link JournalEnd}) */
    private boolean endKept;

    Finish(JournalWriter journal, RunMetadata start, RunMetadata meta, long firstIndex,
        long lastIndex, Waiting waiting) {
      this.journal = journal;
      this.start = start;
      this.lastIndex = lastIndex;
      this.waiting = waiting;
      this.fault = journal.diskFault();
      // the journal also took the samples that arrived after the run's last one: not counted
      this.samples = Math.min(journal.samplesWritten() + journal.samplesHeld(),
          lastIndex + 1 - firstIndex - journal.samplesLost());
      long f = journal.faultIndex();
      this.held = f < 0 || journal.samplesHeld() == 0 ? 0
          : Math.max(0, Math.min(journal.samplesHeld(), lastIndex + 1 - f));
      this.meta = fault.isPresent() ? meta.toBuilder().cause(FinishCause.DISK_FULL).build() : meta;
    }

    Stored run() {
      long since = System.nanoTime();
      // how the run ended goes beside the journal before any wait: a program killed while the
      // run is stored (or waits for room) leaves a journal recovered with its cause and break
      endKept = JournalEnd.write(journal.file(), meta, lastIndex);
      while (true) {
        boolean whole = journal.writeHeld();
        if (whole) {
          Stored s = inArchive(since);
          if (s != null) {
            return s;
          }
        }
        Path there = second; // may be chosen while the run waits (useSecondLocation)
        if (there != null && !there.equals(failedAt)) {
          try {
            return inSecond(there);
          } catch (LoadstoneException e) {
            secondFailed = e.getMessage();
            failedAt = there;
          }
        }
        if (!told) {
          told = true;
          waiting.say(waitingFor(whole));
        }
        if (waiting.cancelled()) {
          throw new LoadstoneException(givenUp(whole));
        }
        sleep(retry_ms);
      }
    }

    /** @return the run stored in the archive, or null when its disk is still full */
    private Stored inArchive(long since) {
      RunMetadata m = withDiskNotes(meta, held > 0 ? String.format(java.util.Locale.ROOT,
          ", %d of them held in memory until space was freed after %.0f s", held,
          (System.nanoTime() - since) / 1e9) : "", told && fault.isEmpty());
      JournalStream.Stored s;
      try {
        s = files.store(archiveDir, journal.file(), lastIndex, m);
      } catch (LoadstoneException | OutOfMemoryError e) {
        if (e instanceof LoadstoneException && !DiskSpace.roomToStore(
            DiskSpace.usable(archiveDir), journal.samplesWritten())) {
          return null; // the disk filled while the run files were written: wait for room
        }
        String why = e instanceof OutOfMemoryError
            ? "the program ran out of memory while storing it (" + e.getMessage() + ")"
            : e.getMessage();
        throw new LoadstoneException("run " + m.runId() + " was not stored: " + why
            + "; its samples are kept in the journal " + journal.file() + ", which becomes"
            + " a run at the next start", e);
      }
      journal.discard();
      return new Stored(m.runId(), s.files().csv(), s.files().json(), s.samples(), m.cause());
    }

    /** Copies the journal and the held samples to the second location and stores it there. */
    private Stored inSecond(Path second) {
      JournalFormat.Opened o = JournalFormat.open(second, start);
      try (FileChannel ch = o.channel()) {
        journal.copyTo(ch);
      } catch (IOException e) {
        org.loadstone.files.Folders.deleteQuietly(o.file());
        throw new LoadstoneException("the journal could not be copied to " + o.file() + " ("
            + e.getMessage() + ")", e);
      }
      String id = o.startInfo().runId();
      RunMetadata m = withDiskNotes(meta.toBuilder().runId(id).build(), held > 0
          ? ", " + held + " of them held in memory" : "", fault.isEmpty());
      List<String> w = new ArrayList<>(m.warnings());
      w.add("stored in the second location " + second + " because the disk holding the archive "
          + archiveDir + " was full");
      JournalStream.Stored s;
      try {
        s = files.store(second, o.file(), lastIndex, m.withWarnings(w));
      } catch (LoadstoneException | OutOfMemoryError e) {
        org.loadstone.files.Folders.deleteQuietly(o.file());
        throw new LoadstoneException("run " + id + " could not be stored in " + second + " ("
            + e.getMessage() + ")", e);
      }
      discard(o.file(), id);
      journal.discard();
      return new Stored(id, s.files().csv(), s.files().json(), s.samples(), m.cause());
    }

    private RunMetadata withDiskNotes(RunMetadata m, String heldNote, boolean atSave) {
      List<String> w = new ArrayList<>(m.warnings());
      long all = samples;
      if (fault.isPresent()) {
        long dropped = journal.samplesLostInMemory();
        w.add("the disk holding the archive filled during the run: " + fault.get() + "; the run"
            + " ends at the last sample received; " + (dropped == 0 ? "all " + all
            + " samples were kept" + heldNote : all + " samples were kept" + heldNote + " and "
            + dropped + " were lost when memory for them ran out"));
      } else if (atSave) {
        w.add("the disk holding the archive was full when the run was stored; it was stored once"
            + " there was room, with all " + all + " samples");
      }
      return m.withWarnings(w);
    }

    private String waitingFor(boolean whole) {
      String also = second == null ? "" : secondFailed != null
          ? " (the second location failed too: " + secondFailed + ")" : "";
      return whole
          ? "the disk holding the archive " + archiveDir + " is full: run " + meta.runId()
              + " (all " + samples + " samples, in its journal "
              + journal.file() + ") is stored as soon as space is freed on it" + also
          : "the disk holding the archive " + archiveDir + " is full: run " + meta.runId()
              + "'s journal holds " + journal.samplesWritten() + " samples and "
              + journal.samplesHeld() + " more are held in memory; they are written, and the"
              + " run stored, as soon as space is freed on that disk" + also;
    }

    private String givenUp(boolean whole) {
      return whole
          ? "run " + meta.runId() + " was not stored: the disk holding the archive stayed full;"
              + " all " + samples + " samples are in its journal "
              + journal.file() + ", which becomes a run at the next start" + (endKept
              ? ", with its cause and break" : " (without its cause and break)")
          : "run " + meta.runId() + " was not stored: the disk holding the archive stayed full;"
              + " its journal " + journal.file() + " holds the first "
              + journal.samplesWritten() + " samples, which become a run at the next start;"
              + " the last " + journal.samplesHeld() + " samples, held in memory, are lost";
    }
  }

  private static void discard(Path journal, String id) {
    try {
      Files.deleteIfExists(journal);
    } catch (IOException e) {
      // the run is written; a leftover journal would be recovered as a second copy, so say so
      throw new LoadstoneException("run " + id + " was written but its journal " + journal
          + " could not be removed (" + e.getMessage() + "): delete it by hand to avoid a"
          + " recovered duplicate", e);
    }
  }

  private static void sleep(long ms) {
    try {
      Thread.sleep(ms);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    }
  }
}
