package org.loadstone.video;

import java.util.Locale;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Setting;

/**
 * How much the image changes from one frame to the next: the mean squared difference of grey
 * values (the frame difference's energy per pixel, grey levels²) over a region, or over the
 * whole frame less the sync light's region (the light coming on is a change of its own). A
 * specimen that breaks changes the image at once — fragments move, a crack opens, the loading
 * part springs forward — so the change stands out at the break however the tracked point moves.
 *
 * <p>Pixels are sampled on a regular grid of at most {@link #MAX_SAMPLES} (every pixel of a
 * region that small), so a 1080p frame costs a few tens of thousands of subtractions, not two
 * million; only the previous frame's samples are held.
 */
final class ImageChange {
  /** At most this many pixels are compared per frame. */
  static final int MAX_SAMPLES = 65_536;

  private final int[] at;
  private byte[] before;
  private byte[] now;

  /**
   * @param width frame width, pixels
   * @param height frame height, pixels
   * @param region the region to watch, or null for the whole frame
   * @param light the sync light's region, left out of the whole frame, or null
   * @throws LoadstoneException when the region reaches outside the frame or holds no pixel
   *     outside the light
   */
  ImageChange(int width, int height, PixelRegion region, PixelRegion light) {
    if (region != null && !region.inside(width, height)) {
      throw new LoadstoneException(String.format(Locale.ROOT, "the image-change region "
          + "%d,%d,%d,%d reaches outside the %dx%d frame: mark a region within the frame",
          region.x(), region.y(), region.width(), region.height(), width, height),
          Setting.VIDEO_SYNC);
    }
    PixelRegion r = region != null ? region : new PixelRegion(0, 0, width, height);
    PixelRegion skip = region == null ? light : null;
    long area = (long) r.width() * r.height();
    int step = (int) Math.max(1, Math.ceil(Math.sqrt((double) area / MAX_SAMPLES)));
    int[] picked = new int[(r.width() / step + 1) * (r.height() / step + 1)];
    int n = 0;
    for (int y = r.y(); y < r.y() + r.height(); y += step) {
      for (int x = r.x(); x < r.x() + r.width(); x += step) {
        if (skip != null && x >= skip.x() && x < skip.x() + skip.width() && y >= skip.y()
            && y < skip.y() + skip.height()) {
          continue;
        }
        picked[n++] = y * width + x;
      }
    }
    if (n == 0) {
      throw new LoadstoneException("the image-change region holds no pixel outside the sync "
          + "light: mark a region over the specimen", Setting.VIDEO_SYNC);
    }
    at = java.util.Arrays.copyOf(picked, n);
    before = new byte[n];
    now = new byte[n];
  }

  /** @return the number of pixels compared per frame */
  int samples() {
    return at.length;
  }

  /**
   * @param frame the next frame (the same size as the first)
   * @return the mean squared grey difference from the frame before, grey levels², or NaN for
   *     the first frame
   */
  double next(GreyFrame frame, boolean first) {
    byte[] luma = frame.luma();
    for (int i = 0; i < at.length; i++) {
      now[i] = luma[at[i]];
    }
    double out = Double.NaN;
    if (!first) {
      long sum = 0;
      for (int i = 0; i < at.length; i++) {
        int d = (now[i] & 0xff) - (before[i] & 0xff);
        sum += d * d;
      }
      out = (double) sum / at.length;
    }
    byte[] t = before;
    before = now;
    now = t;
    return out;
  }
}
