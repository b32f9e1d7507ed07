package org.loadstone.acquire;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

class CurveTraceTest {

  @Test
  void shortCurveIsKeptWhole() {
    CurveTrace c = new CurveTrace(400);
    for (int i = 0; i < 150; i++) {
      c.add(i * 0.01, 3.0 * i);
    }
    double[] x = new double[c.size()];
    double[] y = new double[c.size()];
    int n = c.copyTo(x, y);
    assertThat(n).isEqualTo(300); // one group per sample while there is room: two points each
    for (int i = 0; i < 150; i++) {
      assertThat(x[2 * i]).isEqualTo(i * 0.01);
      assertThat(y[2 * i + 1]).isEqualTo(3.0 * i);
    }
  }

  /**
   * A long loading with a sharp load drop of two samples: the copy stays within its capacity,
   * keeps the curve's order, and still shows the peak and the bottom of the drop exactly.
   */
  @Test
  void longCurveStaysBoundedAndKeepsPeakAndDrop() {
    CurveTrace c = new CurveTrace(1200);
    int samples = 1_000_000;
    int dropAt = 700_001;
    double peak = Double.NEGATIVE_INFINITY;
    double lowest = Double.POSITIVE_INFINITY;
    for (int i = 0; i < samples; i++) {
      double pos = i * 1e-5;
      double f = i < dropAt ? 50 * pos + Math.sin(i) * 0.01 : (i < dropAt + 2 ? 1.5 : 20 - pos);
      peak = Math.max(peak, f);
      lowest = Math.min(lowest, f);
      c.add(pos, f);
    }
    double[] x = new double[c.size()];
    double[] y = new double[c.size()];
    int n = c.copyTo(x, y);
    assertThat(n).isLessThanOrEqualTo(1200 + 2);
    assertThat(n).isGreaterThan(500);
    double max = Double.NEGATIVE_INFINITY;
    double min = Double.POSITIVE_INFINITY;
    for (int i = 0; i < n; i++) {
      max = Math.max(max, y[i]);
      min = Math.min(min, y[i]);
      if (i > 0) {
        assertThat(x[i]).isGreaterThanOrEqualTo(x[i - 1]);
      }
    }
    assertThat(max).isEqualTo(peak);
    assertThat(min).isEqualTo(lowest);
    boolean dropShown = false;
    for (int i = 0; i < n; i++) {
      dropShown |= y[i] == 1.5;
    }
    assertThat(dropShown).as("the two-sample drop to 1.5 N").isTrue();
    assertThat(x[n - 1]).isCloseTo((samples - 1) * 1e-5, org.assertj.core.data.Offset.offset(0.02));
  }

  @Test
  void clearStartsANewCurve() {
    CurveTrace c = new CurveTrace(8);
    for (int i = 0; i < 100; i++) {
      c.add(i, i);
    }
    c.clear();
    c.add(7, 42);
    double[] x = new double[4];
    double[] y = new double[4];
    assertThat(c.copyTo(x, y)).isEqualTo(2);
    assertThat(y[0]).isEqualTo(42);
  }
}
