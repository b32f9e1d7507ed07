package org.loadstone.analysis;

import org.loadstone.units.LoadstoneException;

/**
 * Beam-bending formulas for solid rectangular specimens. Units: force N, lengths mm, stress and
 * modulus MPa (N/mm²), strain dimensionless (mm/mm), slope N/mm.
 *
 * <p>Three-point bend (ASTM D790, ISO 178), centre load P on support span L, width b, depth d:
 * σ = 3PL/(2bd²), ε = 6Dd/L² for midspan deflection D, E = L³m/(4bd³) for load–deflection slope m.
 *
 * <p>Four-point bend (ASTM D6272), total load P split over two load points a distance
 * {@code loadSpan} apart, centred on the support span L. With the shear span a = (L − loadSpan)/2
 * and elementary beam theory (moment Pa/2 between the load points; midspan deflection
 * D = P·a·(3L² − 4a²)/(48EI)):
 *
 * <ul>
 *   <li>σ = 3P(L − loadSpan)/(2bd²) — for loadSpan = L/3 this is PL/(bd²), for L/2 it is
 *       3PL/(4bd²), the D6272 forms;
 *   <li>ε = 12Dd/(3L² − 4a²) — for loadSpan = L/3 this is 108Dd/(23L²) ≈ 4.70Dd/L² (D6272);
 *   <li>E = m·a·(3L² − 4a²)/(4bd³) — for loadSpan = L/3 this is 23L³m/(108bd³) ≈ 0.21L³m/(bd³).
 * </ul>
 *
 * <p>All methods throw {@link LoadstoneException} when a dimension is not finite and positive, or
 * a four-point load span is not shorter than the support span, naming the value and the fix.
 */
public final class Flexure {
  private Flexure() {}

  /** Three-point flexural stress σ = 3PL/(2bd²), MPa. */
  public static double threePointStress_MPa(
      double force_N, double span_mm, double width_mm, double depth_mm) {
    check(span_mm, width_mm, depth_mm);
    finite(force_N, "force");
    return 3 * force_N * span_mm / (2 * width_mm * depth_mm * depth_mm);
  }

  /** Three-point flexural strain ε = 6Dd/L², mm/mm. */
  public static double threePointStrain(double deflection_mm, double span_mm, double depth_mm) {
    check(span_mm, 1, depth_mm);
    finite(deflection_mm, "deflection");
    return 6 * deflection_mm * depth_mm / (span_mm * span_mm);
  }

  /** Three-point flexural modulus E = L³m/(4bd³), MPa, from slope m in N/mm. */
  public static double threePointModulus_MPa(
      double slope_N_per_mm, double span_mm, double width_mm, double depth_mm) {
    check(span_mm, width_mm, depth_mm);
    positive(slope_N_per_mm, "load–deflection slope", "N/mm");
    return Math.pow(span_mm, 3) * slope_N_per_mm / (4 * width_mm * Math.pow(depth_mm, 3));
  }

  /** Four-point flexural stress σ = 3P(L − loadSpan)/(2bd²), MPa. */
  public static double fourPointStress_MPa(
      double force_N, double span_mm, double loadSpan_mm, double width_mm, double depth_mm) {
    double a = shearSpan(span_mm, loadSpan_mm, width_mm, depth_mm);
    finite(force_N, "force");
    return 3 * force_N * (2 * a) / (2 * width_mm * depth_mm * depth_mm);
  }

  /** Four-point midspan flexural strain ε = 12Dd/(3L² − 4a²), mm/mm. */
  public static double fourPointStrain(
      double deflection_mm, double span_mm, double loadSpan_mm, double depth_mm) {
    double a = shearSpan(span_mm, loadSpan_mm, 1, depth_mm);
    finite(deflection_mm, "deflection");
    return 12 * deflection_mm * depth_mm / (3 * span_mm * span_mm - 4 * a * a);
  }

  /** Four-point flexural modulus E = m·a·(3L² − 4a²)/(4bd³), MPa, from midspan slope m. */
  public static double fourPointModulus_MPa(
      double slope_N_per_mm, double span_mm, double loadSpan_mm, double width_mm, double depth_mm) {
    double a = shearSpan(span_mm, loadSpan_mm, width_mm, depth_mm);
    positive(slope_N_per_mm, "load–deflection slope", "N/mm");
    return slope_N_per_mm * a * (3 * span_mm * span_mm - 4 * a * a)
        / (4 * width_mm * Math.pow(depth_mm, 3));
  }

  /** Compression stress P/A, MPa, for a force in N on a loaded area in mm². */
  public static double compressionStress_MPa(double force_N, double area_mm2) {
    finite(force_N, "force");
    positive(area_mm2, "loaded area", "mm²");
    return force_N / area_mm2;
  }

  private static double shearSpan(double span, double loadSpan, double width, double depth) {
    check(span, width, depth);
    if (!(Double.isFinite(loadSpan) && loadSpan > 0 && loadSpan < span)) {
      throw new LoadstoneException(
          "Four-point load span " + loadSpan + " mm is not between 0 and the support span " + span
              + " mm. Enter the distance between the two load points, e.g. span/3.");
    }
    return (span - loadSpan) / 2;
  }

  static void check(double span, double width, double depth) {
    positive(span, "support span", "mm");
    positive(width, "specimen width", "mm");
    positive(depth, "specimen depth", "mm");
  }

  static void positive(double v, String what, String unit) {
    if (!(Double.isFinite(v) && v > 0)) {
      throw new LoadstoneException(
          "The " + what + " is " + v + " " + unit + "; it must be a finite number above zero. "
              + "Correct the specimen or fixture entry.");
    }
  }

  static void finite(double v, String what) {
    if (!Double.isFinite(v)) {
      throw new LoadstoneException(
          "The " + what + " is " + v + "; it must be a finite number. Check the analysis input.");
    }
  }
}
