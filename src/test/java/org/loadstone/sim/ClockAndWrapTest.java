package org.loadstone.sim;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;
import org.loadstone.units.LoadstoneException;

class ClockAndWrapTest {

  @Test
  void sequenceAndDeviceTimeWrapOverALongRun() {
    // 10 samples/s for 4400 s: the u32 microsecond clock wraps after 4294.967296 s (2^32 µs,
    // PROTOCOL.md) and the u16 sequence, started at 60 000, after 5536 samples.
    SimulatedFrame f = SimulatedFrame.builder().scenario(Scenario.DEAD_WEIGHT).rateHz(10)
        .firstSequence(60_000).seed(1).build();
    SimSample prev = f.next();
    int seqWraps = 0;
    int timeWraps = 0;
    long unwrapped = prev.deviceTime_us();
    for (int i = 1; i < 44_000; i++) {
      SimSample s = f.next();
      assertThat((s.seq() - prev.seq()) & 0xFFFF).isEqualTo(1);
      long dt = (s.deviceTime_us() - prev.deviceTime_us()) & 0xFFFF_FFFFL;
      assertThat(dt).isBetween(99_999L, 100_001L);
      if (s.seq() < prev.seq()) {
        seqWraps++;
      }
      if (s.deviceTime_us() < prev.deviceTime_us()) {
        timeWraps++;
      }
      unwrapped += dt;
      // the unwrapped device clock is the true time, to the microsecond
      assertThat((double) unwrapped).isBetween(s.time_s() * 1e6 - 1, s.time_s() * 1e6 + 1);
      prev = s;
    }
    assertThat(seqWraps).isEqualTo(1);
    assertThat(timeWraps).isEqualTo(1);
  }

  @Test
  void fastRunWrapsFromAnyStartAndStaysInOrderWithJitter() {
    SimulatedFrame f = SimulatedFrame.builder().scenario(Scenario.BRITTLE).rateHz(50_000)
        .deviceClockStart_us(0xFFFF_FFFFL - 1_000_000).firstSequence(65_000)
        .conversionJitter_us(3).seed(2).build();
    SampleBlock b = SimRuns.run(f, 50_000, 3);
    int seqWraps = 0;
    int timeWraps = 0;
    for (int i = 1; i < b.size(); i++) {
      assertThat((b.seq(i) - b.seq(i - 1)) & 0xFFFF).isEqualTo(1);
      long dt = (b.deviceTime_us(i) - b.deviceTime_us(i - 1)) & 0xFFFF_FFFFL;
      // nominal 20 µs; jitter cut at ±3σ = ±9 µs, plus 1 µs of clock truncation
      assertThat(dt).isBetween(1L, 39L);
      assertThat(b.time_s(i)).isGreaterThan(b.time_s(i - 1));
      seqWraps += b.seq(i) < b.seq(i - 1) ? 1 : 0;
      timeWraps += b.deviceTime_us(i) < b.deviceTime_us(i - 1) ? 1 : 0;
    }
    // 150 000 samples from 65 000: wraps after 536, 66 072 and 131 608 samples
    assertThat(seqWraps).isEqualTo(3);
    assertThat(timeWraps).isEqualTo(1);
  }

  @Test
  void rateChangeTakesEffectFromTheNextSample() {
    SimulatedFrame f = SimulatedFrame.builder().scenario(Scenario.DEAD_WEIGHT).rateHz(80).build();
    for (int i = 0; i < 80; i++) {
      f.next();
    }
    assertThat(f.lastTime_s()).isEqualTo(1.0);
    f.setRateHz(10);
    assertThat(f.next().time_s()).isEqualTo(1.1);
    assertThat(f.info().adcKind()).isEqualTo("hx711");
    assertThatThrownBy(() -> f.setRateHz(33))
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("10 or 80");
    f.setRateHz(20_000);
    assertThat(f.info().adcKind()).isEqualTo("fast");
  }

  @Test
  void haltStopsAMotorisedCrossheadOnly() {
    SimulatedFrame f = SimulatedFrame.builder().scenario(Scenario.PANEL_FOAM).rateHz(80).build();
    for (int i = 0; i < 400; i++) {
      f.next();
    }
    assertThat(f.halt()).isTrue();
    double x = f.lastCrosshead_mm();
    for (int i = 0; i < 400; i++) {
      f.next();
    }
    assertThat(f.lastCrosshead_mm()).isEqualTo(x);
    SimulatedFrame hand = SimulatedFrame.builder().scenario(Scenario.PANEL_FOAM).handPumped(0.2)
        .build();
    assertThat(hand.halt()).isFalse();
    assertThat(hand.info().motorised()).isFalse();
  }
}
