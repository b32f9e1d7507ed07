package org.loadstone.analysis.stats;

import java.util.List;
import org.loadstone.units.LoadstoneException;

/**
 * Welch's two-sample t-test and one-way analysis of variance, both two-sided / upper-tail as
 * usual. Formulas: B. L. Welch, Biometrika 34 (1947); F. E. Satterthwaite, Biometrics Bulletin 2
 * (1946) for the degrees of freedom; ANOVA as in any statistics text (e.g. Montgomery, "Design and
 * Analysis of Experiments", ch. 3).
 */
public final class HypothesisTests {
  private HypothesisTests() {}

  /**
   * Welch's t-test result.
   *
   * @param t the t statistic, (mean1 − mean2)/√(s1²/n1 + s2²/n2)
   * @param df Welch–Satterthwaite degrees of freedom
   * @param pValue two-sided p-value, in [0, 1]
   */
  public record Welch(double t, double df, double pValue) {}

  /**
   * One-way ANOVA result.
   *
   * @param f the F statistic, between-group over within-group mean square
   * @param dfBetween k − 1
   * @param dfWithin N − k
   * @param pValue upper-tail p-value, in [0, 1]
   */
  public record Anova(double f, int dfBetween, int dfWithin, double pValue) {}

  /**
   * Welch's unequal-variance t-test of two groups.
   *
   * @throws LoadstoneException when a group has fewer than 2 values, a value is not finite, or
   *     both groups have zero scatter
   */
  public static Welch welch(String name1, double[] a, String name2, double[] b) {
    GroupSummary.requireValues(name1, a, 2);
    GroupSummary.requireValues(name2, b, 2);
    double m1 = GroupSummary.mean(a);
    double m2 = GroupSummary.mean(b);
    double v1 = GroupSummary.variance(a, m1) / a.length;
    double v2 = GroupSummary.variance(b, m2) / b.length;
    double se2 = v1 + v2;
    if (!(se2 > 0)) {
      throw new LoadstoneException(
          "Groups '" + name1 + "' and '" + name2 + "' have no scatter at all (every value equal); "
              + "a t-test cannot judge the difference. Check that the values are real results.");
    }
    double t = (m1 - m2) / Math.sqrt(se2);
    double df = se2 * se2 / (v1 * v1 / (a.length - 1) + v2 * v2 / (b.length - 1));
    return new Welch(t, df, Distributions.studentTTwoSided(t, df));
  }

  /**
   * One-way ANOVA of two or more groups.
   *
   * @param names group names, same order as {@code groups}
   * @throws LoadstoneException when fewer than 2 groups, a group has fewer than 2 values, a value
   *     is not finite, or no group has any scatter
   */
  public static Anova oneWayAnova(List<String> names, List<double[]> groups) {
    if (groups.size() < 2 || names.size() != groups.size()) {
      throw new LoadstoneException(
          "A comparison needs at least 2 groups, was given " + groups.size()
              + ". Add another group.");
    }
    int total = 0;
    double grandSum = 0;
    for (int g = 0; g < groups.size(); g++) {
      GroupSummary.requireValues(names.get(g), groups.get(g), 2);
      total += groups.get(g).length;
      for (double x : groups.get(g)) {
        grandSum += x;
      }
    }
    double grand = grandSum / total;
    double ssb = 0;
    double ssw = 0;
    for (double[] v : groups) {
      double m = GroupSummary.mean(v);
      ssb += v.length * (m - grand) * (m - grand);
      ssw += GroupSummary.variance(v, m) * (v.length - 1);
    }
    int dfb = groups.size() - 1;
    int dfw = total - groups.size();
    if (!(ssw > 0)) {
      throw new LoadstoneException(
          "No group has any scatter (every value within each group equal); an analysis of "
              + "variance cannot judge the differences. Check that the values are real results.");
    }
    double f = (ssb / dfb) / (ssw / dfw);
    return new Anova(f, dfb, dfw, Distributions.fUpperTail(f, dfb, dfw));
  }
}
