package org.loadstone.sim;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

class FrameApiTest {

  @Test
  void arrayFillBlockFillAndSinkGiveTheSameSamples() {
    SimulatedFrameBuilder b = SimulatedFrame.builder().scenario(Scenario.CRUSH).rateHz(2000).seed(4);
    int n = 5000;
    int[] seq = new int[n + 3];
    long[] us = new long[n + 3];
    int[] load = new int[n + 3];
    int[] pos = new int[n + 3];
    b.build().fill(seq, us, load, pos, 3, n);
    SampleBlock block = new SampleBlock(n);
    b.build().fill(block, n);
    SimulatedFrame viaSink = b.build();
    for (int i = 0; i < n; i++) {
      assertThat(seq[i + 3]).isEqualTo(block.seq(i));
      assertThat(us[i + 3]).isEqualTo(block.deviceTime_us(i));
      assertThat(load[i + 3]).isEqualTo(block.loadCounts(i));
      assertThat(pos[i + 3]).isEqualTo(block.positionCounts(i));
      SimSample s = viaSink.next();
      assertThat(s).isEqualTo(block.sample(i));
    }
    assertThatThrownBy(() -> b.build().fill(seq, us, load, pos, 4, n))
        .isInstanceOf(IllegalArgumentException.class);
  }

  @Test
  void noLoadUntilTheCrossheadCrossesTheGap() {
    SimulatedFrame f = SimulatedFrame.builder().scenario(Scenario.BRITTLE).rateHz(1000).seed(4)
        .build();
    SampleBlock b = SimRuns.run(f, 1000, 2);
    SimTruth t = f.truth();
    for (int i = 0; i < b.size(); i++) {
      // the crosshead is at v·t exactly (constant rate from time zero)
      assertThat(b.crosshead_mm(i)).isCloseTo(t.crossheadRate_mm_per_s() * b.time_s(i), within(1e-12));
      if (b.crosshead_mm(i) <= t.contactGap_mm()) {
        assertThat(b.force_N(i)).isZero();
      }
    }
    assertThat(b.force_N(b.size() - 1)).isPositive();
  }

  @Test
  void conversionRateErrorShowsInTheDeviceClock() {
    SimulatedFrame f = SimulatedFrame.builder().scenario(Scenario.DEAD_WEIGHT).rateHz(80)
        .conversionRateError_pct(-2).build();
    SimSample first = f.next();
    SimSample last = first;
    for (int i = 0; i < 800; i++) {
      last = f.next();
    }
    // 2 % slow: period 12.5 ms / 0.98 = 12.7551 ms
    double period_us = (last.deviceTime_us() - first.deviceTime_us()) / 800.0;
    assertThat(period_us).isCloseTo(12_500 / 0.98, within(0.01));
  }

  @Test
  void massesCanBeTakenOffOneByOne() {
    SimulatedFrame f = SimulatedFrame.builder().scenario(Scenario.DEAD_WEIGHT).noiseRms_counts(0)
        .nonLinearity_pctFS(0).deadWeightSettling_s(0.01).rateHz(80).build();
    f.placeMass(10);
    f.placeMass(5);
    f.removeMass(10);
    for (int i = 0; i < 80; i++) {
      f.next();
    }
    LoadCell cell = f.truth().loadCell();
    // F = m·g, standard gravity 9.80665 m/s² (CGPM 1901)
    assertThat((double) f.next().loadCounts())
        .isCloseTo(cell.zeroOffset_counts() + cell.countsPerN() * 5 * 9.80665, within(0.5));
    assertThatThrownBy(() -> f.removeMass(6)).isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("only 5.0 kg");
    assertThatThrownBy(() -> f.placeMass(-1)).isInstanceOf(IllegalArgumentException.class);
  }

  @Test
  void lastSampleBeforeAnyIsRefused() {
    SimulatedFrame f = SimulatedFrame.builder().build();
    assertThatThrownBy(f::lastSample).isInstanceOf(IllegalStateException.class);
    assertThat(f.info().adcKind()).isEqualTo("hx711");
    assertThat(f.info().channels()).isEqualTo(2);
    assertThat(f.info().positionCountsPerMm()).isEqualTo(400);
  }
}
