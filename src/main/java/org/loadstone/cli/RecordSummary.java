package org.loadstone.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
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
   * @param json one JSON object instead of text
   * @param archive the {@code --archive} given, or null
   * @param settings how to analyse the stored run (the stiffness method chosen)
   */
  static void print(Recorder.Result r, boolean json, Path archive,
      org.loadstone.analysis.AnalysisSettings settings, PrintWriter out) throws Exception {
    BreakDetector.Break b = r.breakDetail();
    RunMetrics metrics = null;
    String notAnalysed = null;
    try {
      Run run = RunReader.read(r.stored().csv());
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
    if (json) {
      Map<String, Object> m = new LinkedHashMap<>();
      m.put("run_id", r.stored().runId());
      m.put("cause", r.cause().wireName());
      m.put("peak_N", r.peak_N());
      m.put("samples", r.samples());
      m.put("dropped", r.dropped());
      m.put("checksum_errors", r.checksumErrors());
      m.put("break_drop_pct", b == null ? null : b.dropPct());
      m.put("return_to_zero_N", r.returnToZero_N());
      m.put("csv", r.stored().csv().toString());
      m.put("json", r.stored().json().toString());
      if (metrics != null) {
        Map<String, Object> a = metrics.toJsonMap();
        for (String k : new String[] {"stiffness_N_per_mm", "stiffness_ci95_low_N_per_mm",
            "stiffness_ci95_high_N_per_mm", "stiffness_method", "stiffness_refused",
            "energy_to_peak_J",
            "energy_to_break_J", "energy_to_peak_toe_compensated_J",
            "energy_to_break_toe_compensated_J", "specific_peak_N_per_g", "mean_crush_force_N",
            "crush_force_efficiency", "crush_energy_J", "crush_from_mm", "crush_to_mm",
            "specific_crush_energy_J_per_g"}) {
          m.put(k, a.get(k));
        }
      }
      out.println(new ObjectMapper().writeValueAsString(m));
    } else {
      out.printf(Locale.ROOT, "run %s: %s, peak %.2f N, %d samples, %d dropped%n",
          r.stored().runId(), r.cause().wireName(), r.peak_N(), r.samples(), r.dropped());
      out.println(r.returnToZero_N() != null
          ? String.format(Locale.ROOT, "return to zero %+.3g N after the load came off",
              r.returnToZero_N())
          : "return to zero not read: the run ended with load on the cell");
      out.println("  " + r.stored().csv());
      out.println("  " + r.stored().json());
      if (metrics != null) {
        var a = metrics.analysis();
        out.printf(Locale.ROOT, "stiffness %s, energy %s to break, %s to peak (toe-compensated "
            + "%s and %s)%s%n",
            a.stiffness().map(s -> String.format(Locale.ROOT, "%.4g N/mm (95 %% %.4g to %.4g, "
                + "%s, %.4g to %.4g N)", s.slope_N_per_mm(), s.ci95Low_N_per_mm(),
                s.ci95High_N_per_mm(), s.method().words(), s.fromForce_N(), s.toForce_N()))
                .orElse("-"),
            joules(a.energyToBreak_J()), joules(a.energyToPeak_J()),
            joules(a.energyToBreakToeCompensated_J()), joules(a.energyToPeakToeCompensated_J()),
            metrics.specificPeak_N_per_g().isPresent() ? String.format(Locale.ROOT,
                ", peak %.4g N/g", metrics.specificPeak_N_per_g().getAsDouble()) : "");
        a.stiffnessRefusal().ifPresent(no -> out.println("no stiffness: " + no.reason()));
        RunMetrics shown = metrics;
        a.crush().ifPresent(c -> out.printf(Locale.ROOT, "crush %.4g to %.4g mm: mean crush force"
            + " %.4g N, crush-force efficiency %.3f, energy %.4g J%s%n", c.from_mm(), c.to_mm(),
            c.meanForce_N(), c.efficiency(), c.energy_J(),
            shown.specificCrushEnergy_J_per_g().isPresent() ? String.format(Locale.ROOT,
                " (%.3g J/g)", shown.specificCrushEnergy_J_per_g().getAsDouble()) : ""));
        out.println("details: loadstone analyze " + r.stored().runId()
            + (archive != null ? " --archive " + archive : ""));
      } else {
        out.println("not analysed: " + notAnalysed);
      }
    }
    out.flush();
  }

  private static String joules(OptionalDouble e_J) {
    return e_J.isPresent() ? String.format(Locale.ROOT, "%.4g J", e_J.getAsDouble()) : "-";
  }
}
