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
  private final double[] sx3;
  private final double[] sx4;
  private final double[] sx2y;
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
    sx3 = new double[count + 1];
    sx4 = new double[count + 1];
    sx2y = new double[count + 1];
    for (int i = 0; i < count; i++) {
      double u = x[i] - mx;
      double v = y[i] - my;
      sx[i + 1] = sx[i] + u;
      sy[i + 1] = sy[i] + v;
      sxx[i + 1] = sxx[i] + u * u;
      sxy[i + 1] = sxy[i] + u * v;
      syy[i + 1] = syy[i] + v * v;
      sx3[i + 1] = sx3[i] + u * u * u;
      sx4[i + 1] = sx4[i] + u * u * u * u;
      sx2y[i + 1] = sx2y[i] + u * u * v;
    }
  }

  /**
   * How curved samples {@code from..to} are: the quadratic term b of y = a + c·v + b·v² fitted
   * about the window's mean x, expressed as the change of slope across the window (2·b·x-range,
   * same unit as the slope) and as Student's t of b (b over its standard error).
   *
   * @return {slope change, t}; {0, 0} when the window has fewer than 4 samples or no spread
   */
  double[] curvature(int from, int to, double xRange) {
    int n = to - from + 1;
    if (n < 4) {
      return new double[] {0, 0};
    }
    // window sums of powers of u (x about the series mean), then moved to the window's mean c
    double s1 = sx[to + 1] - sx[from];
    double s2 = sxx[to + 1] - sxx[from];
    double s3 = sx3[to + 1] - sx3[from];
    double s4 = sx4[to + 1] - sx4[from];
    double c = s1 / n;
    double m2 = s2 - n * c * c;
    double m3 = s3 - 3 * c * s2 + 2 * n * c * c * c;
    double m4 = s4 - 4 * c * s3 + 6 * c * c * s2 - 3 * n * c * c * c * c;
    double v0 = sy[to + 1] - sy[from];
    double ybar = v0 / n;
    double suy = sxy[to + 1] - sxy[from];
    double su2y = sx2y[to + 1] - sx2y[from];
    double syyW = syy[to + 1] - syy[from] - v0 * v0 / n;
    double svy = suy - c * v0; // Σ (u − c)(y − ȳ)
    double swy = su2y - 2 * c * suy + c * c * v0 - ybar * (s2 - 2 * c * s1 + n * c * c);
    double sww = m4 - m2 * m2 / n;
    double det = m2 * sww - m3 * m3;
    if (!(m2 > 0) || !(det > 0)) {
      return new double[] {0, 0};
    }
    double b1 = (sww * svy - m3 * swy) / det;
    double b2 = (m2 * swy - m3 * svy) / det;
    double sse = Math.max(0, syyW - b1 * svy - b2 * swy);
    double se = Math.sqrt(sse / (n - 3) * m2 / det);
    double change = 2 * b2 * xRange;
    return new double[] {change, se > 0 ? b2 / se : (b2 == 0 ? 0 : Double.POSITIVE_INFINITY)};
  }

  /** Mean of y − (slope·x + intercept) over samples {@code from..to} inclusive. */
  double meanResidual(int from, int to, double slope, double intercept) {
    int n = to - from + 1;
    double sumX = sx[to + 1] - sx[from] + n * mx;
    double sumY = sy[to + 1] - sy[from] + n * my;
    return (sumY - slope * sumX - n * intercept) / n;
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
