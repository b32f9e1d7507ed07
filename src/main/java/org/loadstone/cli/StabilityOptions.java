package org.loadstone.cli;

import org.loadstone.calibration.StabilityDetector;
import org.loadstone.units.LoadstoneException;
import picocli.CommandLine.Option;

/** When a live reading counts as settled, for the commands that capture readings. */
final class StabilityOptions {
  @Option(names = "--window-s", paramLabel = "S", defaultValue = "1",
      description = "Judge the reading over this many seconds of samples (default: ${DEFAULT-VALUE}).")
  double window_s;

  @Option(names = "--max-sd-counts", paramLabel = "COUNTS", defaultValue = "100",
      description = "Largest standard deviation of the counts accepted as settled "
          + "(default: ${DEFAULT-VALUE}).")
  double maxSd_counts;

  @Option(names = "--max-drift-counts-per-s", paramLabel = "COUNTS-PER-S", defaultValue = "50",
      description = "Largest drift in counts per second accepted as settled "
          + "(default: ${DEFAULT-VALUE}).")
  double maxDrift_counts_per_s;

  @Option(names = "--timeout-s", paramLabel = "S", defaultValue = "30",
      description = "Give up waiting for a settled reading after this many seconds "
          + "(default: ${DEFAULT-VALUE}).")
  double timeout_s;

  /**
   * @param rateHz the device's sample rate, > 0
   * @return the detector settings, with window and time-out converted to samples
   * @throws LoadstoneException when a value is out of range
   */
  StabilityDetector.Settings settings(double rateHz) {
    try {
      return StabilityDetector.Settings.ofSeconds(window_s, maxSd_counts, maxDrift_counts_per_s,
          timeout_s, rateHz);
    } catch (LoadstoneException e) {
      throw new LoadstoneException("stability options out of range: --window-s must be > 0,"
          + " --timeout-s at least --window-s, --max-sd-counts and --max-drift-counts-per-s 0 or more");
    }
  }
}
