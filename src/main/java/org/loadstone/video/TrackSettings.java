package org.loadstone.video;

import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Setting;

/**
 * How a point is tracked.
 *
 * @param templateHalf_px half the side of the square template: the template is
 *     {@code 2·templateHalf_px + 1} pixels wide, 3–60
 * @param searchHalf_px how far from the predicted place the template is looked for, pixels each
 *     way, 2–200; a frame whose best match is weak is searched again three times as far
 * @param lostBelow a match whose normalised cross-correlation is below this is no match (the
 *     point is lost in that frame), 0–1
 * @param adaptAbove the template learns from a frame only when its match is at least this good,
 *     0–1, at least {@code lostBelow}
 * @param adaptRate weight of each such frame in the learnt half of the template, 0–1 (0: the
 *     template never changes)
 */
public record TrackSettings(int templateHalf_px, int searchHalf_px, double lostBelow,
    double adaptAbove, double adaptRate) {

  /**
   * 25-pixel template, ±16 pixels search; lost below 0.6, learning above 0.9 at 0.1 per frame.
   * Common practice for NCC tracking of a high-contrast marker, tuned on the synthetic clips of
   * the tests.
   */
  public static final TrackSettings DEFAULTS = new TrackSettings(12, 16, 0.6, 0.9, 0.1);

  /** Checks the ranges. */
  public TrackSettings {
    if (templateHalf_px < 3 || templateHalf_px > 60 || searchHalf_px < 2
        || searchHalf_px > 200) {
      throw new LoadstoneException("a template of " + (2 * templateHalf_px + 1) + " pixels "
          + "searched ±" + searchHalf_px + " pixels cannot be tracked: give a template of 7–121 "
          + "pixels and a search of 2–200 pixels", Setting.TRACK_WINDOW);
    }
    if (!(lostBelow >= 0 && lostBelow <= 1 && adaptAbove >= lostBelow && adaptAbove <= 1
        && adaptRate >= 0 && adaptRate <= 1)) {
      throw new IllegalArgumentException("match limits " + lostBelow + ", " + adaptAbove
          + ", rate " + adaptRate);
    }
  }

  /** @return these settings with another template and search size, pixels */
  public TrackSettings withWindow(int templateSide_px, int search_px) {
    return new TrackSettings(templateSide_px / 2, search_px, lostBelow, adaptAbove, adaptRate);
  }
}
