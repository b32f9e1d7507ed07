package org.loadstone.analysis.position;

import java.util.Arrays;
import org.loadstone.analysis.PositionJumps;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * An imported position–time table (for example from a separate displacement logger), in its own
 * clock. {@link #resampleOnto} puts it on the force record's time stamps.
 *
 * <p>Outside the table's time range the position is unknown, so resampling refuses rather than
 * extrapolates or clamps: a clamped value would look like a stopped crosshead and bend the
 * stiffness and energy silently. Trim the force record to the covered span instead.
 *
 * @param time_s table times, seconds, strictly increasing, finite, at least 2
 * @param position_mm positions, millimetres, finite, same length
 * @throws LoadstoneException when the table is too short, the lengths differ, a value is not
 *     finite (the message names the column and row) or time does not increase
 */
public record PositionTable(double[] time_s, double[] position_mm) {

  /** Validates and copies. */
  public PositionTable {
    Precondition.notNull(time_s, "time_s");
    Precondition.notNull(position_mm, "position_mm");
    time_s = time_s.clone();
    position_mm = position_mm.clone();
    if (time_s.length < 2 || time_s.length != position_mm.length) {
      throw new LoadstoneException(
          "Position table has " + time_s.length + " times and " + position_mm.length
              + " positions; it needs at least 2 rows with one position per time.");
    }
    for (int i = 0; i < time_s.length; i++) {
      if (!Double.isFinite(time_s[i]) || !Double.isFinite(position_mm[i])) {
        throw new LoadstoneException(
            "Position table row " + i + " holds a non-finite "
                + (Double.isFinite(time_s[i]) ? "position_mm" : "time_s")
                + " value. Repair or remove that row.");
      }
      if (i > 0 && !(time_s[i] > time_s[i - 1])) {
        throw new LoadstoneException(
            "Position table time_s does not increase at row " + i + " (" + time_s[i - 1]
                + " s then " + time_s[i] + " s). Sort the table and remove repeated times.");
      }
    }
  }

  /** @return a copy of the table times, seconds */
  @Override
  public double[] time_s() {
    return time_s.clone();
  }

  /** @return a copy of the table positions, millimetres */
  @Override
  public double[] position_mm() {
    return position_mm.clone();
  }

  /**
   * Linearly interpolates the table at the force record's time stamps, except across a jump.
   *
   * <p>A jump (a break or a slip moving the tracked point at once) is a step between two rows
   * far larger than the table's motion and noise allow ({@link PositionJumps#of}: ten times the
   * typical travel in that time, the noise and the resolution). The instant of a jump between two
   * rows is unknown, so force samples that fall between those rows are not drawn towards the far
   * side: they continue the path before the jump at its rate (or hold the last position before
   * it). A straight line across a 2 mm jump would otherwise add up to 2 mm of travel, and the
   * energy under it, to the samples before the break.
   *
   * @param forceTime_s force-record times, seconds, increasing
   * @param offset_s table clock minus force clock for the same instant: the table is read at
   *     {@code forceTime_s[i] + offset_s}
   * @return one position per force time stamp, mm
   * @throws LoadstoneException when a force time falls outside the table's range; the message
   *     names the first such sample and the covered span
   */
  public double[] resampleOnto(double[] forceTime_s, double offset_s) {
    Precondition.notNull(forceTime_s, "forceTime_s");
    Precondition.finite(offset_s, "offset_s");
    double first = time_s[0];
    double last = time_s[time_s.length - 1];
    double[] out = new double[forceTime_s.length];
    boolean[] jump = jumps();
    int j = 0;
    for (int i = 0; i < forceTime_s.length; i++) {
      double tt = forceTime_s[i] + offset_s;
      if (!(tt >= first && tt <= last)) {
        throw new LoadstoneException(
            String.format(
                "Force sample %d at %.6g s falls at %.6g s in the position table, outside its "
                    + "range %.6g to %.6g s. The table cannot be extended; trim the force record "
                    + "to force times %.6g to %.6g s or import a longer table.",
                i, forceTime_s[i], tt, first, last, first - offset_s, last - offset_s));
      }
      if (tt < time_s[j]) {
        j = 0; // times out of order: restart the walk
      }
      while (j < time_s.length - 2 && time_s[j + 1] < tt) {
        j++;
      }
      if (jump[j]) {
        boolean before = j > 0 && !jump[j - 1];
        double rate = before
            ? (position_mm[j] - position_mm[j - 1]) / (time_s[j] - time_s[j - 1]) : 0;
        out[i] = position_mm[j] + rate * (tt - time_s[j]);
        continue;
      }
      double w = (tt - time_s[j]) / (time_s[j + 1] - time_s[j]);
      out[i] = position_mm[j] + w * (position_mm[j + 1] - position_mm[j]);
    }
    return out;
  }

  /**
   * @return for each row j, whether the step from row j to j + 1 is a jump ({@link
   *     PositionJumps#of}, the rule the run's own position column is read by)
   */
  boolean[] jumps() {
    return PositionJumps.of(time_s, position_mm);
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof PositionTable p
        && Arrays.equals(time_s, p.time_s)
        && Arrays.equals(position_mm, p.position_mm);
  }

  @Override
  public int hashCode() {
    return 31 * Arrays.hashCode(time_s) + Arrays.hashCode(position_mm);
  }

  @Override
  public String toString() {
    return "PositionTable[" + time_s.length + " rows]";
  }
}
