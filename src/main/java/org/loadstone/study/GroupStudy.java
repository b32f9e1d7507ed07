package org.loadstone.study;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import java.util.TreeMap;
import org.loadstone.analysis.stats.ComparisonResult;
import org.loadstone.analysis.stats.GroupComparison;
import org.loadstone.study.LeftOut.Kind;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * Compares groups of archived runs: the one service behind {@code loadstone compare}, {@code
 * loadstone report --group}, the console's archive review and the group report. Runs are chosen
 * by {@link RunSelection} ({@link ArchiveRuns#select}); each counted run's figure is taken through
 * the {@link Metric} catalogue and the groups are handed to {@link GroupComparison}.
 */
public final class GroupStudy {
  private GroupStudy() {}

  /**
   * The outcome of comparing on several figures, for a group report.
   *
   * @param selection the runs counted and left out
   * @param results one result per figure that could be compared, in the order asked
   * @param notCompared figures that could not be compared, each with the reason
   */
  public record Report(Selection selection, List<StudyResult> results, List<String> notCompared) {
    /** Copies the lists. */
    public Report {
      Precondition.notNull(selection, "selection");
      results = List.copyOf(results);
      notCompared = List.copyOf(notCompared);
    }
  }

  /**
   * Reads an archive folder, selects its runs and compares the groups: {@code
   * compare(ArchiveRuns.scan(folder).select(sel), metric, targetDifference)}.
   *
   * @throws LoadstoneException as {@link ArchiveRuns#scan}, {@link ArchiveRuns#select} and
   *     {@link #compare} do
   */
  public static StudyResult study(Path folder, RunSelection sel, Metric metric,
      double targetDifference) {
    return compare(ArchiveRuns.scan(folder).select(sel), metric, targetDifference);
  }

  /**
   * Compares the selected groups on one figure. Counted runs that lack it are left out with the
   * reason from their analysis notes.
   *
   * @param sel the selected runs, not null
   * @param metric a {@linkplain Metric#comparable() comparable} figure, not null
   * @param targetDifference relative difference the sample-size advice aims at, e.g. 0.10
   * @return the statistics with outliers by run and every left-out run
   * @throws LoadstoneException when fewer than 2 groups have counted runs with the figure (the
   *     message names the groups found and how many runs were left out, by kind)
   */
  public static StudyResult compare(Selection sel, Metric metric, double targetDifference) {
    Precondition.notNull(sel, "selection");
    Precondition.notNull(metric, "metric");
    if (!metric.comparable()) {
      throw new IllegalArgumentException(metric.word() + " is not a figure to compare groups on");
    }
    Map<String, List<StudyResult.Value>> values = new LinkedHashMap<>();
    List<LeftOut> leftOut = new ArrayList<>(sel.leftOut());
    sel.groups().forEach((g, runs) -> {
      for (RunMetrics m : runs) {
        OptionalDouble v = metric.of(m);
        if (v.isPresent()) {
          values.computeIfAbsent(g, k -> new ArrayList<>()).add(new StudyResult.Value(
              m.metadata().runId(), m.metadata().specimen(), v.getAsDouble()));
        } else {
          leftOut.add(new LeftOut(m.metadata().runId(), m.metadata().specimen(),
              m.metadata().group(), Kind.NO_VALUE, "no " + metric.label()
                  + (m.notes().isEmpty() ? "" : " (" + String.join(" ", m.notes()) + ")")));
        }
      }
    });
    if (values.size() < 2) {
      throw new LoadstoneException("comparing " + metric.label() + " needs counted runs with it "
          + "from at least 2 groups; found " + (values.isEmpty() ? "none"
              : values.size() + " (" + String.join(", ", values.keySet()) + ")")
          + (leftOut.isEmpty() ? "" : "; left out: " + tally(leftOut)));
    }
    Map<String, List<Double>> plain = new LinkedHashMap<>();
    values.forEach((g, list) -> plain.put(g, list.stream().map(StudyResult.Value::value)
        .toList()));
    ComparisonResult r = GroupComparison.compare(metric.label(), plain, targetDifference);
    List<StudyResult.Outlier> outliers = new ArrayList<>();
    for (ComparisonResult.FlaggedValue f : r.outliers()) {
      StudyResult.Value v = values.get(f.group()).get(f.outlier().index());
      outliers.add(new StudyResult.Outlier(f.group(), v.runId(), v.specimen(), v.value(),
          f.outlier().g(), f.outlier().critical()));
    }
    return new StudyResult(metric, values, r, outliers, leftOut);
  }

  /**
   * Compares the selected groups on each figure in turn, for a group report.
   *
   * @param sel the selected runs, not null
   * @param metrics comparable figures, not null
   * @param targetDifference relative difference the sample-size advice aims at, e.g. 0.10
   * @return the results of the figures that could be compared, and why the others could not
   * @throws LoadstoneException when fewer than 2 groups have counted runs
   */
  public static Report compareEach(Selection sel, List<Metric> metrics,
      double targetDifference) {
    Precondition.notNull(sel, "selection");
    Precondition.notNull(metrics, "metrics");
    if (sel.groups().size() < 2) {
      throw new LoadstoneException("a comparison needs counted runs from at least 2 groups; found "
          + (sel.groups().isEmpty() ? "none"
              : sel.groups().size() + " (" + String.join(", ", sel.groups().keySet()) + ")")
          + (sel.leftOut().isEmpty() ? "" : "; left out: " + tally(sel.leftOut())));
    }
    List<StudyResult> results = new ArrayList<>();
    List<String> notCompared = new ArrayList<>();
    for (Metric m : metrics) {
      try {
        results.add(compare(sel, m, targetDifference));
      } catch (LoadstoneException e) {
        notCompared.add(e.getMessage());
      }
    }
    return new Report(sel, results, notCompared);
  }

  /** @return e.g. "1 run left out (1 manual)" or "4 runs left out (3 uncalibrated, 1 manual)" */
  public static String leftOutSummary(List<LeftOut> leftOut) {
    return leftOut.size() + (leftOut.size() == 1 ? " run" : " runs") + " left out ("
        + tally(leftOut) + ")";
  }

  /** @return the left-out runs counted by kind, e.g. "3 uncalibrated, 1 manual" */
  private static String tally(List<LeftOut> leftOut) {
    Map<Kind, Integer> n = new TreeMap<>();
    leftOut.forEach(l -> n.merge(l.kind(), 1, Integer::sum));
    List<String> parts = new ArrayList<>();
    n.forEach((k, c) -> parts.add(c + " " + k.word()));
    return String.join(", ", parts);
  }
}
