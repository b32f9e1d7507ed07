package org.loadstone.report;

import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.loadstone.analysis.stats.GroupSummary;
import org.loadstone.archive.Geometry;
import org.loadstone.archive.RunMetadata;
import org.loadstone.files.FilePublisher;
import org.loadstone.study.GroupStudy;
import org.loadstone.study.LeftOut;
import org.loadstone.study.Metric;
import org.loadstone.study.RunMetrics;
import org.loadstone.study.Selection;
import org.loadstone.study.StudyResult;
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

  /** Peak force, stiffness, energy to peak, flexural stress, core shear stress, specific peak. */
  public static final List<Metric> DEFAULT_METRICS = List.of(Metric.PEAK, Metric.STIFFNESS,
      Metric.ENERGY, Metric.FLEXURAL_STRESS, Metric.CORE_SHEAR, Metric.SPECIFIC_PEAK);

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
    try (PdfLayout p = new PdfLayout("Loadstone run report " + md.runId(), new PdfLayout.PdfInfo(
        "Run report: " + md.specimen(), md.operator(),
        "Three-point bend run " + md.runId() + " of specimen " + md.specimen(),
        String.join(", ", md.specimen(), md.group(), md.runId()), producer()))) {
      p.title("Run report: " + md.specimen(), "run " + md.runId() + "  -  started "
          + when(md) + "  -  Loadstone " + md.softwareVersion());
      p.heading("Specimen and run");
      p.table(new String[] {"item", "value"}, RunFacts.rows(md), new float[] {0.3f, 0.7f}, 8.5f);
      p.heading("Force curve", 270);
      p.chart(Charts.run(m), PdfLayout.TEXT_WIDTH, 260);
      p.heading("Results", 120);
      p.table(new String[] {"quantity (unit)", "value"}, results(m), new float[] {0.55f, 0.45f},
          9);
      if (!m.notes().isEmpty()) {
        p.heading("Notes");
        p.bullets(m.notes(), 8.5f);
      }
      p.glyphNote();
      p.cautionBox("Cautions", CAUTIONS, 8.5f);
      save(p, file);
    }
  }

  /**
   * Writes a group comparison: an overlay of all curves, one chart of each group's curves, then
   * per figure compared a strip plot, the statistics table ({@link #statisticsRows}), the test
   * and p-value, the plain reading, the sample-size advice and outliers by run; then the runs
   * counted per group, the runs left out with the reason, and the cautions.
   *
   * @param title report title, not null
   * @param study the groups compared on each figure ({@link GroupStudy#compareEach}), not null
   * @param file target PDF; must not exist
   * @throws LoadstoneException when there are fewer than 2 groups, or the file exists or cannot
   *     be written
   */
  public static void writeGroups(String title, GroupStudy.Report study, Path file) {
    writeGroups(title, study, file, c -> { });
  }

  /** {@link #writeGroups(String, GroupStudy.Report, Path)}, telling {@code charts} each chart. */
  static void writeGroups(String title, GroupStudy.Report study, Path file,
      java.util.function.Consumer<org.jfree.chart.JFreeChart> charts) {
    Precondition.notNull(title, "title");
    Precondition.notNull(study, "study");
    Precondition.notNull(file, "file");
    Selection sel = study.selection();
    Map<String, List<RunMetrics>> groups = sel.groups();
    if (groups.size() < 2) {
      throw new LoadstoneException("A group report needs at least 2 groups, was given "
          + groups.size() + ". Select runs from two or more groups.");
    }
    GroupColours colours = GroupColours.of(groups.keySet());
    try (PdfLayout p = new PdfLayout("Loadstone group report: " + title, new PdfLayout.PdfInfo(
        title, operators(sel), "Comparison of groups " + String.join(", ", groups.keySet())
            + " over " + sel.counted() + " runs", String.join(", ", groups.keySet()),
        producer()))) {
      p.onChart(charts);
      p.title(title, groups.size() + " groups, " + sel.counted() + " runs counted"
          + (sel.leftOut().isEmpty() ? "" : ", " + sel.leftOut().size() + " left out") + ": "
          + String.join(", ", groups.keySet()));
      p.heading("Force curves by group");
      p.chart(Charts.overlay("all runs", groups, colours), PdfLayout.TEXT_WIDTH, 270);
      for (Map.Entry<String, List<RunMetrics>> e : groups.entrySet()) {
        p.heading("Group " + e.getKey(), 200);
        p.chart(Charts.group(e.getKey(), e.getValue(), colours), PdfLayout.TEXT_WIDTH * 0.8f,
            200);
      }
      for (StudyResult r : study.results()) {
        Metric metric = r.metric();
        p.heading(capital(metric.heading()), 340);
        p.chart(Charts.strip(r.comparison(), r.plainValues(), metric.heading(), colours),
            PdfLayout.TEXT_WIDTH * 0.8f, 190);
        p.table(statsHeads(metric.unit()), statisticsRows(r), new float[] {0.22f, 0.06f, 0.14f,
            0.14f, 0.1f, 0.17f, 0.17f}, 8.5f);
        p.paragraph(testLine(r), 9);
        p.paragraph(r.sentence(), 9);
        r.advice().ifPresent(a -> p.paragraph("Sample size: " + a.sentence(), 9));
        List<String> notes = new ArrayList<>();
        r.outliers().forEach(o -> notes.add(String.format(Locale.ROOT,
            "Possible outlier in group '%s': run %s (%s), %s %s (Grubbs G = %.3g above the "
                + "critical %.3g at the 5 %% level). Check that specimen before leaving it out.",
            o.group(), o.runId(), o.specimen(), metric.format(o.value()), metric.unit(), o.g(),
            o.critical())));
        r.leftOut().stream().filter(l -> l.kind() == LeftOut.Kind.NO_VALUE)
            .forEach(l -> notes.add("Not in this comparison: run " + l.line()));
        if (!notes.isEmpty()) {
          p.bullets(notes, 8.5f);
        }
      }
      p.heading("Runs counted in this report", 80);
      List<String[]> rows = new ArrayList<>();
      groups.forEach((g, list) -> list.forEach(m -> rows.add(new String[] {g,
          m.metadata().specimen(), m.metadata().runId(),
          Metric.PEAK.format(m.analysis().peakForce_N())})));
      p.table(new String[] {"group", "specimen", "run id", "peak force (N)"}, rows,
          new float[] {0.2f, 0.25f, 0.35f, 0.2f}, 8.5f);
      List<String> amended = new ArrayList<>();
      groups.values().forEach(list -> list.stream().map(RunMetrics::metadata)
          .filter(md -> md.amendments().any())
          .forEach(md -> amended.add("Run " + md.runId() + " (" + md.specimen() + "): "
              + RunFacts.amendments(md))));
      if (!amended.isEmpty()) {
        p.heading("Amended runs (counted with their amended values)", 60);
        p.bullets(amended, 8.5f);
      }
      if (!sel.leftOut().isEmpty()) {
        p.heading("Runs left out", 60);
        p.bullets(sel.leftOut().stream().map(l -> "Run " + l.line()).toList(), 8.5f);
      }
      if (!study.notCompared().isEmpty()) {
        p.heading("Not compared");
        p.bullets(study.notCompared(), 8.5f);
      }
      p.glyphNote();
      p.cautionBox("Cautions", CAUTIONS, 8.5f);
      save(p, file);
    }
  }

  /** @return the program and version that made the report, e.g. "Loadstone 0.1.0" */
  static String producer() {
    String v = PdfReport.class.getPackage().getImplementationVersion();
    return "Loadstone " + (v == null ? "dev" : v);
  }

  private static String operators(Selection sel) {
    return String.join(", ", sel.runs().stream().map(m -> m.metadata().operator())
        .filter(o -> !o.isBlank()).distinct().toList());
  }

  /**
   * The statistics table of a group report, one row per group: name, n, mean, SD, CV (%),
   * 95 % CI low and high, the values shown with the figure's digits ({@link Metric#format}).
   *
   * @param r the comparison, not null
   * @return the rows as printed
   */
  public static List<String[]> statisticsRows(StudyResult r) {
    Metric m = r.metric();
    List<String[]> rows = new ArrayList<>();
    for (GroupSummary g : r.groups()) {
      rows.add(new String[] {g.name(), Integer.toString(g.n()), m.format(g.mean()),
          m.format(g.sd()), g.cvPct().isPresent()
              ? String.format(Locale.ROOT, "%.1f", g.cvPct().getAsDouble()) : "-",
          m.format(g.ci95Low()), m.format(g.ci95High())});
    }
    return rows;
  }

  /** @return {@code p = } and the p-value with two significant digits, or {@code p < 0.0001} */
  public static String formatP(double p) {
    return p < 1e-4 ? "p < 0.0001" : String.format(Locale.ROOT, "p = %.2g", p);
  }

  private static String[] statsHeads(String unit) {
    return new String[] {"group", "n", "mean (" + unit + ")", "SD (" + unit + ")", "CV (%)",
        "95 % CI low (" + unit + ")", "95 % CI high (" + unit + ")"};
  }

  private static String testLine(StudyResult r) {
    return switch (r.test()) {
      case WELCH_T -> String.format(Locale.ROOT, "Test: Welch t-test, t = %.3g, df = %.3g, %s",
          r.comparison().statistic().getAsDouble(),
          r.comparison().degreesOfFreedom().getAsDouble(),
          formatP(r.pValue().getAsDouble()));
      case ONE_WAY_ANOVA -> String.format(Locale.ROOT,
          "Test: one-way ANOVA, F = %.3g, within-group df = %.0f, %s",
          r.comparison().statistic().getAsDouble(),
          r.comparison().degreesOfFreedom().getAsDouble(),
          formatP(r.pValue().getAsDouble()));
      case NONE -> "Test: none (see the reading below).";
    };
  }

  private static List<String[]> results(RunMetrics m) {
    List<String[]> rows = new ArrayList<>();
    for (Metric metric : Metric.values()) {
      rows.add(new String[] {metric.heading(), metric.format(metric.of(m))});
    }
    return rows;
  }

  static String num(double v) {
    if (Math.abs(v) < 1e-12) {
      return "0"; // rounding noise of a value that is zero, e.g. a toe offset on a clean line
    }
    return String.format(Locale.ROOT, "%.4g", v);
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
