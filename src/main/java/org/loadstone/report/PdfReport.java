package org.loadstone.report;

import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.loadstone.analysis.stats.GroupSummary;
import org.loadstone.archive.RunMetadata;
import org.loadstone.files.FilePublisher;
import org.loadstone.study.GroupStudy;
import org.loadstone.study.Metric;
import org.loadstone.study.RunMetrics;
import org.loadstone.study.Selection;
import org.loadstone.study.StudyResult;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * PDF reports (PDFBox, the embedded report font, charts as vectors): one run ({@link RunReport})
 * or a comparison of groups of runs ({@link GroupReport}). Both open with a banner of what must
 * be read first and end with traceability, an approval block and the cautions. Files are written
 * through a temporary name and never overwrite an existing one.
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
   * Writes the report of one run (see {@link RunReport}), read from an unnamed place.
   *
   * @param m the run's metrics, not null
   * @param file target PDF; must not exist
   * @throws LoadstoneException when the file exists or cannot be written
   */
  public static void writeRun(RunMetrics m, Path file) {
    writeRun(m, "not given", file);
  }

  /**
   * Writes the report of one run: title, a banner of what must be read first (failed check,
   * uncalibrated, expired calibration, no break, other warnings), the key figures, the force
   * curve, every figure, the specimen and run facts, the check-weight verification, notes,
   * traceability, approval and cautions.
   *
   * @param m the run's metrics, not null
   * @param source where the run was read from (its file or archive folder), for traceability
   * @param file target PDF; must not exist
   * @throws LoadstoneException when the file exists or cannot be written
   */
  public static void writeRun(RunMetrics m, String source, Path file) {
    org.loadstone.units.SlowWork.check("writing a report");
    Precondition.notNull(m, "metrics");
    Precondition.notNull(source, "source");
    Precondition.notNull(file, "file");
    RunMetadata md = m.metadata();
    try (PdfLayout p = new PdfLayout("Loadstone run report " + md.runId(), new PdfLayout.PdfInfo(
        "Run report: " + md.specimen(), md.operator(), md.testType().wireName() + " run "
            + md.runId() + " of specimen " + md.specimen(),
        String.join(", ", md.specimen(), md.group(), md.runId()), producer()))) {
      RunReport.write(p, m, source, Instant.now());
      save(p, file);
    }
  }

  /**
   * Writes a group comparison (see {@link GroupReport}): a banner of what must be read first, an
   * overlay of all curves coloured by group, one chart of each group's curves, then per figure
   * compared a strip plot, the statistics table ({@link #statisticsRows}), the test and p-value,
   * the plain reading, the sample-size advice and outliers by run; the results of every
   * specimen, the runs left out with the reason, traceability, approval and cautions.
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
    org.loadstone.units.SlowWork.check("writing a report");
    Precondition.notNull(title, "title");
    Precondition.notNull(study, "study");
    Precondition.notNull(file, "file");
    Selection sel = study.selection();
    Map<String, List<RunMetrics>> groups = sel.groups();
    if (groups.size() < 2) {
      throw new LoadstoneException("A group report needs at least 2 groups, was given "
          + groups.size() + ". Select runs from two or more groups.");
    }
    try (PdfLayout p = new PdfLayout("Loadstone group report: " + title, new PdfLayout.PdfInfo(
        title, operators(sel), "Comparison of groups " + String.join(", ", groups.keySet())
            + " over " + sel.counted() + " runs", String.join(", ", groups.keySet()),
        producer()))) {
      p.onChart(charts);
      GroupReport.write(p, title, study, Instant.now());
      save(p, file);
    }
  }

  /**
   * @return the program and version that made the report, e.g. "Loadstone 0.1.0": the version
   *     of {@link org.loadstone.units.SoftwareVersion}, as in every JSON document and run file
   */
  static String producer() {
    return "Loadstone " + org.loadstone.units.SoftwareVersion.get();
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

  private static void save(PdfLayout p, Path file) {
    try {
      FilePublisher.publish(file, "PDF report", p::save);
    } catch (UncheckedIOException e) {
      throw new LoadstoneException("Cannot build the PDF report " + file + ": "
          + e.getCause().getMessage(), e);
    }
  }
}
