package org.loadstone.cli;

import java.io.PrintWriter;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.loadstone.analysis.stats.GroupSummary;
import org.loadstone.study.ArchiveRuns;
import org.loadstone.study.GroupStudy;
import org.loadstone.study.LeftOut;
import org.loadstone.study.Metric;
import org.loadstone.study.Selection;
import org.loadstone.study.StudyResult;
import org.loadstone.units.LoadstoneException;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code loadstone compare}: are the groups different, or is it scatter? */
@Command(
    name = "compare",
    description = {
      "Compare groups of archived runs on one metric: real difference or scatter?",
      "",
      "Per group n, mean, SD, CV and 95 %% CI; Welch's t-test (two groups) or one-way ANOVA "
          + "(more); outliers; how many specimens would resolve a given difference; the runs "
          + "left out and why."
    })
public final class CompareCommand implements Callable<Integer> {
  @Mixin ArchiveOption archive;

  @Mixin SelectionOptions select;

  @Option(names = "--by", paramLabel = "KEY", defaultValue = "group", description = "How runs are grouped (default: ${DEFAULT-VALUE}; only 'group' for now).")
  String by;

  @Option(names = "--metric", defaultValue = "peak", paramLabel = "FIGURE",
      completionCandidates = MetricWords.class,
      description = "The figure compared: ${COMPLETION-CANDIDATES} (default: ${DEFAULT-VALUE}).")
  String metric;

  /** The words of the comparable figures, from the metric catalogue. */
  static final class MetricWords implements Iterable<String> {
    @Override
    public java.util.Iterator<String> iterator() {
      return Metric.comparableOnes().stream().map(Metric::word).iterator();
    }
  }

  @Option(names = "--target-pct", paramLabel = "PCT", defaultValue = "10", description = "Difference the sample-size advice aims to resolve, in per cent (default: ${DEFAULT-VALUE}).")
  double targetPct;

  @Option(names = "--json", description = "Write the result as one JSON document on standard output (schema loadstone-compare): groups, test, outliers by run, the sample-size advice, the runs counted and those left out with the reason; the text goes to standard error.")
  boolean json;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public Integer call() throws Exception {
    if (!by.equals("group")) {
      throw new LoadstoneException("--by " + by + " is not supported: runs are grouped by their "
          + "group name (--by group)");
    }
    Metric m = Metric.parse(metric);
    PrintWriter out = JsonDocument.human(spec, json);
    Selection sel = ArchiveRuns.scan(archive.folder()).select(select.selection(),
        ProgressLine.onStderr(spec.commandLine().getErr(), "analysing runs"));
    StudyResult r;
    try {
      r = GroupStudy.compare(sel, m, targetPct / 100);
    } catch (LoadstoneException e) {
      throw new LoadstoneException(e.getMessage() + SelectionOptions.includeHint(sel.leftOut()),
          e, e.settings().toArray(new org.loadstone.units.Setting[0]));
    }
    out.printf(Locale.ROOT, "%s, %d runs counted in %s%n%n", m.heading(),
        r.values().values().stream().mapToInt(java.util.List::size).sum(), sel.folder());
    out.printf(Locale.ROOT, "%-12s %3s %12s %10s %7s %25s%n", "group", "n", "mean", "SD", "CV %",
        "95 % CI");
    for (GroupSummary g : r.groups()) {
      out.printf(Locale.ROOT, "%-12s %3d %12s %10s %7s %25s%n", g.name(), g.n(),
          m.format(g.mean()), m.format(g.sd()), g.cvPct().isPresent()
              ? String.format(Locale.ROOT, "%.1f", g.cvPct().getAsDouble()) : "-",
          g.ci95Low().isPresent() ? m.format(g.ci95Low()) + " … " + m.format(g.ci95High())
              : "needs n ≥ 2");
    }
    out.println();
    out.printf(Locale.ROOT, "test: %s%s%n", r.test().words(), r.pValue().isPresent()
        ? String.format(Locale.ROOT, ", p = %.3g", r.pValue().getAsDouble()) : "");
    out.println(r.sentence());
    for (StudyResult.Outlier o : r.outliers()) {
      out.printf(Locale.ROOT, "possible outlier in %s: run %s (%s), %s %s (Grubbs, α = 0.05)%n",
          o.group(), o.runId(), o.specimen(), m.format(o.value()), m.unit());
    }
    r.advice().ifPresent(a -> out.println(a.sentence()));
    for (LeftOut l : r.leftOut()) {
      out.println("left out: " + l.line());
    }
    if (!r.leftOut().isEmpty()) {
      out.println(GroupStudy.leftOutSummary(r.leftOut())
          + SelectionOptions.includeHint(r.leftOut()));
    }
    if (json) {
      java.util.Map<String, Object> j = new java.util.LinkedHashMap<>(r.toJsonView());
      j.put("archive", sel.folder().toString());
      j.put("target_difference_pct", targetPct);
      JsonDocument.write(spec.commandLine().getOut(), JsonDocument.Kind.COMPARE, j);
    }
    out.flush();
    return 0;
  }
}
