package org.loadstone.acquire;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.UUID;
import org.loadstone.archive.JournalFormat;
import org.loadstone.files.Folders;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Setting;

/**
 * Room on the archive's disk kept from a run's arming until its journal is made: a file of
 * {@value #BYTES} bytes in the journal folder ({@code room-<uuid>.kept}), forced to the disk, and
 * deleted just before the journal is created, so the journal's header, its end and its first
 * samples find room on a disk that filled between the arming and the load. One per store; not
 * shared between threads but for {@link #release}.
 */
final class KeptRoom {
  /** Bytes kept: the journal's header, the room for its end and about 5,800 samples. */
  static final int BYTES = 256 * 1024;

  private final Path archiveDir;
  private volatile Path file;

  KeptRoom(Path archiveDir) {
    this.archiveDir = archiveDir;
  }

  /**
   * Keeps the room, unless kept already.
   *
   * @param elsewhere whether runs have a second location to go to (then a disk without room is
   *     no reason to refuse)
   * @throws LoadstoneException when the disk has no room and there is nowhere else
   */
  void keep(boolean elsewhere) {
    Path kept = file;
    if (kept != null && Files.exists(kept)) {
      return;
    }
    Path jdir = JournalFormat.journalDir(archiveDir);
    Path f = jdir.resolve("room-" + UUID.randomUUID() + ".kept");
    try {
      Files.createDirectories(jdir);
      try (FileChannel ch = FileChannel.open(f, StandardOpenOption.CREATE_NEW,
          StandardOpenOption.WRITE)) {
        ByteBuffer b = ByteBuffer.allocate(BYTES);
        while (b.hasRemaining()) {
          ch.write(b);
        }
        ch.force(true);
      }
      file = f;
    } catch (IOException e) {
      Folders.deleteQuietly(f);
      if (!elsewhere) {
        throw new LoadstoneException("the disk holding the archive " + archiveDir + " has no "
            + "room left for a run (" + e.getMessage() + "): free space on it, or set a second "
            + "location on another disk, before loading the specimen", e, Setting.ARCHIVE_FOLDER);
      }
    }
  }

  /** Gives the room back (to the run's journal, or because no run began). */
  void release() {
    Path f = file;
    file = null;
    if (f != null) {
      Folders.deleteQuietly(f);
    }
  }
}
