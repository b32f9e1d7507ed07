package org.loadstone.sim;

import org.loadstone.units.LoadstoneException;

/**
 * A homogeneous rectangular beam, simply supported, in three-point bending (centre load) or in
 * four-point bending (two equal loads symmetric about mid-span, the crosshead's travel being the
 * deflection at the loading noses), as simulated. Values of the presets are illustrative, not
 * material data.
 *
 * @param span_mm support span L, &gt; 0
 * @param width_mm width b, &gt; 0
 * @param depth_mm depth h, &gt; 0
 * @param modulus_MPa Young's modulus E, N/mm², &gt; 0
 * @param flexuralStrength_MPa outer-fibre stress at fracture, N/mm², &gt; 0
 * @param density_kg_per_m3 density, &gt; 0
 * @param overhang_mm length beyond each support, ≥ 0 (for the mass)
 * @param loadSpan_mm distance between the two loading noses for four-point bending, in (0, span);
 *     0 for three-point bending
 */
public record SolidBeam(
    double span_mm,
    double width_mm,
    double depth_mm,
    double modulus_MPa,
    double flexuralStrength_MPa,
    double density_kg_per_m3,
    double overhang_mm,
    double loadSpan_mm) {

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
    if (!(loadSpan_mm == 0 || (loadSpan_mm > 0 && loadSpan_mm < span_mm))) {
      throw new LoadstoneException("simulated beam: loadSpan_mm = " + loadSpan_mm
          + " is invalid; use 0 (three-point) or a value between 0 and the span");
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

  /**
   * @return the stiffness at the loading point(s): three-point 48·E·I/L³; four-point, with
   *     a = (L − load span)/2 from each support, 12·E·I/(a²(3L − 4a)) (each nose carries P/2 and
   *     deflects P·a²(3L − 4a)/(12EI); Roark's Formulas for Stress and Strain, simply supported
   *     beam with two symmetric loads; from memory), N/mm
   */
  public double stiffness_N_per_mm() {
    if (loadSpan_mm > 0) {
      double a = (span_mm - loadSpan_mm) / 2;
      return 12 * modulus_MPa * secondMoment_mm4() / (a * a * (3 * span_mm - 4 * a));
    }
    return 48 * modulus_MPa * secondMoment_mm4() / (span_mm * span_mm * span_mm);
  }

  /**
   * @return load at which the outer-fibre stress reaches the strength: three-point 3PL/(2bh²),
   *     four-point 3P(L − load span)/(2bh²) (the moment P·a/2 between the noses), N
   */
  public double breakLoad_N() {
    double lever = loadSpan_mm > 0 ? span_mm - loadSpan_mm : span_mm;
    return 2 * flexuralStrength_MPa * width_mm * depth_mm * depth_mm / (3 * lever);
  }

  /** @return mass of the bar (span plus overhangs), kg */
  public double mass_kg() {
    return (span_mm + 2 * overhang_mm) * width_mm * depth_mm * 1e-9 * density_kg_per_m3;
  }
}
