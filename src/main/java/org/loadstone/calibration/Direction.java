package org.loadstone.calibration;

import com.fasterxml.jackson.annotation.JsonCreator;
import com.fasterxml.jackson.annotation.JsonValue;
import java.util.Locale;
import org.loadstone.units.LoadstoneException;

/** Whether a calibration point was taken with the load rising or falling. */
public enum Direction {
  /** ascending load */
  UP,
  /** descending load (for hysteresis) */
  DOWN;

  /** @return "up" or "down", as written in files */
  @JsonValue
  public String label() {
    return name().toLowerCase(Locale.ROOT);
  }

  /**
   * @param text "up" or "down", any case
   * @throws LoadstoneException naming the text and the accepted values
   */
  @JsonCreator
  public static Direction parse(String text) {
    String t = text == null ? "" : text.trim().toLowerCase(Locale.ROOT);
    return switch (t) {
      case "up" -> UP;
      case "down" -> DOWN;
      default -> throw new LoadstoneException(
          "direction '" + text + "' is not known: write 'up' (ascending) or 'down' (descending)");
    };
  }
}
