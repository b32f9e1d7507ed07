package org.loadstone.sim;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

/** Shapes of the force curves after failure, per scenario (the brief's qualitative contract). */
class SpecimenBehaviourTest {

  private static SampleBlock run(Scenario s, double rateHz, double duration_s, long seed) {
    SimulatedFrame f = SimulatedFrame.builder().scenario(s).rateHz(rateHz).seed(seed).build();
    return SimRuns.run(f, rateHz, duration_s);
  }

  /** Counts falls of at least {@code fraction} of the preceding local maximum. */
  private static int drops(SampleBlock b, double fraction, double minForce_N) {
    int n = 0;
    double high = 0;
    boolean falling = false;
    for (int i = 0; i < b.size(); i++) {
      double f = b.force_N(i);
      if (!falling && f > high) {
        high = f;
      } else if (!falling && high > minForce_N && f < high * (1 - fraction)) {
        n++;
        falling = true;
        high = f;
      } else if (falling) {
        if (f < high) {
          high = f;
        } else if (f > high * 1.05) {
          falling = false;
          high = f;
        }
      }
    }
    return n;
  }

  @Test
  void ductileYieldsPlateausThenFallsGraduallyBeforeRupture() {
    SimulatedFrame f = SimulatedFrame.builder().scenario(Scenario.DUCTILE).rateHz(1000).seed(12)
        .build();
    SampleBlock b = SimRuns.run(f, 1000, 12);
    SimTruth t = f.truth();
    int peak = SimRuns.indexOfTime(b, t.peakTime_s());
    int rupture = SimRuns.indexOfTime(b, t.breakTime_s());
    // plateau: 0.5 s before the peak the force is already within 8 % of it
    assertThat(b.force_N(peak - 500)).isGreaterThan(0.92 * t.peakForce_N());
    // gradual fall between the peak and rupture: no millisecond step larger than 1 % of peak
    for (int i = peak + 1; i < rupture; i++) {
      assertThat(b.force_N(i - 1) - b.force_N(i)).isLessThan(0.01 * t.peakForce_N());
    }
    assertThat(b.force_N(rupture - 1)).isLessThan(0.7 * t.peakForce_N());
    // rupture: separated within 5 ms
    assertThat(b.force_N(rupture + 5)).isLessThan(0.01 * t.peakForce_N());
  }

  @Test
  void crushIsASawToothOfPartialDrops() {
    SampleBlock b = run(Scenario.CRUSH, 1000, 10, 13);
    // 0.35 set drop fraction; count falls of more than 30 % of the preceding tooth
    assertThat(drops(b, 0.30, 50)).isGreaterThan(10);
    // and the force never falls to zero while crushing
    int after = SimRuns.indexOfTime(b, 2);
    for (int i = after; i < b.size(); i++) {
      assertThat(b.force_N(i)).isGreaterThan(100);
    }
  }

  @Test
  void foamPanelFailsGradually() {
    SimulatedFrame f = SimulatedFrame.builder().scenario(Scenario.PANEL_FOAM).rateHz(1000).seed(14)
        .build();
    SampleBlock b = SimRuns.run(f, 1000, 45);
    SimTruth t = f.truth();
    int i0 = SimRuns.indexOfTime(b, t.breakTime_s());
    for (int i = i0 + 1; i < b.size(); i++) {
      assertThat(b.force_N(i - 1) - b.force_N(i)).isLessThan(0.002 * t.peakForce_N());
    }
    assertThat(b.force_N(b.size() - 1)).isBetween(0.45 * t.peakForce_N(), 0.9 * t.peakForce_N());
  }

  @Test
  void balsaPanelFailsSuddenly() {
    SimulatedFrame f = SimulatedFrame.builder().scenario(Scenario.PANEL_BALSA).rateHz(10_000)
        .seed(15).build();
    SampleBlock b = SimRuns.run(f, 10_000, 45);
    SimTruth t = f.truth();
    int at = SimRuns.indexOfTime(b, t.breakTime_s() + 0.005);
    assertThat(b.force_N(at)).isLessThan(0.25 * t.peakForce_N());
  }

  @Test
  void boardPanelCollapsesProgressively() {
    SimulatedFrame f = SimulatedFrame.builder().scenario(Scenario.PANEL_BOARD).rateHz(1000)
        .crossheadRate_mm_per_s(1).seed(16).build();
    SampleBlock b = SimRuns.run(f, 1000, 40);
    double peak = f.truth().peakForce_N();
    assertThat(drops(b, 0.25, 30)).isGreaterThanOrEqualTo(10);
    // the teeth decline: the last 5 s peak lower than the first tooth, but stay above the floor
    double late = 0;
    for (int i = SimRuns.indexOfTime(b, 35); i < b.size(); i++) {
      late = Math.max(late, b.force_N(i));
    }
    assertThat(late).isBetween(0.25 * peak, 0.8 * peak);
  }

  @Test
  void handPumpedCrossheadStrokesPausesAndBacksOff() {
    SimulatedFrame f = SimulatedFrame.builder().scenario(Scenario.BRITTLE).handPumped(0.3)
        .rateHz(1000).seed(17).build();
    SampleBlock b = SimRuns.run(f, 1000, 30);
    SimTruth t = f.truth();
    double series = t.systemStiffness_N_per_mm();
    int backOffs = 0;
    int pauseSamples = 0;
    double advance = 0;
    for (int i = 1; i < b.size(); i++) {
      double dx = b.crosshead_mm(i) - b.crosshead_mm(i - 1);
      if (dx == 0) {
        pauseSamples++;
      }
      if (dx > 0) {
        advance += dx;
      }
      // during a back-off under load the specimen unloads along its elastic line through the
      // frame: dF/dx = series stiffness (springs in series, common practice)
      boolean intact = !t.broken() || b.time_s(i) < t.breakTime_s();
      if (dx < -1e-5 && b.force_N(i) > 20 && intact) {
        backOffs++;
        double slope = (b.force_N(i) - b.force_N(i - 1)) / dx;
        assertThat(slope).isCloseTo(series, within(series * 1e-4));
      }
    }
    assertThat(backOffs).isGreaterThan(50);
    // uneven strokes: lengths of the forward runs vary by more than 10 % (CV)
    org.apache.commons.math3.stat.descriptive.DescriptiveStatistics strokes =
        new org.apache.commons.math3.stat.descriptive.DescriptiveStatistics();
    double run = 0;
    for (int i = 1; i < b.size(); i++) {
      double dx = b.crosshead_mm(i) - b.crosshead_mm(i - 1);
      if (dx > 0) {
        run += dx;
      } else if (run > 0) {
        strokes.addValue(run);
        run = 0;
      }
    }
    assertThat(strokes.getN()).isGreaterThan(10);
    assertThat(strokes.getStandardDeviation() / strokes.getMean()).isGreaterThan(0.10);
    assertThat(strokes.getMean()).isBetween(0.2, 0.4); // mean stroke set to 0.3 mm
    assertThat(pauseSamples).isGreaterThan(b.size() / 5);
    // net progress is less than the forward travel (the back-offs)
    assertThat(b.crosshead_mm(b.size() - 1)).isLessThan(advance * 0.98);
  }
}
