package org.loadstone.sim;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.stat.descriptive.DescriptiveStatistics;
import org.apache.commons.math3.stat.inference.KolmogorovSmirnovTest;
import org.junit.jupiter.api.Test;

class NoiseAndDeadWeightTest {
  private static final double G = 9.80665;

  private static DescriptiveStatistics counts(SimulatedFrame f, int n) {
    DescriptiveStatistics s = new DescriptiveStatistics();
    for (int i = 0; i < n; i++) {
      s.addValue(f.next().loadCounts());
    }
    return s;
  }

  private static void settle(SimulatedFrame f, double rateHz) {
    for (int i = 0; i < 2.5 * rateHz; i++) {
      f.next(); // 2.5 s = 12.5 settling time constants
    }
  }

  @Test
  void noiseRmsMatchesTheSetValue() {
    double sigma = 39;
    SimulatedFrame f = SimulatedFrame.builder().scenario(Scenario.DEAD_WEIGHT).rateHz(80)
        .noiseRms_counts(sigma).seed(77).build();
    DescriptiveStatistics s = counts(f, 20_000);
    // Standard deviation by Commons Math. The relative standard error of a sample standard
    // deviation is about 1/√(2(n−1)) = 0.5 % for n = 20 000; 3 % is six standard errors. Rounding
    // to whole counts adds 1/12 count² of variance (negligible here).
    assertThat(s.getStandardDeviation()).isCloseTo(sigma, within(0.03 * sigma));
    assertThat(s.getMean()).isCloseTo(LoadCell.DEFAULT_ZERO_OFFSET_COUNTS, within(4 * sigma / Math.sqrt(20_000)));
  }

  @Test
  void noiseIsGaussian() {
    double sigma = 60;
    SimulatedFrame f = SimulatedFrame.builder().scenario(Scenario.DEAD_WEIGHT).rateHz(80)
        .noiseRms_counts(sigma).seed(78).build();
    double[] z = new double[5000];
    for (int i = 0; i < z.length; i++) {
      z[i] = (f.next().loadCounts() - LoadCell.DEFAULT_ZERO_OFFSET_COUNTS) / sigma;
    }
    // Kolmogorov–Smirnov test against N(0,1), Commons Math; fixed seed, so not flaky. Rounding to
    // whole counts moves the empirical CDF by at most 0.5/60 σ × 0.4 ≈ 0.003, well under the
    // 0.001-level critical distance 1.95/√5000 ≈ 0.028.
    double p = new KolmogorovSmirnovTest().kolmogorovSmirnovTest(new NormalDistribution(0, 1), z);
    assertThat(p).isGreaterThan(0.001);
  }

  @Test
  void deadWeightGivesOffsetPlusSensitivityTimesWeight() {
    double sigma = 39;
    SimulatedFrame f = SimulatedFrame.builder().scenario(Scenario.DEAD_WEIGHT).rateHz(80)
        .noiseRms_counts(sigma).nonLinearity_pctFS(0).seed(5).build();
    LoadCell cell = f.truth().loadCell();
    for (double m : new double[] {2, 5, 10, 20}) {
      f.placeMass(m);
      settle(f, 80);
      DescriptiveStatistics s = counts(f, 800);
      double total = f.placedMass_kg();
      // F = m·g with standard gravity 9.80665 m/s² (CGPM 1901)
      double expected = cell.zeroOffset_counts() + cell.countsPerN() * total * G;
      assertThat(s.getMean()).isCloseTo(expected, within(4 * sigma / Math.sqrt(800) + 1));
    }
    assertThat(f.truth().placedMass_kg()).isEqualTo(37.0);
    f.removeAll();
    settle(f, 80);
    assertThat(counts(f, 800).getMean())
        .isCloseTo(cell.zeroOffset_counts(), within(4 * sigma / Math.sqrt(800) + 1));
  }

  @Test
  void calibrationFromDeadWeightsRecoversSensitivityAndNonLinearity() {
    double nl = 0.05;
    SimulatedFrame f = SimulatedFrame.builder().scenario(Scenario.DEAD_WEIGHT).rateHz(80)
        .nonLinearity_pctFS(nl).seed(21).build();
    LoadCell cell = f.truth().loadCell();
    double capacity = cell.capacity_N();
    int steps = 10;
    double[] force = new double[steps + 1];
    double[] mean = new double[steps + 1];
    settle(f, 80);
    mean[0] = counts(f, 400).getMean();
    double stepMass = capacity / steps / G;
    for (int i = 1; i <= steps; i++) {
      f.placeMass(stepMass);
      settle(f, 80);
      force[i] = f.placedMass_kg() * G;
      mean[i] = counts(f, 400).getMean();
    }
    // Terminal-line calibration as a calibration routine would do it: slope through the zero and
    // full-scale points; non-linearity = largest deviation from that line, % of full-scale output.
    double sens = (mean[steps] - mean[0]) / force[steps];
    assertThat(sens).isCloseTo(cell.countsPerN(), within(cell.countsPerN() * 0.0005));
    double worst = 0;
    for (int i = 0; i <= steps; i++) {
      worst = Math.max(worst, Math.abs(mean[i] - (mean[0] + sens * force[i])));
    }
    double measuredNl = 100 * worst / (sens * force[steps]);
    // the 50 % point lies on the largest deviation, so the estimate is the set value within noise
    // (mean of 400 samples: ±2 counts of the 2147-count bow, 0.1 %)
    assertThat(measuredNl).isCloseTo(nl, within(0.05 * nl));
  }
}
