package org.loadstone.sim;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

class ConverterAveragingTest {

  @Test
  void slowConverterReportsThePeriodMeanOfTheFastStream() {
    SimulatedFrameBuilder b = SimulatedFrame.builder().scenario(Scenario.BRITTLE).seed(31)
        .noiseRms_counts(0);
    SimulatedFrame slow = b.rateHz(10).build();
    SimulatedFrame fast = b.rateHz(10_000).build();
    SampleBlock s = SimRuns.run(slow, 10, 14);
    SampleBlock f = SimRuns.run(fast, 10_000, 14);
    LoadCell cell = slow.truth().loadCell();
    double peakCounts = cell.idealCounts(fast.truth().peakForce_N());
    double maxSlow = 0;
    for (int k = 0; k < s.size(); k++) {
      // slow sample k ends at 0.1·(k+1) s, fast sample i at 1e-4·(i+1) s.
      // Mean of the noise-free output over the slow period by the trapezoid rule on the 10 kHz
      // stream of the same specimen (an integrating converter reports the period mean, common
      // practice for sigma-delta converters)
      double area = 0;
      for (int i = 1000 * k; i < 1000 * (k + 1); i++) {
        double c0 = i == 0 ? cell.idealCounts(0) : cell.idealCounts(f.force_N(i - 1));
        area += 0.5 * (c0 + cell.idealCounts(f.force_N(i))) * 1e-4;
      }
      assertThat((double) s.loadCounts(k)).isCloseTo(area / 0.1, within(0.51));
      maxSlow = Math.max(maxSlow, s.loadCounts(k));
    }
    // a 10 /s converter misses the top of a 2 ms fracture
    assertThat(maxSlow).isLessThan(peakCounts - 1000);
  }

  @Test
  void withoutAveragingTheSlowConverterSamplesTheInstant() {
    SimulatedFrame f = SimulatedFrame.builder().scenario(Scenario.BRITTLE).seed(31).rateHz(80)
        .noiseRms_counts(0).converterAveraging(false).build();
    SampleBlock s = SimRuns.run(f, 80, 5);
    LoadCell cell = f.truth().loadCell();
    for (int i = 0; i < s.size(); i++) {
      assertThat((double) s.loadCounts(i)).isCloseTo(cell.idealCounts(s.force_N(i)), within(0.51));
    }
  }
}
