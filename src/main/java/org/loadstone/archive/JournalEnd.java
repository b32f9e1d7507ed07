package org.loadstone.archive;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.Arrays;
import java.util.Optional;
import org.loadstone.files.Folders;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * How a run ended, kept beside its journal ({@code <run-id>.end}) from the moment the run is
 * finished until it is stored, so that a program killed while storing (or while waiting for a
 * full disk to have room) leaves a journal that {@link JournalRecovery} turns into the run as it
 * ended: its cause, its break, its last sample and its warnings, not a bare "recovered" run.
 *
 * <p>The file is made when the journal is (while the disk had room) as {@value #RESERVE_BYTES}
 * spaces forced to the disk, and the end is later written over them in place: on a disk that
 * has filled meanwhile, overwriting bytes a file already has needs no new room. Layout: one
 * UTF-8 JSON object (the sidecar's end fields, {@code last_index}: the ring index of the run's
 * last sample, and the run's warnings when they fit) padded with spaces; a file of spaces only
 * means the run had not ended. A torn write leaves text that is not a complete JSON object,
 * which reads as no end.
 */
public final class JournalEnd {
  /** Size of the reserved file, bytes. */
  public static final int RESERVE_BYTES = 4096;

  private JournalEnd() {}

  /** @return {@code <run-id>.end} beside {@code <run-id>.journal} */
  public static Path file(Path journal) {
    String n = journal.getFileName().toString();
    return journal.resolveSibling(n.replaceFirst("\\.journal$", "") + ".end");
  }

  /**
   * Makes the reserved file beside a journal just created.
   *
   * @return whether it was made; without it a run killed while stored is recovered without its
   *     end, as before (the run itself is not affected)
   */
  public static boolean reserve(Path journal) {
    Precondition.notNull(journal, "journal");
    Path f = file(journal);
    byte[] spaces = new byte[RESERVE_BYTES];
    Arrays.fill(spaces, (byte) ' ');
    try (FileChannel ch = FileChannel.open(f, StandardOpenOption.CREATE_NEW,
        StandardOpenOption.WRITE)) {
      ByteBuffer b = ByteBuffer.wrap(spaces);
      while (b.hasRemaining()) {
        ch.write(b);
      }
      ch.force(true);
    } catch (IOException | RuntimeException e) {
      Folders.deleteQuietly(f);
      return false;
    }
    return true;
  }

  /**
   * Writes how the run ended over the reserved file, in place, and forces it to the disk.
   *
   * @param journal the run's journal
   * @param ended the run's metadata with its cause and break
   * @param lastIndex the ring index of the run's last sample
   * @return whether it was written (false without a reserved file, or when the disk refuses)
   */
  public static boolean write(Path journal, RunMetadata ended, long lastIndex) {
    Precondition.notNull(ended, "ended");
    Path f = file(journal);
    if (!Files.isRegularFile(f)) {
      return false;
    }
    ObjectNode all = RunJson.toTree(ended);
    ObjectNode o = RunJson.LINE.createObjectNode();
    RunJson.END_FIELDS.forEach(k -> o.set(k, all.get(k)));
    o.put("last_index", lastIndex);
    byte[] text = withWarnings(o, all.get("warnings"));
    if (text.length > RESERVE_BYTES) {
      return false;
    }
    byte[] slot = Arrays.copyOf(text, RESERVE_BYTES);
    Arrays.fill(slot, text.length, RESERVE_BYTES, (byte) ' ');
    try (FileChannel ch = FileChannel.open(f, StandardOpenOption.WRITE)) {
      ByteBuffer b = ByteBuffer.wrap(slot);
      while (b.hasRemaining()) {
        ch.write(b, b.position());
      }
      ch.force(true);
      return true;
    } catch (IOException e) {
      return false;
    }
  }

  private static byte[] withWarnings(ObjectNode o, JsonNode warnings) {
    byte[] bare = o.toString().getBytes(StandardCharsets.UTF_8);
    if (warnings == null) {
      return bare;
    }
    ObjectNode w = o.deepCopy();
    w.set("warnings", warnings);
    byte[] with = w.toString().getBytes(StandardCharsets.UTF_8);
    return with.length <= RESERVE_BYTES ? with : bare;
  }

  /**
   * How a recovered run ended, as kept.
   *
   * @param end the kept object
   * @param lastIndex the ring index of the run's last sample
   * @param file where it was kept
   */
  record Ended(JsonNode end, long lastIndex, Path file) {
    /**
     * @param header the journal header's metadata
     * @return the header's metadata with the kept cause, break fields and warnings; empty when
     *     they do not read as a sidecar's would
     */
    Optional<RunMetadata> applyTo(RunMetadata header) {
      ObjectNode merged = RunJson.toTree(header);
      RunJson.END_FIELDS.forEach(k -> merged.set(k, end.get(k)));
      if (end.has("warnings")) {
        merged.set("warnings", end.get("warnings"));
      }
      try {
        return Optional.of(RunJson.fromTree(merged, "run end " + file, null));
      } catch (LoadstoneException e) {
        return Optional.empty();
      }
    }
  }

  /**
   * @param journal a journal being recovered
   * @return how the run ended, empty when nothing (or nothing whole) was kept
   */
  static Optional<Ended> read(Path journal) {
    Path f = file(journal);
    String text;
    try {
      if (!Files.isRegularFile(f)) {
        return Optional.empty();
      }
      text = Files.readString(f, StandardCharsets.UTF_8).strip();
    } catch (IOException | RuntimeException e) {
      return Optional.empty();
    }
    if (text.isEmpty()) {
      return Optional.empty();
    }
    try {
      JsonNode end = RunJson.LINE.readTree(text);
      if (end == null || !end.isObject() || !end.path("last_index").canConvertToLong()) {
        return Optional.empty();
      }
      return Optional.of(new Ended(end, end.get("last_index").asLong(), f));
    } catch (IOException e) {
      return Optional.empty(); // torn or damaged: recovered as a run whose end is unknown
    }
  }

  /** Removes the file beside a journal that was stored, recovered or moved aside. */
  public static void delete(Path journal) {
    Folders.deleteQuietly(file(journal));
  }
}
