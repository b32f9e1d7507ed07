package org.loadstone.archive;

import java.io.IOException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.loadstone.files.Folders;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * A run id held by this program alone while the files that will carry it are made, so that two
 * programs storing runs in one archive (two stations, a console and an import) never take the
 * same id, even in the same millisecond.
 *
 * <p>A claim is a marker {@code <archive>/.journal/<id>.claim} created exclusively: of two
 * programs claiming one id, the file system lets exactly one create it. The holder then checks
 * that no run file or journal carries the id (one made before the marker existed) and, if one
 * does, lets the id go and tries {@code id-2}, {@code id-3}, … The holder makes the id's journal
 * or run files before {@link #close closing} the claim; from then on those files hold the id,
 * and whoever carries an id never lets go of it before the next holder exists (a run's files are
 * published before its journal is removed), so every later claim sees the id taken. A marker left
 * by a program that ended while holding it only makes that id skipped.
 */
public final class RunIdClaim implements AutoCloseable {
  private final String id;
  private final Path marker;

  private RunIdClaim(String id, Path marker) {
    this.id = id;
    this.marker = marker;
  }

  /**
   * @param archiveDir the archive folder (created with its journal folder when missing)
   * @param wanted the id wanted, e.g. {@link RunIds#base}
   * @return a claim on {@code wanted} or on the first free {@code wanted-n}
   * @throws LoadstoneException naming the folder and the fix when the marker cannot be written
   * @throws IllegalArgumentException when {@code wanted} is not a safe file stem
   */
  public static RunIdClaim claim(Path archiveDir, String wanted) {
    Precondition.notNull(archiveDir, "archiveDir");
    RunIds.requireValid(wanted);
    Path dir = JournalFormat.journalDir(archiveDir);
    RunWriter.ensureFolder(dir);
    for (int n = 1; ; n++) {
      String id = n == 1 ? wanted : wanted + "-" + n;
      Path marker = markerFor(archiveDir, id);
      try {
        Files.createFile(marker);
      } catch (FileAlreadyExistsException e) {
        continue; // another program holds it now
      } catch (IOException e) {
        throw new LoadstoneException("cannot reserve run id " + id + " in " + dir + " ("
            + e.getMessage() + "): free disk space or choose another archive folder", e);
      }
      if (!RunIds.carried(archiveDir, id)) {
        return new RunIdClaim(id, marker);
      }
      Folders.deleteQuietly(marker); // made and let go before our marker existed
    }
  }

  /** @return {@code <archive>/.journal/<id>.claim} */
  static Path markerFor(Path archiveDir, String id) {
    return JournalFormat.journalDir(archiveDir).resolve(id + ".claim");
  }

  /** @return the id held */
  public String id() {
    return id;
  }

  /** Lets the id go; call once the files that carry it exist (or when giving up). */
  @Override
  public void close() {
    Folders.deleteQuietly(marker);
  }
}
