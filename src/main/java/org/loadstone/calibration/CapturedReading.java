package org.loadstone.calibration;

import org.loadstone.units.Precondition;

/**
 * Statistics of the live counts averaged for one calibration point.
 *
 * @param mean_counts mean of the samples
 * @param sd_counts sample standard deviation (n − 1), ≥ 0; 0 when only one sample
 * @param samples number of samples averaged, ≥ 1
 */
public record CapturedReading(double mean_counts, double sd_counts, int samples) {
  /** Validates: finite mean, non-negative SD, at least one sample. */
  public CapturedReading {
    Precondition.finite(mean_counts, "mean_counts");
    Precondition.nonNegative(sd_counts, "sd_counts");
    if (samples < 1) {
      throw new IllegalArgumentException("'samples' must be 1 or more, was " + samples);
    }
  }
}
