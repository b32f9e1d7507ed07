package org.loadstone.calibration;

import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * Choices for one calibration evaluation.
 *
 * @param forceModel how masses became forces (recorded with the calibration); not null
 * @param fullScale_N the reference for "% FS" figures, e.g. the cell's rated capacity; null to
 *     use the largest applied load
 * @param chosenFit the fit to adopt; null to adopt the recommended one
 */
public record CalibrationSettings(ForceFromMass forceModel, Double fullScale_N, FitKind chosenFit) {
  /** Validates. */
  public CalibrationSettings {
    Precondition.notNull(forceModel, "forceModel");
    if (fullScale_N != null && !(fullScale_N > 0 && Double.isFinite(fullScale_N))) {
      throw new LoadstoneException(
          "full scale " + fullScale_N + " N is invalid: give the rated capacity in N (> 0)");
    }
  }

  /** Standard gravity, conventional densities, full scale = largest load, recommended fit. */
  public static CalibrationSettings defaults() {
    return new CalibrationSettings(ForceFromMass.standard(), null, null);
  }

  /** @return a copy with the full scale set, e.g. to a cell's rated capacity */
  public CalibrationSettings withFullScale_N(double fullScale_N) {
    return new CalibrationSettings(forceModel, fullScale_N, chosenFit);
  }

  /** @return a copy that adopts {@code kind} instead of the recommendation */
  public CalibrationSettings withChosenFit(FitKind kind) {
    return new CalibrationSettings(forceModel, fullScale_N, kind);
  }
}
