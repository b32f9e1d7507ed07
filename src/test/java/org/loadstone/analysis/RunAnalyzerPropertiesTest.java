package org.loadstone.analysis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;

class RunAnalyzerPropertiesTest {

  /**
   * Tangent-continuous quadratic toe of length toe, then F = k(x − toe/2) up to the peak, then a
   * drop. The toe-compensation construction of ASTM D790 annex A1 gives toe/2 as corrected zero.
   */
  @Property(tries = 60, seed = "20261202")
  void noiseFreeToeAndLineAreRecovered(
      @ForAll @DoubleRange(min = 1, max = 5000) double k,
      @ForAll @DoubleRange(min = 0.02, max = 0.5) double toe,
      @ForAll @IntRange(min = 60, max = 3000) int samples) {
    double top = 4 * toe + 1.0;
    int n = samples + 2;
    double[] t = new double[n];
    double[] f = new double[n];
    double[] x = new double[n];
    for (int i = 0; i < samples; i++) {
      double d = top * i / (samples - 1);
      t[i] = i;
      x[i] = d;
      f[i] = d < toe ? k * d * d / (2 * toe) : k * (d - toe / 2);
    }
    for (int j = 0; j < 2; j++) {
      t[samples + j] = samples + j;
      x[samples + j] = top + 0.01 * (j + 1);
      f[samples + j] = 0.1 * k;
    }
    RunResult r = RunAnalyzer.analyze(new Curve(t, f, x));
    assertThat(r.stiffness_N_per_mm().orElseThrow()).isCloseTo(k, within(1e-7 * k));
    assertThat(r.toeOffset_mm().orElseThrow()).isCloseTo(toe / 2, within(1e-7));
    // energy to peak: toe area k·toe²/6 plus the trapezoid of the line from toe to top
    double exact =
        k * toe * toe / 6 + 0.5 * (k * toe / 2 + k * (top - toe / 2)) * (top - toe);
    // the trapezoid rule is exact on the line and off by O(h²) on the toe parabola
    double h = top / (samples - 1);
    assertThat(r.energyToPeak_J().orElseThrow() * 1000)
        .isCloseTo(exact, within(k * toe * h + 1e-9 * exact));
  }
}
