package org.loadstone.report;

import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.OptionalDouble;
import org.loadstone.analysis.RunResult;
import org.loadstone.analysis.stats.ComparisonResult;
import org.loadstone.analysis.stats.GroupComparison;
import org.loadstone.analysis.stats.GroupSummary;
import org.loadstone.archive.Geometry;
import org.loadstone.archive.RunMetadata;
import org.loadstone.files.FilePublisher;
import org.loadstone.study.RunMetrics;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * PDF reports (PDFBox, Helvetica): one run, or a comparison of groups of runs. Both end with the
 * cautions box. Files are written through a temporary name and never overwrite an existing one.
 */
public final class PdfReport {
  private PdfReport() {}

  /** The cautions printed in every report. */
  public static final List<String> CAUTIONS = List.of(
      "Brittle specimens can fail explosively and throw fragments: use a shield and eye "
          + "protection.",
      "Keep hands clear of the press while it is loaded.",
      "Never load a cell beyond its rated capacity. The software's overload stop does not "
          + "replace the press's own mechanical limits or an emergency stop.",
      "These figures are engineering estimates, not an accredited calibration or certification. "
          + "Follow your lab's rules, local codes and licensed practice.");

  /**
   * A metric to compare in a group report.
   *
   * @param key key of {@link RunMetrics#toJsonMap()}, e.g. {@code peak_N}
   * @param label plain name for the sentence, e.g. "peak force"
   * @param unit unit for column heads and axes, e.g. "N"
   */
  public record Metric(String key, String label, String unit) {
    /** Checks the fields. */
    public Metric {
      Precondition.notNull(key, "key");
      Precondition.notNull(label, "label");
      Precondition.notNull(unit, "unit");
    }
  }

  /** Peak force, stiffness, energy to peak, flexural stress, core shear stress, specific peak. */
  public static final List<Metric> DEFAULT_METRICS = List.of(
      new Metric("peak_N", "peak force", "N"),
      new Metric("stiffness_N_per_mm", "stiffness", "N/mm"),
      new Metric("energy_to_peak_J", "energy to peak", "J"),
      new Metric("flexural_stress_at_peak_MPa", "flexural stress at peak", "MPa"),
      new Metric("core_shear_stress_at_peak_MPa", "core shear stress at peak", "MPa"),
      new Metric("specific_peak_N_per_g", "specific peak force", "N/g"));

  /**
   * Writes the report of one run: title, metadata, force–displacement chart, results, notes,
   * cautions.
   *
   * @param m the run's metrics, not null
   * @param file target PDF; must not exist
   * @throws LoadstoneException when the file exists or cannot be written
   */
  public static void writeRun(RunMetrics m, Path file) {
    Precondition.notNull(m, "metrics");
    Precondition.notNull(file, "file");
    RunMetadata md = m.metadata();
    try (PdfLayout p = new PdfLayout("Loadstone run report " + md.runId())) {
      p.title("Run report: " + md.specimen(), "run " + md.runId() + "  -  started "
          + when(md) + "  -  Loadstone " + md.softwareVersion());
      p.heading("Specimen and run");
      p.table(new String[] {"item", "value"}, RunFacts.rows(md), new float[] {0.3f, 0.7f}, 8.5f);
      p.heading("Force curve", 260);
      p.chart(Charts.run(m), PdfLayout.TEXT_WIDTH, 260);
      p.heading("Results", 120);
      p.table(new String[] {"quantity (unit)", "value"}, results(m), new float[] {0.55f, 0.45f},
          9);
      if (!m.notes().isEmpty()) {
        p.heading("Notes");
        p.bullets(m.notes(), 8.5f);
      }
      p.cautionBox("Cautions", CAUTIONS, 8.5f);
      save(p, file);
    }
  }

  /**
   * Writes a group comparison: an overlay of all curves, one chart of each group's curves, then
   * per metric a strip plot, the
   * statistics table (n, mean, SD, CV %, 95 % interval), the test and p-value, the plain
   * reading and sample-size advice; then the runs per group and the cautions. A metric that any
   * run lacks is left out with a note.
   *
   * @param title report title, not null
   * @param groups group name → runs, at least 2 groups with at least one run each
   * @param metrics what to compare, not null (see {@link #DEFAULT_METRICS})
   * @param file target PDF; must not exist
   * @throws LoadstoneException when there are fewer than 2 groups, a group is empty, or the file
   *     exists or cannot be written
   */
  public static void writeGroups(String title, Map<String, List<RunMetrics>> groups,
      List<Metric> metrics, Path file) {
    Precondition.notNull(title, "title");
    Precondition.notNull(groups, "groups");
    Precondition.notNull(metrics, "metrics");
    Precondition.notNull(file, "file");
    if (groups.size() < 2) {
      throw new LoadstoneException("A group report needs at least 2 groups, was given "
          + groups.size() + ". Select runs from two or more groups.");
    }
    for (Map.Entry<String, List<RunMetrics>> e : groups.entrySet()) {
      if (e.getValue() == null || e.getValue().isEmpty()) {
        throw new LoadstoneException("Group '" + e.getKey() + "' has no runs; add runs or leave "
            + "the group out of the report.");
      }
    }
    try (PdfLayout p = new PdfLayout("Loadstone group report")) {
      int runs = groups.values().stream().mapToInt(List::size).sum();
      p.title(title, groups.size() + " groups, " + runs + " runs: "
          + String.join(", ", groups.keySet()));
      p.heading("Force curves by group");
      p.chart(Charts.overlay("all runs", groups), PdfLayout.TEXT_WIDTH, 270);
      for (Map.Entry<String, List<RunMetrics>> e : groups.entrySet()) {
        p.heading("Group " + e.getKey(), 200);
        p.chart(Charts.group(e.getKey(), e.getValue()), PdfLayout.TEXT_WIDTH * 0.8f, 200);
      }
      List<String> skipped = new ArrayList<>();
      for (Metric metric : metrics) {
        Map<String, List<Double>> values = values(groups, metric, skipped);
        if (values == null) {
          continue;
        }
        ComparisonResult r = GroupComparison.compare(metric.label(), values);
        p.heading(capital(metric.label()) + " (" + metric.unit() + ")", 340);
        p.chart(Charts.strip(r, values, metric.label() + " (" + metric.unit() + ")"),
            PdfLayout.TEXT_WIDTH * 0.8f, 190);
        p.table(statsHeads(metric.unit()), statsRows(r), new float[] {0.22f, 0.06f, 0.14f, 0.14f,
            0.1f, 0.17f, 0.17f}, 8.5f);
        p.paragraph(testLine(r), 9);
        p.paragraph(r.sentence(), 9);
        r.advice().ifPresent(a -> p.paragraph("Sample size: " + a.sentence(), 9));
        if (!r.outliers().isEmpty()) {
          List<String> o = new ArrayList<>();
          r.outliers().forEach(f -> o.add(String.format(Locale.ROOT,
              "Possible outlier in group '%s': specimen %d of the group, %s %s (Grubbs G = %.3g "
                  + "above the critical %.3g at the 5 %% level). Check that specimen before "
                  + "leaving it out.", f.group(), f.outlier().index() + 1,
              num(f.outlier().value()), metric.unit(), f.outlier().g(), f.outlier().critical())));
          p.bullets(o, 8.5f);
        }
      }
      p.heading("Runs in this report", 80);
      List<String[]> rows = new ArrayList<>();
      groups.forEach((g, list) -> list.forEach(m -> rows.add(new String[] {g,
          m.metadata().specimen(), m.metadata().runId(), num(m.analysis().peakForce_N())})));
      p.table(new String[] {"group", "specimen", "run id", "peak force (N)"}, rows,
          new float[] {0.2f, 0.25f, 0.35f, 0.2f}, 8.5f);
      if (!skipped.isEmpty()) {
        p.heading("Notes");
        p.bullets(skipped, 8.5f);
      }
      p.cautionBox("Cautions", CAUTIONS, 8.5f);
      save(p, file);
    }
  }

  /** @return {@code p = } and the p-value with two significant digits, or {@code p < 0.0001} */
  public static String formatP(double p) {
    return p < 1e-4 ? "p < 0.0001" : String.format(Locale.ROOT, "p = %.2g", p);
  }

  private static Map<String, List<Double>> values(Map<String, List<RunMetrics>> groups,
      Metric metric, List<String> skipped) {
    Map<String, List<Double>> out = new LinkedHashMap<>();
    for (Map.Entry<String, List<RunMetrics>> e : groups.entrySet()) {
      List<Double> v = new ArrayList<>();
      for (RunMetrics m : e.getValue()) {
        OptionalDouble d = m.value(metric.key());
        if (d.isEmpty()) {
          skipped.add(capital(metric.label()) + " left out: run " + m.metadata().runId() + " ("
              + m.metadata().specimen() + ") has no value for it.");
          return null;
        }
        v.add(d.getAsDouble());
      }
      out.put(e.getKey(), v);
    }
    return out;
  }

  private static String[] statsHeads(String unit) {
    return new String[] {"group", "n", "mean (" + unit + ")", "SD (" + unit + ")", "CV (%)",
        "95 % CI low (" + unit + ")", "95 % CI high (" + unit + ")"};
  }

  private static List<String[]> statsRows(ComparisonResult r) {
    List<String[]> rows = new ArrayList<>();
    for (GroupSummary g : r.groups()) {
      rows.add(new String[] {g.name(), Integer.toString(g.n()), num(g.mean()), opt(g.sd()),
          g.cvPct().isPresent() ? String.format(Locale.ROOT, "%.1f", g.cvPct().getAsDouble())
              : "-", opt(g.ci95Low()), opt(g.ci95High())});
    }
    return rows;
  }

  private static String testLine(ComparisonResult r) {
    return switch (r.test()) {
      case WELCH_T -> String.format(Locale.ROOT, "Test: Welch t-test, t = %.3g, df = %.3g, %s",
          r.statistic().getAsDouble(), r.degreesOfFreedom().getAsDouble(),
          formatP(r.pValue().getAsDouble()));
      case ONE_WAY_ANOVA -> String.format(Locale.ROOT,
          "Test: one-way ANOVA, F = %.3g, within-group df = %.0f, %s",
          r.statistic().getAsDouble(), r.degreesOfFreedom().getAsDouble(),
          formatP(r.pValue().getAsDouble()));
      case NONE -> "Test: none (see the reading below).";
    };
  }

  private static List<String[]> results(RunMetrics m) {
    RunResult r = m.analysis();
    List<String[]> rows = new ArrayList<>();
    rows.add(new String[] {"peak force (N)", num(r.peakForce_N())});
    rows.add(new String[] {"time of peak (s)", num(r.peakTime_s())});
    rows.add(new String[] {"break sample / time (s) / force (N)", r.breakPoint().map(b ->
        b.index() + " / " + num(b.time_s()) + " / " + num(b.force_N())
            + (b.detected() ? " (detected)" : " (recorded)")).orElse("-")});
    rows.add(new String[] {"stiffness (N/mm)", opt(r.stiffness_N_per_mm())
        + r.stiffness().map(s -> String.format(Locale.ROOT, "  (R2 %.4f, samples %d-%d)",
            s.rSquared(), s.fromIndex(), s.toIndex())).orElse("")});
    rows.add(new String[] {"toe offset (mm)", opt(r.toeOffset_mm())});
    rows.add(new String[] {"displacement at peak (mm)", opt(r.displacementAtPeak_mm())});
    rows.add(new String[] {"displacement at break (mm)", opt(r.displacementAtBreak_mm())});
    rows.add(new String[] {"energy to peak (J)", opt(r.energyToPeak_J())});
    rows.add(new String[] {"energy to break (J)", opt(r.energyToBreak_J())});
    rows.add(new String[] {"flexural stress at peak (MPa)", opt(m.flexuralStressAtPeak_MPa())});
    rows.add(new String[] {"flexural modulus (MPa)", opt(m.flexuralModulus_MPa())});
    rows.add(new String[] {"core shear stress at peak (MPa)", opt(m.coreShearStressAtPeak_MPa())});
    rows.add(new String[] {"facing stress at peak (MPa)", opt(m.facingStressAtPeak_MPa())});
    rows.add(new String[] {"compression stress at peak (MPa)",
        opt(m.compressionStressAtPeak_MPa())});
    rows.add(new String[] {"specific peak force (N/g)", opt(m.specificPeak_N_per_g())});
    rows.add(new String[] {"specific energy to peak (J/g)", opt(m.specificEnergyToPeak_J_per_g())});
    rows.add(new String[] {"specific energy to break (J/g)",
        opt(m.specificEnergyToBreak_J_per_g())});
    rows.add(new String[] {"specific stiffness (N/mm per g)",
        opt(m.specificStiffness_N_per_mm_per_g())});
    return rows;
  }

  static String num(double v) {
    if (Math.abs(v) < 1e-12) {
      return "0"; // rounding noise of a value that is zero, e.g. a toe offset on a clean line
    }
    return String.format(Locale.ROOT, "%.4g", v);
  }

  static String opt(OptionalDouble v) {
    return v.isPresent() ? num(v.getAsDouble()) : "-";
  }

  private static String when(RunMetadata md) {
    return DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm:ss 'UTC'", Locale.ROOT)
        .format(md.startedAt().atOffset(ZoneOffset.UTC));
  }

  private static String capital(String s) {
    return s.isEmpty() ? s : Character.toUpperCase(s.charAt(0)) + s.substring(1);
  }

  private static void save(PdfLayout p, Path file) {
    try {
      FilePublisher.publish(file, "PDF report", p::save);
    } catch (UncheckedIOException e) {
      throw new LoadstoneException("Cannot build the PDF report " + file + ": "
          + e.getCause().getMessage(), e);
    }
  }

  /** Used by {@link RunFacts} for geometry text. */
  static String geometry(Geometry g) {
    List<String> parts = new ArrayList<>();
    add(parts, "span", g.span_mm(), "mm");
    add(parts, "load span", g.loadSpan_mm(), "mm");
    add(parts, "width", g.width_mm(), "mm");
    add(parts, "depth", g.depth_mm(), "mm");
    add(parts, "facing", g.facing_mm(), "mm");
    add(parts, "core", g.core_mm(), "mm");
    add(parts, "area", g.area_mm2(), "mm2");
    return parts.isEmpty() ? "not measured" : String.join(", ", parts);
  }

  private static void add(List<String> parts, String name, Double v, String unit) {
    if (v != null) {
      parts.add(name + " " + num(v) + " " + unit);
    }
  }
}
