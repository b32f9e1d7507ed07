package org.loadstone.analysis;

/**
 * Values per gram of specimen mass, for comparing cores of different density. Each method
 * throws {@link org.loadstone.units.LoadstoneException} when the mass is not finite and above
 * zero, or the value is not finite.
 */
public final class Specific {
  private Specific() {}

  /** @return force per specimen mass, N/g */
  public static double force_N_per_g(double force_N, double mass_g) {
    return per(force_N, mass_g, "force");
  }

  /** @return energy per specimen mass, J/g */
  public static double energy_J_per_g(double energy_J, double mass_g) {
    return per(energy_J, mass_g, "energy");
  }

  /** @return stiffness per specimen mass, (N/mm)/g */
  public static double stiffness_N_per_mm_per_g(double stiffness_N_per_mm, double mass_g) {
    return per(stiffness_N_per_mm, mass_g, "stiffness");
  }

  private static double per(double value, double mass_g, String what) {
    Flexure.finite(value, what);
    Flexure.positive(mass_g, "specimen mass", "g");
    return value / mass_g;
  }
}
