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
 * <p>Four-point deflections of a simply supported beam under two equal loads P/2 at a from each
 * support (Roark's Formulas for Stress and Strain, simply supported beam tables; Timoshenko,
 * Strength of Materials — both from memory, and checked in the tests by the unit-load method):
 *
 * <ul>
 *   <li>at mid-span D = P·a·(3L² − 4a²)/(48EI) — a gauge under the middle of the span;
 *   <li>at the loading noses D = P·a²·(3L − 4a)/(12EI) — what the crosshead follows, so
 *       E = m·a²·(3L − 4a)/(b·d³) from the crosshead slope m. Using the mid-span form on
 *       crosshead travel overstates E by (3L² − 4a²)/(4a(3L − 4a)): 15 % at a load span of L/3,
 *       37.5 % at L/2.
 * </ul>
 *
 * <p>Large deflections (ASTM D790, the clause for deflections beyond 10 % of the support span,
 * quoted from memory): σ = (3PL/2bd²)·[1 + 6(D/L)² − 4(d/L)(D/L)] at mid-span deflection D.
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

  /**
   * Four-point flexural modulus E = m·a·(3L² − 4a²)/(4bd³), MPa, from the slope m of force
   * against the mid-span deflection (a gauge under the middle, not the crosshead).
   */
  public static double fourPointModulus_MPa(
      double slope_N_per_mm, double span_mm, double loadSpan_mm, double width_mm, double depth_mm) {
    double a = shearSpan(span_mm, loadSpan_mm, width_mm, depth_mm);
    positive(slope_N_per_mm, "load–deflection slope", "N/mm");
    return slope_N_per_mm * a * (3 * span_mm * span_mm - 4 * a * a)
        / (4 * width_mm * Math.pow(depth_mm, 3));
  }

  /**
   * Four-point flexural modulus from the slope of force against the loading noses' deflection
   * (crosshead travel): E = m·a²·(3L − 4a)/(b·d³), MPa.
   */
  public static double fourPointModulusFromLoadPoints_MPa(
      double slope_N_per_mm, double span_mm, double loadSpan_mm, double width_mm, double depth_mm) {
    double a = shearSpan(span_mm, loadSpan_mm, width_mm, depth_mm);
    positive(slope_N_per_mm, "load–deflection slope", "N/mm");
    return slope_N_per_mm * a * a * (3 * span_mm - 4 * a) / (width_mm * Math.pow(depth_mm, 3));
  }

  /** Mid-span deflection P·a·(3L² − 4a²)/(48EI), mm, total load P on two noses. */
  public static double fourPointMidSpanDeflection_mm(double force_N, double span_mm,
      double loadSpan_mm, double modulus_MPa, double secondMoment_mm4) {
    double a = shearSpan(span_mm, loadSpan_mm, 1, 1);
    positive(modulus_MPa, "modulus", "MPa");
    positive(secondMoment_mm4, "second moment of area", "mm⁴");
    return force_N * a * (3 * span_mm * span_mm - 4 * a * a) / (48 * modulus_MPa * secondMoment_mm4);
  }

  /** Deflection at the loading noses P·a²·(3L − 4a)/(12EI), mm, total load P on two noses. */
  public static double fourPointLoadPointDeflection_mm(double force_N, double span_mm,
      double loadSpan_mm, double modulus_MPa, double secondMoment_mm4) {
    double a = shearSpan(span_mm, loadSpan_mm, 1, 1);
    positive(modulus_MPa, "modulus", "MPa");
    positive(secondMoment_mm4, "second moment of area", "mm⁴");
    return force_N * a * a * (3 * span_mm - 4 * a) / (12 * modulus_MPa * secondMoment_mm4);
  }

  /** Mid-span deflection over load-point deflection, (3L² − 4a²)/(4a(3L − 4a)), at least 1. */
  public static double fourPointMidSpanPerLoadPoint(double span_mm, double loadSpan_mm) {
    double a = shearSpan(span_mm, loadSpan_mm, 1, 1);
    return (3 * span_mm * span_mm - 4 * a * a) / (4 * a * (3 * span_mm - 4 * a));
  }

  /**
   * Three-point flexural stress corrected for a large mid-span deflection D (ASTM D790, from
   * memory): 3PL/(2bd²)·[1 + 6(D/L)² − 4(d/L)(D/L)], MPa.
   */
  public static double threePointStressLargeDeflection_MPa(double force_N, double span_mm,
      double width_mm, double depth_mm, double deflection_mm) {
    double plain = threePointStress_MPa(force_N, span_mm, width_mm, depth_mm);
    finite(deflection_mm, "deflection");
    double r = deflection_mm / span_mm;
    return plain * (1 + 6 * r * r - 4 * (depth_mm / span_mm) * r);
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
