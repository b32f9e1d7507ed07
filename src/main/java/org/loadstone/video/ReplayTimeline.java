package org.loadstone.video;

import java.util.Arrays;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * A synchronised clip on the run's clock, frame by frame, for replaying the test: each frame's
 * run time (clip time − the sync's offset), the force recorded at that instant and the frame's
 * displacement.
 *
 * <p>The force is the run's sample nearest the frame's run time — the force at that instant to
 * within half a sample period, with no line drawn across the drop at the break; NaN for a frame
 * before the run's first sample or after its last (more than half a sample period out). The
 * displacement is the table's, NaN where the point was lost.
 *
 * @param clipTime_s each frame's clip time, seconds, increasing
 * @param runTime_s each frame's run time, seconds
 * @param force_N the force at each frame's instant, newtons (NaN outside the run)
 * @param position_mm each frame's displacement, mm (NaN where lost)
 */
public record ReplayTimeline(double[] clipTime_s, double[] runTime_s, double[] force_N,
    double[] position_mm) {

  /** Checks the lengths. */
  public ReplayTimeline {
    int n = clipTime_s.length;
    if (runTime_s.length != n || force_N.length != n || position_mm.length != n || n == 0) {
      throw new IllegalArgumentException("columns of different lengths or none");
    }
  }

  /**
   * @param table a synchronised video table
   * @param runTime_s the run's sample times, seconds, increasing, at least 2
   * @param force_N the run's forces, newtons
   * @throws LoadstoneException when the table carries no sync
   */
  public static ReplayTimeline of(VideoTable table, double[] runTime_s, double[] force_N) {
    Precondition.notNull(table, "table");
    if (runTime_s.length < 2 || force_N.length != runTime_s.length) {
      throw new IllegalArgumentException("run of " + runTime_s.length + " times and "
          + force_N.length + " forces");
    }
    if (table.sync() == null) {
      throw new LoadstoneException("the clip is not synchronised with the run: sync it by the "
          + "break, the image change, the light or an offset first",
          org.loadstone.units.Setting.VIDEO_SYNC);
    }
    int n = table.rows();
    double[] clip = table.time_s().clone();
    double[] run = new double[n];
    double[] force = new double[n];
    double halfSample = 0.5 * (runTime_s[runTime_s.length - 1] - runTime_s[0])
        / (runTime_s.length - 1);
    for (int i = 0; i < n; i++) {
      run[i] = clip[i] - table.sync().offset_s();
      int k = nearest(runTime_s, run[i]);
      force[i] = Math.abs(runTime_s[k] - run[i]) <= halfSample ? force_N[k] : Double.NaN;
    }
    return new ReplayTimeline(clip, run, force, table.position_mm().clone());
  }

  /** @return the number of frames */
  public int rows() {
    return clipTime_s.length;
  }

  /**
   * @param clipTime_s a clip time, seconds
   * @return the row of the last frame at or before it (0 before the first)
   */
  public int rowAt(double clipTime_s) {
    int i = Arrays.binarySearch(this.clipTime_s, clipTime_s);
    return i >= 0 ? i : Math.max(0, -i - 2);
  }

  static int nearest(double[] t, double at) {
    int i = Arrays.binarySearch(t, at);
    if (i >= 0) {
      return i;
    }
    int hi = -i - 1;
    if (hi == 0) {
      return 0;
    }
    if (hi == t.length) {
      return t.length - 1;
    }
    return at - t[hi - 1] <= t[hi] - at ? hi - 1 : hi;
  }
}
