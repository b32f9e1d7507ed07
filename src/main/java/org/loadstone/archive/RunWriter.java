package org.loadstone.archive;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.loadstone.files.FileExistsException;
import org.loadstone.files.FilePublisher;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * Stores a run as {@code <archive>/<run-id>.csv} and {@code <archive>/<run-id>.json}.
 *
 * <p>Both files go through {@link FilePublisher#publishAll}: written to temporary names, forced to
 * the disk, and published without ever replacing a file (not even one a second program made
 * meanwhile), the CSV first and the sidecar last, so a run is never visible without its data.
 * On any failure nothing of the run is left under its names; the run's journal (if any) is left
 * for {@link JournalRecovery}.
 */
public final class RunWriter {
  private RunWriter() {}

  /**
   * @param archiveDir the archive folder; created if missing
   * @param metadata the sidecar; its {@code runId} (made by {@link RunIds}) names the files
   * @param data the samples: finite values, strictly increasing time
   * @return the two files written
   * @throws LoadstoneException when a file of that run id exists (nothing is changed), when the
   *     folder cannot be created or written, or when writing fails (e.g. the disk is full); the
   *     message names the folder or file and the fix
   * @throws IllegalArgumentException when the run id is not a safe file stem
   */
  public static StoredRun write(Path archiveDir, RunMetadata metadata, RunData data) {
    Precondition.notNull(archiveDir, "archiveDir");
    Precondition.notNull(metadata, "metadata");
    Precondition.notNull(data, "data");
    RunCsv.check(data, RunIds.requireValid(metadata.runId()));
    return publish(archiveDir, metadata, data.size(),
        out -> RunCsv.write(data, out, metadata.runId()));
  }

  /**
   * Publishes the sample file written by {@code csvBody} (the header and every line, checked as
   * they are written) and then the sidecar, as {@link #write} does; on any failure, {@link
   * Error}s included, nothing of the run stays under its names.
   *
   * @param samples the number of samples the body writes, for checking the break index
   */
  static StoredRun publish(Path archiveDir, RunMetadata metadata, int samples,
      FilePublisher.Content csvBody) {
    String id = RunIds.requireValid(metadata.runId());
    if (metadata.breakIndex() != null && metadata.breakIndex() >= samples) {
      throw new IllegalArgumentException("break index " + metadata.breakIndex()
          + " is outside the run's " + samples + " samples");
    }
    byte[] sidecar = RunJson.pretty(metadata); // refuses NaN before anything is written
    ensureFolder(archiveDir);
    Path csv = archiveDir.resolve(id + ".csv");
    Path json = archiveDir.resolve(id + ".json");
    try {
      FilePublisher.publishAll(List.of(
          new FilePublisher.Part(csv, "run file", csvBody),
          new FilePublisher.Part(json, "run file", out -> out.write(sidecar))));
      return new StoredRun(csv, json);
    } catch (FileExistsException e) {
      throw new LoadstoneException("run file " + e.file() + " already exists and runs are never"
          + " overwritten: store this run under a new id (a free one is '"
          + RunIds.firstFree(archiveDir, id) + "')");
    } catch (LoadstoneException e) {
      throw new LoadstoneException(e.getMessage() + "; the run's journal (if any) in "
          + JournalFormat.journalDir(archiveDir) + " is kept and recovered at the next start",
          e);
    }
  }

  /**
   * Creates {@code dir} (and its parents) if missing.
   *
   * @throws LoadstoneException naming the folder and the fix when it cannot be created or is not a
   *     writable folder
   */
  static void ensureFolder(Path dir) {
    try {
      Files.createDirectories(dir);
    } catch (IOException e) {
      throw unwritable(dir, e);
    }
    if (!Files.isDirectory(dir) || !Files.isWritable(dir)) {
      throw unwritable(dir, null);
    }
  }

  private static LoadstoneException unwritable(Path dir, IOException e) {
    String why = e == null ? "it is not a writable folder"
        : e.getClass().getSimpleName() + " " + e.getMessage();
    return new LoadstoneException("archive folder " + dir + " cannot be used (" + why + "):"
        + " choose a folder you may write to, or create it and give your user write permission",
        e);
  }
}
