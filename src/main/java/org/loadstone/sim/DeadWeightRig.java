package org.loadstone.sim;

/**
 * Masses hung on the cell. After each change the force settles exponentially to m·g with time
 * constant {@code settling_s} (the hanger swinging to rest, illustrative).
 */
final class DeadWeightRig {
  private final double gravity_m_per_s2;
  private final double settling_s;
  private double mass_kg;
  private double from_N;
  private double change_s;

  DeadWeightRig(double gravity_m_per_s2, double settling_s) {
    this.gravity_m_per_s2 = gravity_m_per_s2;
    this.settling_s = settling_s;
  }

  double force_N(double time_s) {
    double target = mass_kg * gravity_m_per_s2;
    double dt = Math.max(0, time_s - change_s);
    return target + (from_N - target) * StrictMath.exp(-dt / settling_s);
  }

  void setMass(double newMass_kg, double now_s) {
    from_N = force_N(now_s);
    change_s = now_s;
    mass_kg = newMass_kg;
  }

  double mass_kg() {
    return mass_kg;
  }
}
