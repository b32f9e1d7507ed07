package org.loadstone.report;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.function.IntToDoubleFunction;
import org.jfree.data.DomainOrder;
import org.jfree.data.xy.AbstractXYDataset;
import org.loadstone.units.Precondition;

/**
 * A read-only JFreeChart dataset over a run's columns that hands the chart at most two points per
 * drawing column: for each column's share of the samples, the lowest and the highest, in sample
 * order (and the run's first and last sample). A line through them spans, in every column, the
 * same heights as the full line, so drawing costs the same for a thousand samples as for ten
 * million. The
 * columns are read through index functions and never copied; the chosen sample numbers are found
 * once, in one pass, when a trace is added.
 */
public final class TraceDataset extends AbstractXYDataset {
  private static final long serialVersionUID = 1L;

  /** Drawing columns when the caller does not know the chart's width: a wide screen's. */
  public static final int DEFAULT_COLUMNS = 1000;

  private final transient List<Trace> traces = new ArrayList<>();

  private record Trace(String key, IntToDoubleFunction x, IntToDoubleFunction y, int[] items) {}

  /**
   * Adds a trace.
   *
   * @param key the legend name, not null
   * @param n samples, at least 0
   * @param x the horizontal value of sample i (0 ≤ i &lt; n), not null
   * @param y the vertical value of sample i, not null
   * @param columns drawing columns the chart will have, at least 1
   */
  public void add(String key, int n, IntToDoubleFunction x, IntToDoubleFunction y, int columns) {
    Precondition.notNull(key, "key");
    Precondition.notNull(x, "x");
    Precondition.notNull(y, "y");
    if (n < 0 || columns < 1) {
      throw new IllegalArgumentException("samples " + n + " and columns " + columns
          + " must be at least 0 and 1");
    }
    traces.add(new Trace(key, x, y, envelope(n, y, columns)));
    fireDatasetChanged();
  }

  /** Adds a trace of a few points given as arrays (lines, markers), all of them drawn. */
  public void add(String key, double[] x, double[] y) {
    Precondition.notNull(x, "x");
    Precondition.notNull(y, "y");
    if (x.length != y.length) {
      throw new IllegalArgumentException("x has " + x.length + " values, y " + y.length);
    }
    double[] xs = x.clone();
    double[] ys = y.clone();
    int[] all = new int[xs.length];
    Arrays.setAll(all, i -> i);
    traces.add(new Trace(key, i -> xs[i], i -> ys[i], all));
    fireDatasetChanged();
  }

  /**
   * Sample numbers to draw: every one when there are at most two per column, else the lowest and
   * the highest of each column's share, in sample order, and the run's first and last sample.
   */
  static int[] envelope(int n, IntToDoubleFunction y, int columns) {
    if (n <= 2L * columns) {
      int[] all = new int[n];
      Arrays.setAll(all, i -> i);
      return all;
    }
    int[] out = new int[2 * columns + 2];
    int k = put(out, 0, 0);
    for (int c = 0; c < columns; c++) {
      int from = (int) ((long) c * n / columns);
      int to = (int) ((long) (c + 1) * n / columns); // exclusive
      int lo = from;
      int hi = from;
      double min = y.applyAsDouble(from);
      double max = min;
      for (int i = from + 1; i < to; i++) {
        double v = y.applyAsDouble(i);
        if (v < min) {
          min = v;
          lo = i;
        } else if (v > max) {
          max = v;
          hi = i;
        }
      }
      k = put(out, k, Math.min(lo, hi));
      k = put(out, k, Math.max(lo, hi));
    }
    k = put(out, k, n - 1);
    return Arrays.copyOf(out, k);
  }

  private static int put(int[] out, int k, int i) {
    if (k == 0 || out[k - 1] != i) {
      out[k++] = i;
    }
    return k;
  }

  @Override
  public int getSeriesCount() {
    return traces.size();
  }

  @Override
  public Comparable<String> getSeriesKey(int series) {
    return traces.get(series).key();
  }

  @Override
  public int getItemCount(int series) {
    return traces.get(series).items().length;
  }

  @Override
  public Number getX(int series, int item) {
    return getXValue(series, item);
  }

  @Override
  public Number getY(int series, int item) {
    return getYValue(series, item);
  }

  @Override
  public double getXValue(int series, int item) {
    Trace t = traces.get(series);
    return t.x().applyAsDouble(t.items()[item]);
  }

  @Override
  public double getYValue(int series, int item) {
    Trace t = traces.get(series);
    return t.y().applyAsDouble(t.items()[item]);
  }

  /** Sample order, which need not be the order of x (a crosshead may back off). */
  @Override
  public DomainOrder getDomainOrder() {
    return DomainOrder.NONE;
  }
}
