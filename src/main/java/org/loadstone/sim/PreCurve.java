package org.loadstone.sim;

/**
 * Loading curve of an intact specimen, deflection to force, for monotonic loading. Includes the
 * toe region where contact settles: the force follows k·δ²/(2·δt) up to the toe length δt, then
 * the straight line k·(δ − δt/2), which joins it with the same slope k.
 */
abstract class PreCurve {
  final double stiffness_N_per_mm;
  final double toe_mm;

  PreCurve(double stiffness_N_per_mm, double toe_mm) {
    this.stiffness_N_per_mm = stiffness_N_per_mm;
    this.toe_mm = toe_mm;
  }

  /** Equivalent elastic deflection after the toe: force of the linear part is k times this. */
  final double effective_mm(double deflection_mm) {
    if (deflection_mm <= 0) {
      return 0;
    }
    if (deflection_mm < toe_mm) {
      return deflection_mm * deflection_mm / (2 * toe_mm);
    }
    return deflection_mm - toe_mm / 2;
  }

  /** Inverse of {@link #effective_mm} for a positive effective deflection. */
  final double deflectionFor_mm(double effective_mm) {
    if (effective_mm >= toe_mm / 2) {
      return effective_mm + toe_mm / 2;
    }
    return StrictMath.sqrt(2 * toe_mm * effective_mm);
  }

  /** @return force of the intact specimen at a deflection, N, ≥ 0 */
  abstract double force_N(double deflection_mm);

  /**
   * @return force of the loading curve without the strength cap, N (what an undamaged specimen
   *     would carry; after failure it bounds the post-failure envelope from above)
   */
  double uncappedForce_N(double deflection_mm) {
    return force_N(deflection_mm);
  }

  /** @return force at which the specimen fails, N (infinite if it fails by deflection or never) */
  abstract double strength_N();

  /** @return deflection at which the specimen fails, mm (infinite if by force or never) */
  abstract double failureDeflection_mm();

  /** Linear-elastic curve with toe, failing when the force reaches a strength. */
  static final class Elastic extends PreCurve {
    private final double strength_N;

    Elastic(double stiffness_N_per_mm, double toe_mm, double strength_N) {
      super(stiffness_N_per_mm, toe_mm);
      this.strength_N = strength_N;
    }

    @Override
    double force_N(double deflection_mm) {
      return Math.min(stiffness_N_per_mm * effective_mm(deflection_mm), strength_N);
    }

    @Override
    double uncappedForce_N(double deflection_mm) {
      return stiffness_N_per_mm * effective_mm(deflection_mm);
    }

    @Override
    double strength_N() {
      return strength_N;
    }

    @Override
    double failureDeflection_mm() {
      return Double.POSITIVE_INFINITY;
    }
  }

  /**
   * Ductile curve: linear to a proportional limit {@code knee·Fy}, a smooth exponential approach
   * to the yield force Fy with the elastic slope at the joint, slight linear hardening, then from
   * the neck deflection a gradual linear fall to {@code ruptureFraction} of the curve at the
   * rupture deflection, where it fails.
   */
  static final class Ductile extends PreCurve {
    private final double yield_N;
    private final double proportional_N;
    private final double proportional_mm;
    private final double hardening_N_per_mm;
    private final double neck_mm;
    private final double rupture_mm;
    private final double ruptureFraction;

    /** Deflections {@code neck_mm} and {@code rupture_mm} are effective (after the toe). */
    Ductile(
        double stiffness_N_per_mm,
        double toe_mm,
        double yield_N,
        double knee,
        double hardening_N_per_mm,
        double neck_mm,
        double rupture_mm,
        double ruptureFraction) {
      super(stiffness_N_per_mm, toe_mm);
      this.yield_N = yield_N;
      this.proportional_N = knee * yield_N;
      this.proportional_mm = proportional_N / stiffness_N_per_mm;
      this.hardening_N_per_mm = hardening_N_per_mm;
      this.neck_mm = neck_mm;
      this.rupture_mm = rupture_mm;
      this.ruptureFraction = ruptureFraction;
    }

    @Override
    double force_N(double deflection_mm) {
      double u = effective_mm(deflection_mm);
      if (u <= proportional_mm) {
        return stiffness_N_per_mm * u;
      }
      double span = yield_N - proportional_N;
      double beyond = u - proportional_mm;
      double f =
          yield_N
              - span * StrictMath.exp(-stiffness_N_per_mm * beyond / span)
              + hardening_N_per_mm * beyond;
      if (u > neck_mm) {
        double s = Math.min(1, (u - neck_mm) / (rupture_mm - neck_mm));
        f *= 1 - (1 - ruptureFraction) * s;
      }
      return f;
    }

    @Override
    double strength_N() {
      return Double.POSITIVE_INFINITY;
    }

    @Override
    double failureDeflection_mm() {
      return deflectionFor_mm(rupture_mm);
    }
  }
}
