package org.loadstone.analysis;

import java.util.Locale;

/**
 * Finds the initial straight region of the rise of a force–displacement curve and fits it, or
 * says why it cannot.
 *
 * <ol>
 *   <li><b>Where the first rise ends.</b> The search looks only before the first yield, plateau or
 *       peak: the first local maximum of the smoothed force that the force then leaves by more
 *       than the noise (eight smoothed-noise SDs, at least 2 % of the rise), or earlier, the first
 *       place where the local slope (over 10 % of that rise in force) falls below half of the
 *       steepest slope seen before it, each judged with two standard errors to spare. A steeper
 *       region later in the curve (densification, stiffening) is therefore never a candidate.
 *   <li><b>Windows in force span.</b> That first rise is cut at 40 force levels (2.5 % of it
 *       each); a window runs from where the loading path first reaches one level to where it
 *       first reaches a higher one, at least two levels on, and takes every sample in between.
 *       Each window is fitted in O(1) from prefix sums ({@link LinearWindows}).
 *   <li><b>Straight.</b> A window is straight when a parabola fitted over it has a quadratic
 *       term within 2 of its standard errors of zero and changes the slope across the window
 *       by less than 10 %, and when its middle third agrees in slope with either outer third in
 *       the same way (a toe at one end and a bend-over at the other cancel in the parabola, not
 *       in the thirds). A curving toe, a bend-over or a slip inside the window shows as one or
 *       the other.
 *   <li><b>Initial.</b> A window's slope must reach 90 % of the steepest local slope (less two
 *       standard errors) seen in the first rise, so a straight stretch after a first bend-over
 *       is not taken for the initial one.
 *   <li><b>Known well enough.</b> Among those windows the one whose slope has the smallest
 *       relative standard error is chosen: at a given noise that is the longest straight
 *       stretch. Its slope is then refitted directly with a standard error widened for
 *       residuals that follow one another. When the half-width of its 95 % interval exceeds
 *       the required precision, the search refuses and names the window as the closest band.
 * </ol>
 */
final class StiffnessSearch {
  static final int LEVELS = 40;
  private static final double T_CRIT = 2.0;
  private static final double STEEPEST_SHARE = 0.9;
  private static final double MAX_PART_DIFFERENCE = 0.10;

  private StiffnessSearch() {}

  /** A fit or a refusal, exactly one of them non-null. */
  record Outcome(StiffnessFit fit, StiffnessRefusal refusal) {}

  /**
   * @param p the rise
   * @param precision the required half-width of the slope's 95 % interval, fraction of the slope
   */
  static Outcome automatic(RiseProfile p, double precision) {
    if (p.peak + 1 < 6) {
      return refuse(p, "the rise has only " + (p.peak + 1) + " samples; a stiffness needs a "
          + "straight stretch of at least 6", 0, p.peak);
    }
    LinearWindows sums = new LinearWindows(p.x, p.y, p.peak + 1);
    RiseEnd first = firstRiseEnd(p, sums);
    int end = first.index();
    double base = p.smooth[0];
    double rise = p.smooth[end] - base;
    if (!(rise > 0)) {
      return refuse(p, "the force does not rise before the first peak", 0, end);
    }
    int[] at = crossings(p, base, rise, LEVELS, end);
    LinearWindows.Line best = null;
    double bestScore = Double.POSITIVE_INFINITY;
    LinearWindows.Line nearest = null;
    double nearestMiss = Double.POSITIVE_INFINITY;
    for (int a = 1; a <= LEVELS - 2; a++) {
      for (int c = a + 2; c <= LEVELS; c++) {
        int from = at[a];
        int to = Math.min(at[c], end);
        if (to - from + 1 < 6) {
          continue;
        }
        LinearWindows.Line line = sums.fit(from, to);
        if (line == null || !(line.slope() > 0)) {
          continue;
        }
        double miss = straightnessMiss(sums, line, p.x, at, a, c, end);
        double score = line.slopeSe() / line.slope();
        boolean initial = line.slope() >= STEEPEST_SHARE * first.steepest_N_per_mm();
        if (miss <= 1 && initial && score < bestScore) {
          best = line;
          bestScore = score;
        }
        if (miss < nearestMiss) {
          nearest = line;
          nearestMiss = miss;
        }
      }
    }
    if (best == null) {
      if (nearest == null) {
        return refuse(p, "the first rise holds too few samples between its force levels for a "
            + "straight-line fit", 0, end);
      }
      return refuse(p, "no stretch of the first rise (up to " + fmt(p.y[end]) + " N) is "
          + "straight: every window's parts differ in slope by more than the noise allows (a "
          + "curving toe, a bend-over or slips)", nearest.from(), nearest.to());
    }
    StiffnessFit fit =
        StiffnessFit.over(p.x, p.y, best.from(), best.to(), StiffnessFit.Method.AUTOMATIC);
    if (fit == null) {
      return refuse(p, "the straightest window has no rising slope", best.from(), best.to());
    }
    if (fit.relativeHalfWidth95() > precision) {
      return new Outcome(null, new StiffnessRefusal(String.format(Locale.ROOT,
          "the longest straight window of the first rise (%s to %s N, samples %d to %d) knows "
              + "the slope only to ±%.1f %% (95 %%) at this noise (about %s N), coarser than the "
              + "required ±%.1f %%", fmt(fit.fromForce_N()), fmt(fit.toForce_N()),
          fit.fromIndex(), fit.toIndex(), 100 * fit.relativeHalfWidth95(), fmt(p.noise_N),
          100 * precision), fit.fromForce_N(), fit.toForce_N(), fit.fromIndex(), fit.toIndex(),
          fit.slope_N_per_mm(), fit.relativeHalfWidth95()));
    }
    return new Outcome(fit, null);
  }

  /**
   * How far a window is from straight: the largest ratio of a part-to-part slope difference to
   * what noise and the 10 % bound allow; at most 1 means straight.
   */
  private static double straightnessMiss(
      LinearWindows sums, LinearWindows.Line whole, double[] x, int[] at, int a, int c, int end) {
    double range = Math.abs(x[whole.to()] - x[whole.from()]);
    double[] bend = sums.curvature(whole.from(), whole.to(), range);
    double k = whole.slope();
    double miss = Math.abs(bend[0]) <= 1e-9 * k ? 0
        : Math.max(Math.abs(bend[1]) / T_CRIT, Math.abs(bend[0]) / (MAX_PART_DIFFERENCE * k));
    if (c - a >= 3) {
      int t1 = Math.min(at[a + (c - a) / 3], end);
      int t2 = Math.min(at[a + (2 * (c - a)) / 3], end);
      miss = Math.max(miss, partMiss(sums, whole, whole.from(), t1, t1, t2));
      miss = Math.max(miss, partMiss(sums, whole, t2, whole.to(), t1, t2));
    }
    return miss;
  }

  private static double partMiss(
      LinearWindows sums, LinearWindows.Line whole, int a0, int a1, int b0, int b1) {
    if (a1 - a0 + 1 < 3 || b1 - b0 + 1 < 3) {
      return 0; // too short to judge: the whole window's own tests decide
    }
    LinearWindows.Line u = sums.fit(a0, a1);
    LinearWindows.Line v = sums.fit(b0, b1);
    if (u == null || v == null) {
      return Double.POSITIVE_INFINITY;
    }
    double d = Math.abs(u.slope() - v.slope());
    double noise = T_CRIT * Math.hypot(u.slopeSe(), v.slopeSe());
    double floor = 1e-9 * Math.abs(whole.slope());
    return Math.max(d / Math.max(noise, floor), d / (MAX_PART_DIFFERENCE * whole.slope()));
  }

  /**
   * The end of the first rise and the steepest slope seen before it.
   *
   * @param index last sample of the first rise
   * @param steepest_N_per_mm the largest local slope less two standard errors before it, N/mm
   */
  record RiseEnd(int index, double steepest_N_per_mm) {}

  /**
   * The last sample of the first rise: the peak, or an earlier local maximum that the force
   * leaves by more than the noise, or where the local slope first falls below half.
   */
  static RiseEnd firstRiseEnd(RiseProfile p, LinearWindows sums) {
    double base = p.smooth[0];
    double rise = p.smooth[p.peak] - base;
    double smoothNoise = p.noise_N / Math.sqrt(2 * p.halfWidth + 1);
    double drop = Math.max(8 * smoothNoise, 0.02 * rise);
    int top = 0;
    int end = p.peak;
    for (int i = 1; i <= p.peak; i++) {
      if (p.smooth[i] > p.smooth[top]) {
        top = i;
      } else if (p.smooth[i] < p.smooth[top] - drop) {
        end = top;
        break;
      }
    }
    double r = p.smooth[end] - base;
    if (!(r > 0)) {
      return new RiseEnd(end, 0);
    }
    int levels = 20;
    int[] at = crossings(p, base, r, levels, end);
    double reference = 0;
    for (int l = 1; l < levels; l++) {
      int from = at[l - 1];
      int to = Math.min(at[l + 1], end);
      if (to - from + 1 < 4) {
        continue;
      }
      LinearWindows.Line line = sums.fit(from, to);
      if (line == null) {
        continue;
      }
      if (reference > 0 && line.slope() + 2 * line.slopeSe() < 0.5 * reference) {
        return new RiseEnd(Math.min(at[l], end), reference);
      }
      reference = Math.max(reference, line.slope() - 2 * line.slopeSe());
    }
    return new RiseEnd(end, reference);
  }

  /** First index where the smoothed force reaches base + rise·j/levels, j = 0..levels. */
  static int[] crossings(RiseProfile p, double base, double rise, int levels, int end) {
    int[] at = new int[levels + 1];
    int i = 0;
    for (int j = 0; j <= levels; j++) {
      double level = base + rise * j / levels;
      while (i < end && p.smooth[i] < level) {
        i++;
      }
      at[j] = i;
    }
    at[levels] = end;
    return at;
  }

  private static Outcome refuse(RiseProfile p, String reason, int from, int to) {
    StiffnessFit near = to > from
        ? StiffnessFit.over(p.x, p.y, from, to, StiffnessFit.Method.AUTOMATIC) : null;
    return new Outcome(null, new StiffnessRefusal(reason, p.y[from], p.y[to], from, to,
        near == null ? Double.NaN : near.slope_N_per_mm(),
        near == null ? Double.NaN : near.relativeHalfWidth95()));
  }

  static String fmt(double v) {
    return String.format(Locale.ROOT, "%.4g", v);
  }
}
