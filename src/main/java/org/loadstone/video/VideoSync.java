package org.loadstone.video;

import java.util.Locale;
import org.loadstone.analysis.position.BreakAlignment;
import org.loadstone.analysis.position.PositionTable;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Setting;

/**
 * How the clip's clock maps onto the run's: clip time = run time + {@code offset_s} (the
 * convention of {@link org.loadstone.analysis.position.PositionTable#resampleOnto}).
 *
 * @param method "break", "light" or "offset"
 * @param offset_s clip time minus run time for the same instant, seconds
 * @param detail how it was found, in words
 */
public record VideoSync(String method, double offset_s, String detail) {

  /** A light region must change by at least this many grey levels to count as a light. */
  public static final double LIGHT_CONTRAST = 40;

  /** @return a sync given by hand */
  public static VideoSync offset(double offset_s) {
    if (!Double.isFinite(offset_s)) {
      throw new LoadstoneException("the clip's time offset " + offset_s + " s is not a number",
          Setting.VIDEO_SYNC);
    }
    return new VideoSync("offset", offset_s, "given by hand");
  }

  /**
   * Sync by the break: the force record's steepest drop ({@link
   * BreakAlignment#forceBreakTime_s}) against the tracked point's jump, the frame-to-frame step
   * that differs most from the local rate (the median step of the ten rows around it). The jump
   * happened between two frames, so its instant is taken as their midpoint: good to half a frame
   * period, and the force's to half a sample period.
   *
   * @param runTime_s the run's times, seconds
   * @param force_N the run's forces, newtons
   * @param table the tracked table (rows up to the first lost frame are used)
   * @throws LoadstoneException when either record shows no clear break
   */
  public static VideoSync byBreak(double[] runTime_s, double[] force_N, VideoTable table) {
    double forceBreak;
    try {
      forceBreak = BreakAlignment.forceBreakTime_s(runTime_s, force_N);
    } catch (LoadstoneException e) {
      throw new LoadstoneException("the clip cannot be synchronised by the break: "
          + e.getMessage() + " Use the sync light or give the offset.", e, Setting.VIDEO_SYNC);
    }
    PositionTable p = table.positionTable();
    double clipBreak = jump(p.time_s(), p.position_mm());
    return new VideoSync("break", clipBreak - forceBreak, String.format(Locale.ROOT,
        "break at run time %.4f s and clip time %.4f s", forceBreak, clipBreak));
  }

  /** Standard-deviation multiple by which the jump must stand out of the step noise. */
  static final double JUMP_STANDS_OUT = 10;

  static double jump(double[] t, double[] x) {
    int m = t.length - 1;
    if (m < 5) {
      throw new LoadstoneException("the clip has " + t.length + " frames with a position before "
          + "the point was lost; finding the break needs at least 6", Setting.VIDEO_SYNC);
    }
    double[] resid = new double[m];
    for (int i = 0; i < m; i++) {
      double[] around = new double[Math.min(m, i + 6) - Math.max(0, i - 5) - 1];
      int k = 0;
      for (int j = Math.max(0, i - 5); j < Math.min(m, i + 6); j++) {
        if (j != i) {
          around[k++] = x[j + 1] - x[j];
        }
      }
      resid[i] = x[i + 1] - x[i] - median(around);
    }
    int best = 0;
    for (int i = 1; i < m; i++) {
      if (Math.abs(resid[i]) > Math.abs(resid[best])) {
        best = i;
      }
    }
    double[] abs = new double[m];
    for (int i = 0; i < m; i++) {
      abs[i] = Math.abs(resid[i]);
    }
    double sd = 1.4826 * median(abs);
    if (!(Math.abs(resid[best]) > JUMP_STANDS_OUT * sd)) {
      throw new LoadstoneException(String.format(Locale.ROOT, "the tracked point shows no clear "
          + "jump at the break (its largest step, %.4f mm, is within %.0f times the step noise "
          + "%.4f mm), so the clip cannot be synchronised by the break: use the sync light or "
          + "give the offset", Math.abs(resid[best]), JUMP_STANDS_OUT, sd), Setting.VIDEO_SYNC);
    }
    return 0.5 * (t[best] + t[best + 1]);
  }

  private static double median(double[] v) {
    double[] a = v.clone();
    java.util.Arrays.sort(a);
    int n = a.length;
    return n % 2 == 1 ? a[n / 2] : 0.5 * (a[n / 2 - 1] + a[n / 2]);
  }

  /**
   * Sync by the light: the first frame whose light region is brighter than halfway between its
   * darkest and brightest mean is the frame in which the light came on.
   *
   * @param track a track with a light region
   * @param lightOnRun_s when the light came on, in run time, seconds
   * @throws LoadstoneException when the track has no light region, or the region never changes
   *     by {@link #LIGHT_CONTRAST} grey levels (the light is not in it, or never came on), or is
   *     bright from the first frame (the clip starts after the light came on)
   */
  public static VideoSync byLight(Track track, double lightOnRun_s) {
    if (track.lightRegion() == null) {
      throw new LoadstoneException("no sync-light region was marked: mark the region where the "
          + "light shows", Setting.VIDEO_SYNC);
    }
    double lo = Double.POSITIVE_INFINITY;
    double hi = Double.NEGATIVE_INFINITY;
    for (TrackedFrame f : track.frames()) {
      lo = Math.min(lo, f.light());
      hi = Math.max(hi, f.light());
    }
    if (!(hi - lo >= LIGHT_CONTRAST)) {
      throw new LoadstoneException(String.format(Locale.ROOT, "the sync-light region changes "
          + "by only %.0f grey levels over the clip (at least %.0f are needed): the light is not "
          + "in the region or never came on; mark the region on the light, or sync by the break",
          hi - lo, LIGHT_CONTRAST), Setting.VIDEO_SYNC);
    }
    double mid = 0.5 * (lo + hi);
    TrackedFrame on = null;
    for (TrackedFrame f : track.frames()) {
      if (f.light() >= mid) {
        on = f;
        break;
      }
    }
    if (on == track.frames().get(0)) {
      throw new LoadstoneException("the sync light is already on in the clip's first frame, so "
          + "the instant it came on is not in the clip: start filming before arming the run",
          Setting.VIDEO_SYNC);
    }
    return new VideoSync("light", on.time_s() - lightOnRun_s, String.format(Locale.ROOT,
        "light on in frame %d at clip time %.4f s, run time %.4f s", on.index(), on.time_s(),
        lightOnRun_s));
  }
}
