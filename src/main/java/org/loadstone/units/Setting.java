package org.loadstone.units;

/**
 * A setting a user can change to fix an expected failure, named in the domain's words. A core
 * message says what is wrong and what would fix it in these words; the command line adds its
 * option and the console its field, each from its own table of these constants.
 */
public enum Setting {
  /** The calibration that turns counts into force. */
  CALIBRATION("calibration"),
  /** A nominal (data-sheet) sensitivity used instead of a calibration. */
  NOMINAL_SENSITIVITY("nominal sensitivity"),
  /** The load cell's rated capacity. */
  RATED_CAPACITY("rated capacity"),
  /** The largest zero shift accepted between two tares without a warning. */
  ZERO_DRIFT_LIMIT("zero-drift limit"),
  /** How many samples the zero averages. */
  ZERO_SAMPLES("samples in the zero");

  private final String label;

  Setting(String label) {
    this.label = label;
  }

  /** @return the setting in words */
  public String label() {
    return label;
  }
}
