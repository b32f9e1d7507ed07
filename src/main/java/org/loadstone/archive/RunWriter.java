package org.loadstone.archive;

import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.channels.Channels;
import java.nio.channels.FileChannel;
import java.nio.file.AccessDeniedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * Stores a run as {@code <archive>/<run-id>.csv} and {@code <archive>/<run-id>.json}.
 *
 * <p>Each file is written to a temporary name ({@code .<run-id>.<random>.csv.tmp}) in the
 * archive folder, flushed to the disk ({@link FileChannel#force}), and then published under its
 * final name by a hard link, which the file system refuses if the name exists, so a run is
 * never overwritten even by a second program racing for the same id (an atomic rename would
 * silently replace a file that appeared meanwhile); where links are not supported (FAT, exFAT)
 * an {@link StandardCopyOption#ATOMIC_MOVE atomic move} is used right after a check that the
 * name is free. The folder is then flushed so the new names survive a power cut. A reader
 * therefore sees either no file or a complete one. On any failure the temporary files are
 * removed; the run's journal (if any) is left for {@link JournalRecovery}.
 */
public final class RunWriter {
  /** Test seam: wraps the stream that writes a temporary file. */
  interface StreamWrap {
    OutputStream wrap(Path tempFile, OutputStream out) throws IOException;
  }

  private static final RunWriter DEFAULT = new RunWriter((p, o) -> o);
  private final StreamWrap wrap;
  private final boolean links;

  RunWriter(StreamWrap wrap) {
    this(wrap, true);
  }

  /** @param links false to test the path taken on file systems without hard links (FAT) */
  RunWriter(StreamWrap wrap, boolean links) {
    this.wrap = wrap;
    this.links = links;
  }

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
    return DEFAULT.store(archiveDir, metadata, data);
  }

  /** The writer that {@link #write} uses. */
  static RunWriter standard() {
    return DEFAULT;
  }

  StoredRun store(Path archiveDir, RunMetadata metadata, RunData data) {
    Precondition.notNull(archiveDir, "archiveDir");
    Precondition.notNull(metadata, "metadata");
    Precondition.notNull(data, "data");
    RunCsv.check(data, RunIds.requireValid(metadata.runId()));
    return publish(archiveDir, metadata, data.size(),
        out -> RunCsv.write(data, out, metadata.runId()));
  }

  /**
   * Writes the sample file from {@code csvBody} (which writes the header and every line, checking
   * them) and the sidecar, each to a temporary name, then publishes both; on any failure,
   * {@link Error}s included, nothing stays under the run's name.
   *
   * @param samples the number of samples the body writes, for checking the break index
   */
  StoredRun publish(Path archiveDir, RunMetadata metadata, int samples, Body csvBody) {
    String id = RunIds.requireValid(metadata.runId());
    if (metadata.breakIndex() != null && metadata.breakIndex() >= samples) {
      throw new IllegalArgumentException("break index " + metadata.breakIndex()
          + " is outside the run's " + samples + " samples");
    }
    byte[] sidecar = RunJson.pretty(metadata); // refuses NaN before anything is written
    ensureFolder(archiveDir);
    Path csv = archiveDir.resolve(id + ".csv");
    Path json = archiveDir.resolve(id + ".json");
    refuseExisting(archiveDir, id, csv, json);
    Path tmpCsv = null;
    Path tmpJson = null;
    Path current = csv;
    boolean csvPublished = false;
    boolean jsonPublished = false;
    try {
      tmpCsv = temp(archiveDir, id, ".csv");
      writeTemp(tmpCsv, csvBody);
      current = json;
      tmpJson = temp(archiveDir, id, ".json");
      writeTemp(tmpJson, out -> out.write(sidecar));
      current = csv;
      publish(tmpCsv, csv);
      csvPublished = true;
      current = json;
      publish(tmpJson, json);
      jsonPublished = true;
      syncFolder(archiveDir);
      return new StoredRun(csv, json);
    } catch (FileAlreadyExistsException e) {
      throw exists(archiveDir, id, current);
    } catch (AccessDeniedException e) {
      throw unwritable(archiveDir, e);
    } catch (IOException e) {
      throw new LoadstoneException("cannot write run file " + current + ": " + e.getMessage()
          + ": free disk space or choose another archive folder; nothing was stored under this"
          + " name, and the run's journal (if any) in " + JournalFormat.journalDir(archiveDir)
          + " is kept and recovered at the next start", e);
    } finally {
      deleteQuietly(tmpCsv);
      deleteQuietly(tmpJson);
      if (csvPublished && !jsonPublished) {
        deleteQuietly(csv); // never leave a run without its sidecar; it is ours, just made
      }
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

  private static void refuseExisting(Path dir, String id, Path csv, Path json) {
    for (Path p : new Path[] {csv, json}) {
      if (Files.exists(p)) {
        throw exists(dir, id, p);
      }
    }
  }

  private static LoadstoneException exists(Path dir, String id, Path p) {
    return new LoadstoneException("run file " + p + " already exists and runs are never"
        + " overwritten: store this run under a new id (RunIds.newId gives a free one, e.g. '"
        + RunIds.firstFree(dir, id) + "')");
  }

  private static Path temp(Path dir, String id, String ext) throws IOException {
    return Files.createTempFile(dir, "." + id + ".", ext + ".tmp");
  }

  /** Writes a file's content. */
  interface Body {
    void write(OutputStream out) throws IOException;
  }

  private void writeTemp(Path tmp, Body body) throws IOException {
    try (FileChannel ch = FileChannel.open(tmp, StandardOpenOption.WRITE)) {
      OutputStream out = new BufferedOutputStream(wrap.wrap(tmp, Channels.newOutputStream(ch)),
          1 << 16);
      body.write(out);
      out.flush();
      ch.force(true);
    }
  }

  private void publish(Path tmp, Path target) throws IOException {
    if (links) {
      try {
        Files.createLink(target, tmp);
        return;
      } catch (FileAlreadyExistsException e) {
        throw e;
      } catch (IOException | UnsupportedOperationException | SecurityException e) {
        // no hard links here (FAT/exFAT answer EPERM): fall through to the atomic move
      }
    }
    if (Files.exists(target)) {
      throw new FileAlreadyExistsException(target.toString());
    }
    Files.move(tmp, target, StandardCopyOption.ATOMIC_MOVE);
  }

  /** Flushes a folder's entries (new and removed names) to the disk where the platform can. */
  static void syncFolder(Path dir) {
    try (FileChannel ch = FileChannel.open(dir, StandardOpenOption.READ)) {
      ch.force(true);
    } catch (IOException | UnsupportedOperationException e) {
      // some platforms cannot open folders; the files themselves were forced already
    }
  }

  static void deleteQuietly(Path p) {
    if (p != null) {
      try {
        Files.deleteIfExists(p);
      } catch (IOException e) {
        // a stray temporary file starts with a dot and ends in .tmp; it is harmless
      }
    }
  }
}
