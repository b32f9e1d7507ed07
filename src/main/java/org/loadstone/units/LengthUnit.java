package org.loadstone.units;

import java.util.Locale;

/** Units of length with exact conversion factors to the millimetre. */
public enum LengthUnit {
  /** millimetre */
  MM("mm", 1.0),
  /** micrometre */
  UM("um", 0.001),
  /** centimetre */
  CM("cm", 10.0),
  /** metre */
  M("m", 1000.0),
  /** inch, exactly 25.4 mm */
  IN("in", 25.4);

  private final String symbol;
  private final double mmPerUnit;

  LengthUnit(String symbol, double mmPerUnit) {
    this.symbol = symbol;
    this.mmPerUnit = mmPerUnit;
  }

  /** @return the unit symbol as printed */
  public String symbol() {
    return symbol;
  }

  /** @return how many millimetres one of this unit is */
  public double mmPerUnit() {
    return mmPerUnit;
  }

  /** Converts a value in this unit to millimetres. */
  public double toMm(double value) {
    return value * mmPerUnit;
  }

  /** Converts a value in millimetres to this unit. */
  public double fromMm(double value_mm) {
    return value_mm / mmPerUnit;
  }

  /**
   * Parses a unit symbol, case-insensitively ({@code mm}, {@code um} or {@code µm}, {@code cm},
   * {@code m}, {@code in}).
   *
   * @throws LoadstoneException naming the text and the accepted symbols
   */
  public static LengthUnit parse(String text) {
    String t = text == null ? "" : text.trim().toLowerCase(Locale.ROOT).replace('µ', 'u');
    if (t.equals("inch") || t.equals("\"")) {
      return IN;
    }
    for (LengthUnit u : values()) {
      if (u.symbol.equals(t)) {
        return u;
      }
    }
    throw new LoadstoneException(
        "unknown length unit '" + text + "': use one of mm, um, cm, m, in");
  }
}
