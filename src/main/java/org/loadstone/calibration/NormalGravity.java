package org.loadstone.calibration;

import org.loadstone.units.LoadstoneException;

/**
 * Local acceleration due to gravity estimated from latitude and elevation.
 *
 * <p>Normal gravity on the WGS 84 ellipsoid by Somigliana's closed formula
 * {@code γ(φ) = γe (1 + k sin²φ) / sqrt(1 − e² sin²φ)}, with the WGS 84 constants
 * γe = 9.7803253359 m/s² (equator), γp = 9.8321849378 m/s² (poles), k = b·γp/(a·γe) − 1 =
 * 0.00193185265241 and e² = 0.00669437999013 (NIMA TR8350.2, "Department of Defense World
 * Geodetic System 1984", 3rd ed., eq. 4-1 and Table 3.4; values quoted from memory). Elevation
 * is applied with the free-air gradient −3.086e-6 s⁻² per metre (0.3086 mGal/m, a standard
 * geodesy figure). Local anomalies of up to about ±0.01 % are not modelled: enter a measured g
 * where that matters.
 */
public final class NormalGravity {
  /** WGS 84 normal gravity at the equator, m/s². */
  public static final double EQUATOR_M_PER_S2 = 9.7803253359;
  /** WGS 84 normal gravity at the poles, m/s². */
  public static final double POLE_M_PER_S2 = 9.8321849378;
  /** Standard gravity (CGPM 1901, exact), m/s². */
  public static final double STANDARD_M_PER_S2 = 9.80665;
  /** Free-air gradient of gravity, (m/s²) per metre of elevation. */
  public static final double FREE_AIR_GRADIENT_PER_S2 = -3.086e-6;

  private static final double K = 0.00193185265241;
  private static final double E2 = 0.00669437999013;

  private NormalGravity() {}

  /**
   * @param latitude_deg geodetic latitude, −90 to 90 degrees
   * @return normal gravity on the ellipsoid, m/s²
   * @throws LoadstoneException when the latitude is out of range
   */
  public static double onEllipsoid_m_per_s2(double latitude_deg) {
    if (!(latitude_deg >= -90 && latitude_deg <= 90)) {
      throw new LoadstoneException(
          "latitude " + latitude_deg
              + "° is out of range: enter −90 to 90 degrees (north positive)");
    }
    double s = Math.sin(Math.toRadians(latitude_deg));
    double s2 = s * s;
    return EQUATOR_M_PER_S2 * (1 + K * s2) / Math.sqrt(1 - E2 * s2);
  }

  /**
   * @param latitude_deg geodetic latitude, −90 to 90 degrees
   * @param elevation_m height above the ellipsoid (sea level is close enough), −500 to 9000 m
   * @return estimated local gravity, m/s²
   * @throws LoadstoneException when latitude or elevation is out of range
   */
  public static double at_m_per_s2(double latitude_deg, double elevation_m) {
    if (!(elevation_m >= -500 && elevation_m <= 9000)) {
      throw new LoadstoneException(
          "elevation " + elevation_m
              + " m is out of range: enter metres above sea level, −500 to 9000");
    }
    return onEllipsoid_m_per_s2(latitude_deg) + FREE_AIR_GRADIENT_PER_S2 * elevation_m;
  }
}
