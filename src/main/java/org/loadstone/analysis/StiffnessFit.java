package org.loadstone.analysis;

import org.loadstone.units.LoadstoneException;

/**
 * The straight line fitted to the initial linear region of a run: force against displacement
 * from the first sample, {@code force_N = slope_N_per_mm · displacement_mm + intercept_N}.
 *
 * @param fromIndex first sample of the window (inclusive), at least 0
 * @param toIndex last sample of the window (inclusive), greater than {@code fromIndex}
 * @param fromForce_N force at {@code fromIndex}, newtons
 * @param toForce_N force at {@code toIndex}, newtons
 * @param slope_N_per_mm the stiffness, newtons per millimetre, finite and greater than zero
 * @param intercept_N force of the fitted line at zero displacement, newtons
 * @param rSquared coefficient of determination of the fit, in [0, 1]
 * @param method how the window was chosen
 */
public record StiffnessFit(
    int fromIndex,
    int toIndex,
    double fromForce_N,
    double toForce_N,
    double slope_N_per_mm,
    double intercept_N,
    double rSquared,
    Method method) {

  /** How the stiffness window was chosen. */
  public enum Method {
    /** steepest straight window found by the search */
    AUTOMATIC,
    /** the user's force bounds */
    FORCE_BOUNDS,
    /** the user's displacement bounds */
    DISPLACEMENT_BOUNDS,
    /** the user's position-channel bounds */
    POSITION_BOUNDS
  }

  /** Checks the fit. */
  public StiffnessFit {
    if (method == null) {
      throw new IllegalArgumentException("Null 'method' argument.");
    }
    if (fromIndex < 0 || toIndex <= fromIndex) {
      throw new IllegalArgumentException(
          "Stiffness window [" + fromIndex + ", " + toIndex + "] is not an increasing index range");
    }
    if (!(Double.isFinite(slope_N_per_mm) && slope_N_per_mm > 0)) {
      throw new LoadstoneException(
          "Stiffness window samples " + fromIndex + " to " + toIndex + " gives a slope of "
              + slope_N_per_mm + " N/mm; force must rise with displacement there. Choose a window "
              + "on the loading part of the curve.");
    }
  }

  /**
   * The toe offset: where the fitted line reaches zero force, as a displacement from the first
   * sample. This is the corrected zero of displacement of the toe-compensation construction
   * (ASTM D790 annex A1, ISO 178): corrected displacement = displacement − toe offset.
   *
   * @return millimetres; positive when the line meets zero force after the first sample
   */
  public double toeOffset_mm() {
    return -intercept_N / slope_N_per_mm;
  }
}
