package org.loadstone.calibration;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * Whether a calibration may be used for a run, checked before the run starts.
 *
 * @param state the finding
 * @param warning text for the operator; empty when {@link State#OK}
 * @param document the loaded document, or null when missing or unreadable
 */
public record CalibrationStatus(State state, String warning, CalibrationDocument document) {

  /** The findings, in the order they are checked. */
  public enum State {
    /** present, intact, as expected, not expired */
    OK,
    /** no file */
    MISSING,
    /** a file that cannot be read or is invalid */
    UNREADABLE,
    /** the stored hash does not match the content, or differs from the one expected */
    HASH_MISMATCH,
    /** past its valid-until date */
    EXPIRED
  }

  /** @return whether a run may start without a warning */
  public boolean ok() {
    return state == State.OK;
  }

  /**
   * @param file the calibration file
   * @param expectedSha256 the hash a run setup refers to; null to check only the file itself
   * @param today the date of the run
   * @return the status; never throws for a bad file
   */
  public static CalibrationStatus check(Path file, String expectedSha256, LocalDate today) {
    Precondition.notNull(file, "file");
    Precondition.notNull(today, "today");
    if (!Files.exists(file)) {
      return new CalibrationStatus(State.MISSING, "Calibration " + file + " is missing: the run"
          + " would record raw counts only. Restore the file or calibrate the cell first.", null);
    }
    CalibrationDocument d;
    try {
      d = CalibrationFiles.readCalibration(file);
    } catch (LoadstoneException e) {
      return new CalibrationStatus(State.UNREADABLE, e.getMessage(), null);
    }
    String actual = CalibrationFiles.contentSha256(d);
    if (d.contentSha256() == null || !d.contentSha256().equals(actual)) {
      return new CalibrationStatus(State.HASH_MISMATCH, "Calibration " + d.id() + " in " + file
          + " has been changed since it was saved (content hash " + shortHash(actual)
          + " does not match the stored " + shortHash(d.contentSha256()) + "). Do not trust its"
          + " forces: recalibrate or restore the original file.", d);
    }
    if (expectedSha256 != null && !expectedSha256.equalsIgnoreCase(actual)) {
      return new CalibrationStatus(State.HASH_MISMATCH, "Calibration " + d.id() + " is not the"
          + " one this setup refers to (hash " + shortHash(actual) + ", expected "
          + shortHash(expectedSha256) + "). Select the intended calibration or update the"
          + " setup.", d);
    }
    if (today.isAfter(d.validUntilDate())) {
      return new CalibrationStatus(State.EXPIRED, "Calibration " + d.id() + " of cell "
          + d.cellId() + " expired on " + d.validUntil() + ". Forces will be computed with it,"
          + " but recalibrate or verify with a check weight before testing.", d);
    }
    return new CalibrationStatus(State.OK, "", d);
  }

  /**
   * What a warning this class wrote says, read back from a run that stored it (runs keep their
   * warnings as text).
   *
   * @param warning a stored warning, not null
   * @return {@link State#EXPIRED} or {@link State#HASH_MISMATCH} when the warning is one of those
   *     this class writes, else empty
   */
  public static java.util.Optional<State> stateOf(String warning) {
    if (warning.startsWith("Calibration ") && warning.contains(" expired on ")) {
      return java.util.Optional.of(State.EXPIRED);
    }
    if (warning.startsWith("Calibration ") && (warning.contains("Do not trust its forces")
        || warning.contains("is not the one this setup refers to"))) {
      return java.util.Optional.of(State.HASH_MISMATCH);
    }
    return java.util.Optional.empty();
  }

  /**
   * The rule for a calibration changed since it was saved: its forces cannot be trusted, so it
   * is refused unless the user accepts it knowingly.
   *
   * @param accepted whether the user accepted a changed calibration
   * @return this status
   * @throws LoadstoneException when the content no longer matches its hash and it was not
   *     accepted (the message is {@link #warning()} with the way to accept it)
   */
  public CalibrationStatus refuseChanged(boolean accepted) {
    if (state == State.HASH_MISMATCH && !accepted) {
      throw new LoadstoneException(warning + " To use it anyway, accept the changed calibration "
          + "explicitly; the figures will say so.", org.loadstone.units.Setting.CALIBRATION,
          org.loadstone.units.Setting.CHANGED_CALIBRATION);
    }
    return this;
  }

  private static String shortHash(String h) {
    return h == null ? "(none)" : h.substring(0, Math.min(12, h.length()));
  }
}
