package org.loadstone.analysis.position;

import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * Position from a constant crosshead rate, for frames without a position channel:
 * position = rate × (time − first time). This ignores frame compliance and any slack at the
 * start; correct the first with {@link Compliance}.
 */
public final class CrossheadRate {
  private CrossheadRate() {}

  /**
   * @param time_s sample times, seconds, not null
   * @param rate_mm_per_min crosshead rate, millimetres per minute, finite and above zero
   * @return position in mm from the first sample, one per time stamp
   * @throws LoadstoneException when the rate is not finite and above zero
   */
  public static double[] position_mm(double[] time_s, double rate_mm_per_min) {
    Precondition.notNull(time_s, "time_s");
    if (!(Double.isFinite(rate_mm_per_min) && rate_mm_per_min > 0)) {
      throw new LoadstoneException(
          "Crosshead rate is " + rate_mm_per_min + " mm/min; it must be a finite number above "
              + "zero. Enter the rate set on the frame.");
    }
    double[] mm = new double[time_s.length];
    double perSecond = rate_mm_per_min / 60.0;
    for (int i = 0; i < time_s.length; i++) {
      mm[i] = perSecond * (time_s[i] - time_s[0]);
    }
    return mm;
  }
}
