package org.loadstone.analysis.stats;

import org.loadstone.units.LoadstoneException;

/**
 * Specimens per group needed by a two-sided two-sample t-test (equal group sizes, equal scatter).
 *
 * <p>The effect size is d = (relative difference)/(CV as a fraction): both groups are assumed to
 * have the SD of the observed CV times a common mean, which is fair for differences of some tens
 * of per cent. The group size is the smallest n with n ≥ 2·(t_{1−α/2, ν} + t_{power, ν})²/d²,
 * ν = 2n − 2, searched from the normal-approximation start n = 2·(z_{1−α/2} + z_{power})²/d²
 * (the usual t correction of the normal formula, e.g. Snedecor &amp; Cochran, "Statistical
 * Methods", §6.14). It slightly overstates the exact noncentral-t answer at very small n.
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
    // smallestEffect(n) falls as n grows, so walk from the normal start to the smallest n with
    // smallestEffect(n) ≤ d, i.e. n ≥ 2·(t + t)²/d² with the t quantiles at 2n − 2 df
    while (smallestEffect(n, alpha, power) > effectSize) {
      n++;
    }
    while (n > 2 && smallestEffect(n - 1, alpha, power) <= effectSize) {
      n--;
    }
    return n;
  }

  /**
   * Smallest effect size d resolvable with n specimens per group: √(2/n)·(t_{1−α/2,2n−2} +
   * t_{power,2n−2}).
   *
   * @param n specimens per group, at least 2
   */
  public static double smallestEffect(int n, double alpha, double power) {
    check(alpha, power);
    if (n < 2) {
      throw new LoadstoneException(
          "The resolvable difference needs at least 2 specimens per group; was " + n
              + ". Test more specimens.");
    }
    double df = 2.0 * n - 2;
    double s =
        Distributions.studentTQuantile(1 - alpha / 2, df) + Distributions.studentTQuantile(power, df);
    return Math.sqrt(2.0 / n) * s;
  }

  private static void check(double alpha, double power) {
    if (!(alpha > 0 && alpha < 1 && power > 0 && power < 1)) {
      throw new IllegalArgumentException("alpha and power must lie in (0, 1)");
    }
  }
}
