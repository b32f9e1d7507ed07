package org.loadstone.analysis.position;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;
import org.junit.jupiter.api.Test;
import org.loadstone.analysis.Curve;
import org.loadstone.analysis.RunAnalyzer;
import org.loadstone.analysis.RunResult;
import org.loadstone.units.LoadstoneException;

class PositionSourcesTest {
  static final double FORCE_DT = 0.01; // 100 Hz
  static final double TABLE_DT = 0.05; // 20 Hz
  static final double BREAK_S = 23.4567; // break instant, force clock
  static final double RATE_MM_PER_S = 2.0 / 60; // 2 mm/min

  /** Force record: linear rise at the crosshead rate times 40 N/mm, sudden drop at BREAK_S. */
  static double[][] forceRecord(long seed) {
    Random r = new Random(seed);
    int n = 3000;
    double[] t = new double[n];
    double[] f = new double[n];
    for (int i = 0; i < n; i++) {
      t[i] = i * FORCE_DT;
      f[i] = (t[i] < BREAK_S ? 40 * RATE_MM_PER_S * t[i] : 3.0) + 0.02 * r.nextGaussian();
    }
    return new double[][] {t, f};
  }

  /** Table in its own clock (force time + offset): constant rate, stop and retract at break. */
  static PositionTable table(double offset_s, long seed) {
    Random r = new Random(seed);
    int m = 700;
    double[] tt = new double[m];
    double[] x = new double[m];
    double start = 5.0; // the logger started before the force record (in force time)
    for (int j = 0; j < m; j++) {
      double forceTime = start + j * TABLE_DT;
      tt[j] = forceTime + offset_s;
      double p =
          forceTime < BREAK_S
              ? RATE_MM_PER_S * forceTime
              : RATE_MM_PER_S * BREAK_S - 0.5 * (forceTime - BREAK_S);
      x[j] = 10 + p + 0.0005 * r.nextGaussian();
    }
    return new PositionTable(tt, x);
  }

  @Test
  void alignmentRecoversAKnownOffsetWithinOneSamplePeriod() {
    for (double offset : new double[] {12.345, -3.21, 0.0}) {
      double[][] fr = forceRecord(11);
      PositionTable tab = table(offset, 12);
      BreakAlignment.Alignment a = BreakAlignment.byBreak(fr[0], fr[1], tab);
      assertThat(a.offset_s()).as("offset %s", offset).isCloseTo(offset, within(FORCE_DT));
      assertThat(a.forceBreakTime_s()).isCloseTo(BREAK_S, within(FORCE_DT));
    }
  }

  @Test
  void resampledTableGivesTheBeamStiffness() {
    double offset = 12.345;
    double[][] fr = forceRecord(11);
    PositionTable tab = table(offset, 12);
    BreakAlignment.Alignment a = BreakAlignment.byBreak(fr[0], fr[1], tab);
    // the table starts 5 s into the force record: use the covered part only
    int from = 500;
    int n = 2500;
    double[] t = java.util.Arrays.copyOfRange(fr[0], from, from + n);
    double[] f = java.util.Arrays.copyOfRange(fr[1], from, from + n);
    double[] x = tab.resampleOnto(t, a.offset_s());
    RunResult r = RunAnalyzer.analyze(new Curve(t, f, x));
    assertThat(r.stiffness_N_per_mm().orElseThrow()).isCloseTo(40, within(0.4));
    assertThatThrownBy(() -> tab.resampleOnto(fr[0], a.offset_s()))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("Force sample 0")
        .hasMessageContaining("outside its range");
  }

  @Test
  void interpolationIsLinearBetweenRows() {
    PositionTable tab = new PositionTable(new double[] {0, 1, 3}, new double[] {0, 2, 3});
    double[] x = tab.resampleOnto(new double[] {0.5, 1.0, 2.0, 2.5}, 0.5);
    assertThat(x).containsExactly(new double[] {2.0, 2.25, 2.75, 3.0}, within(1e-12));
  }

  @Test
  void noClearBreakIsRefused() {
    double[] t = new double[100];
    double[] f = new double[100];
    for (int i = 0; i < t.length; i++) {
      t[i] = i * 0.1;
      f[i] = Math.sin(i * 0.3);
    }
    PositionTable tab = table(0, 1);
    assertThatThrownBy(() -> BreakAlignment.byBreak(t, f, tab))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("no clear break");
  }

  @Test
  void encoderAndCrossheadRate() {
    assertThat(EncoderScale.toPosition_mm(new long[] {0, 500, -250}, 250.0))
        .containsExactly(0.0, 2.0, -1.0);
    assertThatThrownBy(() -> EncoderScale.toPosition_mm(new long[] {1}, 0))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("counts/mm");
    // 6 mm/min for 30 s = 3 mm
    assertThat(CrossheadRate.position_mm(new double[] {10, 25, 40}, 6.0))
        .containsExactly(new double[] {0, 1.5, 3.0}, within(1e-12));
    assertThatThrownBy(() -> CrossheadRate.position_mm(new double[] {0, 1}, -1))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("mm/min");
  }

  @Test
  void complianceCorrectionRecoversTheSpecimenStiffness() {
    // Springs in series: 1/k_measured = 1/k_specimen + 1/k_frame (elementary mechanics).
    double kFrame = 2000;
    double kSpecimen = 50;
    int n = 200;
    double[] t = new double[n];
    double[] f = new double[n];
    double[] block = new double[n];
    double[] crosshead = new double[n];
    for (int i = 0; i < n; i++) {
      t[i] = i * 0.1;
      f[i] = i < n - 2 ? 2.0 * i : 10;
      block[i] = f[i] / kFrame; // rigid block: only the frame deflects
      crosshead[i] = f[i] / kSpecimen + f[i] / kFrame;
    }
    double k = Compliance.frameStiffness_N_per_mm(RunAnalyzer.analyze(new Curve(t, f, block)));
    assertThat(k).isCloseTo(kFrame, within(1e-6));
    RunResult raw = RunAnalyzer.analyze(new Curve(t, f, crosshead));
    assertThat(raw.stiffness_N_per_mm().orElseThrow())
        .isCloseTo(1 / (1 / kSpecimen + 1 / kFrame), within(1e-9));
    double[] corrected = Compliance.correct(crosshead, f, k);
    RunResult fixed = RunAnalyzer.analyze(new Curve(t, f, corrected));
    assertThat(fixed.stiffness_N_per_mm().orElseThrow()).isCloseTo(kSpecimen, within(1e-6));
    RunResult noPos = RunAnalyzer.analyze(Curve.withoutPosition(t, f));
    assertThatThrownBy(() -> Compliance.frameStiffness_N_per_mm(noPos))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("rigid-block run has no stiffness");
  }

  /**
   * A specimen run is not a rigid block: a sandwich-panel curve straight to 80 % of its peak then
   * rounded over (TestRuns-style: the peak lies 20 % below the line through the rise) and a
   * curve whose straight part is short are refused with the figure; a block loaded straight to
   * its peak and unloaded is accepted (the test above).
   */
  @Test
  void aRunThatBendsOverIsNotTakenForARigidBlock() {
    org.loadstone.archive.RunData panel = org.loadstone.archive.TestRuns.bend(57, 468);
    RunResult bent = RunAnalyzer.analyze(new Curve(panel.time_s(), panel.force_N(),
        panel.position_mm()));
    assertThatThrownBy(() -> Compliance.frameStiffness_N_per_mm(bent))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("does not look like a rigid block")
        .hasMessageContaining("off the straight line");
  }

  @Test
  void badTableIsRefused() {
    assertThatThrownBy(() -> new PositionTable(new double[] {0, 2, 1}, new double[] {0, 1, 2}))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("row 2");
    assertThatThrownBy(() -> new PositionTable(new double[] {0, 1}, new double[] {0, Double.NaN}))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("row 1");
  }
}
