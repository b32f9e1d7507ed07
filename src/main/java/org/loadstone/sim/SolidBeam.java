package org.loadstone.sim;

import org.loadstone.units.LoadstoneException;

/**
 * A homogeneous rectangular beam in three-point bending (centre load, simply supported), as
 * simulated. Values of the presets are illustrative, not material data.
 *
 * @param span_mm support span L, &gt; 0
 * @param width_mm width b, &gt; 0
 * @param depth_mm depth h, &gt; 0
 * @param modulus_MPa Young's modulus E, N/mm², &gt; 0
 * @param flexuralStrength_MPa outer-fibre stress at fracture, N/mm², &gt; 0
 * @param density_kg_per_m3 density, &gt; 0
 * @param overhang_mm length beyond each support, ≥ 0 (for the mass)
 */
public record SolidBeam(
    double span_mm,
    double width_mm,
    double depth_mm,
    double modulus_MPa,
    double flexuralStrength_MPa,
    double density_kg_per_m3,
    double overhang_mm) {

  /** @throws LoadstoneException naming the field when a value is not finite and positive */
  public SolidBeam {
    positive("span_mm", span_mm);
    positive("width_mm", width_mm);
    positive("depth_mm", depth_mm);
    positive("modulus_MPa", modulus_MPa);
    positive("flexuralStrength_MPa", flexuralStrength_MPa);
    positive("density_kg_per_m3", density_kg_per_m3);
    if (!(Double.isFinite(overhang_mm) && overhang_mm >= 0)) {
      throw new LoadstoneException(
          "simulated beam: overhang_mm = " + overhang_mm + " is invalid; use a value >= 0");
    }
  }

  static void positive(String name, double v) {
    if (!(Double.isFinite(v) && v > 0)) {
      throw new LoadstoneException(
          "simulated specimen: " + name + " = " + v + " is invalid; use a finite value > 0");
    }
  }

  /** @return second moment of area b·h³/12, mm⁴ */
  public double secondMoment_mm4() {
    return width_mm * depth_mm * depth_mm * depth_mm / 12;
  }

  /** @return centre-load stiffness 48·E·I/L³, N/mm */
  public double stiffness_N_per_mm() {
    return 48 * modulus_MPa * secondMoment_mm4() / (span_mm * span_mm * span_mm);
  }

  /** @return load at which the outer-fibre stress 3PL/(2bh²) reaches the strength, N */
  public double breakLoad_N() {
    return 2 * flexuralStrength_MPa * width_mm * depth_mm * depth_mm / (3 * span_mm);
  }

  /** @return mass of the bar (span plus overhangs), kg */
  public double mass_kg() {
    return (span_mm + 2 * overhang_mm) * width_mm * depth_mm * 1e-9 * density_kg_per_m3;
  }
}
