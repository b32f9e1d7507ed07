package org.loadstone.study;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import org.loadstone.analysis.stats.ComparisonResult;
import org.loadstone.analysis.stats.ComparisonResult.SampleSizeAdvice;
import org.loadstone.analysis.stats.GroupSummary;
import org.loadstone.units.Precondition;

/**
 * Groups of archived runs compared on one figure: what the command line, the console and the group
 * report all show.
 *
 * @param metric the figure compared, not null
 * @param values group name → the counted runs' values, in the order of {@link
 *     ComparisonResult#groups()}
 * @param comparison per group n, mean, SD, CV and 95 % CI; the test, its p, the plain-sentence
 *     reading and the sample-size advice
 * @param outliers values Grubbs' test flags, by run
 * @param leftOut runs not counted, with the reason: those the selection left out and those that
 *     lack this figure
 */
public record StudyResult(Metric metric, Map<String, List<Value>> values,
    ComparisonResult comparison, List<Outlier> outliers, List<LeftOut> leftOut) {

  /** Checks the fields and copies the collections, keeping their order. */
  public StudyResult {
    Precondition.notNull(metric, "metric");
    Precondition.notNull(values, "values");
    Precondition.notNull(comparison, "comparison");
    Map<String, List<Value>> copy = new LinkedHashMap<>();
    values.forEach((g, list) -> copy.put(g, List.copyOf(list)));
    values = Collections.unmodifiableMap(copy);
    outliers = List.copyOf(outliers);
    leftOut = List.copyOf(leftOut);
  }

  /**
   * One run's value.
   *
   * @param runId the run
   * @param specimen its specimen id
   * @param value the figure, in {@link Metric#unit()}
   */
  public record Value(String runId, String specimen, double value) {}

  /**
   * A value that stands out in its group (Grubbs' test at the 5 % level).
   *
   * @param group the group
   * @param runId the run
   * @param specimen its specimen id
   * @param value the figure, in {@link Metric#unit()}
   * @param g Grubbs' G of the value
   * @param critical the critical G it exceeds
   */
  public record Outlier(String group, String runId, String specimen, double value, double g,
      double critical) {}

  /** @return per group n, mean, SD, CV and 95 % CI, in group order */
  public List<GroupSummary> groups() {
    return comparison.groups();
  }

  /** @return the test run */
  public ComparisonResult.Test test() {
    return comparison.test();
  }

  /** @return the test's p-value; empty when no test could be run ({@link #sentence()} says why) */
  public OptionalDouble pValue() {
    return comparison.pValue();
  }

  /** @return the plain-sentence reading */
  public String sentence() {
    return comparison.sentence();
  }

  /** @return the sample-size advice; empty when no group has 2 or more runs */
  public Optional<SampleSizeAdvice> advice() {
    return comparison.advice();
  }

  /** @return the values alone, group → values, for charts */
  public Map<String, List<Double>> plainValues() {
    Map<String, List<Double>> out = new LinkedHashMap<>();
    values.forEach((g, list) -> out.put(g, list.stream().map(Value::value).toList()));
    return out;
  }

  /**
   * A JSON-friendly view with units in the keys: {@code metric} (the label), {@code metric_name},
   * {@code metric_key}, {@code unit}, {@code test}, {@code p_value}, {@code sentence}, {@code
   * groups} (name → {@code n, mean, sd, cv_pct, ci95_low, ci95_high}), {@code outliers} ({@code
   * run_id, specimen, group, value, grubbs_g, critical_g}), {@code advice} ({@code cv_pct,
   * target_difference_pct, specimens_per_group, current_n, resolvable_difference_pct, sentence},
   * or null), {@code counted} (the runs counted: {@code run_id, specimen, group, value}) and {@code
   * left_out} ({@link LeftOut#toJsonView}). Absent values are null.
   */
  public Map<String, Object> toJsonView() {
    Map<String, Object> j = new LinkedHashMap<>(comparison.toJsonView());
    j.put("metric_name", metric.word());
    j.put("metric_key", metric.key());
    j.put("unit", metric.unit());
    List<Map<String, Object>> flagged = new ArrayList<>();
    for (Outlier o : outliers) {
      Map<String, Object> m = new LinkedHashMap<>();
      m.put("run_id", o.runId());
      m.put("specimen", o.specimen());
      m.put("group", o.group());
      m.put("value", o.value());
      m.put("grubbs_g", o.g());
      m.put("critical_g", o.critical());
      flagged.add(m);
    }
    j.put("outliers", flagged);
    j.put("advice", advice().map(a -> {
      Map<String, Object> m = new LinkedHashMap<>();
      m.put("cv_pct", a.cvPct());
      m.put("target_difference_pct", a.targetDifferencePct());
      m.put("specimens_per_group", a.specimensPerGroup());
      m.put("current_n", a.currentN());
      m.put("resolvable_difference_pct", a.resolvableDifferencePct().isPresent()
          ? a.resolvableDifferencePct().getAsDouble() : null);
      m.put("sentence", a.sentence());
      return m;
    }).orElse(null));
    List<Map<String, Object>> counted = new ArrayList<>();
    values.forEach((g, list) -> list.forEach(v -> {
      Map<String, Object> m = new LinkedHashMap<>();
      m.put("run_id", v.runId());
      m.put("specimen", v.specimen());
      m.put("group", g);
      m.put("value", v.value());
      counted.add(m);
    }));
    j.put("counted", counted);
    j.put("left_out", leftOut.stream().map(LeftOut::toJsonView).toList());
    return j;
  }
}
