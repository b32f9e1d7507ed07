package org.loadstone.files;

import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import org.loadstone.units.LoadstoneException;

/** Folder chores shared by everything that writes files: create, force, tidy. */
public final class Folders {
  private Folders() {}

  /**
   * Creates {@code dir} and its parents when missing.
   *
   * @param what what is to be written there, for the message, e.g. "PDF report"
   * @throws LoadstoneException naming the folder and the fix when it cannot be created or is not
   *     a folder
   */
  public static void create(Path dir, String what) {
    try {
      Files.createDirectories(dir);
    } catch (IOException e) {
      throw new LoadstoneException("folder " + dir + " for the " + what + " cannot be created ("
          + Failures.reason(e) + "): choose a folder you may write to", e);
    }
  }

  /**
   * Forces a folder's entries (new and removed names) to the disk where the platform can; some
   * cannot open folders, and there the files themselves were forced already.
   */
  public static void sync(Path dir) {
    try (FileChannel ch = FileChannel.open(dir, StandardOpenOption.READ)) {
      ch.force(true);
    } catch (IOException | UnsupportedOperationException e) {
      // Windows and some providers refuse to open a folder; nothing more can be done
    }
  }

  /** Removes {@code file} if it exists; a failure is ignored (a stray dot-file is harmless). */
  public static void deleteQuietly(Path file) {
    if (file != null) {
      try {
        Files.deleteIfExists(file);
      } catch (IOException e) {
        // a left-over temporary name starts with a dot and ends in .tmp
      }
    }
  }
}
