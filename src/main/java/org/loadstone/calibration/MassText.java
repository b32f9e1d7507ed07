package org.loadstone.calibration;

import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.loadstone.units.InputException;
import org.loadstone.units.LoadstoneException;

/** Parses a mass typed by a person, possibly a sum of several weights: "500 g + 2 kg". */
public final class MassText {
  private static final Pattern TERM =
      Pattern.compile("^\\s*(\\d+(?:\\.\\d*)?|\\.\\d+)\\s*(mg|g|kg)\\s*$");

  /** The largest mass accepted, kg (a thousand tonnes; more is a typing slip). */
  private static final double MAX_KG = 1e6;

  private MassText() {}

  /**
   * @param text terms "number unit" joined by "+"; units mg, g, kg; a decimal point, no comma
   * @return the total in kg, ≥ 0 and at most a thousand tonnes
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
            "mass " + InputException.shown(text) + ": cannot read "
                + InputException.shown(term.trim()) + ": write each weight as a"
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
    if (!(total <= MAX_KG)) {
      throw new LoadstoneException("mass " + InputException.shown(text) + " is more than a "
          + "thousand tonnes: enter the mass of the weights placed, e.g. '20 kg'");
    }
    return total;
  }

  /**
   * The weights of a calibration as a person lists them: masses separated by commas, semicolons
   * or line breaks, each one or a sum ("1 kg + 500 g"), in any order.
   *
   * @param text the list
   * @param where what the list is, for messages (e.g. "--loads")
   * @return the loads in kg, ascending
   * @throws LoadstoneException when an item is not a mass, is zero, or repeats, or there is none;
   *     the message names the item
   */
  public static List<Double> parseList_kg(String text, String where) {
    List<String> items = new ArrayList<>();
    for (String part : (text == null ? "" : text).split("[,;\\n]")) {
      if (!part.isBlank()) {
        items.add(part.strip());
      }
    }
    List<Double> out = new ArrayList<>();
    for (int i = 0; i < items.size(); i++) {
      String item = items.get(i);
      double kg;
      try {
        kg = parse_kg(item);
      } catch (LoadstoneException e) {
        throw new LoadstoneException(where + ", weight " + (i + 1) + ": " + e.getMessage());
      }
      if (kg == 0) {
        throw new LoadstoneException(where + ", weight " + (i + 1) + " ('" + item + "') is"
            + " zero: the zero point is always read, list only the weights");
      }
      if (out.contains(kg)) {
        throw new LoadstoneException(where + ": '" + item + "' is listed twice: give each"
            + " load once (repeat the whole set as another series)");
      }
      out.add(kg);
    }
    if (out.isEmpty()) {
      throw new LoadstoneException(where + " lists no weights: give at least two, e.g."
          + " \"1 kg, 2 kg, 5 kg\"");
    }
    out.sort(null);
    return out;
  }

  /** @return e.g. "2 kg", "0.5 kg", "250 g" */
  public static String format(double kg) {
    if (kg >= 1 || kg == 0) {
      return plain(kg) + " kg";
    }
    return plain(kg * 1000) + " g";
  }

  private static String plain(double v) {
    BigDecimal b = new BigDecimal(v).setScale(9, RoundingMode.HALF_EVEN).stripTrailingZeros();
    return b.scale() < 0 ? b.setScale(0).toPlainString() : b.toPlainString();
  }
}
