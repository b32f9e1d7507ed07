package org.loadstone.sim;

import org.loadstone.units.LoadstoneException;

/**
 * Ground truth of the simulated specimen (after the seed's scatter).
 *
 * @param kind short description, e.g. "sandwich panel, FOAM core"
 * @param stiffness_N_per_mm elastic stiffness of the specimen alone, after the toe region, &gt; 0
 * @param failureLoad_N designed failure load, N; infinite if the specimen fails by deflection
 *     (the ductile one ruptures at a set deflection) or never fails
 * @param mass_kg specimen mass, kg, ≥ 0: from geometry and density for beams and panels, an
 *     illustrative fixed value for the others
 * @param toe_mm length of the toe region, mm, ≥ 0
 * @param beam the beam, or null when the specimen is not a solid beam
 * @param panel the panel, or null when the specimen is not a sandwich panel
 */
public record SpecimenSummary(
    String kind,
    double stiffness_N_per_mm,
    double failureLoad_N,
    double toe_mm,
    double mass_kg,
    SolidBeam beam,
    SandwichPanel panel) {

  /** @throws LoadstoneException when a value is out of range */
  public SpecimenSummary {
    if (kind == null || kind.isBlank()) {
      throw new LoadstoneException("simulated specimen: kind is missing; give a description");
    }
    SolidBeam.positive("stiffness_N_per_mm", stiffness_N_per_mm);
    if (!(failureLoad_N > 0)) {
      throw new LoadstoneException(
          "simulated specimen: failureLoad_N = " + failureLoad_N + " is invalid; use > 0");
    }
    if (!(Double.isFinite(toe_mm) && toe_mm >= 0 && Double.isFinite(mass_kg) && mass_kg >= 0)) {
      throw new LoadstoneException(
          "simulated specimen: toe_mm and mass_kg must be finite and >= 0, were "
              + toe_mm
              + " and "
              + mass_kg);
    }
  }
}
