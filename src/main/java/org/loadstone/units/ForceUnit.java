package org.loadstone.units;

import java.util.Locale;

/** Units of force with exact conversion factors to the newton. */
public enum ForceUnit {
  /** newton */
  N("N", 1.0),
  /** kilonewton */
  KN("kN", 1000.0),
  /** pound-force, exactly 4.4482216152605 N (avoirdupois pound times standard gravity) */
  LBF("lbf", 4.4482216152605),
  /** kilogram-force, exactly 9.80665 N (standard gravity) */
  KGF("kgf", 9.80665);

  private final String symbol;
  private final double newtonsPerUnit;

  ForceUnit(String symbol, double newtonsPerUnit) {
    this.symbol = symbol;
    this.newtonsPerUnit = newtonsPerUnit;
  }

  /** @return the unit symbol as printed, e.g. {@code kN} */
  public String symbol() {
    return symbol;
  }

  /** @return how many newtons one of this unit is */
  public double newtonsPerUnit() {
    return newtonsPerUnit;
  }

  /** Converts a value in this unit to newtons. */
  public double toNewtons(double value) {
    return value * newtonsPerUnit;
  }

  /** Converts a value in newtons to this unit. */
  public double fromNewtons(double value_N) {
    return value_N / newtonsPerUnit;
  }

  /**
   * Parses a unit symbol, case-insensitively ({@code N}, {@code kN}, {@code lbf}, {@code kgf}).
   *
   * @throws LoadstoneException naming the text and the accepted symbols
   */
  public static ForceUnit parse(String text) {
    String t = text == null ? "" : text.trim().toLowerCase(Locale.ROOT);
    for (ForceUnit u : values()) {
      if (u.symbol.toLowerCase(Locale.ROOT).equals(t)) {
        return u;
      }
    }
    throw new LoadstoneException(
        "unknown force unit '" + text + "': use one of N, kN, lbf, kgf");
  }
}
