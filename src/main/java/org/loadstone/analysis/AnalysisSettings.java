package org.loadstone.analysis;

import org.loadstone.units.LoadstoneException;

/**
 * How {@link RunAnalyzer} reads a run. Immutable; start from {@link #DEFAULTS} and change one
 * setting at a time with the {@code with…} methods.
 *
 * @param breakDropFraction the break is the first sample after the peak whose force has fallen by
 *     at least this fraction of the peak force; in (0, 1); default 0.40
 * @param breakIndex a break sample index chosen by the user, or {@code null} to detect it
 * @param minRSquared the linearity criterion for the automatic stiffness window; in (0, 1];
 *     default 0.995
 * @param minWindowFractionOfRise the automatic stiffness window must span at least this fraction of
 *     the force rise from the first sample to the peak; in (0, 1]; default 0.10
 * @param stiffnessBounds manual stiffness window by force or position bounds, or {@code null} for
 *     the automatic search
 * @param crushWindow stroke window for the mean crush force, or {@code null} for none
 */
public record AnalysisSettings(
    double breakDropFraction,
    Integer breakIndex,
    double minRSquared,
    double minWindowFractionOfRise,
    StiffnessBounds stiffnessBounds,
    CrushWindow crushWindow) {

  /** 40 % drop for the break, R² ≥ 0.995 over at least 10 % of the rise, no crush window. */
  public static final AnalysisSettings DEFAULTS =
      new AnalysisSettings(0.40, null, 0.995, 0.10, null, null);

  /** Checks the ranges. */
  public AnalysisSettings {
    if (!(breakDropFraction > 0 && breakDropFraction < 1)) {
      throw new LoadstoneException(
          "Analysis setting breakDropFraction is " + breakDropFraction
              + "; it must lie between 0 and 1 (0.40 means a 40 % drop from the peak).");
    }
    if (breakIndex != null && breakIndex < 0) {
      throw new LoadstoneException(
          "Analysis setting breakIndex is " + breakIndex + "; give a sample index of 0 or more.");
    }
    if (!(minRSquared > 0 && minRSquared <= 1)) {
      throw new LoadstoneException(
          "Analysis setting minRSquared is " + minRSquared + "; it must lie in (0, 1], e.g. 0.995.");
    }
    if (!(minWindowFractionOfRise > 0 && minWindowFractionOfRise <= 1)) {
      throw new LoadstoneException(
          "Analysis setting minWindowFractionOfRise is " + minWindowFractionOfRise
              + "; it must lie in (0, 1], e.g. 0.10.");
    }
  }

  /** @return these settings with the break at a given sample index */
  public AnalysisSettings withBreakIndex(int index) {
    return new AnalysisSettings(
        breakDropFraction, index, minRSquared, minWindowFractionOfRise, stiffnessBounds,
        crushWindow);
  }

  /** @return these settings with another break drop fraction, in (0, 1) */
  public AnalysisSettings withBreakDropFraction(double fraction) {
    return new AnalysisSettings(
        fraction, breakIndex, minRSquared, minWindowFractionOfRise, stiffnessBounds, crushWindow);
  }

  /** @return these settings with another linearity criterion and minimum window */
  public AnalysisSettings withLinearity(double rSquared, double fractionOfRise) {
    return new AnalysisSettings(
        breakDropFraction, breakIndex, rSquared, fractionOfRise, stiffnessBounds, crushWindow);
  }

  /** @return these settings with a manual stiffness window; {@code null} restores the search */
  public AnalysisSettings withStiffnessBounds(StiffnessBounds bounds) {
    return new AnalysisSettings(
        breakDropFraction, breakIndex, minRSquared, minWindowFractionOfRise, bounds, crushWindow);
  }

  /** @return these settings with a crush stroke window; {@code null} for none */
  public AnalysisSettings withCrushWindow(CrushWindow window) {
    return new AnalysisSettings(
        breakDropFraction, breakIndex, minRSquared, minWindowFractionOfRise, stiffnessBounds,
        window);
  }

  /** Which quantity the manual stiffness bounds apply to. */
  public enum Basis {
    /** bounds are forces in newtons */
    FORCE_N,
    /** bounds are displacements from the first sample, in millimetres */
    DISPLACEMENT_MM,
    /** bounds are raw position-channel values, in millimetres */
    POSITION_MM
  }

  /**
   * A manual stiffness window: the first unbroken run of samples of the rise (first sample to
   * peak) whose force, displacement or position lies within {@code [low, high]}.
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
   * A stroke window for crushing: displacements from the first sample, millimetres.
   *
   * @param from_mm start of the window, finite, at least 0
   * @param to_mm end of the window, finite, greater than {@code from_mm}
   */
  public record CrushWindow(double from_mm, double to_mm) {
    /** Checks the window. */
    public CrushWindow {
      if (!(Double.isFinite(from_mm) && Double.isFinite(to_mm) && from_mm >= 0 && to_mm > from_mm)) {
        throw new LoadstoneException(
            "Crush window [" + from_mm + ", " + to_mm + "] mm is not valid; give 0 ≤ from < to, "
                + "as displacements from the start of the run.");
      }
    }
  }
}
