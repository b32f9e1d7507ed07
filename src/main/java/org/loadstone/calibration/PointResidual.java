package org.loadstone.calibration;

/**
 * How far a fit misses one calibration point, expressed as force.
 *
 * @param point the point
 * @param netCounts counts minus the zero reading of its series
 * @param indicated_N force the fit gives for {@code netCounts}
 * @param error_N indicated minus applied force
 * @param error_pct_reading error in % of the applied force; null at zero load
 * @param error_pct_fs error in % of full scale
 */
public record PointResidual(
    CalibrationPoint point,
    double netCounts,
    double indicated_N,
    double error_N,
    Double error_pct_reading,
    double error_pct_fs) {}
