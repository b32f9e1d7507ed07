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

  /** Feeds a steady reading until the session judges it stable. */
  static void settle(CalibrationSession s, double counts) {
    while (s.offer(counts) != StabilityDetector.State.STABLE) {
      // filling the window
    }
  }

  @Test
  void aLoadAlreadyReadInTheSameSeriesAndDirectionIsRefusedBeforeTheWeightsAreHandled() {
    CalibrationSession s = new CalibrationSession(
        new CalibrationPlan(List.of(1.0, 2.0, 3.0), true, 2), ForceFromMass.standard(), S);
    settle(s, 100);
    s.capture();
    settle(s, 1100);
    s.capture(2.0); // 2 kg placed at the 1 kg step
    assertThat(s.current().mass_kg()).isEqualTo(2.0);
    assertThatThrownBy(() -> s.checkMass(2.0)).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("series 1, up: weights totalling 2.0 kg")
        .hasMessageContaining("2 kg was already read in this series and direction");
    settle(s, 2100);
    assertThatThrownBy(s::capture).hasMessageContaining("already read");
    assertThat(s.points()).hasSize(2);
    s.capture(1.0); // the mass not read yet
    settle(s, 3100);
    s.capture();
    // going down, 2 kg is a new reading in this series and direction
    assertThat(s.current().direction()).isEqualTo(Direction.DOWN);
    assertThat(s.checkMass(2.0)).isCloseTo(ForceFromMass.standard().force_N(2.0), within(1e-12));
    assertThatThrownBy(() -> s.checkMass(0)).hasMessageContaining("needs a mass above zero");
  }

  @Test
  void loadStepsMayBeSkippedZeroStepsNotAndASkipCanBeTakenBack() {
    CalibrationSession s = new CalibrationSession(
        new CalibrationPlan(List.of(1.0, 2.0, 3.0), true, 1), ForceFromMass.standard(), S);
    assertThat(s.canSkip()).isFalse();
    assertThatThrownBy(s::skip).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("zero point cannot be skipped");
    settle(s, 100);
    s.capture();
    assertThat(s.canSkip()).isTrue();
    s.skip();
    assertThat(s.skipped()).isEqualTo(1);
    assertThat(s.current().mass_kg()).isEqualTo(2.0);
    s.retakeLast(); // the skip is undone: the 1 kg step waits again
    assertThat(s.skipped()).isZero();
    assertThat(s.current().mass_kg()).isEqualTo(1.0);
    s.skip();
    while (!s.done()) {
      if (s.canSkip() && s.current().direction() == Direction.DOWN) {
        s.skip();
      } else {
        settle(s, 100 + 1000 * s.current().mass_kg());
        s.capture();
      }
    }
    // up: 0, (1 skipped), 2, 3; down: (2, 1 skipped), 0
    assertThat(s.skipped()).isEqualTo(3);
    assertThat(s.points()).extracting(CalibrationPoint::mass_kg)
        .containsExactly(0.0, 2.0, 3.0, 0.0);
    assertThat(s.stepCount()).isEqualTo(7);
    assertThatThrownBy(s::skip).isInstanceOf(IllegalStateException.class);
  }
}
