package org.loadstone.sim;

import org.loadstone.units.LoadstoneException;

/**
 * A sandwich panel strip with two equal facings in three-point bending (centre load P, span L),
 * as simulated. Preset values are invented but of realistic size; they are illustrative, not
 * material data for any product.
 *
 * <p>Formulas (sandwich beam theory, H. G. Allen, "Analysis and Design of Structural Sandwich
 * Panels", 1969; ASTM C393 for the stresses):
 *
 * <ul>
 *   <li>h = c + 2t total depth; d = c + t distance between facing centroids;
 *   <li>flexural rigidity, thin-facing form: D = E_f·b·t·d²/2 (the facings' own bending
 *       E_f·b·t³/6 and the core's E_c·b·c³/12 are neglected);
 *   <li>shear stiffness U = G_c·b·d²/c;
 *   <li>centre deflection Δ = P·L³/(48·D) + P·L/(4·U), so stiffness P/Δ = 1/(L³/(48D) + L/(4U));
 *   <li>core shear stress τ = P/((h + c)·b); facing stress σ = P·L/(2·t·(h + c)·b).
 * </ul>
 *
 * @param core kind of core, which sets the behaviour after failure
 * @param span_mm support span L, &gt; 0
 * @param width_mm width b, &gt; 0
 * @param facing_mm facing thickness t, &gt; 0
 * @param core_mm core thickness c, &gt; 0
 * @param facingModulus_MPa facing modulus E_f, &gt; 0
 * @param facingStrength_MPa facing stress at failure, &gt; 0
 * @param coreShearModulus_MPa core shear modulus G_c, &gt; 0
 * @param coreShearStrength_MPa core shear strength, &gt; 0
 * @param facingDensity_kg_per_m3 facing density, &gt; 0
 * @param coreDensity_kg_per_m3 core density, &gt; 0
 * @param overhang_mm length beyond each support, ≥ 0 (for the mass)
 */
public record SandwichPanel(
    Core core,
    double span_mm,
    double width_mm,
    double facing_mm,
    double core_mm,
    double facingModulus_MPa,
    double facingStrength_MPa,
    double coreShearModulus_MPa,
    double coreShearStrength_MPa,
    double facingDensity_kg_per_m3,
    double coreDensity_kg_per_m3,
    double overhang_mm) {

  /** Core kinds of the demo panels. */
  public enum Core {
    /** closed-cell foam: after core shear failure the load falls gradually */
    FOAM,
    /** end-grain balsa: core shear failure is sudden and brittle */
    BALSA,
    /** corrugated board: the core collapses progressively in a saw-tooth */
    BOARD
  }

  /** @throws LoadstoneException naming the field when a value is invalid */
  public SandwichPanel {
    if (core == null) {
      throw new LoadstoneException("simulated panel: core is missing; give FOAM, BALSA or BOARD");
    }
    SolidBeam.positive("span_mm", span_mm);
    SolidBeam.positive("width_mm", width_mm);
    SolidBeam.positive("facing_mm", facing_mm);
    SolidBeam.positive("core_mm", core_mm);
    SolidBeam.positive("facingModulus_MPa", facingModulus_MPa);
    SolidBeam.positive("facingStrength_MPa", facingStrength_MPa);
    SolidBeam.positive("coreShearModulus_MPa", coreShearModulus_MPa);
    SolidBeam.positive("coreShearStrength_MPa", coreShearStrength_MPa);
    SolidBeam.positive("facingDensity_kg_per_m3", facingDensity_kg_per_m3);
    SolidBeam.positive("coreDensity_kg_per_m3", coreDensity_kg_per_m3);
    if (!(Double.isFinite(overhang_mm) && overhang_mm >= 0)) {
      throw new LoadstoneException(
          "simulated panel: overhang_mm = " + overhang_mm + " is invalid; use a value >= 0");
    }
  }

  /** @return h = c + 2t, mm */
  public double totalDepth_mm() {
    return core_mm + 2 * facing_mm;
  }

  /** @return d = c + t, distance between facing centroids, mm */
  public double facingCentroidDistance_mm() {
    return core_mm + facing_mm;
  }

  /** @return D = E_f·b·t·d²/2, N·mm² */
  public double flexuralRigidity_Nmm2() {
    double d = facingCentroidDistance_mm();
    return facingModulus_MPa * width_mm * facing_mm * d * d / 2;
  }

  /** @return U = G_c·b·d²/c, N */
  public double shearStiffness_N() {
    double d = facingCentroidDistance_mm();
    return coreShearModulus_MPa * width_mm * d * d / core_mm;
  }

  /** @return P/Δ = 1/(L³/(48D) + L/(4U)), N/mm */
  public double stiffness_N_per_mm() {
    double l = span_mm;
    return 1 / (l * l * l / (48 * flexuralRigidity_Nmm2()) + l / (4 * shearStiffness_N()));
  }

  /** @return load at which τ = P/((h + c)·b) reaches the core shear strength, N */
  public double coreShearFailureLoad_N() {
    return coreShearStrength_MPa * (totalDepth_mm() + core_mm) * width_mm;
  }

  /** @return load at which σ = P·L/(2t(h + c)b) reaches the facing strength, N */
  public double facingFailureLoad_N() {
    return facingStrength_MPa * 2 * facing_mm * (totalDepth_mm() + core_mm) * width_mm / span_mm;
  }

  /** @return the lower of the two failure loads, N */
  public double failureLoad_N() {
    return Math.min(coreShearFailureLoad_N(), facingFailureLoad_N());
  }

  /** @return true when the core fails in shear before the facings */
  public boolean failsInCoreShear() {
    return coreShearFailureLoad_N() <= facingFailureLoad_N();
  }

  /** @return mass of the strip (span plus overhangs): (2·t·ρ_f + c·ρ_c)·length·b, kg */
  public double mass_kg() {
    double areal = 2 * facing_mm * facingDensity_kg_per_m3 + core_mm * coreDensity_kg_per_m3;
    return areal * (span_mm + 2 * overhang_mm) * width_mm * 1e-9;
  }
}
