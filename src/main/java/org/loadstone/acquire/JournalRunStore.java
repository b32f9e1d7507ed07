package org.loadstone.acquire;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.loadstone.archive.JournalContents;
import org.loadstone.archive.JournalRecovery;
import org.loadstone.archive.RunData;
import org.loadstone.archive.RunMetadata;
import org.loadstone.archive.RunWriter;
import org.loadstone.archive.StoredRun;
import org.loadstone.units.Precondition;

/**
 * The archive's run store: samples go to an append-only journal as they arrive (forced to disk at
 * least every 100 ms); at the finish the run is built from the journal, written as CSV + JSON, and
 * only then is the journal removed. If the program dies first, {@link JournalRecovery} rebuilds the
 * run at the next start.
 */
public final class JournalRunStore implements RunStore {
  private final Path archiveDir;

  /** @param archiveDir the archive folder */
  public JournalRunStore(Path archiveDir) {
    this.archiveDir = Precondition.notNull(archiveDir, "archiveDir");
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
          + archiveDir + " (" + e.getMessage() + "): choose another with --archive DIR or fix "
          + "its permissions and free space", e);
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
        JournalContents c = JournalRecovery.readJournal(journal.file());
        RunData d = cut(c.data(), (int) Math.min(c.data().size(), lastIndex - c.firstIndex() + 1));
        List<String> warnings = new ArrayList<>(meta.warnings());
        if (c.missedByJournal() > 0) {
          warnings.add(c.missedByJournal() + " samples were lost because the disk fell more than "
              + "a ring behind the device");
        }
        // the journal settled the id: another station may have held the one asked for
        RunMetadata m = meta.toBuilder().runId(journal.runId()).warnings(warnings).build();
        StoredRun s = RunWriter.write(archiveDir, m, d);
        try {
          Files.deleteIfExists(journal.file());
        } catch (IOException e) {
          // the run is written; a leftover journal would be recovered as a second copy, so say so
          throw new org.loadstone.units.LoadstoneException("run " + m.runId()
              + " was written but its journal " + journal.file() + " could not be removed ("
              + e.getMessage() + "): delete it by hand to avoid a recovered duplicate", e);
        }
        return new Stored(m.runId(), s.csv(), s.json(), d.size());
      }
    };
  }

  static RunData cut(RunData d, int n) {
    if (n >= d.size()) {
      return d;
    }
    return new RunData(Arrays.copyOf(d.time_s(), n), Arrays.copyOf(d.force_N(), n),
        d.position_mm() == null ? null : Arrays.copyOf(d.position_mm(), n),
        Arrays.copyOf(d.rawCounts(), n),
        d.rawPosition() == null ? null : Arrays.copyOf(d.rawPosition(), n),
        Arrays.copyOf(d.seq(), n));
  }

}
