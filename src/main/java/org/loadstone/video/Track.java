package org.loadstone.video;

import java.util.ArrayList;
import java.util.List;

/**
 * A tracked clip: the point (and reference) in every frame, in pixels, with what was asked.
 *
 * @param clip what the clip is
 * @param point the marked point in the first frame
 * @param reference the fixed reference point in the first frame, or null
 * @param lightRegion the sync-light region, or null
 * @param settings how it was tracked
 * @param frames every frame decoded, in order
 * @param complete false when tracking was cancelled before the clip's end
 */
public record Track(ClipInfo clip, PixelPoint point, PixelPoint reference,
    PixelRegion lightRegion, TrackSettings settings, List<TrackedFrame> frames,
    boolean complete) {
  /** Copies the list. */
  public Track {
    frames = List.copyOf(frames);
  }

  /** A stretch of consecutive lost frames. */
  public record LostSpan(int firstFrame, int lastFrame, double from_s, double to_s) {}

  /** @return the stretches of lost frames, in order */
  public List<LostSpan> lostSpans() {
    List<LostSpan> out = new ArrayList<>();
    int start = -1;
    for (int i = 0; i <= frames.size(); i++) {
      boolean lost = i < frames.size() && frames.get(i).lost();
      if (lost && start < 0) {
        start = i;
      } else if (!lost && start >= 0) {
        TrackedFrame a = frames.get(start);
        TrackedFrame b = frames.get(i - 1);
        out.add(new LostSpan(a.index(), b.index(), a.time_s(), b.time_s()));
        start = -1;
      }
    }
    return out;
  }
}
