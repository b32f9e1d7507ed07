package org.loadstone.acquire;

import java.util.Locale;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Setting;

/**
 * How a crush run ends. A crush goes on through the load drops of its saw-tooth, so no drop
 * from the peak ends it; it ends at the first of: the crosshead's travel from the start of
 * recording reaching {@code travelLimit_mm}, force staying below {@code lowForceFraction} of the
 * peak for {@code lowForce_s} (the specimen is crushed through, or slid off), the run's time
 * limit ({@link RunSettings#maxSeconds()}), an overload, or the operator's stop.
 *
 * @param travelLimit_mm crosshead travel from the start of recording that ends the run, mm; 0 =
 *     no travel limit
 * @param lowForceFraction the run ends when force stays below this fraction of the peak; in
 *     [0, 1); 0 = off
 * @param lowForce_s ... for at least this long, s
 */
public record CrushEnd(double travelLimit_mm, double lowForceFraction, double lowForce_s) {
  /** No travel limit; force below 5 % of the peak for 1 s ends the run. */
  public static final CrushEnd DEFAULTS = new CrushEnd(0, 0.05, 1.0);

  /** Checks the ranges. */
  public CrushEnd {
    if (!(Double.isFinite(travelLimit_mm) && travelLimit_mm >= 0)) {
      throw new LoadstoneException("the crush run's travel limit must be 0 (none) or a positive "
          + "travel in mm, was " + num(travelLimit_mm) + ": give the crosshead travel at which "
          + "the crush is complete", Setting.TRAVEL_LIMIT);
    }
    if (!(lowForceFraction >= 0 && lowForceFraction < 1)) {
      throw new LoadstoneException("the crush run's low-force level must be 0 (off) or a "
          + "percentage of the peak below 100, was " + num(100 * lowForceFraction) + " %: give "
          + "e.g. 5 %", Setting.LOW_FORCE_LEVEL);
    }
    if (!(Double.isFinite(lowForce_s) && lowForce_s >= 0)) {
      throw new LoadstoneException("the crush run's low-force time must be 0 or more seconds, "
          + "was " + num(lowForce_s) + ": give how long force must stay low, e.g. 1 s",
          Setting.LOW_FORCE_TIME);
    }
  }

  /**
   * @param mm the travel that ends the run, mm; 0 for none
   * @return this rule with another travel limit
   * @throws LoadstoneException when the travel is negative or not finite
   */
  public CrushEnd withTravelLimit_mm(double mm) {
    return new CrushEnd(mm, lowForceFraction, lowForce_s);
  }

  /**
   * @param fraction share of the peak below which force counts as low, in [0, 1); 0 = off
   * @param seconds how long it must stay low, s
   * @return this rule with another low-force end
   * @throws LoadstoneException when either is out of range
   */
  public CrushEnd withLowForce(double fraction, double seconds) {
    return new CrushEnd(travelLimit_mm, fraction, seconds);
  }

  /** @return the rule in words, e.g. "at 12 mm of travel, or below 5 % of the peak for 1 s" */
  public String words() {
    String travel = travelLimit_mm > 0 ? "at " + num(travelLimit_mm) + " mm of travel" : null;
    String low = lowForceFraction > 0 ? "when force stays below " + num(100 * lowForceFraction)
        + " % of the peak for " + num(lowForce_s) + " s" : null;
    if (travel != null && low != null) {
      return travel + ", or " + low;
    }
    return travel != null ? travel : low != null ? low : "by hand or at the time limit only";
  }

  private static String num(double v) {
    return String.format(Locale.ROOT, "%.6g", v).replaceAll("\\.?0+($|e)", "$1");
  }
}
