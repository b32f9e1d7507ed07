package org.loadstone.calibration;

import java.util.List;
import java.util.Map;

/**
 * Everything evaluated from one set of calibration points.
 *
 * @param points the points, sorted by series, direction, then load in loading order
 * @param zeroCounts zero reading (ascending zero point) of each series, counts
 * @param settings the settings used
 * @param fullScale_N reference for % FS
 * @param maxForce_N largest applied load
 * @param fits every fit that could be made, in {@link FitKind} order
 * @param recommendation the lowest-degree fit judged good enough
 * @param chosen the adopted fit: the settings' choice or the recommendation
 * @param linearity sensitivity, non-linearity, hysteresis, repeatability
 * @param astm ASTM E74 style figures from the ascending readings, or null when they cannot
 *     carry the adopted kind of fit
 * @param iso ISO 7500-1 style figures of the adopted fit
 * @param notes fits left out and why
 */
public record CalibrationReport(
    List<CalibrationPoint> points,
    Map<Integer, Double> zeroCounts,
    CalibrationSettings settings,
    double fullScale_N,
    double maxForce_N,
    List<FitResult> fits,
    FitRecommendation recommendation,
    FitKind chosen,
    LinearityMetrics linearity,
    AstmE74Result astm,
    Iso7500Result iso,
    List<String> notes) {

  /** Copies the collections. */
  public CalibrationReport {
    points = List.copyOf(points);
    zeroCounts = Map.copyOf(zeroCounts);
    fits = List.copyOf(fits);
    notes = List.copyOf(notes);
  }

  /** @return the fit of kind {@code kind}, or null when it could not be made */
  public FitResult fit(FitKind kind) {
    return fits.stream().filter(f -> f.kind() == kind).findFirst().orElse(null);
  }

  /** @return the adopted fit */
  public FitResult chosenFit() {
    return fit(chosen);
  }
}
