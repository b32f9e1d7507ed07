package org.loadstone.analysis.stats;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import org.loadstone.analysis.stats.ComparisonResult.FlaggedValue;
import org.loadstone.analysis.stats.ComparisonResult.SampleSizeAdvice;
import org.loadstone.units.LoadstoneException;

/**
 * Compares groups of specimens on one metric (peak force, stiffness, energy, specific peak …).
 *
 * <p>Two groups: Welch's t-test; three or more: one-way ANOVA. Significance level 0.05, Grubbs'
 * outlier test at 0.05 per group, sample-size advice for 80 % power. When a group has a single
 * specimen no test is run and the sentence says so; the summaries are still given.
 */
public final class GroupComparison {
  private GroupComparison() {}

  /** Significance level of the test, the outlier check and the advice. */
  public static final double ALPHA = 0.05;
  /** Power for the sample-size advice. */
  public static final double POWER = 0.80;
  /** Default relative difference the advice aims to resolve: 10 %. */
  public static final double DEFAULT_TARGET_DIFFERENCE = 0.10;

  /** {@link #compare(String, Map, double)} with a 10 % target difference. */
  public static ComparisonResult compare(String metric, Map<String, List<Double>> groups) {
    return compare(metric, groups, DEFAULT_TARGET_DIFFERENCE);
  }

  /**
   * Compares the groups.
   *
   * @param metric plain name of the metric, used in the sentence, e.g. "peak force"
   * @param groups group name → per-specimen values (finite); iteration order is kept; at least 2
   *     groups, each with at least 1 value
   * @param targetDifference relative difference the advice aims to resolve, in (0, 10), e.g. 0.10
   * @throws LoadstoneException when fewer than 2 groups, a group is empty or a value not finite
   */
  public static ComparisonResult compare(
      String metric, Map<String, List<Double>> groups, double targetDifference) {
    if (metric == null || metric.isBlank()) {
      throw new IllegalArgumentException("Null or blank 'metric' argument.");
    }
    if (groups == null || groups.size() < 2) {
      throw new LoadstoneException(
          "Comparing " + metric + " needs at least 2 groups, was given "
              + (groups == null ? 0 : groups.size()) + ". Select runs from two or more groups.");
    }
    if (!(targetDifference > 0 && targetDifference < 10)) {
      throw new LoadstoneException(
          "Target difference " + targetDifference + " is not a fraction in (0, 10); give e.g. "
              + "0.10 for 10 %.");
    }
    List<String> names = new ArrayList<>();
    List<double[]> values = new ArrayList<>();
    List<GroupSummary> summaries = new ArrayList<>();
    List<FlaggedValue> outliers = new ArrayList<>();
    for (Map.Entry<String, List<Double>> e : groups.entrySet()) {
      double[] v = toArray(e.getKey(), e.getValue());
      names.add(e.getKey());
      values.add(v);
      GroupSummary s = GroupSummary.of(e.getKey(), v);
      summaries.add(s);
      Grubbs.test(v, ALPHA).ifPresent(o -> outliers.add(new FlaggedValue(e.getKey(), o)));
    }
    Optional<SampleSizeAdvice> advice = advice(summaries, targetDifference);

    List<String> small = new ArrayList<>();
    for (GroupSummary s : summaries) {
      if (s.n() < 2) {
        small.add("'" + s.name() + "'");
      }
    }
    if (!small.isEmpty()) {
      String sentence =
          "No test of " + metric + ": group" + (small.size() > 1 ? "s " : " ")
              + String.join(", ", small) + (small.size() > 1 ? " have" : " has")
              + " a single specimen, and a comparison needs at least 2 per group to judge the "
              + "scatter. Test more specimens.";
      return none(metric, summaries, sentence, outliers, advice);
    }
    try {
      if (values.size() == 2) {
        HypothesisTests.Welch w =
            HypothesisTests.welch(names.get(0), values.get(0), names.get(1), values.get(1));
        return new ComparisonResult(
            metric, summaries, ComparisonResult.Test.WELCH_T, OptionalDouble.of(w.t()),
            OptionalDouble.of(w.df()), OptionalDouble.of(w.pValue()),
            Wording.twoGroups(metric, summaries, w.pValue(), ALPHA), outliers, advice);
      }
      HypothesisTests.Anova a = HypothesisTests.oneWayAnova(names, values);
      return new ComparisonResult(
          metric, summaries, ComparisonResult.Test.ONE_WAY_ANOVA, OptionalDouble.of(a.f()),
          OptionalDouble.of(a.dfWithin()), OptionalDouble.of(a.pValue()),
          Wording.manyGroups(metric, summaries, a.pValue(), ALPHA), outliers, advice);
    } catch (LoadstoneException noScatter) {
      return none(metric, summaries, "No test of " + metric + ": " + noScatter.getMessage(),
          outliers, advice);
    }
  }

  private static ComparisonResult none(
      String metric, List<GroupSummary> s, String sentence, List<FlaggedValue> o,
      Optional<SampleSizeAdvice> advice) {
    return new ComparisonResult(
        metric, s, ComparisonResult.Test.NONE, OptionalDouble.empty(), OptionalDouble.empty(),
        OptionalDouble.empty(), sentence, o, advice);
  }

  private static double[] toArray(String name, List<Double> list) {
    if (name == null || name.isBlank()) {
      throw new LoadstoneException("A group has no name; give every group a name.");
    }
    if (list == null || list.isEmpty()) {
      throw new LoadstoneException(
          "Group '" + name + "' has no values. Add specimens to it or leave it out.");
    }
    double[] v = new double[list.size()];
    for (int i = 0; i < v.length; i++) {
      Double d = list.get(i);
      if (d == null) {
        throw new LoadstoneException(
            "Group '" + name + "' value " + (i + 1) + " is missing. Re-analyse or drop that run.");
      }
      v[i] = d;
    }
    return v;
  }

  private static Optional<SampleSizeAdvice> advice(List<GroupSummary> groups, double target) {
    double cv = -1;
    int minN = Integer.MAX_VALUE;
    for (GroupSummary g : groups) {
      minN = Math.min(minN, g.n());
      if (g.cvPct().isPresent()) {
        cv = Math.max(cv, g.cvPct().getAsDouble());
      }
    }
    if (!(cv > 0)) {
      return Optional.empty();
    }
    int need = SampleSize.perGroup(target / (cv / 100), ALPHA, POWER);
    OptionalDouble resolvable =
        minN >= 2
            ? OptionalDouble.of(SampleSize.smallestEffect(minN, ALPHA, POWER) * cv)
            : OptionalDouble.empty();
    String now =
        resolvable.isPresent()
            ? String.format(
                Locale.ROOT, "with %d per group now, differences of about %.1f %% can be told "
                    + "apart.", minN, resolvable.getAsDouble())
            : "a group of one cannot resolve any difference yet.";
    String sentence =
        String.format(
            Locale.ROOT,
            "With a scatter of %.1f %% (CV), %d specimens per group would show a %.0f %% "
                + "difference 8 times in 10 at the 5 %% level; %s",
            cv, need, target * 100, now);
    return Optional.of(
        new SampleSizeAdvice(cv, target * 100, need, minN, resolvable, sentence));
  }
}
