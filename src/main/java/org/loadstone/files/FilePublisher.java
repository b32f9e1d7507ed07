package org.loadstone.files;

import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.channels.Channels;
import java.nio.channels.FileChannel;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ThreadLocalRandom;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * The one way Loadstone writes a finished file: a reader sees either no file or a complete one,
 * and an existing file is never replaced, not even by a second program racing for the name.
 *
 * <p>Each file is written to a temporary name in the target's folder ({@code .<name>.<random>.tmp},
 * created exclusively with the default permissions, so the user's umask applies), forced to the
 * disk, and published under its final name by {@link Placement} (a hard link, which the file
 * system refuses when the name exists; where links are not supported, an exclusively created
 * placeholder that the finished file then replaces). The folder is then forced so the new name
 * survives a power cut, and the temporary name is removed, also on failure.
 */
public final class FilePublisher {
  private static final int BUFFER_BYTES = 1 << 16;

  private FilePublisher() {}

  /** Writes a file's whole content to a stream; the stream is buffered and closed for it. */
  @FunctionalInterface
  public interface Content {
    /** @param out where the content goes; not to be closed by the content */
    void writeTo(OutputStream out) throws IOException;
  }

  /**
   * One file of a group.
   *
   * @param target the final name
   * @param what what the file is, for messages, e.g. "run file" or "PDF report"
   * @param content the whole content
   */
  public record Part(Path target, String what, Content content) {
    public Part {
      Precondition.notNull(target, "target");
      Precondition.notNull(what, "what");
      Precondition.notNull(content, "content");
    }
  }

  /**
   * Publishes {@code bytes} as {@code target}; see {@link #publish(Path, String, Content)}.
   *
   * @return {@code target}
   */
  public static Path publish(Path target, String what, byte[] bytes) {
    Precondition.notNull(bytes, "bytes");
    return publish(target, what, out -> out.write(bytes));
  }

  /**
   * Writes {@code target} through a temporary name, forced to the disk, and publishes it without
   * replacing anything; the folder (and its parents) are created when missing.
   *
   * @param target the final name
   * @param what what the file is, for messages, e.g. "PDF report"
   * @param content the whole content
   * @return {@code target}
   * @throws FileExistsException when {@code target} exists (before or while writing); nothing
   *     is changed
   * @throws LoadstoneException when the folder cannot be created or written or the disk is full;
   *     the message names the file and the fix, and nothing is left under the final name
   */
  public static Path publish(Path target, String what, Content content) {
    return publishAll(List.of(new Part(target, what, content))).get(0);
  }

  /**
   * Publishes a group of files as one: every part is written to its temporary name and forced to
   * the disk first; only then are the parts published, in the given order. When one cannot be
   * published, those this call already published are removed again, newest first. So a reader
   * that takes the last part as the mark of a complete group (a run's sidecar) never sees a
   * partial group.
   *
   * @param parts the files, in the order they are to appear; at least one
   * @return the final names, in the same order
   * @throws FileExistsException when any target exists (checked before anything is written and
   *     again at publication); no file of the group is left
   * @throws LoadstoneException as {@link #publish(Path, String, Content)}
   */
  public static List<Path> publishAll(List<Part> parts) {
    Precondition.notNull(parts, "parts");
    if (parts.isEmpty()) {
      throw new IllegalArgumentException("nothing to publish: give at least one file");
    }
    for (Part p : parts) {
      if (Files.exists(p.target())) {
        throw new FileExistsException(p.target(), p.what());
      }
    }
    List<Path> temps = new ArrayList<>();
    List<Path> published = new ArrayList<>();
    Part current = parts.get(0);
    boolean done = false;
    try {
      for (Part p : parts) {
        current = p;
        Folders.create(p.target().toAbsolutePath().getParent(), p.what());
        temps.add(writeTemp(p));
      }
      for (int i = 0; i < parts.size(); i++) {
        current = parts.get(i);
        Placement.place(temps.get(i), current.target());
        published.add(current.target());
      }
      for (Part p : parts) {
        Folders.sync(p.target().toAbsolutePath().getParent());
      }
      done = true;
      return List.copyOf(published);
    } catch (FileAlreadyExistsException e) {
      throw new FileExistsException(current.target(), current.what());
    } catch (IOException e) {
      throw Failures.cannotWrite(current.target(), current.what(), e);
    } finally {
      if (!done) {
        for (int i = published.size() - 1; i >= 0; i--) {
          Folders.deleteQuietly(published.get(i)); // ours, linked a moment ago
        }
      }
      temps.forEach(Folders::deleteQuietly);
    }
  }

  /**
   * Moves {@code source} to {@code target} in the same file system without replacing anything:
   * published as a finished file is, then the source name removed.
   *
   * @param what what the file is, for messages
   * @throws FileExistsException when {@code target} exists; {@code source} is unchanged
   * @throws LoadstoneException when the move fails; {@code source} is kept
   */
  public static void moveWithoutReplacing(Path source, Path target, String what) {
    Precondition.notNull(source, "source");
    Precondition.notNull(target, "target");
    Folders.create(target.toAbsolutePath().getParent(), what);
    try {
      if (Files.exists(target)) {
        throw new FileAlreadyExistsException(target.toString());
      }
      Placement.place(source, target);
      Folders.sync(target.toAbsolutePath().getParent());
    } catch (FileAlreadyExistsException e) {
      throw new FileExistsException(target, what);
    } catch (IOException e) {
      throw Failures.cannotWrite(target, what, e);
    }
    try {
      Files.deleteIfExists(source);
      Folders.sync(source.toAbsolutePath().getParent());
    } catch (IOException e) {
      throw new LoadstoneException(what + " " + source + " was copied to " + target + " but"
          + " cannot be removed (" + Failures.reason(e) + "): remove it by hand", e);
    }
  }

  private static Path writeTemp(Part p) throws IOException {
    Path dir = p.target().toAbsolutePath().getParent();
    String stem = "." + p.target().getFileName() + ".";
    while (true) {
      Path tmp = dir.resolve(stem + Long.toUnsignedString(
          ThreadLocalRandom.current().nextLong(), 36) + ".tmp");
      FileChannel ch;
      try {
        // default attributes: the finished file gets the permissions the user's umask gives
        ch = FileChannel.open(tmp, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE);
      } catch (FileAlreadyExistsException taken) {
        continue; // another temporary file drew the same name
      }
      try (ch) {
        OutputStream out = new BufferedOutputStream(Channels.newOutputStream(ch), BUFFER_BYTES);
        p.content().writeTo(out);
        out.flush();
        ch.force(true);
        return tmp;
      } catch (IOException | RuntimeException | Error e) { // out of memory too: no stray file
        Folders.deleteQuietly(tmp);
        throw e;
      }
    }
  }
}
