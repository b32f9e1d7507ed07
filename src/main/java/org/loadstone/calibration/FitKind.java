package org.loadstone.calibration;

import com.fasterxml.jackson.annotation.JsonCreator;
import com.fasterxml.jackson.annotation.JsonValue;
import java.util.Locale;
import org.loadstone.units.LoadstoneException;

/** The calibration curves offered: net counts as a polynomial in force. */
public enum FitKind {
  /** counts = b1·F */
  LINEAR_THROUGH_ZERO(1, false),
  /** counts = b0 + b1·F */
  LINEAR(1, true),
  /** counts = b0 + b1·F + b2·F² */
  QUADRATIC(2, true),
  /** counts = b0 + b1·F + b2·F² + b3·F³ */
  CUBIC(3, true);

  private final int degree;
  private final boolean offset;

  FitKind(int degree, boolean offset) {
    this.degree = degree;
    this.offset = offset;
  }

  /** @return highest power of force */
  public int degree() {
    return degree;
  }

  /** @return whether a constant term is fitted */
  public boolean hasOffset() {
    return offset;
  }

  /** @return number of fitted coefficients */
  public int parameters() {
    return offset ? degree + 1 : degree;
  }

  /** @return lower-case name with dashes, as in files: "linear-through-zero", "cubic" */
  @JsonValue
  public String label() {
    return name().toLowerCase(Locale.ROOT).replace('_', '-');
  }

  /**
   * @param text a label as from {@link #label()}, any case
   * @throws LoadstoneException naming the text and the accepted labels
   */
  @JsonCreator
  public static FitKind parse(String text) {
    String t = text == null ? "" : text.trim().toLowerCase(Locale.ROOT).replace('_', '-');
    for (FitKind k : values()) {
      if (k.label().equals(t)) {
        return k;
      }
    }
    throw new LoadstoneException("fit '" + text + "' is not known: use one of"
        + " linear-through-zero, linear, quadratic, cubic");
  }
}
