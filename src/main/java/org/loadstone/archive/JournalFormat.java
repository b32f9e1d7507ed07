package org.loadstone.archive;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.zip.CRC32C;
import org.loadstone.files.Folders;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * The run journal, {@code <archive>/.journal/<run-id>.journal}: an append-only file that holds
 * every raw sample of a run as it arrives, so that a run survives the program's end.
 *
 * <p>Layout: one header line (UTF-8 JSON object ending in {@code \n}) holding {@code
 * "journal_format": 1} and the sidecar fields known at the start (all but {@code cause} and the
 * break fields; the scale spec and zero offset included), then fixed-size records of {@value
 * #RECORD_BYTES} bytes, big-endian:
 *
 * <pre>
 *  0  int64  index      sample number in the ring (gaps = samples the journal missed)
 *  8  int64  time_us    unwrapped device time, µs
 * 16  int64  device_us  device clock as sent (wrapping, 0…2³²−1)
 * 24  int32  counts     load counts
 * 28  int32  position   position counts (0 without a position channel)
 * 32  int32  seq        device sequence number, 0…65535
 * 36  int32  flags      bit 0: has position
 * 40  uint32 crc        CRC-32C of bytes 0…39
 * </pre>
 *
 * A torn last write leaves a short tail or a record whose CRC fails; readers stop there.
 */
public final class JournalFormat {
  /** Format version in the header's {@code journal_format} field. */
  public static final int VERSION = 1;
  /** Size of one sample record. */
  public static final int RECORD_BYTES = 44;
  /** Longest header line accepted, bytes. */
  static final int MAX_HEADER_BYTES = 1 << 20;

  private JournalFormat() {}

  /** @return {@code <archive>/.journal} */
  public static Path journalDir(Path archiveDir) {
    return archiveDir.resolve(".journal");
  }

  /** @return {@code <archive>/.journal/damaged}, where unreadable journals are moved */
  public static Path damagedDir(Path archiveDir) {
    return journalDir(archiveDir).resolve("damaged");
  }

  /** @return {@code <archive>/.journal/<run-id>.journal} */
  public static Path journalFile(Path archiveDir, String runId) {
    return journalDir(archiveDir).resolve(runId + ".journal");
  }

  /**
   * @param startInfo the sidecar as known at the start; cause and break fields are not stored
   * @return the header line, ending in {@code \n}
   */
  public static byte[] header(RunMetadata startInfo) {
    ObjectNode o = RunJson.LINE.createObjectNode();
    o.put("journal_format", VERSION);
    ObjectNode m = RunJson.toTree(startInfo);
    RunJson.END_FIELDS.forEach(m::remove);
    o.setAll(m);
    o.put("journal_format", VERSION); // an extra field of that name must not hide the version
    try {
      return (RunJson.LINE.writeValueAsString(o) + "\n").getBytes(StandardCharsets.UTF_8);
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("cannot serialise journal header", e);
    }
  }

  /**
   * A journal just created and its header forced to the disk.
   *
   * @param startInfo the sidecar as known at the start, with the id the run got
   * @param file the journal
   * @param channel open for appending records, positioned after the header
   */
  public record Opened(RunMetadata startInfo, Path file, FileChannel channel) {}

  /**
   * Creates the run's journal under its id or, when another run or program holds that id
   * (two stations starting in the same millisecond), under the first free {@code id-n}, settled
   * by a {@link RunIdClaim}: a run is never refused at its start for its id.
   *
   * @param startInfo the sidecar as known at the start; its {@code runId} is the id wanted
   * @return the journal, with the start information under the id it got
   * @throws LoadstoneException when the journal cannot be created (a full disk, a folder that
   *     cannot be written)
   */
  public static Opened open(Path archiveDir, RunMetadata startInfo) {
    Precondition.notNull(archiveDir, "archiveDir");
    Precondition.notNull(startInfo, "startInfo");
    try (RunIdClaim claim = RunIdClaim.claim(archiveDir, startInfo.runId())) {
      RunMetadata info = claim.id().equals(startInfo.runId()) ? startInfo
          : startInfo.toBuilder().runId(claim.id()).build();
      FileChannel ch = create(archiveDir, info);
      return new Opened(info, journalFile(archiveDir, claim.id()), ch);
    }
  }

  /**
   * Creates the run's journal (and its folder) under exactly its id, writes the header and
   * forces it to the disk; {@link #open} is the way for a run that must not be refused.
   *
   * @return the open channel, positioned after the header, for appending records
   * @throws LoadstoneException when the journal exists already or cannot be created
   */
  public static FileChannel create(Path archiveDir, RunMetadata startInfo) {
    Precondition.notNull(archiveDir, "archiveDir");
    Precondition.notNull(startInfo, "startInfo");
    String id = RunIds.requireValid(startInfo.runId());
    Path dir = journalDir(archiveDir);
    RunWriter.ensureFolder(dir);
    Path file = journalFile(archiveDir, id);
    ByteBuffer b = ByteBuffer.wrap(header(startInfo)); // before the file exists: keeps it short-lived
    FileChannel ch = null;
    try {
      ch = FileChannel.open(file, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE);
      while (b.hasRemaining()) {
        ch.write(b);
      }
      ch.force(true);
      Folders.sync(dir);
      return ch;
    } catch (FileAlreadyExistsException e) {
      throw new LoadstoneException("journal " + file + " already exists: another run uses id '"
          + id + "'; store it under a free id (" + RunIds.firstFree(archiveDir, id) + ")");
    } catch (IOException e) {
      if (ch != null) {
        try {
          ch.close();
        } catch (IOException ignored) {
          // reporting the first failure
        }
        Folders.deleteQuietly(file);
      }
      throw new LoadstoneException("cannot create journal " + file + ": " + e.getMessage()
          + ": free disk space or choose another archive folder before starting a run", e);
    }
  }

  /** Appends one record of {@value #RECORD_BYTES} bytes at the buffer's position. */
  public static void putRecord(ByteBuffer buf, long index, int seq, long deviceUs, long timeUs,
      int counts, boolean hasPosition, int position) {
    int start = buf.position();
    buf.putLong(index).putLong(timeUs).putLong(deviceUs).putInt(counts)
        .putInt(hasPosition ? position : 0).putInt(seq).putInt(hasPosition ? 1 : 0);
    CRC32C crc = new CRC32C();
    crc.update(buf.array(), buf.arrayOffset() + start, RECORD_BYTES - 4);
    buf.putInt((int) crc.getValue());
  }

  /** @return whether the record at {@code b[off…off+43]} is intact */
  static boolean intact(byte[] b, int off) {
    CRC32C crc = new CRC32C();
    crc.update(b, off, RECORD_BYTES - 4);
    return (int) crc.getValue() == ByteBuffer.wrap(b, off + RECORD_BYTES - 4, 4).getInt();
  }
}
