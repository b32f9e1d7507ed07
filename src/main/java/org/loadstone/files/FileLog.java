package org.loadstone.files;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import org.loadstone.units.Precondition;

/**
 * Append-only files (logs a line at a time): what is appended is on the disk when the call
 * returns, nothing already there is ever rewritten, and a new log gets the permissions the
 * user's umask gives.
 */
public final class FileLog {
  private FileLog() {}

  /**
   * Appends {@code bytes} at the end of {@code log}, creating it (and its folder) when missing,
   * and forces it to the disk; a new log's name is forced too.
   *
   * @param what what the file is, for messages, e.g. "check-weight log"
   * @throws org.loadstone.units.LoadstoneException naming the file and the fix when it cannot be
   *     written (e.g. the disk is full)
   */
  public static void append(Path log, String what, byte[] bytes) {
    Precondition.notNull(log, "log");
    Precondition.notNull(bytes, "bytes");
    Path dir = log.toAbsolutePath().getParent();
    Folders.create(dir, what);
    boolean created = !Files.exists(log);
    try (FileChannel ch = FileChannel.open(log, StandardOpenOption.CREATE,
        StandardOpenOption.APPEND, StandardOpenOption.WRITE)) {
      ByteBuffer b = ByteBuffer.wrap(bytes);
      while (b.hasRemaining()) {
        ch.write(b);
      }
      ch.force(true);
    } catch (IOException e) {
      throw Failures.cannotWrite(log, what, e, "this entry may be missing from it");
    }
    if (created) {
      Folders.sync(dir);
    }
  }
}
