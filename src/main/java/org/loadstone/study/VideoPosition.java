package org.loadstone.study;

import java.util.Locale;
import java.util.Map;
import org.loadstone.analysis.PositionSource;
import org.loadstone.archive.RunMetadata;
import org.loadstone.units.LoadstoneException;
import org.loadstone.video.Track;
import org.loadstone.video.VideoSync;
import org.loadstone.video.VideoTable;

/**
 * A run's position from a tracked clip: where the run's sync light came on, and the table put on
 * the run's clock for analysis.
 */
public final class VideoPosition {
  private VideoPosition() {}

  /** Metadata key of the run time (s) at which the sync light came on, when recorded. */
  public static final String LIGHT_KEY = RunMetadata.SYNC_LIGHT_KEY;

  /**
   * @return the run time at which the sync light came on: the recorded {@value #LIGHT_KEY}, else
   *     the trigger (the end of the pre-trigger history), where the reference firmware switches
   *     the light on
   */
  public static double lightOn_s(RunMetadata m) {
    Object v = m.extra().get(LIGHT_KEY);
    if (v instanceof Number n && Double.isFinite(n.doubleValue())) {
      return n.doubleValue();
    }
    return m.pretrigger_s();
  }

  /**
   * Syncs a track's table to a run by its light.
   *
   * @throws LoadstoneException as {@link VideoSync#byLight}
   */
  public static VideoSync byLight(Track track, RunMetadata run) {
    return VideoSync.byLight(track, lightOn_s(run));
  }

  /**
   * Puts a tracked clip on a run's clock the way asked.
   *
   * @param way how
   * @param offset_s for {@link VideoSync.Way#OFFSET}, clip time minus run time, seconds (else
   *     not read)
   * @param track the tracked clip
   * @param table its table
   * @param run the run's metadata (where the light came on)
   * @param time_s the run's times, seconds
   * @param force_N the run's forces, newtons
   * @throws LoadstoneException as the way's own method in {@link VideoSync}
   */
  public static VideoSync sync(VideoSync.Way way, double offset_s, Track track,
      VideoTable table, RunMetadata run, double[] time_s, double[] force_N) {
    return switch (way) {
      case BREAK -> VideoSync.byBreak(time_s, force_N, table);
      case CHANGE -> VideoSync.byImageChange(time_s, force_N, track);
      case LIGHT -> byLight(track, run);
      case OFFSET -> VideoSync.offset(offset_s);
    };
  }

  /**
   * The run with its position taken from the video table, on the run's clock by the table's sync
   * (or by the break when the table has none). The run's samples outside the frames before the
   * first lost one are trimmed; the rise to the peak force must lie wholly inside them.
   *
   * @param run the run
   * @param table the video table
   * @throws LoadstoneException when the clip does not cover the rise to the peak (it is shorter
   *     than the run, starts late, or the point is lost before the peak), naming the times
   */
  public static RunAdjust apply(RunAdjust run, VideoTable table) {
    VideoSync sync = table.sync() != null ? table.sync()
        : VideoSync.byBreak(run.data().time_s(), run.data().force_N(), table);
    double[] t = run.data().time_s();
    double[] f = run.data().force_N();
    int peak = 0;
    for (int i = 1; i < f.length; i++) {
      if (f[i] > f[peak]) {
        peak = i;
      }
    }
    int start = 0;
    while (start < peak && f[start] < 0.02 * f[peak]) {
      start++;
    }
    double from = table.time_s()[0] - sync.offset_s();
    int end = table.firstLost();
    double to = table.time_s()[Math.max(0, end - 1)] - sync.offset_s();
    if (from > t[start] || to < t[peak]) {
      String why = end < table.rows() ? String.format(Locale.ROOT, " (the point is lost from "
          + "frame %d on)", table.frame()[end]) : "";
      throw new LoadstoneException(String.format(Locale.ROOT, "the clip gives positions for run "
          + "times %.3f to %.3f s%s, but the rise to the peak force spans %.3f to %.3f s: the "
          + "position there would be invented; film the whole loading, or re-track with a "
          + "larger template or search where the point was lost", from, to, why, t[start],
          t[peak]));
    }
    RunAdjust a = run.withPositionTable(table.positionTable(), sync.offset_s());
    a = a.positionMeasures(PositionSource.VIDEO_LOAD_POINT);
    return a;
  }

  /** @return the table's scale and sync, for notes */
  public static Map<String, Object> facts(VideoTable table) {
    return Map.of("scale_mm_per_px", table.scale().mm_per_px(),
        "scale_relative_uncertainty", table.scale().relativeUncertainty(),
        "sync", table.sync() == null ? "break" : table.sync().method());
  }
}
