package org.loadstone.video;

/**
 * One frame of a track.
 *
 * @param index frame number in the clip, from 0
 * @param time_s capture time from the clip's first frame, seconds
 * @param x the point's column, pixels (NaN when lost)
 * @param y the point's row, pixels (NaN when lost)
 * @param refX the reference point's column, pixels (NaN without a reference or when lost)
 * @param refY the reference point's row, pixels (NaN without a reference or when lost)
 * @param confidence the weaker match score of the point and the reference, 0–1 (normalised
 *     cross-correlation)
 * @param lost whether no position is known for this frame: the point or the reference was not
 *     found
 * @param light mean grey value of the sync-light region, 0–255 (NaN without a region)
 * @param change how much the image changed since the previous frame tracked: the mean squared
 *     difference of grey values in the change region ({@link ImageChange}), grey levels²; NaN
 *     in the first frame
 */
public record TrackedFrame(int index, double time_s, double x, double y, double refX,
    double refY, double confidence, boolean lost, double light, double change) {}
