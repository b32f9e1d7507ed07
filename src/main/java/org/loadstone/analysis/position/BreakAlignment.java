package org.loadstone.analysis.position;

import java.util.Arrays;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * Finds the clock offset between a force record and a position table from the break, which both
 * records show as a sharp change.
 *
 * <ul>
 *   <li>Force: the interval with the most negative slope ΔF/Δt; the break instant is its
 *       midpoint (at most half a force sample period off).
 *   <li>Position table: the row where the rate ΔX/Δt changes most; the instant is refined by
 *       intersecting straight lines fitted to up to 5 rows before and 5 rows after that row's
 *       neighbourhood, so it is found between rows.
 * </ul>
 *
 * <p>A table with a jump (a step larger than the noise, {@link PositionTable#jumps}: the tracked
 * point springs at the break or slips) has its break at the jump, between the two rows around
 * it; lines fitted across a jump would meet far from it.
 *
 * <p>Each change must stand out: the force drop must be at least 10 × the median absolute
 * sample-to-sample slope, and so must the rate change in the table; otherwise the break is not
 * clear enough and an offset must be given by hand.
 */
public final class BreakAlignment {
  private BreakAlignment() {}

  /**
   * @param offset_s table clock minus force clock, for {@link PositionTable#resampleOnto}
   * @param forceBreakTime_s break instant in the force clock, seconds
   * @param tableBreakTime_s break instant in the table clock, seconds
   */
  public record Alignment(double offset_s, double forceBreakTime_s, double tableBreakTime_s) {}

  /**
   * Aligns the table to the force record by the break.
   *
   * @param forceTime_s force times, seconds, strictly increasing, at least 3
   * @param force_N forces, newtons, same length
   * @param table the position table, at least 4 rows
   * @throws LoadstoneException when either record is too short or shows no clear break
   */
  public static Alignment byBreak(double[] forceTime_s, double[] force_N, PositionTable table) {
    Precondition.notNull(forceTime_s, "forceTime_s");
    Precondition.notNull(force_N, "force_N");
    Precondition.notNull(table, "table");
    if (forceTime_s.length != force_N.length || force_N.length < 3) {
      throw new LoadstoneException(
          "Break alignment needs a force record of at least 3 samples with one force per time; got "
              + forceTime_s.length + " times and " + force_N.length + " forces.");
    }
    double tf = forceBreak(forceTime_s, force_N);
    double tt = jumpBreak(table);
    if (Double.isNaN(tt)) {
      tt = tableBreak(table.time_s(), table.position_mm());
    }
    return new Alignment(tt - tf, tf, tt);
  }

  /**
   * The break of a table with a jump ({@link PositionTable#jumps}): the first jump is the break
   * itself, at an unknown instant between its two rows, taken as their middle (at most half a
   * row interval off); NaN when the table has no jump.
   */
  static double jumpBreak(PositionTable table) {
    boolean[] jump = table.jumps();
    double[] t = table.time_s();
    for (int j = 0; j < jump.length; j++) {
      if (jump[j]) {
        return 0.5 * (t[j] + t[j + 1]);
      }
    }
    return Double.NaN;
  }

  /**
   * The break instant of a force record alone: the midpoint of its steepest drop.
   *
   * @param t times, seconds, increasing, at least 3
   * @param f forces, newtons, same length
   * @throws LoadstoneException when the steepest drop does not stand out from the noise
   */
  public static double forceBreakTime_s(double[] t, double[] f) {
    Precondition.notNull(t, "t");
    Precondition.notNull(f, "f");
    if (t.length != f.length || f.length < 3) {
      throw new LoadstoneException("the force record has " + f.length + " samples; finding "
          + "its break needs at least 3 with one force per time");
    }
    return forceBreak(t, f);
  }

  static double forceBreak(double[] t, double[] f) {
    int n = f.length;
    double[] slope = new double[n - 1];
    int worst = 0;
    for (int i = 0; i < n - 1; i++) {
      slope[i] = (f[i + 1] - f[i]) / (t[i + 1] - t[i]);
      if (slope[i] < slope[worst]) {
        worst = i;
      }
    }
    double median = median(slope);
    if (!(-slope[worst] > 10 * median)) {
      throw new LoadstoneException(
          "The force record shows no clear break (its steepest drop does not stand out from the "
              + "noise), so it cannot be aligned with the position table automatically. Give the "
              + "time offset by hand.");
    }
    return 0.5 * (t[worst] + t[worst + 1]);
  }

  static double tableBreak(double[] t, double[] x) {
    int m = t.length;
    if (m < 4) {
      throw new LoadstoneException(
          "The position table has " + m + " rows; automatic alignment needs at least 4. Give the "
              + "time offset by hand.");
    }
    double[] v = new double[m - 1];
    for (int i = 0; i < m - 1; i++) {
      v[i] = (x[i + 1] - x[i]) / (t[i + 1] - t[i]);
    }
    double[] dv = new double[m - 2];
    int best = 0;
    for (int j = 1; j < m - 1; j++) {
      dv[j - 1] = Math.abs(v[j] - v[j - 1]);
      if (dv[j - 1] > dv[best]) {
        best = j - 1;
      }
    }
    int row = best + 1;
    if (!(dv[best] > 10 * median(dv))) {
      throw new LoadstoneException(
          "The position table shows no clear change of rate at the break, so it cannot be aligned "
              + "automatically. Give the time offset by hand.");
    }
    // lines clear of the kink: rows ≤ row − 1 before, rows ≥ row + 1 after
    int beforeEnd = row - 1;
    int afterStart = row + 1;
    double[] a = line(t, x, Math.max(0, beforeEnd - 4), beforeEnd);
    double[] b = line(t, x, afterStart, Math.min(m - 1, afterStart + 4));
    if (a == null || b == null || Math.abs(a[0] - b[0]) < 1e-12 * Math.max(1, Math.abs(a[0]))) {
      return t[row];
    }
    double cross = (b[1] - a[1]) / (a[0] - b[0]);
    // the kink lies within the rows adjacent to the chosen row; keep the estimate there
    return Math.min(Math.max(cross, t[row - 1]), t[row + 1]);
  }

  /** Least-squares line x = s·t + c over rows from..to; {s, c}, or null with fewer than 2 rows. */
  private static double[] line(double[] t, double[] x, int from, int to) {
    int n = to - from + 1;
    if (n < 2) {
      return null;
    }
    double mt = 0;
    double mx = 0;
    for (int i = from; i <= to; i++) {
      mt += t[i];
      mx += x[i];
    }
    mt /= n;
    mx /= n;
    double stt = 0;
    double stx = 0;
    for (int i = from; i <= to; i++) {
      stt += (t[i] - mt) * (t[i] - mt);
      stx += (t[i] - mt) * (x[i] - mx);
    }
    double s = stx / stt;
    return new double[] {s, mx - s * mt};
  }

  private static double median(double[] values) {
    double[] a = new double[values.length];
    for (int i = 0; i < a.length; i++) {
      a[i] = Math.abs(values[i]);
    }
    Arrays.sort(a);
    return a[a.length / 2];
  }
}
