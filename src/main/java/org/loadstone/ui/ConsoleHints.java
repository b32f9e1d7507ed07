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

  /** @return where the console changes this setting */
  static String where(Setting s) {
    return switch (s) {
      case CALIBRATION -> "Calibrate tab: make or use a calibration";
      case NOMINAL_SENSITIVITY -> "start the console with a nominal sensitivity (--counts-per-n)";
      case RATED_CAPACITY -> "start the console with the cell's capacity (--capacity-N)";
      case ZERO_DRIFT_LIMIT -> "start the console with another limit (--zero-drift-N)";
      case ZERO_SAMPLES -> "the console averages half a second of samples";
    };
  }

  /**
   * @param e a core failure
   * @return its message followed by where the console changes the settings it names
   */
  static String withHow(LoadstoneException e) {
    Set<String> how = new LinkedHashSet<>();
    for (Setting s : e.settings()) {
      how.add(where(s));
    }
    return how.isEmpty() ? e.getMessage()
        : e.getMessage() + " (in the console: " + String.join("; or ", how) + ")";
  }
}
