package org.loadstone.cli;

import org.loadstone.calibration.ForceFromMass;
import org.loadstone.calibration.NormalGravity;
import org.loadstone.units.LoadstoneException;
import picocli.CommandLine.Option;

/** How masses become forces: local gravity and air buoyancy, for the calibrate command. */
final class ForceModelOptions {
  @Option(names = "--gravity-m-per-s2", paramLabel = "M-PER-S2",
      description = "Local acceleration due to gravity in m/s² (default: standard 9.80665, or "
          + "from --latitude-deg and --elevation-m).")
  Double g;

  @Option(names = "--latitude-deg", paramLabel = "DEG",
      description = "Site latitude in degrees, for normal gravity (with --elevation-m).")
  Double latitude_deg;

  @Option(names = "--elevation-m", paramLabel = "M",
      description = "Site elevation above sea level in m (with --latitude-deg).")
  Double elevation_m;

  @Option(names = "--air-density-kg-per-m3", paramLabel = "KG-PER-M3",
      description = "Air density in kg/m³ for the buoyancy correction; 0 turns it off "
          + "(default: ${DEFAULT-VALUE}, the conventional value).",
      defaultValue = "1.2")
  double airDensity_kg_per_m3;

  @Option(names = "--weight-density-kg-per-m3", paramLabel = "KG-PER-M3",
      description = "Actual density of the weights in kg/m³ (default: ${DEFAULT-VALUE}, steel). Masses are "
          + "conventional masses (OIML R 111), so this matters only when --air-density-kg-per-m3 is not "
          + "1.2.",
      defaultValue = "8000")
  double weightDensity_kg_per_m3;

  /**
   * @return the force model the options describe
   * @throws LoadstoneException when --gravity-m-per-s2 is combined with a site, or the site is incomplete, or
   *     a value is out of range
   */
  ForceFromMass model() {
    boolean site = latitude_deg != null || elevation_m != null;
    if (g != null && site) {
      throw new LoadstoneException("--gravity-m-per-s2 and --latitude-deg/--elevation-m both given: give either the"
          + " measured g, or the site's latitude and elevation, not both");
    }
    double gValue;
    String source;
    if (site) {
      if (latitude_deg == null || elevation_m == null) {
        throw new LoadstoneException("normal gravity needs both --latitude-deg DEG and"
            + " --elevation-m M: add the missing one, or give --gravity-m-per-s2 instead");
      }
      ForceFromMass at = ForceFromMass.atSite(latitude_deg, elevation_m);
      gValue = at.g_m_per_s2();
      source = at.gSource();
    } else if (g != null) {
      gValue = g;
      source = "entered";
    } else {
      gValue = NormalGravity.STANDARD_M_PER_S2;
      source = "standard";
    }
    return new ForceFromMass(gValue, source, airDensity_kg_per_m3, weightDensity_kg_per_m3);
  }
}
