package org.loadstone.video;

import org.loadstone.units.LoadstoneException;

/**
 * A rectangle of pixels.
 *
 * @param x left column
 * @param y top row
 * @param width columns, at least 1
 * @param height rows, at least 1
 */
public record PixelRegion(int x, int y, int width, int height) {
  /** Checks the size. */
  public PixelRegion {
    if (width < 1 || height < 1) {
      throw new LoadstoneException("a region of " + width + "x" + height + " pixels holds no "
          + "pixel: give its width and height as at least 1");
    }
  }

  /**
   * Reads "X,Y,W,H" (left, top, width, height in pixels).
   *
   * @param text four integers separated by commas
   * @throws LoadstoneException when the text is not four integers
   */
  public static PixelRegion parse(String text) {
    String[] p = text.trim().split("\\s*,\\s*");
    if (p.length == 4) {
      try {
        return new PixelRegion(Integer.parseInt(p[0]), Integer.parseInt(p[1]),
            Integer.parseInt(p[2]), Integer.parseInt(p[3]));
      } catch (NumberFormatException e) {
        // reported below
      }
    }
    throw new LoadstoneException("the region '" + text + "' is not a rectangle: write it as "
        + "X,Y,W,H (left, top, width, height in whole pixels)");
  }

  /** @return whether the rectangle lies wholly inside a frame of that size */
  public boolean inside(int frameWidth, int frameHeight) {
    return x >= 0 && y >= 0 && x + width <= frameWidth && y + height <= frameHeight;
  }
}
