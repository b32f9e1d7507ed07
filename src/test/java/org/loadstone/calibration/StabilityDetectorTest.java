package org.loadstone.calibration;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;
import org.junit.jupiter.api.Test;
import org.loadstone.units.LoadstoneException;

class StabilityDetectorTest {
  // 20-sample window at 10 Hz; SD ≤ 5 counts, drift ≤ 1 count/s; give up after 10 s
  static final StabilityDetector.Settings S = new StabilityDetector.Settings(20, 5, 1, 100, 10);

  @Test
  void settlesOnAQuietReadingAndReportsItsStatistics() {
    StabilityDetector d = new StabilityDetector(S);
    Random rnd = new Random(42);
    double[] values = new double[20];
    StabilityDetector.State st = null;
    for (int i = 0; i < 20; i++) {
      values[i] = 123456 + (rnd.nextBoolean() ? 1 : -1);
      st = d.offer(values[i]);
      if (i < 19) {
        assertThat(st).isEqualTo(StabilityDetector.State.FILLING);
      }
    }
    assertThat(st).isEqualTo(StabilityDetector.State.STABLE);
    CapturedReading r = d.reading();
    // reference: Commons Math descriptive statistics over the same 20 values
    var ref = new org.apache.commons.math3.stat.descriptive.DescriptiveStatistics(values);
    assertThat(r.mean_counts()).isCloseTo(ref.getMean(), within(1e-9));
    assertThat(r.sd_counts()).isCloseTo(ref.getStandardDeviation(), within(1e-9));
    assertThat(r.samples()).isEqualTo(20);
  }

  @Test
  void slowDriftAloneKeepsItSettling() {
    // ramp of 0.2 counts per sample = 2 counts/s (least-squares slope of a line is exact);
    // its SD over 20 samples is 0.2·sqrt(20·21/12) = 1.18 counts, below the SD limit
    StabilityDetector d = new StabilityDetector(S);
    StabilityDetector.State st = null;
    for (int i = 0; i < 30; i++) {
      st = d.offer(5000 + 0.2 * i);
    }
    assertThat(st).isEqualTo(StabilityDetector.State.SETTLING);
    assertThat(d.lastDrift_counts_per_s()).isCloseTo(2.0, within(1e-9));
    assertThat(d.lastSd_counts()).isCloseTo(0.2 * Math.sqrt(20 * 21 / 12.0), within(1e-9));
  }

  @Test
  void timesOutOnADriftingReadingWithAClearMessage() {
    StabilityDetector d = new StabilityDetector(S);
    for (int i = 0; i < 99; i++) {
      d.offer(5000 + 0.2 * i);
    }
    assertThatThrownBy(() -> d.offer(5000 + 0.2 * 99))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("reading did not settle within 10.0 s")
        .hasMessageContaining("sd=1.18 counts")
        .hasMessageContaining("drift=2.00 counts/s")
        .hasMessageContaining("vibration, a touching cable or a swinging weight");
    d.reset();
    assertThat(d.offer(1)).isEqualTo(StabilityDetector.State.FILLING);
  }
}
