package org.loadstone.analysis;

import org.loadstone.units.LoadstoneException;

/**
 * Sandwich-beam formulas. Units: force N, lengths mm, stresses and moduli MPa, bending rigidity
 * D in N·mm², shear rigidity U in N, deflection mm.
 *
 * <p>Stresses under three-point bend (ASTM C393 / D7250 forms): core shear stress
 * τ = P/((d + c)b), facing stress σ = PL/(2t(d + c)b).
 *
 * <p>Deflection (H. G. Allen, "Analysis and Design of Structural Sandwich Panels", 1969),
 * simply supported beam, centre load: Δ = PL³/(48D) + PL/(4U), with
 * D = E_f·b·t³/6 + E_f·b·t·h²/2 + E_c·b·c³/12 and U = G_c·b·h²/c, where h = (d + c)/2 is the
 * distance between facing centroids.
 */
public final class Sandwich {
  private Sandwich() {}

  /** Core shear stress τ = P/((d + c)b), MPa. */
  public static double coreShearStress_MPa(double force_N, SandwichGeometry g) {
    Flexure.finite(force_N, "force");
    return force_N / ((g.totalThickness_mm() + g.coreThickness_mm()) * g.width_mm());
  }

  /** Facing stress σ = PL/(2t(d + c)b), MPa, for a centre load on support span L. */
  public static double facingStress_MPa(double force_N, double span_mm, SandwichGeometry g) {
    Flexure.finite(force_N, "force");
    Flexure.positive(span_mm, "support span", "mm");
    return force_N * span_mm
        / (2 * g.facingThickness_mm()
            * (g.totalThickness_mm() + g.coreThickness_mm())
            * g.width_mm());
  }

  /**
   * Bending rigidity D, N·mm².
   *
   * @param facingModulus_MPa E_f, above zero
   * @param coreModulus_MPa E_c, zero or more (zero neglects the core's own bending)
   */
  public static double bendingRigidity_Nmm2(
      SandwichGeometry g, double facingModulus_MPa, double coreModulus_MPa) {
    Flexure.positive(facingModulus_MPa, "facing modulus", "MPa");
    if (!(Double.isFinite(coreModulus_MPa) && coreModulus_MPa >= 0)) {
      throw new LoadstoneException(
          "The core modulus is " + coreModulus_MPa + " MPa; give zero or a positive value.");
    }
    double b = g.width_mm();
    double t = g.facingThickness_mm();
    double c = g.coreThickness_mm();
    double h = g.facingCentroidDistance_mm();
    return facingModulus_MPa * b * t * t * t / 6
        + facingModulus_MPa * b * t * h * h / 2
        + coreModulus_MPa * b * c * c * c / 12;
  }

  /** Shear rigidity U = G_c·b·h²/c, N, for core shear modulus G_c in MPa. */
  public static double shearRigidity_N(SandwichGeometry g, double coreShearModulus_MPa) {
    Flexure.positive(coreShearModulus_MPa, "core shear modulus", "MPa");
    double h = g.facingCentroidDistance_mm();
    return coreShearModulus_MPa * g.width_mm() * h * h / g.coreThickness_mm();
  }

  /** Midspan deflection Δ = PL³/(48D) + PL/(4U), mm, simply supported, centre load. */
  public static double threePointDeflection_mm(
      double force_N, double span_mm, double bendingRigidity_Nmm2, double shearRigidity_N) {
    Flexure.finite(force_N, "force");
    Flexure.positive(span_mm, "support span", "mm");
    Flexure.positive(bendingRigidity_Nmm2, "bending rigidity", "N·mm²");
    Flexure.positive(shearRigidity_N, "shear rigidity", "N");
    return force_N * Math.pow(span_mm, 3) / (48 * bendingRigidity_Nmm2)
        + force_N * span_mm / (4 * shearRigidity_N);
  }
}
