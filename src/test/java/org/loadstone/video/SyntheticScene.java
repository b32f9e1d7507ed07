package org.loadstone.video;

import java.util.Random;
import java.util.function.DoubleFunction;

/**
 * Test helper: draws grey frames of a marker moving by a known path, with its ground truth.
 *
 * <p>The marker and the reference are patterns of Gaussian spots drawn at their exact,
 * sub-pixel places (each spot is an analytic function of continuous coordinates, so a shift of
 * 0.37 px is a shift of 0.37 px, not a rounded one). On top: a weak background texture, camera
 * shake moving everything (marker, reference, background) alike, a brightness and contrast change
 * over the clip, a blur growing over the clip (the spots widen), Gaussian pixel noise, an
 * optional occlusion of the marker by a flat card, and an optional sync light that comes on.
 */
final class SyntheticScene {
  final int w;
  final int h;
  /** Marker centre in scene pixels at time t (the truth). */
  DoubleFunction<double[]> marker = t -> new double[] {80, 60};
  /** Reference centre in scene pixels (fixed in the scene). */
  double[] reference = null;
  /** Camera shake at time t, pixels added to everything. */
  DoubleFunction<double[]> shake = t -> new double[] {0, 0};
  /** Grey gain and offset at time t (brightness change). */
  DoubleFunction<double[]> light = t -> new double[] {1, 0};
  /** Spot sigma at time t, pixels (blur). */
  DoubleFunction<Double> sigma = t -> 1.8;
  double noiseSd = 2;
  /** Frames during which the marker is covered by a flat card: first, last (inclusive). */
  int occludedFrom = -1;
  int occludedTo = -2;
  /** Sync light: the region, and the time it comes on (NaN: never). */
  PixelRegion lamp = null;
  double lampOn_s = Double.NaN;
  /** A crack that opens across the specimen: the region turns dark from the time given. */
  PixelRegion crack = null;
  double crackAt_s = Double.NaN;

  private final double[][] spots;
  private final double[][] refSpots;
  private final Random noise;

  SyntheticScene(int w, int h, long seed) {
    this.w = w;
    this.h = h;
    Random r = new Random(seed);
    spots = pattern(r, 12);
    refSpots = pattern(r, 10);
    noise = new Random(seed * 31 + 7);
  }

  private static double[][] pattern(Random r, int n) {
    double[][] s = new double[n][];
    for (int i = 0; i < n; i++) {
      s[i] = new double[] {r.nextDouble() * 16 - 8, r.nextDouble() * 16 - 8,
          (r.nextBoolean() ? 1 : -1) * (50 + r.nextDouble() * 40)};
    }
    return s;
  }

  /** Draws the frame at time t, frame number k. */
  byte[] frame(double t, int k) {
    double[] sh = shake.apply(t);
    double[] gl = light.apply(t);
    double sg = sigma.apply(t);
    double[] m = marker.apply(t);
    double[] img = new double[w * h];
    for (int y = 0; y < h; y++) {
      for (int x = 0; x < w; x++) {
        double u = x - sh[0];
        double v = y - sh[1];
        img[y * w + x] = 110 + 12 * Math.sin(u * 0.21) * Math.cos(v * 0.17)
            + 6 * Math.sin(u * 0.05 + v * 0.09);
      }
    }
    boolean covered = k >= occludedFrom && k <= occludedTo;
    if (covered) {
      fill(img, m[0] + sh[0], m[1] + sh[1], 14, 130);
    } else {
      draw(img, spots, m[0] + sh[0], m[1] + sh[1], sg);
    }
    if (reference != null) {
      draw(img, refSpots, reference[0] + sh[0], reference[1] + sh[1], sg);
    }
    byte[] out = new byte[w * h];
    for (int i = 0; i < img.length; i++) {
      double v = gl[1] + gl[0] * img[i] + noiseSd * noise.nextGaussian();
      out[i] = (byte) Math.max(0, Math.min(255, Math.round(v)));
    }
    if (crack != null && t >= crackAt_s) {
      for (int y = crack.y(); y < crack.y() + crack.height(); y++) {
        for (int x = crack.x(); x < crack.x() + crack.width(); x++) {
          out[y * w + x] = (byte) 25;
        }
      }
    }
    if (lamp != null) {
      boolean on = t >= lampOn_s;
      for (int y = lamp.y(); y < lamp.y() + lamp.height(); y++) {
        for (int x = lamp.x(); x < lamp.x() + lamp.width(); x++) {
          out[y * w + x] = (byte) (on ? 240 : 40);
        }
      }
    }
    return out;
  }

  /**
   * An opaque plate of side 2·PLATE px carrying the spots: it hides the background behind it, as
   * the crosshead's marker does. Its edge is drawn with the covered fraction of each pixel along
   * each axis, so the plate too moves by exact sub-pixel amounts.
   */
  private void draw(double[] img, double[][] pattern, double cx, double cy, double sg) {
    int x0 = Math.max(0, (int) (cx - PLATE - 2));
    int x1 = Math.min(w - 1, (int) (cx + PLATE + 2));
    int y0 = Math.max(0, (int) (cy - PLATE - 2));
    int y1 = Math.min(h - 1, (int) (cy + PLATE + 2));
    double k = 1 / (2 * sg * sg);
    for (int y = y0; y <= y1; y++) {
      double cover_y = cover(y - cy);
      for (int x = x0; x <= x1; x++) {
        double c = cover_y * cover(x - cx);
        if (c <= 0) {
          continue;
        }
        double s = 95;
        for (double[] p : pattern) {
          double dx = x - cx - p[0];
          double dy = y - cy - p[1];
          s += p[2] * Math.exp(-(dx * dx + dy * dy) * k);
        }
        img[y * w + x] = (1 - c) * img[y * w + x] + c * s;
      }
    }
  }

  static final double PLATE = 15;

  /** Fraction of the pixel [d − 0.5, d + 0.5] inside [−PLATE, PLATE]. */
  private static double cover(double d) {
    double lo = Math.max(d - 0.5, -PLATE);
    double hi = Math.min(d + 0.5, PLATE);
    return Math.max(0, hi - lo);
  }

  private void fill(double[] img, double cx, double cy, int half, double grey) {
    for (int y = Math.max(0, (int) cy - half); y <= Math.min(h - 1, (int) cy + half); y++) {
      for (int x = Math.max(0, (int) cx - half); x <= Math.min(w - 1, (int) cx + half); x++) {
        img[y * w + x] = grey;
      }
    }
  }
}
