package org.loadstone.analysis.stats;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * The outcome of {@link GroupComparison#compare}: per-group summaries, the test used, its
 * p-value, a plain sentence, outliers and sample-size advice.
 *
 * @param metric what was compared, e.g. "peak force"
 * @param groups summaries in the input order
 * @param test the test that was run
 * @param statistic t (Welch) or F (ANOVA); empty when no test was run
 * @param degreesOfFreedom Welch–Satterthwaite df, or the within-group df of the ANOVA; empty
 *     when no test was run
 * @param pValue the p-value; empty when no test was run ({@link #sentence()} says why)
 * @param sentence a plain-language reading of the result
 * @param outliers values flagged by Grubbs' test, by group
 * @param advice sample-size advice; empty when no group has 2 or more specimens
 */
public record ComparisonResult(
    String metric,
    List<GroupSummary> groups,
    Test test,
    OptionalDouble statistic,
    OptionalDouble degreesOfFreedom,
    OptionalDouble pValue,
    String sentence,
    List<FlaggedValue> outliers,
    Optional<SampleSizeAdvice> advice) {

  /** Which test was run. */
  public enum Test {
    /** two groups: Welch's unequal-variance t-test */
    WELCH_T,
    /** three or more groups: one-way analysis of variance */
    ONE_WAY_ANOVA,
    /** no test: a group has fewer than 2 specimens, or there is no scatter */
    NONE;

    /** @return the test in words, as reports and the command line name it */
    public String words() {
      return switch (this) {
        case WELCH_T -> "Welch's t-test";
        case ONE_WAY_ANOVA -> "one-way ANOVA";
        case NONE -> "none (a group has fewer than 2 specimens, or no scatter)";
      };
    }
  }

  /** Copies the lists. */
  public ComparisonResult {
    groups = List.copyOf(groups);
    outliers = List.copyOf(outliers);
  }

  /**
   * A value flagged as an outlier.
   *
   * @param group group name
   * @param outlier the Grubbs result (index within the group's list)
   */
  public record FlaggedValue(String group, Grubbs.Outlier outlier) {}

  /**
   * Sample-size advice for a two-group comparison at α = 0.05 with 80 % power.
   *
   * @param cvPct coefficient of variation used, per cent (the largest group CV, to be safe)
   * @param targetDifferencePct the relative difference to resolve, per cent
   * @param specimensPerGroup specimens per group that would resolve it
   * @param currentN the smallest group size now
   * @param resolvableDifferencePct the smallest relative difference the current n resolves, per
   *     cent; empty when a group has a single specimen
   * @param sentence the advice in words
   */
  public record SampleSizeAdvice(
      double cvPct,
      double targetDifferencePct,
      int specimensPerGroup,
      int currentN,
      OptionalDouble resolvableDifferencePct,
      String sentence) {}

  /**
   * A JSON-friendly view: {@code metric, test, p_value, sentence} and {@code groups}, a map from
   * group name to {@code n, mean, sd, cv_pct, ci95_low, ci95_high}. Absent values are
   * {@code null}. Maps keep the input order.
   */
  public Map<String, Object> toJsonView() {
    Map<String, Object> out = new LinkedHashMap<>();
    out.put("metric", metric);
    out.put("test", test.name().toLowerCase(java.util.Locale.ROOT));
    out.put("p_value", box(pValue));
    out.put("sentence", sentence);
    Map<String, Object> gs = new LinkedHashMap<>();
    for (GroupSummary g : groups) {
      Map<String, Object> m = new LinkedHashMap<>();
      m.put("n", g.n());
      m.put("mean", g.mean());
      m.put("sd", box(g.sd()));
      m.put("cv_pct", box(g.cvPct()));
      m.put("ci95_low", box(g.ci95Low()));
      m.put("ci95_high", box(g.ci95High()));
      gs.put(g.name(), m);
    }
    out.put("groups", gs);
    return out;
  }

  private static Double box(OptionalDouble v) {
    return v.isPresent() ? v.getAsDouble() : null;
  }
}
