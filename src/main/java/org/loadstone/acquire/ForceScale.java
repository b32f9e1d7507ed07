package org.loadstone.acquire;

/**
 * Turns raw load counts into force. The calibration package supplies fitted scales; until a
 * calibration is chosen, a linear scale from a nominal sensitivity is used.
 */
public interface ForceScale {
  /**
   * @param countsAboveZero counts minus the zero (tare) offset
   * @return force in N
   */
  double force_N(double countsAboveZero);

  /** @return a short description for status lines and run metadata */
  String describe();

  /**
   * The scale a run stores ({@link org.loadstone.archive.ScaleSpec}), so live force and force
   * derived again from the stored raw counts come from the same arithmetic.
   */
  static ForceScale of(org.loadstone.archive.ScaleSpec spec, String description) {
    java.util.function.DoubleUnaryOperator f = org.loadstone.archive.ScaleForce.of(spec);
    return new ForceScale() {
      @Override
      public double force_N(double countsAboveZero) {
        return f.applyAsDouble(countsAboveZero);
      }

      @Override
      public String describe() {
        return description;
      }
    };
  }

  /**
   * A straight line through zero.
   *
   * @param countsPerN sensitivity, non-zero
   */
  static ForceScale linear(double countsPerN, String source) {
    if (!(Double.isFinite(countsPerN) && countsPerN != 0)) {
      throw new IllegalArgumentException("sensitivity must be a non-zero number, was " + countsPerN);
    }
    return new ForceScale() {
      @Override
      public double force_N(double countsAboveZero) {
        return countsAboveZero / countsPerN;
      }

      @Override
      public String describe() {
        return String.format(java.util.Locale.ROOT, "linear %.4g counts/N (%s)", countsPerN, source);
      }
    };
  }
}
