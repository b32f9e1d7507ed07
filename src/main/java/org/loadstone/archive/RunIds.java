package org.loadstone.archive;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.regex.Pattern;
import org.loadstone.units.Precondition;

/**
 * Run ids: {@code <UTC start, ISO 8601 basic format to the millisecond>-<safe specimen>}, e.g.
 * {@code 20261202T181233.417Z-balsa-07}, so that ids sort by start time as plain text. When a run,
 * its sidecar or its journal with that id already exists, {@code -2}, {@code -3}, … is appended:
 * an id is never reused. {@link #newId} proposes an id; the id a run is stored under is settled
 * by a {@link RunIdClaim} when its journal (or, for an import, its files) is made, so two
 * programs proposing the same id in the same millisecond both keep their runs.
 */
public final class RunIds {
  private static final DateTimeFormatter STAMP =
      DateTimeFormatter.ofPattern("uuuuMMdd'T'HHmmss.SSS'Z'").withZone(ZoneOffset.UTC);
  private static final Pattern VALID = Pattern.compile("[A-Za-z0-9_-][A-Za-z0-9._-]{0,199}");

  private RunIds() {}

  /**
   * @param startedAt when the run began
   * @param specimen the specimen id as typed, may be null
   * @return the id before any disambiguation, e.g. {@code 20261202T181233.417Z-balsa-07}
   */
  public static String base(Instant startedAt, String specimen) {
    Precondition.notNull(startedAt, "startedAt");
    return STAMP.format(startedAt) + "-" + SafeNames.forFile(specimen);
  }

  /**
   * @param archiveDir the archive folder (need not exist yet)
   * @return {@link #base} if no file of the archive uses it, else the first free {@code base-n}
   */
  public static String newId(Path archiveDir, Instant startedAt, String specimen) {
    return firstFree(archiveDir, base(startedAt, specimen));
  }

  /**
   * @return {@code id} if no run file, sidecar or journal (live or damaged) uses it, else the first
   *     free {@code id-2}, {@code id-3}, …
   */
  public static String firstFree(Path archiveDir, String id) {
    Precondition.notNull(archiveDir, "archiveDir");
    requireValid(id);
    if (!taken(archiveDir, id)) {
      return id;
    }
    for (int n = 2; ; n++) {
      String c = id + "-" + n;
      if (!taken(archiveDir, c)) {
        return c;
      }
    }
  }

  /** @return whether any file in the archive uses {@code id}, or a program holds a claim on it */
  public static boolean taken(Path archiveDir, String id) {
    return carried(archiveDir, id) || Files.exists(RunIdClaim.markerFor(archiveDir, id));
  }

  /** @return whether a run file, sidecar or journal (live or damaged) carries {@code id} */
  static boolean carried(Path archiveDir, String id) {
    return Files.exists(archiveDir.resolve(id + ".csv"))
        || Files.exists(archiveDir.resolve(id + ".json"))
        || Files.exists(JournalFormat.journalFile(archiveDir, id))
        || Files.exists(JournalFormat.damagedDir(archiveDir).resolve(id + ".journal"));
  }

  /**
   * @return whether {@code id} is usable as a file stem: 1 to 200 of {@code A–Z a–z 0–9 . _ -},
   *     not starting with a dot
   */
  public static boolean isValid(String id) {
    return id != null && VALID.matcher(id).matches();
  }

  /** @throws IllegalArgumentException when {@code id} is not {@link #isValid valid} */
  public static String requireValid(String id) {
    if (!isValid(id)) {
      throw new IllegalArgumentException("run id '" + id + "' is not a safe file stem: make ids"
          + " with RunIds.newId");
    }
    return id;
  }
}
