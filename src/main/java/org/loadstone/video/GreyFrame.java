package org.loadstone.video;

import org.loadstone.units.Precondition;

/**
 * One decoded frame as 8-bit luma, row by row.
 *
 * <p>The pixel array is handed over, not copied (a clip of 1080p frames would otherwise copy
 * 2 MB per frame twice); a consumer must not change it.
 *
 * @param index frame number in decoding order, from 0
 * @param time_s capture time from the clip's first frame, seconds (from the stream's timestamps,
 *     so a variable frame rate is honoured)
 * @param width pixels per row, at least 1
 * @param height rows, at least 1
 * @param luma {@code width * height} grey values, 0–255 as unsigned bytes
 */
public record GreyFrame(int index, double time_s, int width, int height, byte[] luma) {
  /** Checks the sizes. */
  public GreyFrame {
    Precondition.notNull(luma, "luma");
    if (width < 1 || height < 1 || luma.length != width * height) {
      throw new IllegalArgumentException("frame " + width + "x" + height + " with "
          + luma.length + " pixels");
    }
    Precondition.finite(time_s, "time_s");
  }

  /** @return the grey value at (x, y), 0–255 */
  public int at(int x, int y) {
    return luma[y * width + x] & 0xff;
  }

  /**
   * @param region a rectangle, clipped to the frame
   * @return the mean grey value inside it, 0–255
   */
  public double mean(PixelRegion region) {
    int x0 = Math.max(0, region.x()), y0 = Math.max(0, region.y());
    int x1 = Math.min(width, region.x() + region.width());
    int y1 = Math.min(height, region.y() + region.height());
    long sum = 0;
    for (int y = y0; y < y1; y++) {
      for (int x = x0; x < x1; x++) {
        sum += luma[y * width + x] & 0xff;
      }
    }
    int n = Math.max(1, (x1 - x0) * (y1 - y0));
    return (double) sum / n;
  }
}
