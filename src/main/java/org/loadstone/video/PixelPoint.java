package org.loadstone.video;

import java.util.Locale;
import org.loadstone.units.LoadstoneException;

/**
 * A point in the image, pixels from the top-left corner (x to the right, y down); the centre of
 * the top-left pixel is (0, 0).
 *
 * @param x column, pixels, finite
 * @param y row, pixels, finite
 */
public record PixelPoint(double x, double y) {
  /** Checks the values. */
  public PixelPoint {
    if (!Double.isFinite(x) || !Double.isFinite(y)) {
      throw new IllegalArgumentException("point (" + x + ", " + y + ") is not finite");
    }
  }

  /**
   * Reads "X,Y".
   *
   * @param text two numbers separated by a comma
   * @param what what the point marks, for the message
   * @throws LoadstoneException when the text is not two numbers
   */
  public static PixelPoint parse(String text, String what) {
    String[] p = text.trim().split("\\s*,\\s*");
    if (p.length == 2) {
      try {
        return new PixelPoint(Double.parseDouble(p[0]), Double.parseDouble(p[1]));
      } catch (IllegalArgumentException e) {
        // reported below
      }
    }
    throw new LoadstoneException("the " + what + " '" + text + "' is not a pixel position: "
        + "write it as two numbers X,Y (pixels from the top-left corner, y down)");
  }

  /** @return the distance to another point, pixels */
  public double distanceTo(PixelPoint o) {
    return Math.hypot(x - o.x, y - o.y);
  }

  @Override
  public String toString() {
    return String.format(Locale.ROOT, "(%.2f, %.2f)", x, y);
  }
}
