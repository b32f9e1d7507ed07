package org.loadstone.sim;

/**
 * Ground truth of a simulated run so far (a snapshot; take a new one after more samples).
 * Peak, energies and break come from the model's own steps (at most 100 µs apart, and exactly at
 * every sample instant), so at a slow rate the true peak can lie between samples.
 *
 * @param scenario the scenario
 * @param seed the seed
 * @param rateHz current nominal sample rate, samples/s
 * @param loadCell the cell: capacity, sensitivity, zero offset, noise, non-linearity
 * @param positionCountsPerMm encoder resolution, counts/mm
 * @param gravity_m_per_s2 gravity used for dead weights, m/s²
 * @param crossheadRate_mm_per_s constant crosshead rate, mm/s; NaN when hand-pumped or in the
 *     dead-weight mode
 * @param contactGap_mm crosshead travel before it touches the specimen, mm; NaN in the
 *     dead-weight mode
 * @param frameStiffness_N_per_mm stiffness of the load frame, N/mm; NaN in the dead-weight mode
 * @param specimen the specimen, or null in the dead-weight mode
 * @param systemStiffness_N_per_mm specimen and frame in series, 1/(1/k_s + 1/k_f), N/mm; NaN in
 *     the dead-weight mode
 * @param peakForce_N largest true force so far, N (0 before any load)
 * @param peakTime_s true time of the peak, s, NaN before any load
 * @param breakTime_s true time the failure began, s, NaN if not (yet) failed
 * @param breakForce_N true force when the failure began, N, NaN if not failed
 * @param energyToPeak_J work done on the specimen, ∫F dδ, from contact to the peak, J
 * @param energyToBreak_J the same to the failure, J, NaN if not failed
 * @param crossheadEnergyToPeak_J ∫F dx over crosshead travel (includes frame stretch) to the
 *     peak, J
 * @param crossheadEnergyToBreak_J the same to the failure, J, NaN if not failed
 * @param samples samples produced so far
 * @param saturatedSamples of which clipped by the converter
 * @param placedMass_kg mass on the cell now (dead-weight mode), kg
 */
public record SimTruth(
    Scenario scenario,
    long seed,
    double rateHz,
    LoadCell loadCell,
    double positionCountsPerMm,
    double gravity_m_per_s2,
    double crossheadRate_mm_per_s,
    double contactGap_mm,
    double frameStiffness_N_per_mm,
    SpecimenSummary specimen,
    double systemStiffness_N_per_mm,
    double peakForce_N,
    double peakTime_s,
    double breakTime_s,
    double breakForce_N,
    double energyToPeak_J,
    double energyToBreak_J,
    double crossheadEnergyToPeak_J,
    double crossheadEnergyToBreak_J,
    long samples,
    long saturatedSamples,
    double placedMass_kg) {

  /** @throws IllegalArgumentException when the scenario or the cell is missing */
  public SimTruth {
    if (scenario == null || loadCell == null) {
      throw new IllegalArgumentException("Null 'scenario' or 'loadCell' argument.");
    }
  }

  /** @return whether the specimen has failed */
  public boolean broken() {
    return !Double.isNaN(breakTime_s);
  }
}
