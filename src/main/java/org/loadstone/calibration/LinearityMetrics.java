package org.loadstone.calibration;

/**
 * Figures of the load cell itself, independent of the adopted curve.
 *
 * @param sensitivity_counts_per_N slope of the best straight line (least squares with offset)
 *     through the ascending points
 * @param nonlinearity_pct_fs largest deviation of an ascending load's mean from that line, % FS
 * @param hysteresis_pct_fs largest |descending − ascending| at the same load in the same
 *     series, % FS; null when there are no descending points
 * @param repeatability_pct_fs largest spread (max − min) between series at the same load and
 *     direction, % FS; null with one series
 */
public record LinearityMetrics(
    double sensitivity_counts_per_N,
    double nonlinearity_pct_fs,
    Double hysteresis_pct_fs,
    Double repeatability_pct_fs) {}
