package org.loadstone.ui;

import java.util.LinkedHashSet;
import java.util.Set;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Setting;

/**
 * The console's part of a message: where in the console (or at its start) each setting a core
 * message asks for is changed.
 */
final class ConsoleHints {
  private ConsoleHints() {}

  /** @return where the console changes this setting, or null where the console has no say */
  static String where(Setting s) {
    return switch (s) {
      case CALIBRATION -> "Calibrate tab: make or use a calibration";
      case CHANGED_CALIBRATION -> "start the console with --accept-changed-calibration";
      case NOMINAL_SENSITIVITY -> "start the console with a nominal sensitivity (--counts-per-n)";
      case RATED_CAPACITY -> "start the console with the cell's capacity (--capacity-n)";
      case ZERO_DRIFT_LIMIT -> "start the console with another limit (--zero-drift-n)";
      case ZERO_SAMPLES -> "the console averages half a second of samples";
      case START_THRESHOLD, BREAK_DROP, TAIL, TIME_LIMIT, TRAVEL_LIMIT, LOW_FORCE_LEVEL,
          LOW_FORCE_TIME -> "Live tab, Run settings: the field marked";
      case PRETRIGGER, ARMING_LEVEL, DEBOUNCE, ABSOLUTE_STOP, OVERLOAD_WARNING, OVERLOAD_STOP ->
          "the console uses the default for this one; set it with 'loadstone record'";
      case ARCHIVE_FOLDER -> "type another folder in the Archive tab and press Load; runs are "
          + "stored in the folder the console was started with";
      case PORT -> "start the console on another port (--port)";
      case SIM_SCENARIO -> "start the console with --scenario dead-weight";
      case SIM_SPEED -> "start the console with another --sim-speed";
      case IMPORT_TIME_UNIT, IMPORT_FORCE_UNIT, IMPORT_LENGTH_UNIT, IMPORT_DELIMITER,
          IMPORT_DECIMAL_COMMA, TABLE_DECIMAL_COMMA, TABLE_OFFSET, VIDEO_FRAME_RATE, VIDEO_SYNC,
          TRACK_WINDOW -> null;
    };
  }

  /**
   * @param e a core failure
   * @return its message followed by where the console changes the settings it names
   */
  static String withHow(LoadstoneException e) {
    Set<String> how = new LinkedHashSet<>();
    for (Setting s : e.settings()) {
      String w = where(s);
      if (w != null) {
        how.add(w);
      }
    }
    return how.isEmpty() ? e.getMessage()
        : e.getMessage() + " (in the console: " + String.join("; or ", how) + ")";
  }
}
