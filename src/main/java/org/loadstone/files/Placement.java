package org.loadstone.files;

import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;

/**
 * Gives a finished file its final name without ever replacing a file someone else made.
 *
 * <p>First choice: a hard link from the finished file's name, which the file system refuses
 * when the final name exists. File systems without hard links (FAT and exFAT answer EPERM, some
 * providers throw {@link UnsupportedOperationException}) take a checked fallback: the final name
 * is created exclusively as an empty placeholder (refused when it exists), and the finished file
 * is then renamed over that placeholder, which is ours; where even an atomic rename is not
 * supported, the content is copied into the placeholder and forced to the disk. Between the two
 * steps a reader may see an empty file under the final name, never someone else's file replaced.
 */
final class Placement {
  private Placement() {}

  /**
   * @param finished a complete file, forced to the disk; it keeps its name when linked, loses it
   *     when renamed
   * @param target the final name, in the same folder
   * @throws FileAlreadyExistsException when {@code target} exists; nothing was changed
   * @throws IOException when it cannot be placed; nothing is left under {@code target}
   */
  static void place(Path finished, Path target) throws IOException {
    try {
      Files.createLink(target, finished);
      return;
    } catch (FileAlreadyExistsException e) {
      throw e;
    } catch (UnsupportedOperationException | FileSystemException e) {
      // no hard links on this file system (FAT, exFAT, some network shares): the fallback
    }
    Files.newByteChannel(target, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE).close();
    boolean placed = false;
    try {
      try {
        Files.move(finished, target, StandardCopyOption.ATOMIC_MOVE);
      } catch (AtomicMoveNotSupportedException e) {
        copyInto(finished, target);
      }
      placed = true;
    } finally {
      if (!placed) {
        Folders.deleteQuietly(target); // our empty or partial placeholder
      }
    }
  }

  private static void copyInto(Path from, Path placeholder) throws IOException {
    try (FileChannel in = FileChannel.open(from, StandardOpenOption.READ);
        FileChannel out = FileChannel.open(placeholder, StandardOpenOption.WRITE)) {
      long size = in.size();
      for (long done = 0; done < size; ) {
        done += in.transferTo(done, size - done, out);
      }
      out.force(true);
    }
  }
}
