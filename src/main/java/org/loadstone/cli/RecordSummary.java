package org.loadstone.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.OptionalDouble;
import org.loadstone.acquire.BreakDetector;
import org.loadstone.acquire.Recorder;
import org.loadstone.archive.Run;
import org.loadstone.study.RunMetrics;
import org.loadstone.archive.RunReader;
import org.loadstone.units.LoadstoneException;

/**
 * What {@code loadstone record} prints when a run is stored: the run, its files, and the post-run
 * figures of the stored run as {@code loadstone analyze} computes them.
 */
final class RecordSummary {
  private RecordSummary() {}

  /**
   * @param r the stored run
   * @param json one JSON document ({@link JsonDocument.Kind#RECORD}) instead of text
   * @param archive the {@code --archive} given, or null
   * @param settings how to analyse the stored run (the stiffness method chosen)
   * @param out standard output
   * @param err standard error, where the text goes with {@code json}
   */
  static void print(Recorder.Result r, boolean json, Path archive,
      org.loadstone.analysis.AnalysisSettings settings, PrintWriter out, PrintWriter err)
      throws Exception {
    BreakDetector.Break b = r.breakDetail();
    RunMetrics metrics = null;
    String notAnalysed = null;
    String ended = r.cause().wireName();
    java.util.List<String> warnings = java.util.List.of();
    try {
      Run run = RunReader.read(r.stored().csv());
      warnings = run.metadata().warnings();
      ended = org.loadstone.study.RunEnd.words(run.metadata());
      metrics = RunMetrics.of(run.metadata(), run.data(), settings);
    } catch (LoadstoneException e) {
      notAnalysed = e.getMessage();
    } catch (OutOfMemoryError e) {
      // the run is safe on disk; only its figures wait for a program with more memory
      metrics = null;
      notAnalysed = "the run is stored, but analysing its " + r.samples() + " samples needs more"
          + " memory than the " + Runtime.getRuntime().maxMemory() / (1 << 20) + " MiB this"
          + " program was given: run 'loadstone analyze " + r.stored().runId() + "' with a"
          + " larger heap (java -Xmx…)";
    }
    PrintWriter h = json ? err : out;
    h.printf(Locale.ROOT, "run %s: %s, peak %.2f N, %d samples, %d dropped%n",
        r.stored().runId(), ended, r.peak_N(), r.samples(), r.dropped());
    h.println(r.returnToZero_N() != null
        ? String.format(Locale.ROOT, "return to zero %+.3g N after the load came off",
            r.returnToZero_N())
        : "return to zero not read: the run ended with load on the cell");
    h.println("  " + r.stored().csv());
    h.println("  " + r.stored().json());
    if (metrics != null) {
      var a = metrics.analysis();
      h.printf(Locale.ROOT, "stiffness %s, energy %s to peak (toe-compensated %s)%s%s%n",
          a.stiffness().map(s -> String.format(Locale.ROOT, "%.4g N/mm (95 %% %.4g to %.4g, "
              + "%s, %.4g to %.4g N)", s.slope_N_per_mm(), s.ci95Low_N_per_mm(),
              s.ci95High_N_per_mm(), s.method().words(), s.fromForce_N(), s.toForce_N()))
              .orElse("-"),
          joules(a.energyToPeak_J()), joules(a.energyToPeakToeCompensated_J()),
          a.breakPoint().isEmpty() ? "" : ", " + joules(a.energyToBreak_J()) + " to break "
              + "(toe-compensated " + joules(a.energyToBreakToeCompensated_J()) + ")",
          metrics.specificPeak_N_per_g().isPresent() ? String.format(Locale.ROOT,
              ", peak %.4g N/g", metrics.specificPeak_N_per_g().getAsDouble()) : "");
      a.stiffnessRefusal().ifPresent(no -> h.println("no stiffness: " + no.reason()));
      RunMetrics shown = metrics;
      a.crush().ifPresent(c -> h.printf(Locale.ROOT, "crush %.4g to %.4g mm: mean crush force"
          + " %.4g N, crush-force efficiency %.3f, energy %.4g J%s%n", c.from_mm(), c.to_mm(),
          c.meanForce_N(), c.efficiency(), c.energy_J(),
          shown.specificCrushEnergy_J_per_g().isPresent() ? String.format(Locale.ROOT,
              " (%.3g J/g)", shown.specificCrushEnergy_J_per_g().getAsDouble()) : ""));
      h.println("details: loadstone analyze " + r.stored().runId()
          + (archive != null ? " --archive " + archive : ""));
    } else {
      h.println("not analysed: " + notAnalysed);
    }
    if (json) {
      Map<String, Object> m = new LinkedHashMap<>(JsonViews.stored(r.stored().runId(),
          r.stored().csv(), r.stored().json()));
      m.put("cause", r.cause().wireName());
      m.put("peak_N", r.peak_N());
      m.put("sample_count", r.samples());
      m.put("dropped", r.dropped());
      m.put("checksum_errors", r.checksumErrors());
      m.put("drop_at_break_pct", b == null ? null : b.dropPct());
      m.put("return_to_zero_N", r.returnToZero_N());
      m.put("warnings", warnings);
      m.put("analysis", metrics == null ? null : metrics.toJsonMap());
      m.put("not_analysed", notAnalysed);
      JsonDocument.write(out, JsonDocument.Kind.RECORD, m);
    }
    h.flush();
    out.flush();
  }

  private static String joules(OptionalDouble e_J) {
    return e_J.isPresent() ? String.format(Locale.ROOT, "%.4g J", e_J.getAsDouble()) : "-";
  }
}
