package org.loadstone.analysis.stats;

import java.util.Optional;

/**
 * Grubbs' test for one outlier, two-sided (F. E. Grubbs, Technometrics 11, 1969; NIST/SEMATECH
 * e-Handbook of Statistical Methods, §1.3.5.17). G = max|xᵢ − x̄|/s; the value is an outlier when
 * G &gt; ((n − 1)/√n)·√(t²/(n − 2 + t²)), t the upper α/(2n) quantile of Student's t with n − 2
 * degrees of freedom. Needs n ≥ 3; tests only the single most extreme value.
 */
public final class Grubbs {
  private Grubbs() {}

  /**
   * A flagged value.
   *
   * @param index position in the group's value list, from 0
   * @param value the value
   * @param g Grubbs' statistic
   * @param critical the critical value it exceeded
   */
  public record Outlier(int index, double value, double g, double critical) {}

  /** The two-sided critical value of G for n values at significance alpha (n ≥ 3). */
  public static double critical(int n, double alpha) {
    if (n < 3 || !(alpha > 0 && alpha < 1)) {
      throw new IllegalArgumentException("Grubbs needs n ≥ 3 and 0 < alpha < 1");
    }
    double t = Distributions.studentTQuantile(1 - alpha / (2 * n), n - 2);
    return (n - 1) / Math.sqrt(n) * Math.sqrt(t * t / (n - 2 + t * t));
  }

  /**
   * Tests the most extreme value of a group.
   *
   * @return the outlier, or empty when there is none, fewer than 3 values, or no scatter
   */
  public static Optional<Outlier> test(double[] values, double alpha) {
    if (values.length < 3) {
      return Optional.empty();
    }
    double mean = GroupSummary.mean(values);
    double sd = Math.sqrt(GroupSummary.variance(values, mean));
    if (!(sd > 0)) {
      return Optional.empty();
    }
    int worst = 0;
    for (int i = 1; i < values.length; i++) {
      if (Math.abs(values[i] - mean) > Math.abs(values[worst] - mean)) {
        worst = i;
      }
    }
    double g = Math.abs(values[worst] - mean) / sd;
    double crit = critical(values.length, alpha);
    return g > crit
        ? Optional.of(new Outlier(worst, values[worst], g, crit))
        : Optional.empty();
  }
}
