package org.loadstone.analysis;

import org.loadstone.units.Precondition;

/**
 * Jumps in a position record: a step between two successive readings far larger than the record's
 * own motion and noise allow — the tracked point springing at the break, a specimen slipping on a
 * support, an encoder losing its count. One rule for position tables (video tracks, loggers) and
 * for the position column of a run (encoder, gauge, imported), so both treat a jump alike: as a
 * break in the record, never as travel.
 *
 * <p>A step {@code j → j+1} is a jump when {@code |Δx| > 10·r·Δt + 10·σ + 10·q}, where {@code r}
 * is the speed around it (the median absolute speed of the five steps on each side, so a
 * crosshead that speeds up or returns after the break is not taken for a jump, while a single
 * step among slow ones is), {@code σ} the reading noise (from the median absolute second
 * difference, 1.4826·median/√6, for normal noise) and {@code q} the record's resolution: the median
 * step that moves at all (an encoder's count, a tracker's interpolated step), or, when larger, the
 * median of the many steps above three noise SDs (an encoder's count under the small continuous
 * steps a frame-compliance correction adds). A gap in time allows proportionally more travel, so lost
 * samples are not taken for a jump. Records of under five readings have none.
 */
public final class PositionJumps {
  private PositionJumps() {}

  /** Steps on each side whose speed tells the motion around a step. */
  static final int NEIGHBOURS = 5;

  /** Steps above the noise that make a resolution rather than a few jumps. */
  static final int MANY = 20;

  /** Steps before a jump whose speed the path goes on at across it. */
  static final int SPEED_SPAN = 10;

  /**
   * @param time_s reading times, seconds, increasing
   * @param position_mm readings, millimetres, finite, same length
   * @return for each reading j below the last, whether the step to j + 1 is a jump
   */
  public static boolean[] of(double[] time_s, double[] position_mm) {
    Precondition.notNull(time_s, "time_s");
    Precondition.notNull(position_mm, "position_mm");
    int m = position_mm.length - 1;
    boolean[] jump = new boolean[Math.max(m, 0)];
    if (m < 4 || time_s.length != position_mm.length) {
      return jump;
    }
    double[] speed = new double[m];
    for (int j = 0; j < m; j++) {
      double dt = time_s[j + 1] - time_s[j];
      speed[j] = dt > 0 ? Math.abs(position_mm[j + 1] - position_mm[j]) / dt : 0;
    }
    double[] work = new double[m];
    for (int j = 0; j < m - 1; j++) {
      work[j] = Math.abs(position_mm[j + 2] - 2 * position_mm[j + 1] + position_mm[j]);
    }
    double noise = 1.4826 * Selection.kth(work, m - 1, (m - 1) / 2) / Math.sqrt(6);
    double quantum = resolution(position_mm, 3 * noise, work);
    if (quantum == 0) {
      return jump; // the record never moves
    }
    double[] around = new double[2 * NEIGHBOURS];
    for (int j = 0; j < m; j++) {
      int count = 0;
      for (int i = Math.max(0, j - NEIGHBOURS); i <= Math.min(m - 1, j + NEIGHBOURS); i++) {
        if (i != j) {
          around[count++] = speed[i];
        }
      }
      double local = Selection.kth(around, count, count / 2);
      double dt = Math.max(0, time_s[j + 1] - time_s[j]);
      double limit = 10 * local * dt + 10 * noise + 10 * quantum;
      jump[j] = Math.abs(position_mm[j + 1] - position_mm[j]) > limit;
    }
    return jump;
  }

  /**
   * The record's resolution: the median of the steps that move at all, or, when larger, the
   * median of the steps above {@code floor} if there are at least {@link #MANY} of them (an
   * encoder's counts among the small continuous steps a compliance correction adds; fewer are
   * jumps, not a resolution); 0 when nothing moves.
   */
  private static double resolution(double[] x, double floor, double[] work) {
    double q = 0;
    for (double above : new double[] {0, floor}) {
      int count = 0;
      for (int j = 0; j + 1 < x.length; j++) {
        double step = Math.abs(x[j + 1] - x[j]);
        if (step > above) {
          work[count++] = step;
        }
      }
      if (count > 0 && (above == 0 || count >= MANY)) {
        q = Math.max(q, Selection.kth(work, count, count / 2));
      }
    }
    return q;
  }

  /**
   * The record with its jumps taken out: across each jump the path goes on at the speed of the
   * readings before it (over up to {@link #SPEED_SPAN} steps that are not jumps; held when there
   * are none), and every reading after it is moved by the same amount, so the travel measured
   * before and after the jump is kept and the jump itself adds none.
   *
   * @param time_s reading times, seconds, increasing
   * @param position_mm readings, millimetres; not changed
   * @param jump {@link #of} of the same record
   * @param last the last reading to mend; jumps after it are left as measured
   * @return a new array, equal to {@code position_mm} up to the first jump
   */
  public static double[] mended(double[] time_s, double[] position_mm, boolean[] jump,
      int last) {
    double[] out = position_mm.clone();
    double shift = 0;
    for (int j = 0; j < jump.length && j < last; j++) {
      if (jump[j]) {
        double before = speedBefore(time_s, out, jump, j);
        double continued = out[j] + before * (time_s[j + 1] - time_s[j]);
        shift = continued - position_mm[j + 1];
      }
      out[j + 1] = position_mm[j + 1] + shift;
    }
    return out;
  }

  /** Signed speed over the up to {@link #SPEED_SPAN} readings before j with no jump, mm/s. */
  private static double speedBefore(double[] t, double[] x, boolean[] jump, int j) {
    int from = j;
    while (from > 0 && j - from < SPEED_SPAN && !jump[from - 1]) {
      from--;
    }
    double dt = t[j] - t[from];
    return from == j || !(dt > 0) ? 0 : (x[j] - x[from]) / dt;
  }
}
