package org.loadstone.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.loadstone.analysis.AnalysisSettings;
import org.loadstone.analysis.AnalysisSettings.StiffnessBounds;
import org.loadstone.archive.RunMetrics;
import org.loadstone.cli.RunResolver.ResolvedRun;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code loadstone analyze}: peak, break, stiffness, energy and geometry values of one run. */
@Command(
    name = "analyze",
    description = {
      "Analyse one run: peak force, break, stiffness and energy.",
      "Flexural and sandwich values follow when the run's geometry is known. RUN is a CSV "
          + "with columns time_s, force_N and (optionally) position_mm."
    })
public final class AnalyzeCommand implements Callable<Integer> {
  @picocli.CommandLine.Mixin ArchiveOption archive;

  @Parameters(paramLabel = "RUN", description = "A run id (or id prefix) in the archive, a run's CSV, or any CSV with columns time_s, force_N, position_mm.")
  String run;

  @Option(names = "--stiffness-from-N", paramLabel = "A",
      description = "Fit the stiffness between these forces instead of searching (with --stiffness-to-N).")
  Double fromN;

  @Option(names = "--stiffness-to-N", paramLabel = "B", description = "Upper force of the stiffness fit.")
  Double toN;

  @Option(names = "--json", description = "End with the results as one JSON object on the last line.")
  boolean json;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  /** Label, key of {@link RunMetrics#toJsonMap()}, unit. */
  private static final String[][] ROWS = {
    {"peak force", "peak_N", "N"}, {"time of peak", "peak_time_s", "s"},
    {"break sample", "break_index", ""}, {"break time", "break_time_s", "s"},
    {"break force", "break_force_N", "N"}, {"stiffness", "stiffness_N_per_mm", "N/mm"},
    {"stiffness fit R2", "stiffness_r_squared", ""}, {"toe offset", "toe_offset_mm", "mm"},
    {"displacement at peak", "displacement_at_peak_mm", "mm"},
    {"displacement at break", "displacement_at_break_mm", "mm"},
    {"energy to peak", "energy_to_peak_J", "J"}, {"energy to break", "energy_to_break_J", "J"},
    {"flexural stress at peak", "flexural_stress_at_peak_MPa", "MPa"},
    {"flexural modulus", "flexural_modulus_MPa", "MPa"},
    {"core shear stress at peak", "core_shear_stress_at_peak_MPa", "MPa"},
    {"facing stress at peak", "facing_stress_at_peak_MPa", "MPa"},
    {"compression stress at peak", "compression_stress_at_peak_MPa", "MPa"},
    {"specific peak force", "specific_peak_N_per_g", "N/g"},
    {"specific energy to peak", "specific_energy_to_peak_J_per_g", "J/g"},
    {"specific energy to break", "specific_energy_to_break_J_per_g", "J/g"},
    {"specific stiffness", "specific_stiffness_N_per_mm_per_g", "N/mm per g"},
  };

  @Override
  public Integer call() throws Exception {
    if ((fromN == null) != (toN == null)) {
      throw new CommandLine.ParameterException(spec.commandLine(),
          "--stiffness-from-N and --stiffness-to-N go together; give both or neither.");
    }
    AnalysisSettings settings = AnalysisSettings.DEFAULTS;
    if (fromN != null) {
      settings = settings.withStiffnessBounds(StiffnessBounds.force_N(fromN, toN));
    }
    ResolvedRun r = CliWiring.resolve(run, archive.folder());
    RunMetrics m = RunMetrics.of(r.metadata(), r.data(), settings);
    Map<String, Object> j = m.toJsonMap();
    PrintWriter out = spec.commandLine().getOut();
    out.printf(Locale.ROOT, "run %s, specimen %s, %d samples (%s)%n", m.metadata().runId(),
        m.metadata().specimen(), m.analysis().sampleCount(), r.source());
    for (String[] row : ROWS) {
      Object v = j.get(row[1]);
      String text = v == null ? "-"
          : v instanceof Double d ? (Math.abs(d) < 1e-12 ? "0" : String.format(Locale.ROOT, "%.5g", d))
          : v.toString();
      out.printf(Locale.ROOT, "  %-28s %14s %s%n", row[0], text, v == null ? "" : row[2]);
    }
    for (String note : m.notes()) {
      out.println("note: " + note);
    }
    if (json) {
      out.println(new ObjectMapper().writeValueAsString(j));
    }
    out.flush();
    return 0;
  }
}
