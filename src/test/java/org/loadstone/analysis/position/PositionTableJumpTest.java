package org.loadstone.analysis.position;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.loadstone.analysis.Curve;
import org.loadstone.analysis.RunAnalyzer;
import org.loadstone.analysis.RunResult;

class PositionTableJumpTest {
  static final double K = 80; // N/mm
  static final double V = 0.5; // mm/s
  static final double FRAME = 1.0 / 30;

  @Test
  void aJumpAtTheBreakIsNotInterpolatedIntoTheRise() {
    // Video track at 30 frames/s of a point moving at 0.5 mm/s that jumps 2 mm at the break,
    // 31 ms after frame 60; the next frame (33.3 ms after) already shows the jump.
    double breakAt = 60 * FRAME + 0.031;
    int frames = 80;
    double[] ft = new double[frames];
    double[] fx = new double[frames];
    for (int j = 0; j < frames; j++) {
      ft[j] = j * FRAME;
      fx[j] = V * ft[j] + (ft[j] > breakAt ? 2.0 : 0.0);
    }
    PositionTable table = new PositionTable(ft, fx);
    // force at 500 samples/s: F = K·x up to the peak 1 ms before the break, then a drop
    int n = (int) Math.floor((frames - 1) * FRAME * 500);
    double[] t = new double[n];
    double[] f = new double[n];
    for (int i = 0; i < n; i++) {
      t[i] = i / 500.0;
      f[i] = t[i] < breakAt - 0.001 ? K * V * t[i] : 0.05 * K * V * t[i];
    }
    double[] x = table.resampleOnto(t, 0);
    RunResult r = RunAnalyzer.analyze(new Curve(t, f, x));
    double tPeak = r.peakTime_s();
    // truth: displacement v·t at the peak, energy ½·K·d² of a linear spring (elementary
    // mechanics), N·mm / 1000 = J
    double d = V * tPeak;
    assertThat(r.displacementAtPeak_mm().orElseThrow()).isCloseTo(d, within(0.02 * d));
    double energy = 0.5 * K * d * d / 1000;
    assertThat(r.energyToPeak_J().orElseThrow()).isCloseTo(energy, within(0.02 * energy));
    // a straight line across the jump would have put the peak about 1.6 mm further on
    double naive = fx[60] + (tPeak - ft[60]) / FRAME * (fx[61] - fx[60]);
    assertThat(naive - d).isGreaterThan(1.5);
  }

  @Test
  void aTableWithAJumpIsAlignedByTheJumpAndKeepsTheRiseRight() {
    // the same track in its own clock, 0.4 s ahead of the force record's; alignment by the
    // break must find the offset from the jump (a break in the record) to within a frame
    double offset = 0.4;
    double breakAt = 60 * FRAME + 0.031; // force clock
    int frames = 80;
    double[] ft = new double[frames];
    double[] fx = new double[frames];
    for (int j = 0; j < frames; j++) {
      ft[j] = offset + j * FRAME;
      fx[j] = V * j * FRAME + (j * FRAME > breakAt ? 2.0 : 0.0);
    }
    PositionTable table = new PositionTable(ft, fx);
    int n = (int) Math.floor(((frames - 1) * FRAME - 0.1) * 500);
    double[] t = new double[n];
    double[] f = new double[n];
    for (int i = 0; i < n; i++) {
      t[i] = 0.05 + i / 500.0; // the force record starts a little after the track
      f[i] = t[i] < breakAt - 0.001 ? K * V * t[i] : 0.05 * K * V * t[i];
    }
    BreakAlignment.Alignment a = BreakAlignment.byBreak(t, f, table);
    assertThat(a.offset_s()).isCloseTo(offset, within(FRAME / 2));
    double[] x = table.resampleOnto(t, a.offset_s());
    RunResult r = RunAnalyzer.analyze(new Curve(t, f, x));
    // truth: the point is at v·t, so the displacement from the first sample is v·(t − t0);
    // the force K·v·t does ½·K·v²·(t² − t0²) of work over it (elementary mechanics)
    double d = V * (r.peakTime_s() - t[0]);
    assertThat(r.displacementAtPeak_mm().orElseThrow()).isCloseTo(d, within(0.02 * d));
    double energy = 0.5 * K * V * V * (r.peakTime_s() * r.peakTime_s() - t[0] * t[0]) / 1000;
    assertThat(r.energyToPeak_J().orElseThrow()).isCloseTo(energy, within(0.02 * energy));
  }

  @Test
  void aSteadyTableHasNoJumps() {
    double[] ft = new double[50];
    double[] fx = new double[50];
    for (int j = 0; j < 50; j++) {
      ft[j] = j * FRAME;
      fx[j] = V * ft[j] + 0.002 * Math.sin(7 * j); // tracking noise well below a frame's travel
    }
    for (boolean jump : new PositionTable(ft, fx).jumps()) {
      assertThat(jump).isFalse();
    }
  }
}
