package org.loadstone.calibration;

import com.fasterxml.jackson.annotation.JsonProperty;
import org.loadstone.units.LoadstoneException;

/**
 * Force exerted by a dead weight whose mass is given as a <em>conventional mass</em> m_c, as
 * printed on weights and on their calibration certificates.
 *
 * <p>OIML R 111-1 defines the conventional mass of a weight as the mass of a reference weight of
 * density 8000 kg/m³ that balances it in air of density 1.2 kg/m³ (the convention, from memory:
 * the reference conditions also name 20 °C). So a weight of true mass m and density ρ_weight
 * has m·(1 − 1.2/ρ_weight) = m_c·(1 − 1.2/8000), and its force in air of density ρ_air is
 *
 * <pre>
 * F = m·g·(1 − ρ_air/ρ_weight) = m_c·g·(1 − 1.2/8000)·(1 − ρ_air/ρ_weight)/(1 − 1.2/ρ_weight)
 * </pre>
 *
 * <p>In air of the conventional 1.2 kg/m³ this is m_c·g·(1 − 1.2/8000) whatever the weight is
 * made of; for weights of 8000 kg/m³ it is m_c·g·(1 − ρ_air/8000) in any air. Only when both
 * differ does ρ_weight enter, by −(ρ_air − 1.2)·(1/ρ_weight − 1/8000): about 25 ppm for
 * aluminium in air of 1.1 kg/m³. Treating m_c as a true mass instead would make aluminium
 * weights (2700 kg/m³) 294 ppm light.
 *
 * @param g_m_per_s2 local acceleration due to gravity, 9.7 to 9.9 m/s²
 * @param gSource how g was obtained, for the record (e.g. "standard", "entered",
 *     "WGS 84 normal gravity at 51.5°, 35 m")
 * @param airDensity_kg_per_m3 0 to 2 kg/m³ (0 turns the buoyancy correction off)
 * @param weightDensity_kg_per_m3 actual density of the weights, 1000 to 25000 kg/m³; matters
 *     only when the air is not at the conventional 1.2 kg/m³
 */
public record ForceFromMass(
    @JsonProperty("g_m_per_s2") double g_m_per_s2,
    @JsonProperty("g_source") String gSource,
    @JsonProperty("air_density_kg_per_m3") double airDensity_kg_per_m3,
    @JsonProperty("weight_density_kg_per_m3") double weightDensity_kg_per_m3) {

  /** Conventional density of air, OIML R 111-1, kg/m³. */
  public static final double CONVENTIONAL_AIR_KG_PER_M3 = 1.2;
  /** Conventional density of weights, OIML R 111-1, kg/m³. */
  public static final double CONVENTIONAL_WEIGHT_KG_PER_M3 = 8000;
  /** The ratio m_c·(1 − 1.2/8000) on which the conventional mass is defined (OIML R 111-1). */
  private static final double CONVENTIONAL_FACTOR =
      1 - CONVENTIONAL_AIR_KG_PER_M3 / CONVENTIONAL_WEIGHT_KG_PER_M3;

  /**
   * The size of the two corrections for one mass, against the plain product m · 9.80665.
   *
   * @param force_N the corrected force
   * @param gravityCorrection_N m·(g − g_standard)
   * @param gravityRelative (g − g_standard) / g_standard
   * @param buoyancyCorrection_N F − m_c·g, the air-buoyancy correction
   * @param buoyancyRelative F/(m_c·g) − 1, −1.5e-4 with the conventional densities
   */
  public record Corrections(
      double force_N,
      double gravityCorrection_N,
      double gravityRelative,
      double buoyancyCorrection_N,
      double buoyancyRelative) {}

  /** Validates ranges; the messages name the input and its accepted range. */
  public ForceFromMass {
    if (!(g_m_per_s2 >= 9.7 && g_m_per_s2 <= 9.9)) {
      throw new LoadstoneException(
          "gravity " + g_m_per_s2 + " m/s² is not a value found on the Earth's surface: enter"
              + " 9.7 to 9.9 m/s², or give latitude and elevation");
    }
    if (gSource == null || gSource.isBlank()) {
      gSource = "entered";
    }
    if (!(airDensity_kg_per_m3 >= 0 && airDensity_kg_per_m3 <= 2)) {
      throw new LoadstoneException(
          "air density " + airDensity_kg_per_m3 + " kg/m³ is out of range: enter 0 to 2 kg/m³"
              + " (1.2 is the conventional value)");
    }
    if (!(weightDensity_kg_per_m3 >= 1000 && weightDensity_kg_per_m3 <= 25000)) {
      throw new LoadstoneException(
          "weight density " + weightDensity_kg_per_m3 + " kg/m³ is out of range: enter 1000 to"
              + " 25000 kg/m³ (8000 is the conventional value for steel weights)");
    }
  }

  /** Standard gravity 9.80665 m/s² and the conventional densities. */
  public static ForceFromMass standard() {
    return new ForceFromMass(
        NormalGravity.STANDARD_M_PER_S2, "standard", CONVENTIONAL_AIR_KG_PER_M3,
        CONVENTIONAL_WEIGHT_KG_PER_M3);
  }

  /** An entered g with the conventional densities. */
  public static ForceFromMass withGravity(double g_m_per_s2) {
    return new ForceFromMass(
        g_m_per_s2, "entered", CONVENTIONAL_AIR_KG_PER_M3, CONVENTIONAL_WEIGHT_KG_PER_M3);
  }

  /** g from {@link NormalGravity#at_m_per_s2} with the conventional densities. */
  public static ForceFromMass atSite(double latitude_deg, double elevation_m) {
    double g = NormalGravity.at_m_per_s2(latitude_deg, elevation_m);
    return new ForceFromMass(
        g, "WGS 84 normal gravity at latitude " + latitude_deg + "°, elevation " + elevation_m
            + " m", CONVENTIONAL_AIR_KG_PER_M3, CONVENTIONAL_WEIGHT_KG_PER_M3);
  }

  /**
   * @param mass_kg conventional mass of the weights (OIML R 111-1), ≥ 0
   * @return force in N
   * @throws LoadstoneException when the mass is negative or not finite
   */
  public double force_N(double mass_kg) {
    if (!(mass_kg >= 0 && Double.isFinite(mass_kg))) {
      throw new LoadstoneException("mass " + mass_kg + " kg is invalid: enter zero or more");
    }
    return mass_kg * g_m_per_s2 * buoyancyFactor();
  }

  /**
   * @return F/(m_c·g) for a conventional mass m_c: (1 − 1.2/8000)·(1 − ρ_air/ρ_weight)/(1 −
   *     1.2/ρ_weight), OIML R 111-1 convention
   */
  public double buoyancyFactor() {
    return CONVENTIONAL_FACTOR * (1 - airDensity_kg_per_m3 / weightDensity_kg_per_m3)
        / (1 - CONVENTIONAL_AIR_KG_PER_M3 / weightDensity_kg_per_m3);
  }

  /** @return the force and the size of each correction for {@code mass_kg} */
  public Corrections corrections(double mass_kg) {
    double f = force_N(mass_kg);
    double g0 = NormalGravity.STANDARD_M_PER_S2;
    double buoyRel = buoyancyFactor() - 1;
    return new Corrections(
        f, mass_kg * (g_m_per_s2 - g0), (g_m_per_s2 - g0) / g0,
        mass_kg * g_m_per_s2 * buoyRel, buoyRel);
  }
}
