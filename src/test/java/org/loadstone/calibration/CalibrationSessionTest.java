package org.loadstone.calibration;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.loadstone.units.LoadstoneException;

class CalibrationSessionTest {
  static final StabilityDetector.Settings S = new StabilityDetector.Settings(10, 5, 20, 60, 10);

  @Test
  void walksThePlanAndCapturesTheMeanOfTheStableWindow() {
    CalibrationPlan plan = new CalibrationPlan(List.of(1.0, 2.0, 4.0), false, 1);
    ForceFromMass m = ForceFromMass.standard();
    CalibrationSession s = new CalibrationSession(plan, m, S);
    Random rnd = new Random(3);
    while (!s.done()) {
      double truth = 5000 + 1000 * m.force_N(s.current().mass_kg());
      StabilityDetector.State st;
      do {
        st = s.offer(truth + rnd.nextGaussian());
      } while (st != StabilityDetector.State.STABLE);
      CalibrationPoint p = s.capture();
      // mean of 10 samples of unit noise: within 4/sqrt(10) of the truth
      assertThat(p.counts_mean()).isCloseTo(truth, within(1.3));
      assertThat(p.samples()).isEqualTo(10);
    }
    assertThat(s.points()).hasSize(4);
    CalibrationReport r = CalibrationService.fitFromPoints(s.points(),
        CalibrationSettings.defaults());
    assertThat(r.linearity().sensitivity_counts_per_N()).isCloseTo(1000, within(0.1));
  }

  @Test
  void refusesToCaptureAnUnsettledReadingAndReportsATimeOutWithTheStep() {
    CalibrationSession s = new CalibrationSession(
        new CalibrationPlan(List.of(1.0, 2.0), false, 1), ForceFromMass.standard(), S);
    s.offer(100);
    assertThatThrownBy(s::capture).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("not stable yet");
    assertThatThrownBy(() -> {
      for (int i = 0; i < 100; i++) {
        s.offer(100 + 50 * (i % 2));
      }
    }).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("series 1, up: remove all weights")
        .hasMessageContaining("did not settle within 6.0 s");
    for (int i = 0; i < 10; i++) {
      s.offer(100);
    }
    assertThatThrownBy(() -> s.capture(2.0)).hasMessageContaining("remove all weights");
    s.capture();
    assertThat(s.current().mass_kg()).isEqualTo(1.0);
    s.retakeLast();
    assertThat(s.current().mass_kg()).isZero();
  }
}
