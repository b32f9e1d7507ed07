package org.loadstone.cli;

import java.util.ArrayList;
import java.util.List;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Setting;
import picocli.CommandLine;

/**
 * The command line's part of a message: the option that changes each setting a core message asks
 * for, named only when the command at hand has it.
 */
final class CliHints {
  private CliHints() {}

  /** @return the option that changes this setting, with its parameter */
  static String option(Setting s) {
    return switch (s) {
      case CALIBRATION -> "--cal FILE";
      case CHANGED_CALIBRATION -> "--accept-changed-calibration";
      case NOMINAL_SENSITIVITY -> "--counts-per-n K";
      case RATED_CAPACITY -> "--capacity-n";
      case ZERO_DRIFT_LIMIT -> "--zero-drift-n";
      case ZERO_SAMPLES -> "--zero-samples";
      case START_THRESHOLD -> "--start-at-n";
      case PRETRIGGER -> "--pretrigger-s";
      case BREAK_DROP -> "--stop-drop-pct";
      case ARMING_LEVEL -> "--arm-at-n";
      case DEBOUNCE -> "--debounce-s";
      case ABSOLUTE_STOP -> "--stop-below-n";
      case TAIL -> "--tail-s";
      case OVERLOAD_WARNING -> "--warn-pct";
      case OVERLOAD_STOP -> "--overload-pct";
      case TIME_LIMIT -> "--max-duration-s";
      case TRAVEL_LIMIT -> "--travel-limit-mm";
      case LOW_FORCE_LEVEL -> "--low-force-pct";
      case LOW_FORCE_TIME -> "--low-force-s";
      case ARCHIVE_FOLDER -> "--archive DIR";
      case PORT -> "--port PORT, e.g. --port sim or --port /dev/ttyACM0; 'loadstone ports' "
          + "lists the serial ports";
      case SIM_SCENARIO -> "--scenario dead-weight";
      case SIM_SPEED -> "--sim-speed";
      case IMPORT_TIME_UNIT -> "--time-unit";
      case IMPORT_FORCE_UNIT -> "--force-unit";
      case IMPORT_LENGTH_UNIT -> "--length-unit";
      case IMPORT_DELIMITER -> "--delimiter";
      case IMPORT_DECIMAL_COMMA -> "--decimal ','";
      case TABLE_DECIMAL_COMMA -> "--table-decimal ','";
      case TABLE_OFFSET -> "--table-offset-s";
      case VIDEO_FRAME_RATE -> "--frame-rate-hz";
      case VIDEO_SYNC -> "--sync";
      case TRACK_WINDOW -> "--search-px";
    };
  }

  /**
   * @param e a failure
   * @param command the command that met it
   * @return its message followed by the options of this command that would fix it
   */
  static String withHow(LoadstoneException e, CommandLine command) {
    List<String> options = new ArrayList<>();
    for (Setting s : e.settings()) {
      String o = option(s);
      String name = o.split(" ")[0];
      if (command.getCommandSpec().findOption(name) != null && !options.contains(o)) {
        options.add(o);
      }
    }
    return options.isEmpty() ? e.getMessage()
        : e.getMessage() + " (" + String.join(" or ", options) + ")";
  }
}
