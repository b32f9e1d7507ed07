package org.loadstone.video;

import java.util.Locale;
import org.loadstone.units.LoadstoneException;

/**
 * The way the loading part moves in the image. Displacement is the motion along it; the motion
 * across it (to the right of the direction of travel) is reported as an alignment check.
 */
public enum LoadingDirection {
  /** Towards the bottom of the frame (a press loading from above, the camera upright). */
  DOWN(0, 1),
  /** Towards the top of the frame. */
  UP(0, -1),
  /** Towards the left of the frame. */
  LEFT(-1, 0),
  /** Towards the right of the frame. */
  RIGHT(1, 0);

  final double ux;
  final double uy;

  LoadingDirection(double ux, double uy) {
    this.ux = ux;
    this.uy = uy;
  }

  /** @return the motion (dx, dy) in pixels along this direction */
  public double along(double dx, double dy) {
    return dx * ux + dy * uy;
  }

  /** @return the motion (dx, dy) in pixels across this direction, positive to its right */
  public double across(double dx, double dy) {
    // right of travel in image coordinates (y down): (−uy, ux)
    return -dx * uy + dy * ux;
  }

  /** @return the lower-case word */
  public String word() {
    return name().toLowerCase(Locale.ROOT);
  }

  /**
   * @param text down, up, left or right
   * @throws LoadstoneException for any other word
   */
  public static LoadingDirection parse(String text) {
    for (LoadingDirection d : values()) {
      if (d.word().equalsIgnoreCase(text.trim())) {
        return d;
      }
    }
    throw new LoadstoneException("the loading direction '" + text + "' is not one of down, up, "
        + "left, right: give the way the loading part moves in the image");
  }
}
