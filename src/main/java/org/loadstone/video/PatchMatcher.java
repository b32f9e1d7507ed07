package org.loadstone.video;

/**
 * Normalised cross-correlation of a square template over a search window of a grey frame, with
 * the peak refined to a fraction of a pixel: first by a least-squares paraboloid over the 3×3
 * scores around it, then by fitting the grey values themselves ({@link #refine}).
 *
 * <p>The score of a place is Σ(t − t̄)(i − ī) / √(Σ(t − t̄)² Σ(i − ī)²) (zero-mean NCC, so a
 * change of brightness or contrast leaves it alone); the window sums Σi and Σi² come from running
 * sums, so a place costs one dot product of the template's size. Reuses its buffers: one matcher
 * per tracked point, not shared between threads.
 */
final class PatchMatcher {
  /** A match: the template's centre in the frame, pixels, and its score. */
  record Match(double x, double y, double score, boolean atEdge) {}

  private final int half;
  private final int side;
  private final int n;
  private float[] region = new float[0];
  private double[] rowSum = new double[0];
  private double[] rowSq = new double[0];
  private float[] scores = new float[0];

  PatchMatcher(int half) {
    this.half = half;
    this.side = 2 * half + 1;
    this.n = side * side;
  }

  /**
   * @param frame the frame
   * @param template zero-mean template values, {@code side²}, row by row
   * @param templateNorm √Σt² of the template
   * @param cx column of the search centre
   * @param cy row of the search centre
   * @param reach candidates from −reach to +reach each way
   * @return the best match, or null when no candidate fits inside the frame
   */
  Match find(GreyFrame frame, float[] template, double templateNorm, int cx, int cy, int reach) {
    int x0 = Math.max(half, cx - reach);
    int x1 = Math.min(frame.width() - 1 - half, cx + reach);
    int y0 = Math.max(half, cy - reach);
    int y1 = Math.min(frame.height() - 1 - half, cy + reach);
    if (x0 > x1 || y0 > y1 || templateNorm <= 0) {
      return null;
    }
    int cw = x1 - x0 + 1;
    int ch = y1 - y0 + 1;
    int rw = cw + side - 1;
    int rh = ch + side - 1;
    if (region.length < rw * rh) {
      region = new float[rw * rh];
    }
    byte[] luma = frame.luma();
    int fw = frame.width();
    for (int y = 0; y < rh; y++) {
      int src = (y0 - half + y) * fw + x0 - half;
      int dst = y * rw;
      for (int x = 0; x < rw; x++) {
        region[dst + x] = luma[src + x] & 0xff;
      }
    }
    // column-window sums per row, then the window sum over rows, for Σi and Σi²
    if (rowSum.length < cw * rh) {
      rowSum = new double[cw * rh];
      rowSq = new double[cw * rh];
    }
    for (int y = 0; y < rh; y++) {
      double s = 0;
      double q = 0;
      int base = y * rw;
      for (int x = 0; x < side; x++) {
        float v = region[base + x];
        s += v;
        q += v * v;
      }
      rowSum[y * cw] = s;
      rowSq[y * cw] = q;
      for (int x = 1; x < cw; x++) {
        float in = region[base + x + side - 1];
        float out = region[base + x - 1];
        s += in - out;
        q += in * in - out * out;
        rowSum[y * cw + x] = s;
        rowSq[y * cw + x] = q;
      }
    }
    if (scores.length < cw * ch) {
      scores = new float[cw * ch];
    }
    int best = -1;
    float bestScore = -2;
    for (int x = 0; x < cw; x++) {
      double s = 0;
      double q = 0;
      for (int y = 0; y < side; y++) {
        s += rowSum[y * cw + x];
        q += rowSq[y * cw + x];
      }
      for (int y = 0; y < ch; y++) {
        if (y > 0) {
          s += rowSum[(y + side - 1) * cw + x] - rowSum[(y - 1) * cw + x];
          q += rowSq[(y + side - 1) * cw + x] - rowSq[(y - 1) * cw + x];
        }
        double var = q - s * s / n;
        float score;
        if (var <= 1e-6 * n) {
          score = 0;
        } else {
          score = (float) (dot(template, y * rw + x, rw) / (Math.sqrt(var) * templateNorm));
        }
        scores[y * cw + x] = score;
        if (score > bestScore) {
          bestScore = score;
          best = y * cw + x;
        }
      }
    }
    int bx = best % cw;
    int by = best / cw;
    boolean edge = (bx == 0 && x0 > half) || (bx == cw - 1 && x1 < frame.width() - 1 - half)
        || (by == 0 && y0 > half) || (by == ch - 1 && y1 < frame.height() - 1 - half);
    double dx = 0;
    double dy = 0;
    if (bx > 0 && bx < cw - 1 && by > 0 && by < ch - 1) {
      double[] d = peak(scores, cw, bx, by);
      dx = d[0];
      dy = d[1];
    }
    return new Match(x0 + bx + dx, y0 + by + dy, bestScore, edge);
  }

  /**
   * Refines a match by Gauss–Newton on the grey values (Lucas–Kanade with a gain and an offset):
   * the shift (δx, δy) and the brightness a·t + b that make the frame, sampled bilinearly around
   * (x, y), best equal the template in least squares. The parabola over the NCC scores is biased
   * towards whole pixels by up to about a tenth of a pixel (Shimizu and Okutomi, "Sub-pixel
   * estimation error cancellation", 2005, from memory); fitting the grey values themselves is
   * not.
   *
   * @return the refined centre, or the given one when the fit does not settle within a pixel
   */
  double[] refine(GreyFrame f, float[] template, double x, double y) {
    double x0 = x;
    double y0 = y;
    for (int it = 0; it < 8; it++) {
      if (x - half - 2 < 0 || y - half - 2 < 0 || x + half + 2 > f.width() - 1
          || y + half + 2 > f.height() - 1) {
        return new double[] {x0, y0};
      }
      // normal equations of the columns [gx, gy, t, 1] against the grey values
      double[] a = new double[16];
      double[] rhs = new double[4];
      int k = 0;
      for (int j = -half; j <= half; j++) {
        for (int i = -half; i <= half; i++) {
          double px = x + i;
          double py = y + j;
          double v = bilinear(f, px, py);
          double gx = 0.5 * (bilinear(f, px + 1, py) - bilinear(f, px - 1, py));
          double gy = 0.5 * (bilinear(f, px, py + 1) - bilinear(f, px, py - 1));
          double t = template[k++];
          double[] c = {gx, gy, -t, -1};
          for (int r = 0; r < 4; r++) {
            for (int q = 0; q < 4; q++) {
              a[r * 4 + q] += c[r] * c[q];
            }
            rhs[r] -= c[r] * v;
          }
        }
      }
      double[] d = solve4(a, rhs);
      if (d == null || !Double.isFinite(d[0]) || !Double.isFinite(d[1])) {
        return new double[] {x0, y0};
      }
      x += d[0];
      y += d[1];
      if (Math.abs(x - x0) > 1 || Math.abs(y - y0) > 1) {
        return new double[] {x0, y0};
      }
      if (Math.abs(d[0]) < 1e-4 && Math.abs(d[1]) < 1e-4) {
        break;
      }
    }
    return new double[] {x, y};
  }

  static double bilinear(GreyFrame f, double x, double y) {
    int xi = (int) Math.floor(x);
    int yi = (int) Math.floor(y);
    double fx = x - xi;
    double fy = y - yi;
    double a = f.at(xi, yi) * (1 - fx) + f.at(xi + 1, yi) * fx;
    double b = f.at(xi, yi + 1) * (1 - fx) + f.at(xi + 1, yi + 1) * fx;
    return a * (1 - fy) + b * fy;
  }

  /** Gaussian elimination with partial pivoting; null when singular. */
  private static double[] solve4(double[] a, double[] b) {
    int n = 4;
    for (int c = 0; c < n; c++) {
      int p = c;
      for (int r = c + 1; r < n; r++) {
        if (Math.abs(a[r * n + c]) > Math.abs(a[p * n + c])) {
          p = r;
        }
      }
      if (Math.abs(a[p * n + c]) < 1e-12) {
        return null;
      }
      if (p != c) {
        for (int q = 0; q < n; q++) {
          double t = a[c * n + q];
          a[c * n + q] = a[p * n + q];
          a[p * n + q] = t;
        }
        double t = b[c];
        b[c] = b[p];
        b[p] = t;
      }
      for (int r = c + 1; r < n; r++) {
        double m = a[r * n + c] / a[c * n + c];
        for (int q = c; q < n; q++) {
          a[r * n + q] -= m * a[c * n + q];
        }
        b[r] -= m * b[c];
      }
    }
    double[] x = new double[n];
    for (int r = n - 1; r >= 0; r--) {
      double s = b[r];
      for (int q = r + 1; q < n; q++) {
        s -= a[r * n + q] * x[q];
      }
      x[r] = s / a[r * n + r];
    }
    return x;
  }

  private double dot(float[] t, int start, int rw) {
    double acc = 0;
    int k = 0;
    for (int y = 0; y < side; y++) {
      int row = start + y * rw;
      float a = 0;
      for (int x = 0; x < side; x++) {
        a += t[k++] * region[row + x];
      }
      acc += a;
    }
    return acc;
  }

  /**
   * The maximum of the least-squares paraboloid c + bx·x + by·y + axx·x² + axy·xy + ayy·y² over
   * the 3×3 scores around (bx, by); falls back to two 1-D parabolas when the paraboloid has no
   * maximum within a pixel.
   */
  static double[] peak(float[] s, int w, int px, int py) {
    double gx = 0;
    double gy = 0;
    double xx = 0;
    double yy = 0;
    double xy = 0;
    for (int j = -1; j <= 1; j++) {
      for (int i = -1; i <= 1; i++) {
        double v = s[(py + j) * w + px + i];
        gx += i * v;
        gy += j * v;
        xy += i * j * v;
        xx += (i * i - 2.0 / 3) * v;
        yy += (j * j - 2.0 / 3) * v;
      }
    }
    double bx = gx / 6;
    double by = gy / 6;
    double axy = xy / 4;
    double axx = xx / 2;
    double ayy = yy / 2;
    double det = 4 * axx * ayy - axy * axy;
    if (axx < 0 && det > 0) {
      double x = (-2 * ayy * bx + axy * by) / det;
      double y = (-2 * axx * by + axy * bx) / det;
      if (Math.abs(x) <= 1 && Math.abs(y) <= 1) {
        return new double[] {x, y};
      }
    }
    return new double[] {parabola(s[py * w + px - 1], s[py * w + px], s[py * w + px + 1]),
        parabola(s[(py - 1) * w + px], s[py * w + px], s[(py + 1) * w + px])};
  }

  private static double parabola(double l, double c, double r) {
    double d = l - 2 * c + r;
    if (d >= 0) {
      return 0;
    }
    return Math.max(-0.5, Math.min(0.5, 0.5 * (l - r) / d));
  }
}
