package org.loadstone.acquire;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import org.loadstone.archive.JournalFormat;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Setting;

/**
 * The room a run needs on the disk of the archive: its journal while it records, then its run
 * file beside the journal while it is stored. Checked before a run is armed ({@link
 * #requireBeforeArming}) and watched while it records ({@link #shortFall}).
 */
public final class DiskSpace {
  /**
   * Longest line of a run's CSV: three numbers in Java's shortest form (at most 24 characters
   * each), two 32-bit integers (11 each), the sequence (5), five commas and the line end.
   */
  public static final int CSV_LINE_BYTES = 3 * 24 + 2 * 11 + 5 + 5 + 1;
  /** Bytes one sample takes while the run is stored: its journal record and its CSV line. */
  public static final int BYTES_PER_SAMPLE = JournalFormat.RECORD_BYTES + CSV_LINE_BYTES;
  /** Room asked for above the estimate: a quarter more, plus the sidecar, index and temporaries. */
  public static final double MARGIN = 1.25;
  /** Fixed room asked for above the estimate, bytes. */
  public static final long RESERVE_BYTES = 16L << 20;
  /** A run without a time limit is planned for this long, s. */
  public static final double PLANNED_S_WITHOUT_LIMIT = 600;

  private DiskSpace() {}

  /** @return bytes needed to record and store {@code samples} samples, with the margin */
  public static long bytesFor(double samples) {
    return (long) Math.ceil(samples * BYTES_PER_SAMPLE * MARGIN) + RESERVE_BYTES;
  }

  /**
   * @param rate_Hz the device's sample rate
   * @param settings the run's time limit and pre-trigger history
   * @return bytes the run needs at most (without a time limit: for {@value
   *     #PLANNED_S_WITHOUT_LIMIT} s)
   */
  public static long bytesForRun(double rate_Hz, RunSettings settings) {
    return bytesFor(rate_Hz * (plannedSeconds(settings) + settings.pretrigger_s()));
  }

  private static double plannedSeconds(RunSettings s) {
    return s.maxSeconds() > 0 ? s.maxSeconds() + s.postBreak_s() : PLANNED_S_WITHOUT_LIMIT;
  }

  /**
   * @param dir a folder (or a file in it)
   * @return bytes this program may still write on its disk, or -1 when the disk does not say
   */
  public static long usable(Path dir) {
    try {
      return Files.getFileStore(dir).getUsableSpace();
    } catch (IOException | RuntimeException e) {
      return -1;
    }
  }

  /**
   * Refuses a run that would not fit on the disk of the archive, before it is armed (and so
   * before the specimen is loaded).
   *
   * @param archive the archive folder (exists)
   * @param rate_Hz the device's sample rate
   * @param settings the run's time limit and pre-trigger history
   * @throws LoadstoneException naming the disk, the room there and the room the run needs
   */
  public static void requireBeforeArming(Path archive, double rate_Hz, RunSettings settings) {
    long free = usable(archive);
    long need = bytesForRun(rate_Hz, settings);
    if (free >= 0 && free < need) {
      String length = settings.maxSeconds() > 0
          ? String.format(Locale.ROOT, "its time limit of %.0f s", settings.maxSeconds())
          : String.format(Locale.ROOT, "%.0f minutes (it has no time limit)",
              PLANNED_S_WITHOUT_LIMIT / 60);
      throw new LoadstoneException(String.format(Locale.ROOT, "the disk holding the archive %s"
          + " has %s free, and a run of %s at %.6g samples/s needs %s: free space on it, choose"
          + " another archive folder, or set a shorter time limit", archive, size(free),
          length, rate_Hz, size(need)), Setting.ARCHIVE_FOLDER, Setting.TIME_LIMIT);
    }
  }

  /**
   * The watch during a run: whether what is recorded so far can still be stored.
   *
   * @param free bytes free on the disk (negative: unknown)
   * @param samples samples recorded so far
   * @return a warning when the disk lacks the room to store them, else null
   */
  public static String shortFall(long free, long samples) {
    if (roomToStore(free, samples)) {
      return null;
    }
    long need = csvBytes(samples);
    return "the disk holding the archive has " + size(free) + " left, and storing the "
        + samples + " samples recorded so far needs about " + size(need) + ": free space on it"
        + " now; if it fills, the samples are held in memory until there is room";
  }

  /**
   * @param free bytes free on the disk (negative: unknown, taken as room)
   * @param samples samples in the journal
   * @return whether their run file fits beside the journal, with the margin
   */
  public static boolean roomToStore(long free, long samples) {
    return free < 0 || free >= csvBytes(samples) + RESERVE_BYTES / 4;
  }

  private static long csvBytes(long samples) {
    return (long) Math.ceil(samples * (double) CSV_LINE_BYTES * MARGIN);
  }

  /** @return a byte count in words: "512 bytes", "3.2 MB", "1.50 GB" */
  public static String size(long bytes) {
    if (bytes < 10_000) {
      return bytes + " bytes";
    }
    if (bytes < 1_000_000_000L) {
      return String.format(Locale.ROOT, "%.1f MB", bytes / 1e6);
    }
    return String.format(Locale.ROOT, "%.2f GB", bytes / 1e9);
  }
}
