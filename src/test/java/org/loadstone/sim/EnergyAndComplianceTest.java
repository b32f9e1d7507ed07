package org.loadstone.sim;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.apache.commons.math3.stat.regression.SimpleRegression;
import org.junit.jupiter.api.Test;

class EnergyAndComplianceTest {

  @Test
  void energyTruthEqualsTrapezoidAreaOfTheTrueCurve() {
    SimulatedFrame f = SimulatedFrame.builder().scenario(Scenario.BRITTLE).rateHz(10_000).seed(8)
        .build();
    SampleBlock b = SimRuns.run(f, 10_000, 14);
    SimTruth t = f.truth();
    double spec = 0;
    double cross = 0;
    double specToPeak = Double.NaN;
    double crossToPeak = Double.NaN;
    for (int i = 1; i < b.size(); i++) {
      double mean = 0.5 * (b.force_N(i) + b.force_N(i - 1));
      // trapezoid rule on the sampled true curve
      spec += mean * (b.deflection_mm(i) - b.deflection_mm(i - 1));
      cross += mean * (b.crosshead_mm(i) - b.crosshead_mm(i - 1));
      if (b.time_s(i) == t.peakTime_s()) {
        specToPeak = spec / 1000;
        crossToPeak = cross / 1000;
      }
    }
    assertThat(t.energyToPeak_J()).isCloseTo(specToPeak, within(1e-9));
    assertThat(t.crossheadEnergyToPeak_J()).isCloseTo(crossToPeak, within(1e-9));
    assertThat(t.energyToBreak_J()).isCloseTo(specToPeak, within(1e-9));
  }

  @Test
  void energyToPeakMatchesTheClosedFormAtASlowRate() {
    SimulatedFrame f = SimulatedFrame.builder().scenario(Scenario.BRITTLE).rateHz(80).seed(8)
        .build();
    SimRuns.run(f, 80, 14);
    SimTruth t = f.truth();
    double k = t.specimen().stiffness_N_per_mm();
    double p = t.peakForce_N();
    double toe = t.specimen().toe_mm();
    // Work of a linear spring to force P is P²/(2k) (strain energy, any mechanics text); the toe
    // F = kδ²/(2δt) for δ < δt, then k(δ − δt/2), adds kδt²/6 − kδt²/8 = kδt²/24 (integrating
    // the two pieces). Through the frame the crosshead work adds the frame's P²/(2k_f).
    double expected_J = (p * p / (2 * k) + k * toe * toe / 24) / 1000;
    // The model reaches the peak within one step (≤ 100 µs of crosshead travel at 0.5 mm/s), so
    // the work of that last step, P·v·Δt, bounds the difference.
    double oneStep_J = p * 0.5 * SimulatedFrame.MAX_STEP_S / 1000;
    assertThat(t.energyToPeak_J()).isCloseTo(expected_J, within(oneStep_J));
    double frame_J = p * p / (2 * t.frameStiffness_N_per_mm()) / 1000;
    assertThat(t.crossheadEnergyToPeak_J()).isCloseTo(expected_J + frame_J, within(oneStep_J));
  }

  @Test
  void crossheadForceSlopeIsSpecimenAndFrameInSeries() {
    double kf = 50;
    SimulatedFrame f = SimulatedFrame.builder().scenario(Scenario.BRITTLE).rateHz(1000).seed(2)
        .frameStiffness_N_per_mm(kf).nonLinearity_pctFS(0).build();
    SampleBlock b = SimRuns.run(f, 1000, 30);
    SimTruth t = f.truth();
    double ks = t.specimen().stiffness_N_per_mm();
    // springs in series: 1/k = 1/k_s + 1/k_f (common practice)
    double series = 1 / (1 / ks + 1 / kf);
    assertThat(t.systemStiffness_N_per_mm()).isCloseTo(series, within(series * 1e-12));
    SimpleRegression trueFit = new SimpleRegression();
    SimpleRegression measuredFit = new SimpleRegression();
    double failure = t.specimen().failureLoad_N();
    LoadCell cell = t.loadCell();
    for (int i = 0; i < b.size() && b.force_N(i) < 0.8 * failure; i++) {
      if (b.force_N(i) > 0.2 * failure) {
        trueFit.addData(b.crosshead_mm(i), b.force_N(i));
        measuredFit.addData(b.positionCounts(i) / t.positionCountsPerMm(),
            (b.loadCounts(i) - cell.zeroOffset_counts()) / cell.countsPerN());
      }
    }
    assertThat(trueFit.getSlope()).isCloseTo(series, within(series * 1e-6));
    // through noise and encoder steps of 1/400 mm: 0.5 % is ample over ~2000 points
    assertThat(measuredFit.getSlope()).isCloseTo(series, within(series * 0.005));
    assertThat(series).isLessThan(0.7 * ks); // the frame matters here, so the check can fail
  }

  @Test
  void rigidBlockMeasuresTheFrame() {
    SimulatedFrame f = SimulatedFrame.builder().scenario(Scenario.RIGID_BLOCK).rateHz(1000)
        .seed(2).build();
    SampleBlock b = SimRuns.run(f, 1000, 20);
    SimpleRegression fit = new SimpleRegression();
    for (int i = 0; i < b.size(); i++) {
      if (b.force_N(i) > 50 && b.force_N(i) < 450) {
        fit.addData(b.crosshead_mm(i), b.force_N(i));
      }
    }
    double kf = f.truth().frameStiffness_N_per_mm();
    double ks = f.truth().specimen().stiffness_N_per_mm();
    assertThat(fit.getSlope()).isCloseTo(1 / (1 / ks + 1 / kf), within(1e-6 * kf));
    assertThat(fit.getSlope()).isCloseTo(kf, within(0.005 * kf));
  }
}
