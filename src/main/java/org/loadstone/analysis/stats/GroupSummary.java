package org.loadstone.analysis.stats;

import java.util.OptionalDouble;
import org.loadstone.units.LoadstoneException;

/**
 * Descriptive statistics of one group of specimens.
 *
 * <p>The mean uses a corrected two-pass sum and the standard deviation the n − 1 denominator with
 * deviations from that mean, which keeps full precision on data with many equal leading digits
 * (checked on the NIST StRD univariate sets). Values that need at least two specimens (SD, CV,
 * confidence interval) are empty for a group of one; {@link #requireSpread()} turns that into a
 * clear message.
 *
 * @param name group name, not blank
 * @param n number of specimens, at least 1
 * @param mean arithmetic mean
 * @param sd sample standard deviation (n − 1); empty when n = 1
 * @param cvPct coefficient of variation, 100·sd/|mean|; empty when n = 1 or the mean is 0
 * @param ci95Low lower end of the 95 % confidence interval of the mean (Student t); empty when n = 1
 * @param ci95High upper end of that interval; empty when n = 1
 */
public record GroupSummary(
    String name,
    int n,
    double mean,
    OptionalDouble sd,
    OptionalDouble cvPct,
    OptionalDouble ci95Low,
    OptionalDouble ci95High) {

  /** Checks the fields. */
  public GroupSummary {
    if (name == null || name.isBlank()) {
      throw new IllegalArgumentException("Null or blank 'name' argument.");
    }
    if (n < 1 || sd == null || cvPct == null || ci95Low == null || ci95High == null) {
      throw new IllegalArgumentException("GroupSummary needs n ≥ 1 and non-null optionals");
    }
  }

  /**
   * Summarises one group.
   *
   * @param name group name
   * @param values per-specimen values, finite, at least one
   * @throws LoadstoneException when the group is empty or holds a non-finite value
   */
  public static GroupSummary of(String name, double[] values) {
    requireValues(name, values, 1);
    int n = values.length;
    double mean = mean(values);
    if (n < 2) {
      return new GroupSummary(
          name, 1, mean, OptionalDouble.empty(), OptionalDouble.empty(), OptionalDouble.empty(),
          OptionalDouble.empty());
    }
    double sd = Math.sqrt(variance(values, mean));
    double half = Distributions.studentTQuantile(0.975, n - 1) * sd / Math.sqrt(n);
    OptionalDouble cv = mean != 0 ? OptionalDouble.of(100 * sd / Math.abs(mean)) : OptionalDouble.empty();
    return new GroupSummary(
        name, n, mean, OptionalDouble.of(sd), cv, OptionalDouble.of(mean - half),
        OptionalDouble.of(mean + half));
  }

  /**
   * @return the standard deviation
   * @throws LoadstoneException when the group has a single specimen
   */
  public double requireSpread() {
    if (sd.isEmpty()) {
      throw new LoadstoneException(
          "Group '" + name + "' has 1 specimen; its scatter (SD, CV, confidence interval) needs "
              + "at least 2. Test more specimens of this group.");
    }
    return sd.getAsDouble();
  }

  static double mean(double[] v) {
    double sum = 0;
    for (double x : v) {
      sum += x;
    }
    double m = sum / v.length;
    double corr = 0;
    for (double x : v) {
      corr += x - m;
    }
    return m + corr / v.length;
  }

  static double variance(double[] v, double mean) {
    double ss = 0;
    double s = 0;
    for (double x : v) {
      double d = x - mean;
      ss += d * d;
      s += d;
    }
    return (ss - s * s / v.length) / (v.length - 1);
  }

  static void requireValues(String name, double[] values, int min) {
    if (values == null || values.length < min) {
      throw new LoadstoneException(
          "Group '" + name + "' has " + (values == null ? 0 : values.length) + " value(s); "
              + "this needs at least " + min + ". Add specimens to the group or leave it out.");
    }
    for (int i = 0; i < values.length; i++) {
      if (!Double.isFinite(values[i])) {
        throw new LoadstoneException(
            "Group '" + name + "' value " + (i + 1) + " is " + values[i]
                + "; every specimen value must be a finite number. Re-analyse or drop that run.");
      }
    }
  }
}
