package org.loadstone.analysis;

import org.loadstone.units.Precondition;

/**
 * Why the automatic search gives no stiffness, and the band of the rise that came closest, so the
 * user can look at it and, if it suits, ask for it as an explicit force band.
 *
 * @param reason the reason in words, naming the criterion that was not met; not blank
 * @param closestFromForce_N lower force of the closest band, N
 * @param closestToForce_N upper force of the closest band, N
 * @param closestFromIndex first sample of the closest band
 * @param closestToIndex last sample of the closest band
 * @param closestSlope_N_per_mm the slope over the closest band, N/mm (not a result: shown so the
 *     user can judge the band)
 * @param closestHalfWidth95 half its 95 % interval as a fraction of that slope
 */
public record StiffnessRefusal(
    String reason,
    double closestFromForce_N,
    double closestToForce_N,
    int closestFromIndex,
    int closestToIndex,
    double closestSlope_N_per_mm,
    double closestHalfWidth95) {

  /** Checks the reason. */
  public StiffnessRefusal {
    Precondition.notNull(reason, "reason");
    if (reason.isBlank()) {
      throw new IllegalArgumentException("A stiffness refusal needs a reason");
    }
  }
}
