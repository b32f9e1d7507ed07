package org.loadstone.acquire;

import java.nio.file.Path;
import java.time.LocalDate;
import org.loadstone.device.SimSetup;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Setting;

/**
 * How counts become force for a run, and the cell's rated capacity: one policy for the command
 * line and the console.
 *
 * <ul>
 *   <li>A calibration, when one is chosen, always wins; one changed since it was saved is
 *       refused unless accepted knowingly ({@link
 *       org.loadstone.calibration.CalibrationStatus#refuseChanged}), and then its warning is
 *       shown and stored with each run.
 *   <li>Otherwise a nominal sensitivity is used only when the user gave one, or on the simulated
 *       frame, whose cell's data sheet is known; a nominal scale always carries a warning that is
 *       shown before the run and stored with it.
 *   <li>With neither, a run is refused (the live view may still show counts).
 *   <li>The rated capacity is the one given, else the calibrated cell's profile, else the
 *       simulated cell's; a run with no known capacity is refused, since the overload stop
 *       depends on it.
 * </ul>
 */
public final class ScalePolicy {
  private ScalePolicy() {}

  /**
   * Chooses the scale.
   *
   * @param calibration a calibration file, or null
   * @param nominalCountsPerN a nominal sensitivity the user gave, counts/N, or null
   * @param simulated the simulated frame, or null for a real device
   * @param today for the calibration's expiry check
   * @return the scale, or null when none is known (a run will be refused)
   * @throws LoadstoneException when the calibration cannot be used
   */
  public static ScaleChoice choose(Path calibration, Double nominalCountsPerN, SimSetup simulated,
      LocalDate today) {
    return choose(calibration, nominalCountsPerN, simulated, today, false);
  }

  /**
   * As {@link #choose(Path, Double, SimSetup, LocalDate)}, with the user's answer to a
   * calibration changed since it was saved.
   *
   * @param acceptChanged whether such a calibration may be used (with its warning) rather than
   *     refused
   */
  public static ScaleChoice choose(Path calibration, Double nominalCountsPerN, SimSetup simulated,
      LocalDate today, boolean acceptChanged) {
    if (calibration != null) {
      return ScaleChoice.fromCalibration(calibration, today, acceptChanged);
    }
    if (nominalCountsPerN != null) {
      if (!(Double.isFinite(nominalCountsPerN) && nominalCountsPerN != 0)) {
        throw new LoadstoneException("the nominal sensitivity must be a non-zero number of "
            + "counts per N, was " + nominalCountsPerN + ": take it from the cell's data sheet "
            + "(rated output × amplifier gain) or calibrate the cell", Setting.NOMINAL_SENSITIVITY);
      }
      return ScaleChoice.nominal(nominalCountsPerN, "given", null);
    }
    if (simulated != null) {
      var cell = simulated.cell();
      return ScaleChoice.nominal(cell.countsPerN(), "simulated cell's nominal", cell.capacity_N());
    }
    return null;
  }

  /**
   * @param scale the chosen scale, or null
   * @param device the device's name, for the message
   * @return the scale
   * @throws LoadstoneException when there is none, saying what would fix it
   */
  public static ScaleChoice require(ScaleChoice scale, String device) {
    if (scale == null) {
      throw new LoadstoneException("no calibration is chosen for " + device + ", so force "
          + "cannot be known: choose a calibration of this cell (make one with known weights), "
          + "or a nominal sensitivity for a rough, uncalibrated reading", Setting.CALIBRATION,
          Setting.NOMINAL_SENSITIVITY);
    }
    return scale;
  }

  /**
   * @param given the capacity the user gave, N, or null
   * @param scale the chosen scale (its cell profile may know the capacity), or null
   * @return the rated capacity, N
   * @throws LoadstoneException when it is unknown or not a positive number
   */
  public static double capacity_N(Double given, ScaleChoice scale) {
    Double c = given != null ? given : scale == null ? null : scale.ratedCapacity_N();
    if (c == null) {
      throw new LoadstoneException("the load cell's rated capacity is unknown, and the overload "
          + "stop depends on it: give the cell's rated capacity (from its data sheet), or keep "
          + "the cell's profile in the folder 'cells' beside the calibration file",
          Setting.RATED_CAPACITY);
    }
    if (!(Double.isFinite(c) && c > 0)) {
      throw new LoadstoneException("the load cell's rated capacity must be a positive force in "
          + "N, was " + c + ": give the capacity from the cell's data sheet",
          Setting.RATED_CAPACITY);
    }
    return c;
  }
}
