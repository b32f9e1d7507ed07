package org.loadstone.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.OptionalDouble;
import java.util.concurrent.Callable;
import org.loadstone.analysis.AnalysisSettings;
import org.loadstone.analysis.stats.ComparisonResult;
import org.loadstone.analysis.stats.GroupSummary;
import org.loadstone.archive.ArchiveIndex;
import org.loadstone.archive.FinishCause;
import org.loadstone.study.GroupStudy;
import org.loadstone.study.RunMetrics;
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
      "Per group n, mean, SD, CV and 95 %% CI; Welch's t-test (two groups) or one-way",
      "ANOVA (more); outliers; how many specimens would resolve a given difference."
    })
public final class CompareCommand implements Callable<Integer> {
  @Mixin ArchiveOption archive;

  @Option(names = "--by", defaultValue = "group", description = "How runs are grouped (default: ${DEFAULT-VALUE}; only 'group' for now).")
  String by;

  @Option(names = "--metric", defaultValue = "peak", description = "peak, stiffness, energy, energy-to-break, specific-peak, specific-energy, specific-stiffness, flexural-modulus, core-shear (default: ${DEFAULT-VALUE}).")
  String metric;

  @Option(names = "--groups", split = ",", description = "Only these groups (comma separated).")
  List<String> only;

  @Option(names = "--target-pct", defaultValue = "10", description = "Difference the sample-size advice aims to resolve, in per cent (default: ${DEFAULT-VALUE}).")
  double targetPct;

  @Option(names = "--include-unbroken", description = "Also use runs that did not end in a break (manual, time limit, recovered…).")
  boolean includeUnbroken;

  @Option(names = "--json", description = "End with the result as one JSON object on the last line.")
  boolean json;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public Integer call() throws Exception {
    if (!by.equals("group")) {
      throw new LoadstoneException("--by " + by + " is not supported: runs are grouped by their "
          + "group name (--by group)");
    }
    GroupStudy.Metric m = GroupStudy.Metric.parse(metric);
    PrintWriter out = spec.commandLine().getOut();
    ArchiveIndex idx = ArchiveIndex.scan(archive.folder());
    List<ArchiveIndex.Entry> entries = idx.entries().stream()
        .filter(e -> includeUnbroken || e.metadata().cause() == FinishCause.BREAK
            || e.metadata().cause() == FinishCause.IMPORTED)
        .filter(e -> only == null || only.stream().anyMatch(g -> g.equalsIgnoreCase(
            e.metadata().group())))
        .toList();
    Map<String, List<RunMetrics>> runs = GroupStudy.load(entries, AnalysisSettings.DEFAULTS);
    GroupStudy.Outcome o = GroupStudy.compare(runs, m, targetPct / 100);
    ComparisonResult r = o.comparison();
    out.printf(Locale.ROOT, "%s (%s), %d runs in %s%n%n", m.label(), m.unit(),
        runs.values().stream().mapToInt(List::size).sum(), idx.folder());
    out.printf(Locale.ROOT, "%-12s %3s %12s %10s %7s %25s%n", "group", "n", "mean", "SD", "CV %",
        "95 % CI");
    for (GroupSummary g : r.groups()) {
      out.printf(Locale.ROOT, "%-12s %3d %12s %10s %7s %25s%n", g.name(), g.n(), num(g.mean()),
          opt(g.sd()), g.cvPct().isPresent() ? String.format(Locale.ROOT, "%.1f",
              g.cvPct().getAsDouble()) : "—",
          g.ci95Low().isPresent() ? num(g.ci95Low().getAsDouble()) + " … "
              + num(g.ci95High().getAsDouble()) : "needs n ≥ 2");
    }
    out.println();
    String test = r.test().words();
    out.printf(Locale.ROOT, "test: %s%s%n", test,
        r.pValue().isPresent() ? String.format(Locale.ROOT, ", p = %.3g", r.pValue().getAsDouble())
            : "");
    out.println(r.sentence());
    for (ComparisonResult.FlaggedValue f : r.outliers()) {
      out.printf(Locale.ROOT, "possible outlier in %s: %s (Grubbs, α = 0.05)%n", f.group(),
          num(f.outlier().value()));
    }
    r.advice().ifPresent(a -> out.println(a.sentence()));
    for (String s : o.leftOut()) {
      out.println("left out: " + s);
    }
    if (json) {
      Map<String, Object> j = new LinkedHashMap<>(r.toJsonView());
      j.put("metric_key", m.key());
      j.put("unit", m.unit());
      j.put("left_out", o.leftOut());
      out.println(new ObjectMapper().writeValueAsString(j));
    }
    out.flush();
    return 0;
  }

  private static String num(double v) {
    return String.format(Locale.ROOT, Math.abs(v) >= 1000 ? "%.0f" : Math.abs(v) >= 10 ? "%.1f"
        : "%.3f", v);
  }

  private static String opt(OptionalDouble v) {
    return v.isPresent() ? num(v.getAsDouble()) : "—";
  }
}
