package org.loadstone.analysis;

/**
 * Least-squares straight lines over index windows of one (x, y) series, each in O(1) after an
 * O(n) set-up, from prefix sums of x, y, x², xy and y². The sums are taken about the series means
 * so that the differences of prefix sums do not lose precision.
 */
final class LinearWindows {
  private final double[] sx;
  private final double[] sy;
  private final double[] sxx;
  private final double[] sxy;
  private final double[] syy;
  private final double mx;
  private final double my;

  /** One fitted window, see {@link #fit(int, int)}. */
  record Line(
      int from,
      int to,
      double slope,
      double intercept,
      double rSquared,
      double slopeSe,
      double residualSd) {
    int length() {
      return to - from + 1;
    }
  }

  /** Sums over {@code x[0..count-1]}, {@code y[0..count-1]}. */
  LinearWindows(double[] x, double[] y, int count) {
    double ax = 0;
    double ay = 0;
    for (int i = 0; i < count; i++) {
      ax += x[i];
      ay += y[i];
    }
    mx = ax / count;
    my = ay / count;
    sx = new double[count + 1];
    sy = new double[count + 1];
    sxx = new double[count + 1];
    sxy = new double[count + 1];
    syy = new double[count + 1];
    for (int i = 0; i < count; i++) {
      double u = x[i] - mx;
      double v = y[i] - my;
      sx[i + 1] = sx[i] + u;
      sy[i + 1] = sy[i] + v;
      sxx[i + 1] = sxx[i] + u * u;
      sxy[i + 1] = sxy[i] + u * v;
      syy[i + 1] = syy[i] + v * v;
    }
  }

  /** Mean of y − (slope·x + intercept) over samples {@code from..to} inclusive. */
  double meanResidual(int from, int to, double slope, double intercept) {
    int n = to - from + 1;
    double sumX = sx[to + 1] - sx[from] + n * mx;
    double sumY = sy[to + 1] - sy[from] + n * my;
    return (sumY - slope * sumX - n * intercept) / n;
  }

  /**
   * The search's score of a window without making its {@link Line}: slope − 2 standard errors
   * when the slope is positive and R² reaches {@code minR2}, else NaN.
   */
  double score(int from, int to, double minR2) {
    Line line = fit(from, to); // not kept, so the compiler need not make it
    if (line == null || line.slope() <= 0 || line.rSquared() < minR2) {
      return Double.NaN;
    }
    return line.slope() - 2 * line.slopeSe();
  }

  /**
   * Fits samples {@code from..to} inclusive (at least 2).
   *
   * @return the line, or {@code null} when x does not vary over the window
   */
  Line fit(int from, int to) {
    int n = to - from + 1;
    double u = sx[to + 1] - sx[from];
    double v = sy[to + 1] - sy[from];
    double cxx = sxx[to + 1] - sxx[from] - u * u / n;
    double cxy = sxy[to + 1] - sxy[from] - u * v / n;
    double cyy = syy[to + 1] - syy[from] - v * v / n;
    if (!(cxx > 0)) {
      return null;
    }
    double slope = cxy / cxx;
    double meanU = u / n;
    double meanV = v / n;
    double intercept = (my + meanV) - slope * (mx + meanU);
    double r2 = cyy > 0 ? Math.min(1.0, cxy * cxy / (cxx * cyy)) : 1.0;
    double sse = Math.max(0.0, cyy - slope * cxy);
    double resSd = n > 2 ? Math.sqrt(sse / (n - 2)) : 0.0;
    return new Line(from, to, slope, intercept, r2, resSd / Math.sqrt(cxx), resSd);
  }
}
