package org.loadstone.calibration;

import java.util.List;

/**
 * One fitted calibration curve and how well it matches the points.
 *
 * @param kind the model
 * @param countsOfForce net counts as a polynomial in force (N), lowest order first
 * @param inverse the counts → force use of the curve over the calibrated range
 * @param degreesOfFreedom ascending readings minus fitted coefficients (the curve is fitted to
 *     the ascending readings of every series)
 * @param residualSd_counts sqrt(SSE / dof) of the fit in counts, ascending readings
 * @param residualSd_N sqrt(Σ error_N² / dof) over the ascending readings, the residuals taken as
 *     force through the inverse
 * @param maxError_pct_fs largest |error| of an ascending reading, % of full scale
 * @param residuals one per point, descending readings too, in the order of the points
 */
public record FitResult(
    FitKind kind,
    Polynomial countsOfForce,
    CountsToForce inverse,
    int degreesOfFreedom,
    double residualSd_counts,
    double residualSd_N,
    double maxError_pct_fs,
    List<PointResidual> residuals) {
  /** Copies the list. */
  public FitResult {
    residuals = List.copyOf(residuals);
  }
}
