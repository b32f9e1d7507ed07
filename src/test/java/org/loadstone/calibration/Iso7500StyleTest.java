package org.loadstone.calibration;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import org.junit.jupiter.api.Test;

class Iso7500StyleTest {
  @Test
  void classLimitsFollowTheTableAtTheirBoundaries() {
    // ISO 7500-1:2018 Table 2 as quoted (from memory) in Iso7500Style: class 0.5 allows
    // |q| ≤ 0.5, b ≤ 0.5, |v| ≤ 0.75, a ≤ 0.25; class 1 doubles them; class 3 is six times.
    assertThat(Iso7500Style.classOf(0.5, 0.5, -0.75, 0.25)).isZero();
    assertThat(Iso7500Style.classOf(-0.51, 0.1, null, 0.1)).isEqualTo(1);
    assertThat(Iso7500Style.classOf(0.1, 0.1, 1.6, 0.1)).isEqualTo(2);
    assertThat(Iso7500Style.classOf(0.1, 2.9, null, 1.5)).isEqualTo(3);
    assertThat(Iso7500Style.classOf(3.01, null, null, 0.1)).isEqualTo(-1);
    assertThat(Iso7500Style.classOf(0.1, null, null, 1.51)).isEqualTo(-1);
  }

  @Test
  void aCellWiredTheOtherWayRoundGivesTheSameFigures() {
    // counts falling with load (negative sensitivity) must give the same relative errors
    List<CalibrationPoint> pts = CalibrationServiceTest.isoSet().stream()
        .map(p -> new CalibrationPoint(p.force_N(), p.mass_kg(), p.direction(), p.series(),
            -p.counts_mean(), p.counts_sd(), p.samples())).toList();
    CalibrationSettings s = CalibrationSettings.defaults().withChosenFit(FitKind.LINEAR);
    CalibrationReport neg = CalibrationService.fitFromPoints(pts, s);
    CalibrationReport pos = CalibrationService.fitFromPoints(CalibrationServiceTest.isoSet(), s);
    assertThat(neg.iso().systemClass()).isEqualTo(pos.iso().systemClass()).isEqualTo("1");
    for (int i = 0; i < pos.iso().points().size(); i++) {
      assertThat(neg.iso().points().get(i).q_pct())
          .isCloseTo(pos.iso().points().get(i).q_pct(), within(1e-9));
    }
    assertThat(neg.linearity().sensitivity_counts_per_N())
        .isCloseTo(-pos.linearity().sensitivity_counts_per_N(), within(1e-9));
    assertThat(neg.linearity().hysteresis_pct_fs())
        .isCloseTo(pos.linearity().hysteresis_pct_fs(), within(1e-9));
    CountsToForce inv = neg.chosenFit().inverse();
    // the ascending line of the set (CalibrationServiceTest.isoSet): counts = c + k·F, so
    // −100·600 net counts of the reversed cell indicate (60000 − c)/k N
    double k = 100 - 12000.0 / 700000;
    double c = 20 + 12000.0 / 700000 * 500;
    assertThat(inv.force_N(-100 * 600.0)).isCloseTo((60000 - c) / k, within(1e-9));
  }
}
