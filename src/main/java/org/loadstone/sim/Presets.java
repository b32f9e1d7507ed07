package org.loadstone.sim;

/**
 * Numbers of the scenarios. All are invented for the simulator, of realistic size, and are
 * illustrative, not material data. Scatter is drawn per specimen from the seed (CV 3–8 %).
 */
final class Presets {
  private Presets() {}

  /** What a scenario sets up. */
  record Setup(
      SpecimenModel model,
      SpecimenSummary summary,
      double crossheadRate_mm_per_s,
      double gap_mm) {}

  /** Default frame stiffness of the simulated bench frame, N/mm. */
  static final double FRAME_STIFFNESS_N_PER_MM = 8000;

  static Setup setup(Scenario scenario, long seed) {
    SimRandom scatter = SimRandom.stream(seed, SimRandom.SPECIMEN);
    SimRandom failure = SimRandom.stream(seed, SimRandom.FAILURE);
    switch (scenario) {
      case BRITTLE:
        return brittle(scatter);
      case FOUR_POINT:
        return fourPoint(scatter);
      case DUCTILE:
        return ductile(scatter);
      case CRUSH:
        return crush(scatter, failure);
      case OVER_RANGE:
        return overRange(scatter);
      case RIGID_BLOCK:
        return rigidBlock();
      case PANEL_FOAM:
      case PANEL_BALSA:
      case PANEL_BOARD:
        return panel(scenario, scatter, failure);
      case DEAD_WEIGHT:
      default:
        return null;
    }
  }

  /** A glassy polymer bar, 64 mm span (16 × depth), fails at about 190 N. */
  private static Setup brittle(SimRandom r) {
    return bar(new SolidBeam(64, 12, 4, 3200 * r.scatter(0.03), 95 * r.scatter(0.06), 1190, 8,
        0), "brittle bar", 0.5);
  }

  /**
   * The brittle bar's material as a longer, deeper bar in four-point bending: 96 mm span, 32 mm
   * load span (L/3), 12 × 6 mm; about 50 N/mm at the loading noses and 430 N at fracture.
   */
  private static Setup fourPoint(SimRandom r) {
    return bar(new SolidBeam(96, 12, 6, 3200 * r.scatter(0.03), 95 * r.scatter(0.06), 1190, 8,
        32), "brittle bar, four-point", 1.0);
  }

  /** A bar that is linear after a short toe and fractures at its strength. */
  private static Setup bar(SolidBeam beam, String kind, double rate_mm_per_s) {
    double toe = 0.08;
    double k = beam.stiffness_N_per_mm();
    double strength = beam.breakLoad_N();
    SpecimenModel m =
        new HistorySpecimen(
            new PreCurve.Elastic(k, toe, strength), new PostFailure.SuddenDrop(0.02, 0.002));
    return new Setup(
        m, new SpecimenSummary(kind, k, strength, toe, beam.mass_kg(), beam, null),
        rate_mm_per_s, 0.3);
  }

  /** Yields near 320 N, necks after about 2.5 mm, ruptures at about 4 mm. */
  private static Setup ductile(SimRandom r) {
    double k = 900 * r.scatter(0.03);
    double yield = 320 * r.scatter(0.04);
    double toe = 0.05;
    double rupture = 4.0 * r.scatter(0.06);
    SpecimenModel m =
        new HistorySpecimen(
            new PreCurve.Ductile(k, toe, yield, 0.8, 15, 2.5, rupture, 0.45),
            new PostFailure.SuddenDrop(0, 0.003));
    return new Setup(
        m, new SpecimenSummary("ductile specimen", k, Double.POSITIVE_INFINITY, toe, 0.012,
            null, null),
        0.5, 0.3);
  }

  /** First collapse near 360 N, then teeth around 85 % of it. */
  private static Setup crush(SimRandom r, SimRandom failure) {
    double k = 1200 * r.scatter(0.03);
    double first = 360 * r.scatter(0.05);
    double toe = 0.05;
    SpecimenModel m =
        new HistorySpecimen(
            new PreCurve.Elastic(k, toe, first),
            new PostFailure.SawTooth(0.35, 0.004, 0.7 * k, 0.85, 1.0, 0.85, 0.08, failure));
    return new Setup(
        m, new SpecimenSummary("crushing specimen", k, first, toe, 0.008, null, null),
        0.5, 0.3);
  }

  /** 25 kN/mm and 6 kN: six times the frame cell's capacity. */
  private static Setup overRange(SimRandom r) {
    double k = 25_000 * r.scatter(0.03);
    double strength = 6000 * r.scatter(0.05);
    SpecimenModel m =
        new HistorySpecimen(
            new PreCurve.Elastic(k, 0.02, strength), new PostFailure.SuddenDrop(0.02, 0.002));
    return new Setup(
        m, new SpecimenSummary("over-range specimen", k, strength, 0.02, 0.05, null, null),
        0.1, 0.3);
  }

  /** A steel block: 2 MN/mm, never fails. */
  private static Setup rigidBlock() {
    double k = 2_000_000;
    SpecimenModel m =
        new HistorySpecimen(
            new PreCurve.Elastic(k, 0, Double.POSITIVE_INFINITY),
            new PostFailure.SuddenDrop(0, 0.002));
    return new Setup(
        m, new SpecimenSummary("rigid block", k, Double.POSITIVE_INFINITY, 0, 0.4, null, null),
        0.01, 0.1);
  }

  /**
   * Shelf-panel strips 25 mm wide on a 150 mm span: 0.5 mm glass-fibre facings on a 10 mm core.
   */
  private static Setup panel(Scenario scenario, SimRandom r, SimRandom failure) {
    SandwichPanel.Core core;
    double g;
    double tau;
    double rho;
    double cvG;
    double cvTau;
    if (scenario == Scenario.PANEL_FOAM) {
      core = SandwichPanel.Core.FOAM;
      g = 20;
      tau = 0.65;
      rho = 60;
      cvG = 0.05;
      cvTau = 0.05;
    } else if (scenario == Scenario.PANEL_BALSA) {
      core = SandwichPanel.Core.BALSA;
      g = 110;
      tau = 1.3;
      rho = 110;
      cvG = 0.08;
      cvTau = 0.08;
    } else {
      core = SandwichPanel.Core.BOARD;
      g = 6;
      tau = 0.35;
      rho = 45;
      cvG = 0.06;
      cvTau = 0.07;
    }
    SandwichPanel p =
        new SandwichPanel(
            core,
            150,
            25 * r.scatter(0.003),
            0.5 * r.scatter(0.02),
            10 * r.scatter(0.005),
            16_000 * r.scatter(0.04),
            220 * r.scatter(0.05),
            g * r.scatter(cvG),
            tau * r.scatter(cvTau),
            1700,
            rho,
            20);
    double k = p.stiffness_N_per_mm();
    double fail = p.failureLoad_N();
    double toe = 0.15;
    PostFailure post;
    if (!p.failsInCoreShear()) {
      post = new PostFailure.SuddenDrop(0.1, 0.002); // facing fracture
    } else if (core == SandwichPanel.Core.FOAM) {
      post = new PostFailure.Gradual(0.5, 1.5);
    } else if (core == SandwichPanel.Core.BALSA) {
      post = new PostFailure.SuddenDrop(0.18, 0.003);
    } else {
      post = new PostFailure.SawTooth(0.3, 0.006, 0.5 * k, 0.9, 0.94, 0.35, 0.08, failure);
    }
    SpecimenModel m = new HistorySpecimen(new PreCurve.Elastic(k, toe, fail), post);
    return new Setup(
        m,
        new SpecimenSummary("sandwich panel, " + core + " core", k, fail, toe, p.mass_kg(), null, p),
        0.2, 0.5);
  }
}
