package org.loadstone.archive;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * Specimen ids as an operator types them, one specimen after another: the next id in a series
 * and whether an id was already tested in an archive. Shared by every face that takes runs.
 */
public final class SpecimenIds {
  private static final Pattern TRAILING_NUMBER = Pattern.compile("^(.*?)(\\d+)$");
  private static final Pattern RUN_FILE =
      Pattern.compile("^\\d{8}T\\d{6}\\.\\d{3}Z-(.+?)(-\\d+)?\\.json$");

  private SpecimenIds() {}

  /**
   * The id of the next specimen of a series: the number at the end counted on, its width kept
   * ({@code P-07} → {@code P-08}, {@code P-99} → {@code P-100}, {@code foam 9} → {@code foam
   * 10}); an id with no number at the end gets {@code -2}.
   *
   * @param id the specimen just tested, not blank
   * @return the next one
   */
  public static String next(String id) {
    Precondition.notNull(id, "id");
    String t = id.strip();
    if (t.isEmpty()) {
      throw new LoadstoneException("a specimen id is needed before the next one can be counted "
          + "on: type the first specimen's id");
    }
    Matcher m = TRAILING_NUMBER.matcher(t);
    if (!m.matches()) {
      return t + "-2";
    }
    String digits = m.group(2);
    String next = new java.math.BigInteger(digits).add(java.math.BigInteger.ONE).toString();
    if (next.length() < digits.length()) {
      next = "0".repeat(digits.length() - next.length()) + next;
    }
    return m.group(1) + next;
  }

  /**
   * Whether a run of this specimen is stored in the archive (its sidecar names it), for a
   * warning before the same id is used twice.
   *
   * @param archiveDir the archive folder (need not exist)
   * @param specimen the id as typed
   * @return the ids of the stored runs of that specimen, oldest first; empty when none
   */
  public static List<String> runsOf(Path archiveDir, String specimen) {
    Precondition.notNull(archiveDir, "archiveDir");
    if (specimen == null || specimen.isBlank() || !Files.isDirectory(archiveDir)) {
      return List.of();
    }
    String wanted = specimen.strip();
    String safe = SafeNames.forFile(wanted);
    try (Stream<Path> files = Files.list(archiveDir)) {
      return files.filter(f -> {
        Matcher m = RUN_FILE.matcher(f.getFileName().toString());
        return m.matches() && (m.group(1).equals(safe)
            || (m.group(1) + (m.group(2) == null ? "" : m.group(2))).equals(safe));
      }).sorted().filter(f -> {
        try {
          return wanted.equals(RunReader.readMetadata(f).specimen());
        } catch (LoadstoneException unreadable) {
          return false; // listed with its reason by the archive, not here
        }
      }).map(f -> {
        String n = f.getFileName().toString();
        return n.substring(0, n.length() - ".json".length());
      }).toList();
    } catch (IOException e) {
      return List.of(); // an unreadable folder is reported when a run is stored there
    }
  }
}
