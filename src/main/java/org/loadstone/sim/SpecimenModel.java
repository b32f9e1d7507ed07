package org.loadstone.sim;

/**
 * Force of a specimen as a function of its deflection history. The frame solver calls {@link
 * #force_N} many times per step with trial deflections (no state change), then {@link #commit}
 * once with the solution.
 */
interface SpecimenModel {
  /**
   * Force the specimen would carry at this deflection and time, given the committed history.
   * Continuous in {@code deflection_mm}; never negative (the specimen cannot pull the crosshead).
   *
   * @param deflection_mm deflection from first contact, mm (negative = crosshead clear)
   * @param time_s true time, s, not earlier than the last commit
   */
  double force_N(double deflection_mm, double time_s);

  /** Accepts the solved deflection at a time; may start failure. @return the force there */
  double commit(double deflection_mm, double time_s);

  /** @return elastic stiffness after the toe region, N/mm */
  double elasticStiffness_N_per_mm();

  /** @return true time the failure began, s, or NaN while intact */
  double failureTime_s();
}
