package org.loadstone.archive;

import java.io.BufferedInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.List;
import java.util.function.UnaryOperator;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * Stores the run in a journal as run files by streaming: one pass over the records counts what
 * becomes a sample, a second writes each sample's CSV line as it is read. The heap used does not
 * grow with the run's length. The journal is not changed; removing it once the run is stored is
 * the caller's step.
 */
public final class JournalStream {
  private JournalStream() {}

  /**
   * A run stored from its journal.
   *
   * @param files the run's CSV and sidecar
   * @param samples samples written
   * @param missedByJournal samples the journal never got (it fell more than a ring behind)
   */
  public record Stored(StoredRun files, int samples, long missedByJournal) {}

  /**
   * @param archiveDir the archive folder
   * @param journal the run's journal, complete (its writer finished)
   * @param lastIndex last ring index that belongs to the run (inclusive)
   * @param metadata the run's sidecar; a warning is added when the journal missed samples
   * @return what was stored
   * @throws LoadstoneException when the journal cannot be read, holds a value a run file may not
   *     hold, or the files cannot be written; nothing is then published and the journal is kept
   */
  public static Stored store(Path archiveDir, Path journal, long lastIndex, RunMetadata metadata) {
    return store(out -> out, archiveDir, journal, lastIndex, metadata);
  }

  /** @param wrap a test seam around the stream the sample file is written to */
  static Stored store(UnaryOperator<OutputStream> wrap, Path archiveDir, Path journal,
      long lastIndex, RunMetadata metadata) {
    Precondition.notNull(archiveDir, "archiveDir");
    Precondition.notNull(journal, "journal");
    Precondition.notNull(metadata, "metadata");
    try {
      JournalScan count;
      JournalScan.Derive derive;
      try (InputStream in = open(journal)) {
        RunMetadata header = JournalRecovery.readHeader(in, journal);
        derive = JournalRecovery.derive(header);
        count = JournalScan.run(in, lastIndex, null);
      }
      boolean pos = count.position();
      List<String> w = new java.util.ArrayList<>(metadata.warnings());
      if (count.missedByJournal > 0) {
        w.add(count.missedByJournal + " samples were lost because the disk fell more than a ring"
            + " behind the device");
      }
      RunMetadata m = metadata.withWarnings(w);
      String id = m.runId();
      StoredRun files = RunWriter.publish(archiveDir, m, count.samples, target -> {
        OutputStream out = wrap.apply(target);
        try (InputStream in = open(journal)) {
          JournalRecovery.readHeader(in, journal);
          RunCsv.LineWriter lines = new RunCsv.LineWriter(out, id);
          JournalScan second = JournalScan.run(in, lastIndex, (i, tUs, k, hasPos, p, s) ->
              lines.line(derive.time_s(tUs, count.firstTimeUs), derive.force_N(k), pos,
                  pos ? derive.position_mm(p) : 0, k, pos ? p : 0, s));
          lines.flush();
          if (second.samples != count.samples) {
            throw new LoadstoneException("journal " + journal + " changed while run " + id
                + " was stored from it (" + count.samples + " samples, then " + second.samples
                + "): stop the other program writing to it and recover the run again");
          }
        }
      });
      return new Stored(files, count.samples, count.missedByJournal);
    } catch (NoSuchFileException e) {
      throw new LoadstoneException("journal " + journal + " of run " + metadata.runId()
          + " does not exist: the run's samples are not on the disk", e);
    } catch (IOException e) {
      throw new LoadstoneException("journal " + journal + " cannot be read: " + e.getMessage()
          + ": check the file's permissions", e);
    }
  }

  private static InputStream open(Path journal) throws IOException {
    return new BufferedInputStream(Files.newInputStream(journal), 1 << 16);
  }
}
