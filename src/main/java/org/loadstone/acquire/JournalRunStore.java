package org.loadstone.acquire;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
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
 * dies first, {@link JournalRecovery} rebuilds the
 * run at the next start.
 */
public final class JournalRunStore implements RunStore {
  /** Turns a finished journal into run files; a seam for tests that make storing fail. */
  interface RunFiles {
    JournalStream.Stored store(Path archiveDir, Path journal, long lastIndex, RunMetadata meta);
  }

  private final Path archiveDir;
  private final RunFiles files;

  /** @param archiveDir the archive folder */
  public JournalRunStore(Path archiveDir) {
    this(archiveDir, JournalStream::store);
  }

  JournalRunStore(Path archiveDir, RunFiles files) {
    this.archiveDir = Precondition.notNull(archiveDir, "archiveDir");
    this.files = files;
  }

  /**
   * Makes sure runs can be written here before a run starts: creates the folder and its journal
   * folder and writes and removes a probe file.
   *
   * @throws org.loadstone.units.LoadstoneException naming the folder and the fix
   */
  public void checkWritable() {
    Path jdir = org.loadstone.archive.JournalFormat.journalDir(archiveDir);
    try {
      Files.createDirectories(jdir);
      Path probe = Files.createTempFile(jdir, "probe", ".tmp");
      Files.delete(probe);
    } catch (IOException | RuntimeException e) {
      throw new org.loadstone.units.LoadstoneException("cannot write runs to the archive folder "
          + archiveDir + " (" + e.getMessage() + "): choose another archive folder, or fix "
          + "this one's permissions and free space", e, org.loadstone.units.Setting.ARCHIVE_FOLDER);
    }
  }

  @Override
  public Recording begin(RunMetadata start, SampleRing ring, long firstIndex) {
    JournalWriter journal = JournalWriter.start(archiveDir, start, ring.cursorAt(firstIndex));
    return new Recording() {
      @Override
      public long durableSamples() {
        return journal.samplesDurable();
      }

      @Override
      public Stored finish(long lastIndex, RunMetadata meta) {
        journal.finish();
        // the journal settled the id: another station may have held the one asked for
        RunMetadata m = meta.toBuilder().runId(journal.runId()).build();
        JournalStream.Stored s;
        try {
          s = files.store(archiveDir, journal.file(), lastIndex, m);
        } catch (LoadstoneException | OutOfMemoryError e) {
          String why = e instanceof OutOfMemoryError
              ? "the program ran out of memory while storing it (" + e.getMessage() + ")"
              : e.getMessage();
          throw new LoadstoneException("run " + m.runId() + " was not stored: " + why
              + "; its samples are kept in the journal " + journal.file() + ", which becomes"
              + " a run at the next start", e);
        }
        try {
          Files.deleteIfExists(journal.file());
        } catch (IOException e) {
          // the run is written; a leftover journal would be recovered as a second copy, so say so
          throw new org.loadstone.units.LoadstoneException("run " + m.runId()
              + " was written but its journal " + journal.file() + " could not be removed ("
              + e.getMessage() + "): delete it by hand to avoid a recovered duplicate", e);
        }
        return new Stored(m.runId(), s.files().csv(), s.files().json(), s.samples());
      }
    };
  }
}
