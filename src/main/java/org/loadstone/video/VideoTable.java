package org.loadstone.video;

import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.loadstone.analysis.position.PositionTable;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * A position–time table from a tracked clip: one row per frame, in the clip's clock, with the
 * displacement along the loading direction (the point's motion less the reference's), the motion
 * across it, the match confidence and whether the frame was lost (no position then).
 *
 * @param time_s clip capture times, seconds, increasing
 * @param position_mm displacement along the loading direction from the first frame, mm (NaN
 *     where lost)
 * @param across_mm motion across the loading direction, mm (NaN where lost)
 * @param confidence match score per frame, 0–1
 * @param frame frame numbers in the clip
 * @param lost whether each frame was lost
 * @param scale the scale used
 * @param direction the loading direction
 * @param sync how the clip maps onto a run, or null when not synchronised
 * @param about what was tracked, in words and numbers (clip, codec, points, settings), for the
 *     sidecar
 */
public record VideoTable(double[] time_s, double[] position_mm, double[] across_mm,
    double[] confidence, int[] frame, boolean[] lost, ImageScale scale,
    LoadingDirection direction, VideoSync sync, Map<String, Object> about) {

  /** Checks the lengths; copies nothing (the table is built once and only read). */
  public VideoTable {
    Precondition.notNull(scale, "scale");
    Precondition.notNull(direction, "direction");
    int n = time_s.length;
    if (position_mm.length != n || across_mm.length != n || confidence.length != n
        || frame.length != n || lost.length != n) {
      throw new IllegalArgumentException("columns of different lengths");
    }
    about = Map.copyOf(about);
  }

  /**
   * @param track the tracked clip
   * @param scale millimetres per pixel
   * @param direction the way the loading part moves in the image
   */
  public static VideoTable of(Track track, ImageScale scale, LoadingDirection direction) {
    List<TrackedFrame> f = track.frames();
    int n = f.size();
    double[] t = new double[n];
    double[] x = new double[n];
    double[] a = new double[n];
    double[] c = new double[n];
    int[] k = new int[n];
    boolean[] lost = new boolean[n];
    TrackedFrame f0 = f.get(0);
    boolean ref = track.reference() != null;
    for (int i = 0; i < n; i++) {
      TrackedFrame g = f.get(i);
      t[i] = g.time_s();
      c[i] = g.confidence();
      k[i] = g.index();
      lost[i] = g.lost();
      if (g.lost()) {
        x[i] = Double.NaN;
        a[i] = Double.NaN;
        continue;
      }
      double dx = g.x() - f0.x() - (ref ? g.refX() - f0.refX() : 0);
      double dy = g.y() - f0.y() - (ref ? g.refY() - f0.refY() : 0);
      x[i] = direction.along(dx, dy) * scale.mm_per_px();
      a[i] = direction.across(dx, dy) * scale.mm_per_px();
    }
    Map<String, Object> about = new LinkedHashMap<>();
    ClipInfo ci = track.clip();
    about.put("clip", ci.file().getFileName().toString());
    about.put("container", ci.container());
    about.put("codec", ci.codec());
    about.put("width_px", ci.width());
    about.put("height_px", ci.height());
    about.put("nominal_rate_fps", ci.nominalRate_fps());
    about.put("time_source", ci.timeSource());
    about.put("point_px", List.of(track.point().x(), track.point().y()));
    if (ref) {
      about.put("reference_px", List.of(track.reference().x(), track.reference().y()));
    }
    about.put("template_px", 2 * track.settings().templateHalf_px() + 1);
    about.put("search_px", track.settings().searchHalf_px());
    about.put("lost_below", track.settings().lostBelow());
    about.put("complete", track.complete());
    return new VideoTable(t, x, a, c, k, lost, scale, direction, null, about);
  }

  /** @return this table with a sync */
  public VideoTable withSync(VideoSync s) {
    return new VideoTable(time_s, position_mm, across_mm, confidence, frame, lost, scale,
        direction, s, about);
  }

  /** @return the number of rows */
  public int rows() {
    return time_s.length;
  }

  /** @return the row of the first lost frame, or {@link #rows()} when none was lost */
  public int firstLost() {
    for (int i = 0; i < lost.length; i++) {
      if (lost[i]) {
        return i;
      }
    }
    return lost.length;
  }

  /** @return the number of lost frames */
  public int lostCount() {
    int n = 0;
    for (boolean b : lost) {
      n += b ? 1 : 0;
    }
    return n;
  }

  /**
   * The table as a position source: the rows before the first lost frame. Nothing after a lost
   * frame is used, so a gap is never bridged by a line drawn across it.
   *
   * @throws LoadstoneException when fewer than two frames precede the first lost one
   */
  public PositionTable positionTable() {
    int end = firstLost();
    if (end < 2) {
      throw new LoadstoneException(String.format(Locale.ROOT, "the tracked point is lost from "
          + "frame %d (clip time %.4f s), leaving fewer than 2 frames with a position: mark the "
          + "point on a sharper marker, or track with a larger template or search",
          frame[end], time_s[end]), org.loadstone.units.Setting.TRACK_WINDOW);
    }
    return new PositionTable(Arrays.copyOf(time_s, end), Arrays.copyOf(position_mm, end));
  }
}
