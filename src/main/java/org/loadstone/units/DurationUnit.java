package org.loadstone.units;

import java.util.Locale;

/** Units of time with exact conversion factors to the second. */
public enum DurationUnit {
  /** second */
  S("s", 1.0),
  /** millisecond */
  MS("ms", 0.001),
  /** minute */
  MIN("min", 60.0);

  private final String symbol;
  private final double secondsPerUnit;

  DurationUnit(String symbol, double secondsPerUnit) {
    this.symbol = symbol;
    this.secondsPerUnit = secondsPerUnit;
  }

  /** @return the unit symbol as printed, e.g. {@code ms} */
  public String symbol() {
    return symbol;
  }

  /** Converts a value in this unit to seconds. */
  public double toSeconds(double value) {
    return value * secondsPerUnit;
  }

  /**
   * Parses a unit symbol, case-insensitively ({@code s}, {@code ms}, {@code min}; {@code sec}
   * is read as {@code s}).
   *
   * @throws LoadstoneException naming the text and the accepted symbols
   */
  public static DurationUnit parse(String text) {
    String t = text == null ? "" : text.trim().toLowerCase(Locale.ROOT);
    if (t.equals("sec")) {
      return S;
    }
    for (DurationUnit u : values()) {
      if (u.symbol.equals(t)) {
        return u;
      }
    }
    throw new LoadstoneException("unknown time unit '" + text + "': use one of s, ms, min");
  }
}
