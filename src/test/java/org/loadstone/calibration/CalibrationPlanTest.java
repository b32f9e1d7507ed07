package org.loadstone.calibration;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.loadstone.units.LoadstoneException;

class CalibrationPlanTest {
  @Test
  void stepsGoUpAndDownThroughEachSeriesAndFeedTheFit() {
    CalibrationPlan plan = new CalibrationPlan(List.of(5.0, 10.0, 20.0, 30.0, 50.0), true, 3);
    List<CalibrationPlan.Step> steps = plan.steps();
    // per series: zero + 5 up + 4 down (top read once) + zero return = 11
    assertThat(steps).hasSize(33);
    assertThat(steps.get(0).prompt()).isEqualTo("series 1, up: remove all weights (zero point)");
    assertThat(steps.get(5).mass_kg()).isEqualTo(50.0);
    assertThat(steps.get(6).direction()).isEqualTo(Direction.DOWN);
    assertThat(steps.get(6).mass_kg()).isEqualTo(30.0);
    assertThat(steps.get(10).mass_kg()).isZero();
    assertThat(steps.get(11).series()).isEqualTo(2);
    assertThat(steps.get(32).number()).isEqualTo(33);
    // a linear cell read through the plan: the service accepts the points as they come
    ForceFromMass m = ForceFromMass.standard();
    List<CalibrationPoint> pts = steps.stream().map(s -> s.toPoint(new CapturedReading(
        1000 + 8600 * m.force_N(s.mass_kg()) + (s.direction() == Direction.DOWN ? 30 : 0), 20,
        50), m)).toList();
    CalibrationReport r = CalibrationService.fitFromPoints(pts, CalibrationSettings.defaults());
    assertThat(r.linearity().hysteresis_pct_fs()).isPositive();
    assertThat(r.iso().points()).hasSize(5);
  }

  @Test
  void refusesUnsortedOrTooFewLoads() {
    assertThatThrownBy(() -> new CalibrationPlan(List.of(5.0), false, 1))
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("at least two loads");
    assertThatThrownBy(() -> new CalibrationPlan(List.of(5.0, 5.0, 10.0), false, 1))
        .hasMessageContaining("strictly ascending");
    assertThatThrownBy(() -> new CalibrationPlan(List.of(5.0, 10.0), false, 0))
        .hasMessageContaining("1 to 10 series");
  }
}
