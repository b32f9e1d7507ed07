package org.loadstone.calibration;

import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.loadstone.units.LoadstoneException;

/** Parses a mass typed by a person, possibly a sum of several weights: "500 g + 2 kg". */
public final class MassText {
  private static final Pattern TERM =
      Pattern.compile("^\\s*(\\d+(?:\\.\\d*)?|\\.\\d+)\\s*(mg|g|kg)\\s*$");

  private MassText() {}

  /**
   * @param text terms "number unit" joined by "+"; units mg, g, kg; a decimal point, no comma
   * @return the total in kg, ≥ 0
   * @throws LoadstoneException naming the term that is wrong and the accepted form
   */
  public static double parse_kg(String text) {
    if (text == null || text.isBlank()) {
      throw new LoadstoneException(
          "mass is empty: enter e.g. '2 kg' or '500 g + 2 kg'");
    }
    double total = 0;
    for (String term : text.split("\\+", -1)) {
      Matcher m = TERM.matcher(term.toLowerCase(Locale.ROOT));
      if (!m.matches()) {
        throw new LoadstoneException(
            "mass '" + text + "': cannot read '" + term.trim() + "': write each weight as a"
                + " number and a unit (mg, g or kg) with a decimal point, joined by '+', e.g."
                + " '500 g + 2 kg'");
      }
      double v = Double.parseDouble(m.group(1));
      total += switch (m.group(2)) {
        case "mg" -> v * 1e-6;
        case "g" -> v * 1e-3;
        default -> v;
      };
    }
    return total;
  }
}
