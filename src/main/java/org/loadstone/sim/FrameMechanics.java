package org.loadstone.sim;

/**
 * The specimen in a frame of finite stiffness, driven by the crosshead. At each step the crosshead
 * position x is shared between specimen deflection δ and frame stretch F/k_frame:
 *
 * <pre>
 *   x − gap = δ + F(δ, t) / k_frame
 * </pre>
 *
 * solved for δ from the previous solution outwards, so after a fracture the first root in the
 * direction of travel is taken (the frame springs back onto the broken specimen). Also keeps the
 * ground-truth ledger: peak, energies (trapezoid rule per step), failure time.
 */
final class FrameMechanics {
  private static final double TOLERANCE_MM = 1e-10;

  private final SpecimenModel specimen;
  private final double frameStiffness_N_per_mm;
  private final double gap_mm;

  private double time_s;
  private double crosshead_mm;
  private double deflection_mm;
  private double force_N;

  private double energy_Nmm;
  private double crossheadEnergy_Nmm;
  private double peak_N;
  private double peak_s = Double.NaN;
  private double energyToPeak_Nmm;
  private double crossheadEnergyToPeak_Nmm;
  private double break_s = Double.NaN;
  private double breakForce_N = Double.NaN;
  private double energyToBreak_Nmm = Double.NaN;
  private double crossheadEnergyToBreak_Nmm = Double.NaN;

  /** @param start_s true time the specimen is mounted, s (the crosshead then at 0) */
  FrameMechanics(SpecimenModel specimen, double frameStiffness_N_per_mm, double gap_mm,
      double start_s) {
    this.specimen = specimen;
    this.frameStiffness_N_per_mm = frameStiffness_N_per_mm;
    this.gap_mm = gap_mm;
    this.deflection_mm = -gap_mm;
    this.time_s = start_s;
  }

  private double residual(double delta_mm, double x_mm, double t) {
    return delta_mm + specimen.force_N(delta_mm, t) / frameStiffness_N_per_mm - x_mm;
  }

  /** Moves to a new crosshead position at a later time and solves the frame. */
  void step(double newCrosshead_mm, double t) {
    double x = newCrosshead_mm - gap_mm;
    double a = deflection_mm;
    double ga = residual(a, x, t);
    double solved;
    if (Math.abs(ga) <= TOLERANCE_MM) {
      solved = a;
    } else {
      double dir = ga < 0 ? 1 : -1;
      double h = Math.max(Math.abs(newCrosshead_mm - crosshead_mm), 1e-6);
      double b = a + dir * h;
      double gb = residual(b, x, t);
      int guard = 0;
      while ((gb < 0) == (ga < 0) && Math.abs(gb) > TOLERANCE_MM && guard++ < 200) {
        a = b;
        ga = gb;
        h *= 2;
        b = a + dir * h;
        gb = residual(b, x, t);
      }
      solved = Math.abs(gb) <= TOLERANCE_MM ? b : illinois(a, ga, b, gb, x, t);
    }
    double newForce = specimen.commit(solved, t);
    double meanForce = 0.5 * (force_N + newForce);
    energy_Nmm += meanForce * (Math.max(solved, 0) - Math.max(deflection_mm, 0));
    crossheadEnergy_Nmm += meanForce * (newCrosshead_mm - crosshead_mm);
    time_s = t;
    crosshead_mm = newCrosshead_mm;
    deflection_mm = solved;
    force_N = newForce;
    if (newForce > peak_N) {
      peak_N = newForce;
      peak_s = t;
      energyToPeak_Nmm = energy_Nmm;
      crossheadEnergyToPeak_Nmm = crossheadEnergy_Nmm;
    }
    if (Double.isNaN(break_s) && !Double.isNaN(specimen.failureTime_s())) {
      break_s = specimen.failureTime_s();
      breakForce_N = newForce;
      energyToBreak_Nmm = energy_Nmm;
      crossheadEnergyToBreak_Nmm = crossheadEnergy_Nmm;
    }
  }

  /** Illinois false position on a bracket [a, b] with residuals of opposite sign. */
  private double illinois(double a, double ga, double b, double gb, double x, double t) {
    int side = 0;
    for (int i = 0; i < 200; i++) {
      double c = (a * gb - b * ga) / (gb - ga);
      if (!(c > Math.min(a, b) && c < Math.max(a, b))) {
        // rounding put the secant on an end: that end is as close as doubles resolve
        if (Math.abs(ga) <= Math.abs(gb) ? Math.abs(ga) < 1e-9 : Math.abs(gb) < 1e-9) {
          return Math.abs(ga) <= Math.abs(gb) ? a : b;
        }
        c = 0.5 * (a + b);
      }
      double gc = residual(c, x, t);
      if (Math.abs(gc) <= TOLERANCE_MM || Math.abs(b - a) <= TOLERANCE_MM) {
        return c;
      }
      if ((gc < 0) == (gb < 0)) {
        b = c;
        gb = gc;
        if (side == -1) {
          ga *= 0.5;
        }
        side = -1;
      } else {
        a = c;
        ga = gc;
        if (side == 1) {
          gb *= 0.5;
        }
        side = 1;
      }
    }
    return 0.5 * (a + b);
  }

  double time_s() {
    return time_s;
  }

  double crosshead_mm() {
    return crosshead_mm;
  }

  /** @return specimen deflection from first contact, mm, 0 before contact */
  double deflection_mm() {
    return Math.max(0, deflection_mm);
  }

  double force_N() {
    return force_N;
  }

  double peak_N() {
    return peak_N;
  }

  double peak_s() {
    return peak_s;
  }

  double energyToPeak_J() {
    return energyToPeak_Nmm / 1000;
  }

  double crossheadEnergyToPeak_J() {
    return crossheadEnergyToPeak_Nmm / 1000;
  }

  double break_s() {
    return break_s;
  }

  double breakForce_N() {
    return breakForce_N;
  }

  double energyToBreak_J() {
    return energyToBreak_Nmm / 1000;
  }

  double crossheadEnergyToBreak_J() {
    return crossheadEnergyToBreak_Nmm / 1000;
  }

  double frameStiffness_N_per_mm() {
    return frameStiffness_N_per_mm;
  }

  SpecimenModel specimen() {
    return specimen;
  }
}
