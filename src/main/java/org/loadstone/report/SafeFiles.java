package org.loadstone.report;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.loadstone.units.LoadstoneException;

/** Writes a file through a temporary sibling and never replaces an existing file. */
final class SafeFiles {
  private SafeFiles() {}

  /** Something that writes the whole content to a stream. */
  interface Content {
    void writeTo(OutputStream out) throws IOException;
  }

  /**
   * Writes {@code target} through a temporary file in the same folder, then links it into place;
   * the link fails when the target exists, so a file is never overwritten.
   *
   * @throws LoadstoneException when the target exists or the folder cannot be written
   */
  static void write(Path target, String what, Content content) {
    Path abs = target.toAbsolutePath();
    if (Files.exists(abs)) {
      throw exists(abs, what);
    }
    Path dir = abs.getParent();
    Path tmp = null;
    try {
      Files.createDirectories(dir);
      tmp = Files.createTempFile(dir, "." + abs.getFileName(), ".tmp");
      if (Files.getFileStore(tmp).supportsFileAttributeView("posix")) {
        // temporary files are private; the finished file is an ordinary readable one
        Files.setPosixFilePermissions(tmp,
            java.nio.file.attribute.PosixFilePermissions.fromString("rw-r--r--"));
      }
      try (OutputStream out = Files.newOutputStream(tmp)) {
        content.writeTo(out);
      }
      try {
        Files.createLink(abs, tmp);
      } catch (UnsupportedOperationException | FileAlreadyExistsException e) {
        if (e instanceof FileAlreadyExistsException) {
          throw e;
        }
        Files.move(tmp, abs); // no hard links here: a plain move, which also refuses to replace
        tmp = null;
      }
    } catch (FileAlreadyExistsException e) {
      throw exists(abs, what);
    } catch (IOException e) {
      throw new LoadstoneException("Cannot write the " + what + " " + abs + ": " + e.getMessage()
          + ". Check that the folder exists and is writable.", e);
    } finally {
      if (tmp != null) {
        try {
          Files.deleteIfExists(tmp);
        } catch (IOException ignored) {
          // a stray temporary file is harmless; the target is complete or absent
        }
      }
    }
  }

  private static LoadstoneException exists(Path p, String what) {
    return new LoadstoneException("The " + what + " " + p + " already exists; Loadstone never "
        + "overwrites a file. Choose another name or move the old file away.");
  }
}
