package org.loadstone.report;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.SplittableRandom;
import org.jfree.chart.plot.XYPlot;
import org.jfree.data.xy.XYDataset;
import org.junit.jupiter.api.Test;
import org.loadstone.archive.RunData;
import org.loadstone.archive.RunFixtures;
import org.loadstone.study.RunMetrics;

/** The chart's per-column envelope against a brute-force look at every sample. */
class TraceDatasetTest {
  @Test
  void fewSamplesAreAllDrawn() {
    double[] y = {3, 1, 4, 1, 5};
    TraceDataset ds = new TraceDataset();
    ds.add("f", y.length, i -> i * 0.5, i -> y[i], 10);
    assertThat(ds.getItemCount(0)).isEqualTo(5);
    for (int i = 0; i < 5; i++) {
      assertThat(ds.getXValue(0, i)).isEqualTo(i * 0.5);
      assertThat(ds.getYValue(0, i)).isEqualTo(y[i]);
    }
  }

  @Test
  void everyColumnKeepsItsLowestAndHighest() {
    int n = 1_000_003;
    int columns = 640;
    double[] y = new double[n];
    SplittableRandom r = new SplittableRandom(9); // fixed seed
    for (int i = 0; i < n; i++) {
      y[i] = Math.sin(i * 1e-5) * 300 + r.nextGaussian() * 4 + (r.nextInt(50_000) == 0 ? 900 : 0);
    }
    TraceDataset ds = new TraceDataset();
    ds.add("force", n, i -> i / 50_000.0, i -> y[i], columns);
    int items = ds.getItemCount(0);
    assertThat(items).isLessThanOrEqualTo(2 * columns + 2).isGreaterThanOrEqualTo(columns);
    int[] idx = TraceDataset.envelope(n, i -> y[i], columns);
    for (int k = 1; k < idx.length; k++) {
      assertThat(idx[k]).isGreaterThan(idx[k - 1]); // sample order, so the line is the run's
    }
    assertThat(idx[0]).isZero();
    assertThat(idx[idx.length - 1]).isEqualTo(n - 1);
    int k = 0;
    for (int c = 0; c < columns; c++) {
      int from = (int) ((long) c * n / columns);
      int to = (int) ((long) (c + 1) * n / columns);
      double min = Double.POSITIVE_INFINITY;
      double max = Double.NEGATIVE_INFINITY;
      for (int i = from; i < to; i++) {
        min = Math.min(min, y[i]);
        max = Math.max(max, y[i]);
      }
      double kmin = Double.POSITIVE_INFINITY;
      double kmax = Double.NEGATIVE_INFINITY;
      while (k < idx.length && idx[k] < to) {
        kmin = Math.min(kmin, y[idx[k]]);
        kmax = Math.max(kmax, y[idx[k]]);
        k++;
      }
      assertThat(kmin).isEqualTo(min);
      assertThat(kmax).isEqualTo(max);
    }
    assertThat(k).isEqualTo(idx.length);
    assertThat(ds.getXValue(0, items - 1)).isEqualTo((n - 1) / 50_000.0);
  }

  @Test
  void aLongRunsChartHoldsAsManyPointsAsAShortRunsWouldAtThatWidth() {
    int n = 400_000;
    double[] t = new double[n];
    double[] f = new double[n];
    double[] x = new double[n];
    int[] k = new int[n];
    int[] s = new int[n];
    SplittableRandom r = new SplittableRandom(3); // fixed seed
    for (int i = 0; i < n; i++) {
      t[i] = i / 50_000.0;
      x[i] = 6.0 * i / n;
      double u = Math.min(1.0, i / (0.7 * n));
      f[i] = (i < 0.7 * n ? 320 * u : 320 - 200 * (i - 0.7 * n) / (0.3 * n)) + r.nextGaussian();
      k[i] = (int) Math.round(f[i] * 8590);
      s[i] = i & 0xFFFF;
    }
    RunData d = new RunData(t, f, x, k, k.clone(), s);
    RunMetrics m = RunMetrics.of(RunFixtures.fullMetadata("long-chart"), d);
    XYDataset ds = ((XYPlot) Charts.run(m).getPlot()).getDataset();
    assertThat(ds.getItemCount(0)).isLessThanOrEqualTo(2 * TraceDataset.DEFAULT_COLUMNS + 2);
    double top = Double.NEGATIVE_INFINITY;
    for (int i = 0; i < ds.getItemCount(0); i++) {
      top = Math.max(top, ds.getYValue(0, i));
    }
    assertThat(top).isEqualTo(m.analysis().peakForce_N()); // the peak is never thinned away
  }
}
