package org.loadstone.analysis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;
import org.junit.jupiter.api.Test;
import org.loadstone.analysis.AnalysisSettings.CrushWindow;
import org.loadstone.analysis.AnalysisSettings.StiffnessBounds;
import org.loadstone.units.LoadstoneException;

class RunAnalyzerTest {

  // A 4 mm deep, 25 mm wide panel strip on a 64 mm span (16:1 span-to-depth, ASTM D790).
  static final double E_MPA = 3000.0;
  static final double SPAN = 64.0;
  static final double WIDTH = 25.0;
  static final double DEPTH = 4.0;
  static final double TOE_MM = 0.20;

  /** Simply supported beam, centre load: k = 48EI/L³ (any strength-of-materials text). */
  static double beamStiffness() {
    double inertia = WIDTH * Math.pow(DEPTH, 3) / 12.0;
    return 48 * E_MPA * inertia / Math.pow(SPAN, 3);
  }

  /**
   * Toe (quadratic seating ramp, tangent-continuous), then the straight beam line, then a smooth
   * bend-over to the peak, then a drop to a break. For x ≥ TOE the force is k·(x − TOE/2), so the
   * D790-annex construction (extend the straight part to zero force) must give TOE/2.
   */
  static Curve beamCurve(double noise_N, long seed) {
    double k = beamStiffness();
    Random rnd = new Random(seed);
    int n = 1200;
    double[] t = new double[n];
    double[] f = new double[n];
    double[] x = new double[n];
    double linearEnd = 2.5;
    for (int i = 0; i < n; i++) {
      t[i] = i * 0.01;
      double d = i * 0.004; // 0.004 mm per sample
      x[i] = 1.5 + d; // the channel does not start at zero
      double force;
      if (d < TOE_MM) {
        force = k * d * d / (2 * TOE_MM);
      } else if (d < linearEnd) {
        force = k * (d - TOE_MM / 2);
      } else {
        double over = d - linearEnd;
        force = k * (linearEnd - TOE_MM / 2) + k * over / (1 + over / 0.3);
      }
      if (d > 4.4) {
        force *= Math.max(0.05, 1 - (d - 4.4) * 4);
      }
      f[i] = force + noise_N * rnd.nextGaussian();
    }
    return new Curve(t, f, x);
  }

  @Test
  void beamModulusFromAutomaticStiffnessWithinHalfPercent() {
    RunResult r = RunAnalyzer.analyze(beamCurve(0.2, 42L)); // noise 0.2 N on a ~190 N peak
    double m = r.stiffness_N_per_mm().orElseThrow();
    double e = Flexure.threePointModulus_MPa(m, SPAN, WIDTH, DEPTH);
    // E back from k = 48EI/L³ and E = L³m/(4bd³) (ASTM D790): must equal the E used, within 0.5 %.
    assertThat(e).isCloseTo(E_MPA, within(0.005 * E_MPA));
    StiffnessFit fit = r.stiffness().orElseThrow();
    assertThat(fit.rSquared()).isGreaterThanOrEqualTo(0.995);
    assertThat(fit.method()).isEqualTo(StiffnessFit.Method.AUTOMATIC);
    // The toe covers samples 0–50 and the bend-over starts at sample 625. The window may reach a
    // few samples into either where they deviate by less than the noise, but not where the local
    // slope is below half the beam stiffness: before sample 25 (toe) or after 656 (bend-over).
    assertThat(fit.fromIndex()).isGreaterThanOrEqualTo(25);
    assertThat(fit.toIndex()).isLessThanOrEqualTo(656);
    // and it must cover most of the straight part, not a short piece of it
    assertThat(fit.toIndex() - fit.fromIndex()).isGreaterThan(500);
  }

  @Test
  void toeOffsetMatchesTheD790AnnexConstruction() {
    // ASTM D790 annex A1 (and ISO 178): extend the linear region to zero force; that point is
    // the corrected zero of displacement. By construction of beamCurve it lies at TOE/2.
    RunResult r = RunAnalyzer.analyze(beamCurve(0.0, 1L));
    assertThat(r.toeOffset_mm().orElseThrow()).isCloseTo(TOE_MM / 2, within(1e-6));
    double dispPeak = r.displacementAtPeak_mm().orElseThrow();
    assertThat(r.correctedDisplacementAtPeak_mm().orElseThrow())
        .isCloseTo(dispPeak - TOE_MM / 2, within(1e-6));
    double dispBreak = r.displacementAtBreak_mm().orElseThrow();
    assertThat(r.correctedDisplacementAtBreak_mm().orElseThrow())
        .isCloseTo(dispBreak - TOE_MM / 2, within(1e-6));
    // noise-free straight part: the fitted slope is the beam stiffness itself
    assertThat(r.stiffness_N_per_mm().orElseThrow()).isCloseTo(beamStiffness(), within(1e-6));
  }

  @Test
  void energyUnderLinearSpringIsHalfKxSquared() {
    // Work of a linear spring F = kx from 0 to x1 is ½·k·x1² (elementary mechanics).
    double k = 120.0;
    double x1 = 2.0;
    int n = 401;
    double[] t = new double[n + 3];
    double[] f = new double[n + 3];
    double[] x = new double[n + 3];
    for (int i = 0; i < n; i++) {
      t[i] = i * 0.01;
      x[i] = x1 * i / (n - 1);
      f[i] = k * x[i];
    }
    for (int j = 0; j < 3; j++) {
      t[n + j] = (n + j) * 0.01;
      x[n + j] = x1 + 0.005 * (j + 1);
      f[n + j] = k * x1 * (0.3 - 0.1 * j);
    }
    RunResult r = RunAnalyzer.analyze(new Curve(t, f, x));
    assertThat(r.peakIndex()).isEqualTo(n - 1);
    assertThat(r.energyToPeak_J().orElseThrow())
        .isCloseTo(0.5 * k * x1 * x1 / 1000.0, within(1e-12));
    assertThat(r.stiffness_N_per_mm().orElseThrow()).isCloseTo(k, within(1e-9));
    // the break is the first sample at or below 60 % of the peak: the first after the peak
    RunResult.BreakPoint b = r.breakPoint().orElseThrow();
    assertThat(b.index()).isEqualTo(n);
    assertThat(b.detected()).isTrue();
    double extra = 0.5 * (k * x1 + 0.3 * k * x1) * 0.005;
    assertThat(r.energyToBreak_J().orElseThrow())
        .isCloseTo((0.5 * k * x1 * x1 + extra) / 1000.0, within(1e-12));
  }

  @Test
  void peakAndBreakFigures() {
    double[] t = {0, 1, 2, 3, 4, 5, 6};
    double[] f = {0, 10, 20, 30, 25, 17, 5};
    double[] x = {0, 1, 2, 3, 4, 5, 6};
    RunResult r = RunAnalyzer.analyze(new Curve(t, f, x));
    assertThat(r.peakForce_N()).isEqualTo(30);
    assertThat(r.peakTime_s()).isEqualTo(3);
    assertThat(r.peakPosition_mm().orElseThrow()).isEqualTo(3);
    // 40 % drop from 30 N: first sample at or below 18 N is index 5
    assertThat(r.breakPoint().orElseThrow().index()).isEqualTo(5);
    RunResult given = RunAnalyzer.analyze(new Curve(t, f, x), AnalysisSettings.DEFAULTS.withBreakIndex(4));
    assertThat(given.breakPoint().orElseThrow().force_N()).isEqualTo(25);
    assertThat(given.breakPoint().orElseThrow().detected()).isFalse();
    assertThat(given.displacementAtBreak_mm().orElseThrow()).isEqualTo(4);
    assertThatThrownBy(
            () -> RunAnalyzer.analyze(new Curve(t, f, x), AnalysisSettings.DEFAULTS.withBreakIndex(2)))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("Break index 2");
  }

  @Test
  void noBreakWhenForceNeverDropsEnough() {
    double[] t = {0, 1, 2, 3};
    double[] f = {0, 10, 20, 15};
    RunResult r = RunAnalyzer.analyze(new Curve(t, f, new double[] {0, 1, 2, 3}));
    assertThat(r.breakPoint()).isEmpty();
    assertThat(r.energyToBreak_J()).isEmpty();
    assertThat(r.notes()).anyMatch(s -> s.contains("No break"));
  }

  @Test
  void withoutPositionStiffnessAndEnergyAreAbsent() {
    Curve c = beamCurve(0.05, 7L);
    RunResult r = RunAnalyzer.analyze(Curve.withoutPosition(c.time_s(), c.force_N()));
    assertThat(r.stiffness()).isEmpty();
    assertThat(r.stiffness_N_per_mm()).isEmpty();
    assertThat(r.energyToPeak_J()).isEmpty();
    assertThat(r.displacementAtPeak_mm()).isEmpty();
    assertThat(r.notes()).anyMatch(s -> s.contains("No position channel"));
    assertThat(r.peakForce_N()).isGreaterThan(100);
    assertThatThrownBy(
            () ->
                RunAnalyzer.analyze(
                    Curve.withoutPosition(c.time_s(), c.force_N()),
                    AnalysisSettings.DEFAULTS.withStiffnessBounds(StiffnessBounds.force_N(10, 50))))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("no position channel");
  }

  @Test
  void manualBoundsOverrideTheSearch() {
    Curve c = beamCurve(0.0, 1L);
    double k = beamStiffness();
    RunResult byForce =
        RunAnalyzer.analyze(
            c, AnalysisSettings.DEFAULTS.withStiffnessBounds(StiffnessBounds.force_N(30, 120)));
    assertThat(byForce.stiffness().orElseThrow().method())
        .isEqualTo(StiffnessFit.Method.FORCE_BOUNDS);
    assertThat(byForce.stiffness().orElseThrow().fromForce_N()).isBetween(30.0, 31.0);
    assertThat(byForce.stiffness_N_per_mm().orElseThrow()).isCloseTo(k, within(1e-6));
    // a window over the toe only gives a smaller slope: the override is really used
    RunResult toe =
        RunAnalyzer.analyze(
            c, AnalysisSettings.DEFAULTS.withStiffnessBounds(StiffnessBounds.displacement_mm(0, 0.1)));
    assertThat(toe.stiffness_N_per_mm().orElseThrow()).isLessThan(0.5 * k);
    // position bounds use the raw channel, which starts at 1.5 mm in beamCurve
    RunResult byPosition =
        RunAnalyzer.analyze(
            c, AnalysisSettings.DEFAULTS.withStiffnessBounds(StiffnessBounds.position_mm(2.0, 3.0)));
    StiffnessFit pf = byPosition.stiffness().orElseThrow();
    assertThat(pf.method()).isEqualTo(StiffnessFit.Method.POSITION_BOUNDS);
    assertThat(pf.fromIndex()).isEqualTo(125); // 1.5 + 125 × 0.004 = 2.0 mm
    assertThat(pf.toIndex()).isEqualTo(375);
    assertThat(pf.slope_N_per_mm()).isCloseTo(k, within(1e-6));
    assertThatThrownBy(
            () ->
                RunAnalyzer.analyze(
                    c,
                    AnalysisSettings.DEFAULTS.withStiffnessBounds(
                        StiffnessBounds.force_N(1e6, 2e6))))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("at least 3");
  }

  @Test
  void energyIsGivenAsMeasuredAndToeCompensated() {
    // A parabolic toe f = a·x² tangent at x1 = 1.5 mm to the line f = k(x − x1/2), k = 100 N/mm,
    // up to a 200 N peak, then a brittle drop. Toe compensation (ASTM D790 annex A1, ASTM D638
    // annex A1; from memory) replaces the toe by the line from its zero at x1/2 = 0.75 mm, so
    // the compensated energy to peak is the triangle P²/(2k) = 200 N·mm; the measured one adds
    // the toe's excess, ∫a·x² − ∫line = k·x1²/24 = 9.375 N·mm (hand integration).
    double k = 100;
    double x1 = 1.5;
    double a = k / (2 * x1);
    double peak = 200;
    double xp = x1 / 2 + peak / k;
    for (long seed = 1; seed <= 5; seed++) {
      Random rnd = new Random(seed);
      int n = 3000;
      double[] t = new double[n];
      double[] f = new double[n];
      double[] x = new double[n];
      for (int i = 0; i < n; i++) {
        x[i] = i * 0.001;
        t[i] = i * 0.01;
        double clean = x[i] < x1 ? a * x[i] * x[i]
            : x[i] <= xp ? k * (x[i] - x1 / 2) : Math.max(0, peak - 4000 * (x[i] - xp));
        f[i] = clean + 0.2 * rnd.nextGaussian(); // noise SD = peak/1000
      }
      RunResult r = RunAnalyzer.analyze(new Curve(t, f, x));
      assertThat(r.toeOffset_mm().getAsDouble()).as("seed " + seed)
          .isCloseTo(0.75, within(0.02));
      assertThat(r.energyToPeakToeCompensated_J().getAsDouble()).as("seed " + seed)
          .isCloseTo(0.200, within(0.002));
      assertThat(r.energyToPeak_J().getAsDouble()).as("seed " + seed)
          .isCloseTo(0.209375, within(0.002));
      // past the peak both follow the same measured samples
      assertThat(r.energyToBreakToeCompensated_J().getAsDouble()
          - r.energyToPeakToeCompensated_J().getAsDouble())
          .isCloseTo(r.energyToBreak_J().getAsDouble() - r.energyToPeak_J().getAsDouble(),
              within(1e-12));
    }
  }

  @Test
  void meanCrushForceAndEfficiency() {
    // Rise to 100 N over 1 mm, then a flat 60 N plateau to 10 mm: mean over [2, 9] mm is 60 N,
    // efficiency 0.6 (crush-force efficiency = mean crush force / peak force, common practice).
    int n = 1001;
    double[] t = new double[n];
    double[] f = new double[n];
    double[] x = new double[n];
    for (int i = 0; i < n; i++) {
      t[i] = i * 0.1;
      x[i] = i * 0.01;
      f[i] = x[i] <= 1.0 ? 100 * x[i] : (x[i] < 1.2 ? 100 - 200 * (x[i] - 1.0) : 60);
    }
    RunResult r =
        RunAnalyzer.analyze(
            new Curve(t, f, x), AnalysisSettings.DEFAULTS.withCrushWindow(new CrushWindow(2.005, 9)));
    RunResult.CrushResult c = r.crush().orElseThrow();
    assertThat(c.meanForce_N()).isCloseTo(60, within(1e-9));
    assertThat(c.efficiency()).isCloseTo(0.6, within(1e-9));
    // energy over the stroke is the area: 60 N × 6.995 mm = 419.7 N·mm (rectangle)
    assertThat(c.energy_J()).isCloseTo(60 * (9 - 2.005) / 1000, within(1e-12));
    // the whole stroke, 0 to 10 mm, by hand: triangle 0.5·1·100 = 50, trapezoid over the drop
    // 0.2·(100 + 60)/2 = 16, plateau 60·8.8 = 528, so 594 N·mm and a mean of 59.4 N
    RunResult.CrushResult whole = RunAnalyzer.analyze(new Curve(t, f, x),
        AnalysisSettings.DEFAULTS.withCrushWindow(CrushWindow.WHOLE_STROKE)).crush().orElseThrow();
    assertThat(whole.to_mm()).isCloseTo(10, within(1e-12));
    assertThat(whole.energy_J()).isCloseTo(0.594, within(1e-9));
    assertThat(whole.meanForce_N()).isCloseTo(59.4, within(1e-9));
    assertThat(whole.efficiency()).isCloseTo(0.594, within(1e-9));
    assertThatThrownBy(
            () ->
                RunAnalyzer.analyze(
                    new Curve(t, f, x),
                    AnalysisSettings.DEFAULTS.withCrushWindow(new CrushWindow(2, 20))))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("crush stroke 2.000 to 20.00 mm")
        .hasMessageContaining("largest displacement of the run, 10.00 mm")
        .hasMessageContaining("ends at or before 10.00 mm");
  }

  @Test
  void runWithoutRiseIsRefused() {
    Random rnd = new Random(3);
    double[] t = new double[200];
    double[] f = new double[200];
    for (int i = 0; i < t.length; i++) {
      t[i] = i * 0.01;
      f[i] = 0.02 * rnd.nextGaussian();
    }
    assertThatThrownBy(() -> RunAnalyzer.analyze(Curve.withoutPosition(t, f)))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("no rise");
    double[] falling = {10, 8, 6, 4};
    assertThatThrownBy(
            () -> RunAnalyzer.analyze(Curve.withoutPosition(new double[] {0, 1, 2, 3}, falling)))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("no rise");
  }

  @Test
  void badCurvesAreRefusedWithTheirPlace() {
    assertThatThrownBy(() -> Curve.withoutPosition(new double[] {0}, new double[] {1}))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("at least 2");
    assertThatThrownBy(
            () -> new Curve(new double[] {0, 1, 2}, new double[] {0, 1, 2}, new double[] {0, Double.NaN, 1}))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("position_mm")
        .hasMessageContaining("sample 1");
    assertThatThrownBy(
            () -> Curve.withoutPosition(new double[] {0, 1, 2}, new double[] {0, 1, Double.NaN}))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("force_N")
        .hasMessageContaining("sample 2");
    assertThatThrownBy(
            () -> Curve.withoutPosition(new double[] {0, 1, 1, 2}, new double[] {0, 1, 2, 3}))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("sample 2");
    assertThatThrownBy(() -> Curve.withoutPosition(new double[] {0, 1}, new double[] {0, 1, 2}))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("differ in length");
  }

  @Test
  @org.junit.jupiter.api.Timeout(value = 10, unit = java.util.concurrent.TimeUnit.MINUTES)
  void searchOnALongCurveFindsTheSlope() {
    // 200 000 samples: the prefix-sum search is O(n·k) and takes well under a second; a quadratic
    // one would take hours and trip the hang guard (no wall-clock threshold beyond that)
    int n = 200_000;
    double[] t = new double[n];
    double[] f = new double[n];
    double[] x = new double[n];
    for (int i = 0; i < n; i++) {
      t[i] = i * 1e-3;
      x[i] = i * 1e-5;
      f[i] = x[i] < 1.5 ? 50 * x[i] : 75 - (x[i] - 1.5) * 10;
    }
    RunResult r = RunAnalyzer.analyze(new Curve(t, f, x));
    assertThat(r.stiffness_N_per_mm().orElseThrow()).isCloseTo(50, within(1e-6));
  }
}
