package org.loadstone.units;

/**
 * A setting a user can change to fix an expected failure, named in the domain's words. A core
 * message says what is wrong and what would fix it in these words; the command line adds its
 * option and the console its field, each from its own table of these constants.
 */
public enum Setting {
  /** The calibration that turns counts into force. */
  CALIBRATION("calibration"),
  /** Using a calibration whose content changed since it was saved, knowingly. */
  CHANGED_CALIBRATION("acceptance of a changed calibration"),
  /** A nominal (data-sheet) sensitivity used instead of a calibration. */
  NOMINAL_SENSITIVITY("nominal sensitivity"),
  /** The load cell's rated capacity. */
  RATED_CAPACITY("rated capacity"),
  /** The largest zero shift accepted between two tares without a warning. */
  ZERO_DRIFT_LIMIT("zero-drift limit"),
  /** How many samples the zero averages. */
  ZERO_SAMPLES("samples in the zero"),
  /** The force at which recording starts. */
  START_THRESHOLD("start threshold"),
  /** The history kept before the start. */
  PRETRIGGER("pre-trigger history"),
  /** How far force must fall below the peak for a break. */
  BREAK_DROP("break drop"),
  /** The peak a break needs first. */
  ARMING_LEVEL("arming level"),
  /** How long a drop must last to count. */
  DEBOUNCE("debounce time"),
  /** A force below which the run also ends. */
  ABSOLUTE_STOP("absolute stop level"),
  /** How long recording goes on after the break. */
  TAIL("post-break tail"),
  /** The overload warning level. */
  OVERLOAD_WARNING("overload warning level"),
  /** The overload stop level. */
  OVERLOAD_STOP("overload stop level"),
  /** The longest run. */
  TIME_LIMIT("time limit"),
  /** The crosshead travel that ends a crush run. */
  TRAVEL_LIMIT("travel limit"),
  /** The fraction of the peak below which force ends a crush run. */
  LOW_FORCE_LEVEL("low-force level"),
  /** How long force must stay below the low-force level to end a crush run. */
  LOW_FORCE_TIME("low-force time"),
  /** The folder runs are stored in. */
  ARCHIVE_FOLDER("archive folder"),
  /** The device's port. */
  PORT("port"),
  /** What is on the simulated frame. */
  SIM_SCENARIO("simulated scenario"),
  /** How much faster than real time the simulated frame runs. */
  SIM_SPEED("simulation speed"),
  /** The time unit of an imported file. */
  IMPORT_TIME_UNIT("time unit of the file"),
  /** The force unit of an imported file. */
  IMPORT_FORCE_UNIT("force unit of the file"),
  /** The length unit of an imported file. */
  IMPORT_LENGTH_UNIT("length unit of the file"),
  /** The column delimiter of an imported file. */
  IMPORT_DELIMITER("column delimiter of the file"),
  /** Whether an imported file writes numbers with a decimal comma. */
  IMPORT_DECIMAL_COMMA("decimal comma of the file"),
  /** Whether a position table writes numbers with a decimal comma. */
  TABLE_DECIMAL_COMMA("decimal comma of the position table"),
  /** The time offset between a position table and the force record. */
  TABLE_OFFSET("position table's time offset"),
  /** The capture rate of a clip (a folder of images, a slow-motion clip). */
  VIDEO_FRAME_RATE("clip's capture frame rate"),
  /** How a clip is brought onto the run's clock (break, sync light, offset). */
  VIDEO_SYNC("clip's sync with the run"),
  /** The size of the tracked template and of its search window. */
  TRACK_WINDOW("tracker's template and search window");

  private final String label;

  Setting(String label) {
    this.label = label;
  }

  /** @return the setting in words */
  public String label() {
    return label;
  }
}
