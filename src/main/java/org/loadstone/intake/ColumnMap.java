package org.loadstone.intake;

import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import org.loadstone.units.LoadstoneException;

/**
 * Which columns of a foreign CSV hold time, force and position. Each entry is a header name
 * (compared after trimming, case-insensitively) or a 1-based column number.
 *
 * @param time the time column, not blank
 * @param force the force column, not blank
 * @param position the position column, or {@code null} when the file has none
 */
public record ColumnMap(String time, String force, String position) {

  /** The columns of a Loadstone run CSV and of {@link CsvImport#plain}. */
  public static final ColumnMap PLAIN = new ColumnMap("time_s", "force_N", "position_mm");

  /** Checks the entries. */
  public ColumnMap {
    if (time == null || time.isBlank() || force == null || force.isBlank()) {
      throw new LoadstoneException(
          "Column map needs both time and force, e.g. time=Time,force=Load[,position=Ext].");
    }
    time = time.trim();
    force = force.trim();
    position = position == null || position.isBlank() ? null : position.trim();
  }

  /**
   * Parses {@code time=Time [s],force=Load,position=3}: comma-separated {@code key=column} pairs,
   * keys {@code time}, {@code force}, {@code position}.
   *
   * @throws LoadstoneException naming the bad pair and the accepted keys
   */
  public static ColumnMap parse(String text) {
    if (text == null || text.isBlank()) {
      throw new LoadstoneException(
          "Column map is empty; give e.g. time=Time,force=Load,position=Ext.");
    }
    Map<String, String> m = new LinkedHashMap<>();
    for (String pair : text.split(",")) {
      int eq = pair.indexOf('=');
      String key = eq < 0 ? "" : pair.substring(0, eq).trim().toLowerCase(Locale.ROOT);
      if (eq < 0 || !(key.equals("time") || key.equals("force") || key.equals("position"))) {
        throw new LoadstoneException("Column map entry '" + pair.trim() + "' is not key=column "
            + "with key time, force or position; e.g. time=Time,force=Load,position=Ext.");
      }
      if (m.put(key, pair.substring(eq + 1)) != null) {
        throw new LoadstoneException("Column map names '" + key + "' twice; give it once.");
      }
    }
    if (!m.containsKey("time") || !m.containsKey("force")) {
      throw new LoadstoneException("Column map '" + text + "' lacks "
          + (m.containsKey("time") ? "force" : "time") + "; both time and force are needed.");
    }
    return new ColumnMap(m.get("time"), m.get("force"), m.get("position"));
  }
}
