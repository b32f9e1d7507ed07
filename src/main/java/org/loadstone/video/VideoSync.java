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
 * @param method "break", "change", "light" or "offset"
 * @param offset_s clip time minus run time for the same instant, seconds
 * @param detail how it was found, in words
 */
public record VideoSync(String method, double offset_s, String detail) {

  /** The ways a clip is put on a run's clock. */
  public enum Way {
    /** The tracked point's jump against the force's drop. */
    BREAK,
    /** The image's sudden change against the force's drop. */
    CHANGE,
    /** The sync light's first bright frame against the run time it came on. */
    LIGHT,
    /** An offset given by hand. */
    OFFSET;

    /** @return the lower-case word */
    public String word() {
      return name().toLowerCase(Locale.ROOT);
    }
  }

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
    double forceBreak = forceBreak(runTime_s, force_N);
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
    double[] steps = new double[m];
    for (int i = 0; i < m; i++) {
      steps[i] = x[i + 1] - x[i];
    }
    Spike s = Spike.in(steps);
    if (!s.standsOut()) {
      throw new LoadstoneException(String.format(Locale.ROOT, "the tracked point shows no clear "
          + "jump at the break (its largest step, %.4f mm, is within %.0f times the step noise "
          + "%.4f mm), so the clip cannot be synchronised by the break: use the sync light or "
          + "give the offset", s.size(), JUMP_STANDS_OUT, s.noise()), Setting.VIDEO_SYNC);
    }
    return 0.5 * (t[s.index()] + t[s.index() + 1]);
  }

  /**
   * The value of a series that differs most from the local level (the median of the ten values
   * around it), with the series' robust noise (1.4826 × the median absolute difference).
   */
  record Spike(int index, double size, double noise) {
    static Spike in(double[] v) {
      int m = v.length;
      double[] resid = new double[m];
      for (int i = 0; i < m; i++) {
        double[] around = new double[Math.min(m, i + 6) - Math.max(0, i - 5) - 1];
        int k = 0;
        for (int j = Math.max(0, i - 5); j < Math.min(m, i + 6); j++) {
          if (j != i) {
            around[k++] = v[j];
          }
        }
        resid[i] = Math.abs(v[i] - median(around));
      }
      int best = 0;
      for (int i = 1; i < m; i++) {
        if (resid[i] > resid[best]) {
          best = i;
        }
      }
      return new Spike(best, resid[best], 1.4826 * median(resid));
    }

    boolean standsOut() {
      return size > JUMP_STANDS_OUT * noise;
    }
  }

  /**
   * Sync by the image change at the break: the force record's steepest drop against the frame in
   * which the image changed most suddenly ({@link TrackedFrame#change()}, the difference from the
   * frame before standing out of the local level by {@link #JUMP_STANDS_OUT} robust SDs). The
   * break happened between that frame and the one before, so its instant is taken as their
   * midpoint: good to half a frame period. Needs no tracked point: lost frames count too.
   *
   * @param runTime_s the run's times, seconds
   * @param force_N the run's forces, newtons
   * @param track the tracked clip (its change series, in the region asked for)
   * @throws LoadstoneException when the force shows no clear break, the clip has fewer than 7
   *     frames, or no change stands out
   */
  public static VideoSync byImageChange(double[] runTime_s, double[] force_N, Track track) {
    double forceBreak = forceBreak(runTime_s, force_N);
    java.util.List<TrackedFrame> f = track.frames();
    if (f.size() < 7) {
      throw new LoadstoneException("the clip has " + f.size() + " frames; finding the image "
          + "change at the break needs at least 7", Setting.VIDEO_SYNC);
    }
    double[] change = new double[f.size() - 1];
    for (int i = 1; i < f.size(); i++) {
      change[i - 1] = f.get(i).change();
    }
    Spike s = Spike.in(change);
    if (!s.standsOut()) {
      throw new LoadstoneException(String.format(Locale.ROOT, "the image shows no sudden change "
          + "at the break (its largest change, %.3g grey levels², is within %.0f times the "
          + "frame-to-frame noise %.3g), so the clip cannot be synchronised by the image change: "
          + "mark a region over the specimen, use the sync light or give the offset", s.size(),
          JUMP_STANDS_OUT, s.noise()), Setting.VIDEO_SYNC);
    }
    // fragments may keep the image changing for a few frames, the most in a later one: the
    // break is where the burst began, the first of the frames in a row above half its height
    double level = median(change);
    int first = s.index();
    while (first > 0 && change[first - 1] - level > 0.5 * (change[s.index()] - level)) {
      first--;
    }
    TrackedFrame a = f.get(first);
    TrackedFrame b = f.get(first + 1);
    double clipBreak = 0.5 * (a.time_s() + b.time_s());
    return new VideoSync("change", clipBreak - forceBreak, String.format(Locale.ROOT,
        "break at run time %.4f s; image change between frames %d and %d, clip time %.4f s",
        forceBreak, a.index(), b.index(), clipBreak));
  }

  private static double forceBreak(double[] runTime_s, double[] force_N) {
    try {
      return BreakAlignment.forceBreakTime_s(runTime_s, force_N);
    } catch (LoadstoneException e) {
      throw new LoadstoneException("the clip cannot be synchronised by the break: "
          + e.getMessage() + " Use the sync light or give the offset.", e, Setting.VIDEO_SYNC);
    }
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
