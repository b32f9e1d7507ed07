package org.loadstone.analysis.stats;

import org.loadstone.units.LoadstoneException;

/**
 * Specimens per group needed by a two-sided two-sample t-test (equal group sizes, equal scatter).
 *
 * <p>The effect size is d = (relative difference)/(CV as a fraction): both groups are assumed to
 * have the SD of the observed CV times a common mean, which is fair for differences of some tens
 * of per cent. The power is exact: with n per group the test statistic follows the noncentral t
 * on ν = 2n − 2 degrees of freedom with noncentrality δ = d·√(n/2), so the power is
 * P(T &gt; t_{1−α/2,ν}) + P(T &lt; −t_{1−α/2,ν}) ({@link Distributions#noncentralTCdf}; e.g. Cohen,
 * "Statistical Power Analysis for the Behavioral Sciences", 2nd ed., ch. 2, from memory). The
 * group size is the smallest n whose power reaches the wanted one. (The normal formula with t
 * quantiles, n ≥ 2·(t_{1−α/2} + t_power)²/d², is slightly optimistic at small n: at d = 3.04 it
 * gives 3 specimens, whose power is 0.79, not 0.80.)
 */
public final class SampleSize {
  private SampleSize() {}

  /**
   * @param effectSize d = difference / SD, above zero
   * @param alpha two-sided significance level, in (0, 1)
   * @param power wanted power, in (0, 1)
   * @return specimens per group, at least 2
   */
  public static int perGroup(double effectSize, double alpha, double power) {
    check(alpha, power);
    if (!(effectSize > 0) || Double.isInfinite(effectSize)) {
      throw new LoadstoneException(
          "Sample-size advice needs a positive, finite effect size; was " + effectSize
              + ". Give a difference above zero and a scatter above zero.");
    }
    double zsum = Distributions.normalQuantile(1 - alpha / 2) + Distributions.normalQuantile(power);
    int n = Math.max(2, (int) Math.ceil(2 * zsum * zsum / (effectSize * effectSize)));
    // the power grows with n: walk from the normal start to the smallest n that reaches it
    while (power(n, effectSize, alpha) < power) {
      n++;
    }
    while (n > 2 && power(n - 1, effectSize, alpha) >= power) {
      n--;
    }
    return n;
  }

  /**
   * Exact power of the two-sided two-sample t-test with {@code n} specimens per group.
   *
   * @param n specimens per group, at least 2
   * @param effectSize d = difference / SD, zero or more
   * @param alpha two-sided significance level, in (0, 1)
   * @return the probability of a significant result, in [α, 1)
   */
  public static double power(int n, double effectSize, double alpha) {
    requireTwo(n);
    if (!(effectSize >= 0) || Double.isInfinite(effectSize)) {
      throw new IllegalArgumentException("effect size must be finite and zero or more, was "
          + effectSize);
    }
    double df = 2.0 * n - 2;
    double crit = Distributions.studentTQuantile(1 - alpha / 2, df);
    double delta = effectSize * Math.sqrt(n / 2.0);
    if (delta > 10 * crit + 40) {
      // a difference of tens of SDs (identical specimens whose scatter is rounding): the
      // noncentral t's series would need δ²/2 terms, and P(T ≤ crit) is below e^-100 even at
      // two degrees of freedom (T < crit needs a χ² on 2 df above 2(δ/crit)²)
      return Math.nextDown(1.0);
    }
    return 1 - Distributions.noncentralTCdf(crit, df, delta)
        + Distributions.noncentralTCdf(-crit, df, delta);
  }

  /**
   * Smallest effect size d that n specimens per group resolve with the wanted power: the d whose
   * exact {@link #power} is {@code power}.
   *
   * @param n specimens per group, at least 2
   * @return d, zero when even no difference is found that often (power ≤ α)
   */
  public static double smallestEffect(int n, double alpha, double power) {
    check(alpha, power);
    requireTwo(n);
    if (power <= alpha) {
      return 0;
    }
    double df = 2.0 * n - 2;
    double lo = 0;
    double hi = Math.sqrt(2.0 / n) * (Distributions.studentTQuantile(1 - alpha / 2, df)
        + Math.abs(Distributions.studentTQuantile(power, df))) + 1;
    while (power(n, hi, alpha) < power) {
      lo = hi;
      hi *= 2;
    }
    for (int i = 0; i < 200 && hi - lo > 1e-13 * hi; i++) {
      double mid = 0.5 * (lo + hi);
      if (power(n, mid, alpha) < power) {
        lo = mid;
      } else {
        hi = mid;
      }
    }
    return hi;
  }

  private static void requireTwo(int n) {
    if (n < 2) {
      throw new LoadstoneException(
          "The resolvable difference needs at least 2 specimens per group; was " + n
              + ". Test more specimens.");
    }
  }

  private static void check(double alpha, double power) {
    if (!(alpha > 0 && alpha < 1 && power > 0 && power < 1)) {
      throw new IllegalArgumentException("alpha and power must lie in (0, 1)");
    }
  }
}
