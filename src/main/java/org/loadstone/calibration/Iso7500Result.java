package org.loadstone.calibration;

import java.util.List;

/**
 * Figures computed in the style of ISO 7500-1 (verification of the force-measuring system of
 * testing machines) — not a substitute for an accredited calibration. Here the "force-measuring
 * system" is the load cell with the adopted curve, and the "true force" is the dead-weight force.
 *
 * @param points the relative errors at each non-zero load, ascending order
 * @param f0_pct relative zero error: the indication after unloading against the zero set at the
 *     series' start, % of full scale, the largest in magnitude over the series; null without a
 *     descending zero point
 * @param systemClass "0.5", "1", "2", "3" or "none"
 * @param notes what was not assessed and why the class is what it is
 */
public record Iso7500Result(
    List<Point> points, Double f0_pct, String systemClass, List<String> notes) {

  /** Copies the lists. */
  public Iso7500Result {
    points = List.copyOf(points);
    notes = List.copyOf(notes);
  }

  /**
   * Relative errors at one load, all in %.
   *
   * @param force_N applied load
   * @param q_pct relative accuracy error (mean indicated − applied) / applied
   * @param b_pct relative repeatability (max − min indicated) / mean indicated; null with one
   *     series
   * @param v_pct relative reversibility (descending − ascending indicated) / applied, the largest
   *     in magnitude over the series; null without descending points at this load
   * @param a_pct relative resolution r / applied
   * @param pointClass the best class whose limits all figures meet, or "none"
   */
  public record Point(
      double force_N, double q_pct, Double b_pct, Double v_pct, double a_pct, String pointClass) {}
}
