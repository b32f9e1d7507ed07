package org.loadstone.acquire;

/**
 * How much of the load cell a reading uses, and whether it can be trusted at all: force as a
 * fraction of the cell's rated capacity against the run's overload warning and stop levels, and
 * whether the converter is saturated (its counts pinned at the end of its range, so the true force
 * is unknown and higher). One rule for the console's capacity bar and the command line.
 *
 * @param fraction |force| ÷ rated capacity (1 = full scale), NaN when the force or the capacity is
 *     unknown
 * @param level where the fraction lies against the warning and stop levels
 * @param saturated whether the converter's counts sit at the end of its range
 * @param capacity_N the rated capacity, NaN when unknown
 * @param warnFraction the warning level as a fraction of capacity
 * @param stopFraction the stop level as a fraction of capacity
 */
public record CapacityGauge(double fraction, Level level, boolean saturated, double capacity_N,
    double warnFraction, double stopFraction) {
  /**
   * The ends of a 24-bit converter's range after sign extension (protocol v1: a 24-bit converter
   * gives −8 388 608…8 388 607); a reading at or beyond them is saturated.
   */
  public static final long MIN_COUNTS = -8_388_608L;

  /** See {@link #MIN_COUNTS}. */
  public static final long MAX_COUNTS = 8_388_607L;

  /** Where a reading lies against the cell's limits. */
  public enum Level {
    /** capacity unknown (or no force yet) */
    UNKNOWN,
    /** below the overload warning level */
    NORMAL,
    /** at or above the warning level, below the stop level */
    WARNING,
    /** at or above the stop level, or the converter saturated: over range */
    OVER
  }

  /**
   * @param force_N the force, NaN when unknown
   * @param counts the raw counts of the same sample
   * @param capacity_N the cell's rated capacity, NaN or ≤ 0 when unknown
   * @param settings the overload warning and stop levels (% of rated capacity)
   * @return the gauge
   */
  public static CapacityGauge of(double force_N, long counts, double capacity_N,
      RunSettings settings) {
    double warn = settings.overloadWarnPct() / 100;
    double stop = settings.overloadStopPct() / 100;
    boolean saturated = counts <= MIN_COUNTS || counts >= MAX_COUNTS;
    boolean known = capacity_N > 0 && Double.isFinite(capacity_N) && Double.isFinite(force_N);
    double fraction = known ? Math.abs(force_N) / capacity_N : Double.NaN;
    Level level = saturated || (known && fraction >= stop) ? Level.OVER
        : !known ? Level.UNKNOWN : fraction >= warn ? Level.WARNING : Level.NORMAL;
    return new CapacityGauge(fraction, level, saturated,
        capacity_N > 0 ? capacity_N : Double.NaN, warn, stop);
  }

  /** @return whether the reading is over range: saturated, or at or above the stop level */
  public boolean overRange() {
    return level == Level.OVER;
  }

  /** @return the fraction for a bar, held to 0…1 (0 when unknown) */
  public double barFraction() {
    return Double.isNaN(fraction) ? 0 : Math.min(1, fraction);
  }

  /**
   * @return in words, e.g. {@code 63 % of 1000 N}, {@code SATURATED: the converter is at the end
   *     of its range}, {@code capacity unknown}
   */
  public String words() {
    if (saturated) {
      return "saturated: the converter is at the end of its range, the force is higher";
    }
    if (level == Level.UNKNOWN) {
      return Double.isNaN(capacity_N) ? "rated capacity unknown" : "no force yet";
    }
    String s = String.format(java.util.Locale.ROOT, "%.0f %% of %s N", 100 * fraction,
        trim(capacity_N));
    return level == Level.OVER ? s + ": over range"
        : level == Level.WARNING ? s + ": near the overload stop" : s;
  }

  private static String trim(double v) {
    return v == Math.rint(v) ? Long.toString((long) v) : Double.toString(v);
  }
}
