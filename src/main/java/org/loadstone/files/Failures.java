package org.loadstone.files;

import java.io.IOException;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import org.loadstone.units.LoadstoneException;

/** Turns an I/O failure into a message naming the file, the fault and the fix. */
final class Failures {
  /** Below this a disk counts as full when a write fails. */
  private static final long NEARLY_FULL_BYTES = 1 << 20;

  private Failures() {}

  /** For a file published whole: nothing is left under its name. */
  static LoadstoneException cannotWrite(Path file, String what, IOException e) {
    return cannotWrite(file, what, e, "nothing was written under this name");
  }

  /**
   * @param outcome what the user finds on the disk afterwards
   */
  static LoadstoneException cannotWrite(Path file, String what, IOException e, String outcome) {
    Path dir = file.toAbsolutePath().getParent();
    if (diskFull(dir, e)) {
      return new LoadstoneException("the " + what + " " + file + " cannot be written: the disk"
          + " holding " + dir + " is full (" + reason(e) + "): free space on it or choose"
          + " another folder; " + outcome, e);
    }
    return new LoadstoneException("the " + what + " " + file + " cannot be written ("
        + reason(e) + "): check that " + dir + " is a folder you may write to, with free space; "
        + outcome, e);
  }

  /** @return the failure in words, without Java class names where the platform gave a reason */
  static String reason(IOException e) {
    if (e instanceof FileSystemException f) {
      if (f.getReason() != null) {
        return f.getReason();
      }
      if (e instanceof java.nio.file.AccessDeniedException) {
        return "permission denied";
      }
      if (e instanceof java.nio.file.NoSuchFileException) {
        return "no such file or folder: " + f.getFile();
      }
    }
    return e.getMessage() != null ? e.getMessage() : e.getClass().getSimpleName();
  }

  private static boolean diskFull(Path dir, IOException e) {
    String m = String.valueOf(e.getMessage()).toLowerCase(Locale.ROOT);
    if (m.contains("no space left") || m.contains("not enough space") || m.contains("disk full")
        || m.contains("quota")) {
      return true;
    }
    try {
      return Files.getFileStore(dir).getUsableSpace() < NEARLY_FULL_BYTES;
    } catch (IOException | RuntimeException ignored) {
      return false;
    }
  }
}
