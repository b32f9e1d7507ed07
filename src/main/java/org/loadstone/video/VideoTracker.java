package org.loadstone.video;

import java.util.ArrayList;
import java.util.List;
import java.util.function.BooleanSupplier;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * Tracks a marked point, and optionally a fixed reference point, through a clip, frame by frame
 * as they are decoded (only the current frame is held), and measures the sync-light region's
 * brightness on the way.
 */
public final class VideoTracker {
  private VideoTracker() {}

  /** Told after each frame; called on the tracking thread. */
  public interface Progress {
    /**
     * @param frame the frame just tracked
     * @param clip the clip
     */
    void tracked(TrackedFrame frame, ClipInfo clip);
  }

  /**
   * What to track.
   *
   * @param point the point on the moving part, first frame
   * @param reference a fixed point whose motion (camera shake) is taken off, or null
   * @param lightRegion the sync light's region, or null
   * @param settings how the points are tracked
   * @param changeRegion where the image change is measured ({@link ImageChange}), or null for the
   *     whole frame less the light's region
   */
  public record Request(PixelPoint point, PixelPoint reference, PixelRegion lightRegion,
      TrackSettings settings, PixelRegion changeRegion) {
    /** Checks the required fields. */
    public Request {
      Precondition.notNull(point, "point");
      Precondition.notNull(settings, "settings");
    }

    /** A request measuring the image change over the whole frame (less the light). */
    public Request(PixelPoint point, PixelPoint reference, PixelRegion lightRegion,
        TrackSettings settings) {
      this(point, reference, lightRegion, settings, null);
    }
  }

  /**
   * @param clip an open clip, read from its current frame to its end
   * @param request the point, the reference (or null), the light region (or null), the settings
   * @param progress told after each frame, or null
   * @param cancelled asked before each frame; true stops tracking with the frames so far
   * @return the track, {@link Track#complete()} false when cancelled
   * @throws LoadstoneException when the clip has no frame, a point or a region lies outside the
   *     frame, or the clip is damaged
   */
  public static Track track(ClipSource clip, Request request, Progress progress,
      BooleanSupplier cancelled) {
    GreyFrame first = clip.next();
    ClipInfo info = clip.info();
    if (first == null) {
      throw new LoadstoneException("clip " + info.file() + " holds no frame: copy it from the "
          + "camera again");
    }
    PointTracker point = new PointTracker(first, request.point(), request.settings(),
        "tracked point");
    PointTracker ref = request.reference() == null ? null
        : new PointTracker(first, request.reference(), request.settings(), "reference point");
    PixelRegion region = request.lightRegion();
    if (region != null && !region.inside(first.width(), first.height())) {
      throw new LoadstoneException("the sync-light region " + region.x() + "," + region.y() + ","
          + region.width() + "," + region.height() + " reaches outside the " + first.width()
          + "x" + first.height() + " frame: mark the light within the frame",
          org.loadstone.units.Setting.VIDEO_SYNC);
    }
    ImageChange change = new ImageChange(first.width(), first.height(), request.changeRegion(),
        region);
    List<TrackedFrame> frames = new ArrayList<>();
    PixelPoint p = request.point();
    PixelPoint r = request.reference();
    TrackedFrame f0 = new TrackedFrame(first.index(), first.time_s(), p.x(), p.y(),
        r == null ? Double.NaN : r.x(), r == null ? Double.NaN : r.y(), 1, false,
        region == null ? Double.NaN : first.mean(region), change.next(first, true));
    frames.add(f0);
    if (progress != null) {
      progress.tracked(f0, info);
    }
    double lastTime = first.time_s();
    boolean complete = true;
    GreyFrame g;
    while (true) {
      if (cancelled != null && cancelled.getAsBoolean()) {
        complete = false;
        break;
      }
      g = clip.next();
      if (g == null) {
        break;
      }
      if (!(g.time_s() > lastTime)) {
        // a repeated or reordered timestamp: the frame's capture time is unknown, so it is skipped
        continue;
      }
      lastTime = g.time_s();
      PointTracker.Step s = point.step(g);
      PointTracker.Step rs = ref == null ? null : ref.step(g);
      boolean lost = s.lost() || (rs != null && rs.lost());
      double conf = rs == null ? s.score() : Math.min(s.score(), rs.score());
      TrackedFrame f = new TrackedFrame(g.index(), g.time_s(), s.x(), s.y(),
          rs == null ? Double.NaN : rs.x(), rs == null ? Double.NaN : rs.y(), conf, lost,
          region == null ? Double.NaN : g.mean(region), change.next(g, false));
      frames.add(f);
      if (progress != null) {
        progress.tracked(f, info);
      }
    }
    return new Track(info, request.point(), request.reference(), region, request.settings(),
        frames, complete);
  }
}
