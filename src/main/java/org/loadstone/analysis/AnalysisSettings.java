package org.loadstone.analysis;

import org.loadstone.units.LoadstoneException;

/**
 * How {@link RunAnalyzer} reads a run. Immutable; start from {@link #DEFAULTS} and change one
 * setting at a time with the {@code with…} methods.
 *
 * @param breakDropFraction the break is the first sample after the peak whose force has fallen by
 *     at least this fraction of the peak force; in (0, 1); default 0.40
 * @param breakIndex a break sample index chosen by the user, or {@code null} to detect it
 * @param stiffnessPrecision how well the automatic stiffness must be known: the half-width of
 *     its 95 % interval as a fraction of the slope; in (0, 0.5]; default 0.03 (±3 %). A window
 *     is only long enough when its slope meets this; when none does, the search refuses.
 * @param stiffnessBounds a stiffness band chosen by the user (force, fraction of the peak,
 *     displacement or position), or {@code null} for the automatic search
 * @param crushWindow stroke window for the mean crush force, or {@code null} for none (a
 *     crush run's figures then take the whole stroke, see {@code study.RunMetrics})
 * @param noBreak why the run has no break to find, in words (a crush run goes on through its
 *     load drops and ends by its own rule), or {@code null} to find the break by the drop rule
 */
public record AnalysisSettings(
    double breakDropFraction,
    Integer breakIndex,
    double stiffnessPrecision,
    StiffnessBounds stiffnessBounds,
    CrushWindow crushWindow,
    String noBreak) {

  /** 40 % drop for the break, automatic stiffness known to ±3 % (95 %), no crush window. */
  public static final AnalysisSettings DEFAULTS =
      new AnalysisSettings(0.40, null, 0.03, null, null, null);

  /** Checks the ranges. */
  public AnalysisSettings {
    if (!(breakDropFraction > 0 && breakDropFraction < 1)) {
      throw new LoadstoneException(
          "Analysis setting breakDropFraction is " + breakDropFraction
              + "; it must lie between 0 and 1 (0.40 means a 40 % drop from the peak).");
    }
    if (noBreak != null && (noBreak.isBlank() || breakIndex != null)) {
      throw new IllegalArgumentException("A run without a break needs the reason in words and "
          + "no break index.");
    }
    if (breakIndex != null && breakIndex < 0) {
      throw new LoadstoneException(
          "Analysis setting breakIndex is " + breakIndex + "; give a sample index of 0 or more.");
    }
    if (!(stiffnessPrecision > 0 && stiffnessPrecision <= 0.5)) {
      throw new LoadstoneException(
          "Analysis setting stiffness precision is " + stiffnessPrecision
              + "; give the half-width of the slope's 95 % interval as a fraction above 0 and at "
              + "most 0.5 (0.03 means ±3 %).");
    }
  }

  /** @return these settings with the break at a given sample index (a run without one gets it) */
  public AnalysisSettings withBreakIndex(int index) {
    return new AnalysisSettings(
        breakDropFraction, index, stiffnessPrecision, stiffnessBounds, crushWindow, null);
  }

  /** @return these settings with another break drop fraction, in (0, 1) */
  public AnalysisSettings withBreakDropFraction(double fraction) {
    return new AnalysisSettings(
        fraction, breakIndex, stiffnessPrecision, stiffnessBounds, crushWindow, noBreak);
  }

  /** @return these settings with another required stiffness precision, in (0, 0.5] */
  public AnalysisSettings withStiffnessPrecision(double halfWidth95) {
    return new AnalysisSettings(
        breakDropFraction, breakIndex, halfWidth95, stiffnessBounds, crushWindow, noBreak);
  }

  /** @return these settings with a manual stiffness window; {@code null} restores the search */
  public AnalysisSettings withStiffnessBounds(StiffnessBounds bounds) {
    return new AnalysisSettings(
        breakDropFraction, breakIndex, stiffnessPrecision, bounds, crushWindow, noBreak);
  }

  /** @return these settings with a crush stroke window; {@code null} for none */
  public AnalysisSettings withCrushWindow(CrushWindow window) {
    return new AnalysisSettings(
        breakDropFraction, breakIndex, stiffnessPrecision, stiffnessBounds, window, noBreak);
  }

  /**
   * @param why why the run has no break, in words, e.g. "a crush run ends by its own rule"
   * @return these settings finding no break: break figures are absent and a note gives {@code
   *     why}; any break index is dropped
   */
  public AnalysisSettings withoutBreak(String why) {
    return new AnalysisSettings(
        breakDropFraction, null, stiffnessPrecision, stiffnessBounds, crushWindow, why);
  }

  /**
   * The settings as plain values with units in the keys, for a run's analysis record: {@code
   * break_drop_fraction, break_index, no_break, stiffness_method, stiffness_band_basis,
   * stiffness_band_low, stiffness_band_high, stiffness_precision_95, crush_from_mm,
   * crush_to_mm, crush_stroke}; absent values (and an end at the end of the stroke) are {@code
   * null}. Key order is fixed.
   */
  public java.util.Map<String, Object> toMap() {
    java.util.Map<String, Object> m = new java.util.LinkedHashMap<>();
    m.put("break_drop_fraction", breakDropFraction);
    m.put("break_index", breakIndex);
    m.put("no_break", noBreak);
    m.put("stiffness_method", stiffnessBounds == null ? "automatic" : "band");
    m.put("stiffness_band", stiffnessBounds == null ? null : stiffnessBounds.words());
    m.put("stiffness_band_basis", stiffnessBounds == null ? null
        : stiffnessBounds.basis().name().toLowerCase(java.util.Locale.ROOT));
    m.put("stiffness_band_low", stiffnessBounds == null ? null : stiffnessBounds.low());
    m.put("stiffness_band_high", stiffnessBounds == null ? null : stiffnessBounds.high());
    m.put("stiffness_precision_95", stiffnessPrecision);
    m.put("crush_from_mm", crushWindow == null ? null : crushWindow.from_mm());
    m.put("crush_to_mm", crushWindow == null || crushWindow.toTheEnd() ? null
        : crushWindow.to_mm());
    m.put("crush_stroke", crushWindow == null ? null : crushWindow.words());
    return m;
  }

  /** Which quantity the manual stiffness bounds apply to. */
  public enum Basis {
    /** bounds are forces in newtons */
    FORCE_N,
    /** bounds are fractions of the peak force, e.g. 0.10 and 0.40 */
    PEAK_FRACTION,
    /** bounds are displacements from the first sample, in millimetres */
    DISPLACEMENT_MM,
    /** bounds are raw position-channel values, in millimetres */
    POSITION_MM
  }

  /**
   * A stiffness band: every sample of the rise (first sample to peak) from where the loading path
   * first reaches {@code low} to where it first reaches {@code high}, in force, fraction of the
   * peak force, displacement or position. Samples inside are all used, whatever their noise.
   *
   * @param basis what the bounds measure
   * @param low lower bound, finite
   * @param high upper bound, finite, greater than {@code low}
   */
  public record StiffnessBounds(Basis basis, double low, double high) {
    /** Checks the bounds. */
    public StiffnessBounds {
      if (basis == null) {
        throw new IllegalArgumentException("Null 'basis' argument.");
      }
      if (!(Double.isFinite(low) && Double.isFinite(high) && high > low)) {
        throw new LoadstoneException(
            "Stiffness bounds [" + low + ", " + high + "] are not a finite range with low < high; "
                + "give two finite numbers, the smaller first.");
      }
    }

    /** @return bounds on force, newtons */
    public static StiffnessBounds force_N(double low, double high) {
      return new StiffnessBounds(Basis.FORCE_N, low, high);
    }

    /** @return bounds as fractions of the peak force, e.g. 0.10 and 0.40 */
    public static StiffnessBounds peakFraction(double low, double high) {
      return new StiffnessBounds(Basis.PEAK_FRACTION, low, high);
    }

    /** @return the band in words with its unit, e.g. {@code 10–40 % of the peak} */
    public String words() {
      return switch (basis) {
        case FORCE_N -> plain(low) + " to " + plain(high) + " N";
        case PEAK_FRACTION -> plain(100 * low) + " to " + plain(100 * high) + " % of the peak";
        case DISPLACEMENT_MM -> plain(low) + " to " + plain(high) + " mm of displacement";
        case POSITION_MM -> "position " + plain(low) + " to " + plain(high) + " mm";
      };
    }

    /** @return the value to 6 significant digits without trailing zeros, e.g. 50 or 0.0125 */
    static String plain(double v) {
      return new java.math.BigDecimal(v).round(new java.math.MathContext(6))
          .stripTrailingZeros().toPlainString();
    }

    /** @return bounds on the raw position channel, millimetres */
    public static StiffnessBounds position_mm(double low, double high) {
      return new StiffnessBounds(Basis.POSITION_MM, low, high);
    }

    /** @return bounds on displacement from the first sample, millimetres */
    public static StiffnessBounds displacement_mm(double low, double high) {
      return new StiffnessBounds(Basis.DISPLACEMENT_MM, low, high);
    }
  }

  /**
   * A stroke window for crushing: displacements from the first sample, millimetres. An end of
   * {@code +∞} means "to the end of the stroke" (the run's largest displacement).
   *
   * @param from_mm start of the window, finite, at least 0
   * @param to_mm end of the window, greater than {@code from_mm}; finite or {@code +∞}
   */
  public record CrushWindow(double from_mm, double to_mm) {
    /** The whole stroke, from the first sample to the largest displacement. */
    public static final CrushWindow WHOLE_STROKE = new CrushWindow(0, Double.POSITIVE_INFINITY);

    /** Checks the window. */
    public CrushWindow {
      if (!(Double.isFinite(from_mm) && !Double.isNaN(to_mm) && from_mm >= 0
          && to_mm > from_mm)) {
        throw new LoadstoneException(
            "Crush stroke [" + from_mm + ", " + to_mm + "] mm is not valid for the mean crush "
                + "force; give 0 ≤ from < to, as displacements from the start of the run.");
      }
    }

    /** @return a window from {@code from_mm} to the end of the stroke */
    public static CrushWindow toEnd(double from_mm) {
      return new CrushWindow(from_mm, Double.POSITIVE_INFINITY);
    }

    /** @return whether the window runs to the end of the stroke */
    public boolean toTheEnd() {
      return to_mm == Double.POSITIVE_INFINITY;
    }

    /** @return the window in words, e.g. "2 to 9 mm" or "0 mm to the end of the stroke" */
    public String words() {
      return toTheEnd() ? String.format(java.util.Locale.ROOT, "%.4g mm to the end of the stroke",
          from_mm) : String.format(java.util.Locale.ROOT, "%.4g to %.4g mm", from_mm, to_mm);
    }
  }
}
