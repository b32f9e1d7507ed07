package org.loadstone.analysis;

/**
 * The rise of a run (first sample to the peak) as the stiffness search and bands read it: the force
 * noise estimated from the data, a lightly smoothed force used only to find where the loading path
 * reaches a level (never for fitting), and the first crossing of a force or displacement level.
 *
 * <p>Noise: the standard deviation of independent force noise from the second differences of the
 * force, σ = 1.4826 · median|f[i+1] − 2f[i] + f[i−1]| / √6 (the median makes it blind to the few
 * large steps of a slip or a break; a second difference of independent noise has variance 6σ²).
 * On a smooth curve sampled densely the signal adds almost nothing to a second difference.
 *
 * <p>Smoothing: a centred moving average just long enough that the smoothed force's noise is
 * below 0.2 % of the rise, at most 1/40 of the rise's samples; none on a clean curve.
 */
final class RiseProfile {
  final double[] x;
  final double[] y;
  final int peak;
  final double noise_N;
  final double[] smooth;
  final int halfWidth;

  /**
   * @param x displacement from the first sample, mm
   * @param y force, N
   * @param peak index of the peak (last sample of the rise)
   */
  RiseProfile(double[] x, double[] y, int peak) {
    this.x = x;
    this.y = y;
    this.peak = peak;
    this.noise_N = noise(y, 0, peak);
    double rise = Math.max(1e-300, y[peak] - y[0]);
    double ratio = noise_N / (0.002 * rise);
    int h = (int) Math.ceil(0.5 * ratio * ratio);
    this.halfWidth = Math.max(0, Math.min(h, (peak + 1) / 40));
    this.smooth = movingAverage(y, peak, halfWidth);
  }

  /** Force noise SD of samples from..to from their second differences, N; 0 for under 5 samples. */
  static double noise(double[] y, int from, int to) {
    int m = to - from - 1;
    if (m < 3) {
      return 0;
    }
    double[] d = new double[m];
    for (int i = from + 1; i < to; i++) {
      d[i - from - 1] = Math.abs(y[i + 1] - 2 * y[i] + y[i - 1]);
    }
    double median = m % 2 == 1 ? Selection.kth(d, m, m / 2)
        : 0.5 * (Selection.kth(d, m, m / 2 - 1) + Selection.kth(d, m, m / 2));
    return 1.4826 * median / Math.sqrt(6);
  }

  private static double[] movingAverage(double[] y, int peak, int h) {
    int n = peak + 1;
    double[] out = new double[n];
    if (h == 0) {
      System.arraycopy(y, 0, out, 0, n);
      return out;
    }
    double[] prefix = new double[n + 1];
    for (int i = 0; i < n; i++) {
      prefix[i + 1] = prefix[i] + y[i];
    }
    for (int i = 0; i < n; i++) {
      int a = Math.max(0, i - h);
      int b = Math.min(n - 1, i + h);
      out[i] = (prefix[b + 1] - prefix[a]) / (b - a + 1);
    }
    return out;
  }

  /**
   * @return the first index in {@code from..to} where the smoothed force reaches {@code level},
   *     or {@code to + 1} when it never does
   */
  int firstForce(double level, int from, int to) {
    for (int i = from; i <= to; i++) {
      if (smooth[i] >= level) {
        return i;
      }
    }
    return to + 1;
  }

  /**
   * @return the first index of the rise where x + shift reaches {@code level}, or peak + 1 when
   *     never
   */
  int firstDisplacement(double level, double shift) {
    for (int i = 0; i <= peak; i++) {
      if (x[i] + shift >= level) {
        return i;
      }
    }
    return peak + 1;
  }
}
