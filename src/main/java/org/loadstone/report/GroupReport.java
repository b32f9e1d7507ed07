package org.loadstone.report;

import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.loadstone.archive.RunMetadata;
import org.loadstone.study.GroupStudy;
import org.loadstone.study.LeftOut;
import org.loadstone.study.Metric;
import org.loadstone.study.RunMetrics;
import org.loadstone.study.Selection;
import org.loadstone.study.StudyResult;

/**
 * The report of a group comparison: warnings, the curves of all groups and of each group, then
 * per figure compared a strip plot, the statistics, the test and its p, the reading, the
 * sample-size advice and the outliers by run; the results of every specimen; the runs left out
 * with the reason; traceability, approval and cautions.
 */
final class GroupReport {
  private GroupReport() {}

  /** The figures of the per-specimen table, after group, specimen and run. */
  static final List<Metric> SPECIMEN_FIGURES = List.of(Metric.PEAK, Metric.STIFFNESS,
      Metric.ENERGY, Metric.SPECIFIC_PEAK);

  static void write(PdfLayout p, String title, GroupStudy.Report study, Instant made) {
    Selection sel = study.selection();
    Map<String, List<RunMetrics>> groups = sel.groups();
    GroupColours colours = GroupColours.of(sel);
    List<RunMetadata> counted = sel.runs().stream().map(RunMetrics::metadata).toList();
    p.title(title, groups.size() + " groups, " + sel.counted() + " runs counted"
        + (sel.leftOut().isEmpty() ? "" : ", " + sel.leftOut().size() + " left out (listed at "
            + "the end)") + ": " + String.join(", ", groups.keySet()));
    ReportParts.banner(p, counted);
    p.heading("Force curves by group", 280);
    p.chart(Charts.overlay("all runs", groups, colours), PdfLayout.TEXT_WIDTH, 270);
    for (Map.Entry<String, List<RunMetrics>> e : groups.entrySet()) {
      p.heading("Group " + e.getKey(), 210);
      p.chart(Charts.group(e.getKey(), e.getValue(), colours), PdfLayout.TEXT_WIDTH * 0.8f,
          200);
    }
    for (StudyResult r : study.results()) {
      statistics(p, r, colours);
    }
    if (!study.notCompared().isEmpty()) {
      p.heading("Not compared");
      p.bullets(study.notCompared(), 8.5f);
    }
    p.heading("Results of every specimen", 80);
    p.table(specimenHeads(), specimenRows(sel), new float[] {0.08f, 0.12f, 0.2f, 0.08f, 0.09f,
        0.08f, 0.08f, 0.09f, 0.18f}, 7);
    List<String> amended = new ArrayList<>();
    for (RunMetadata md : counted) {
      if (md.amendments().any()) {
        amended.add("Run " + md.runId() + " (" + md.specimen() + "): "
            + RunFacts.amendments(md));
      }
    }
    if (!amended.isEmpty()) {
      p.heading("Amended runs (counted with their amended values)", 60);
      p.bullets(amended, 8);
    }
    if (!sel.leftOut().isEmpty()) {
      p.heading("Runs left out", 60);
      p.bullets(sel.leftOut().stream().map(l -> "Run " + l.line()
          + (l.group().isEmpty() ? "" : " (group " + l.group() + ")")).toList(), 8);
    }
    ReportParts.close(p);
    ReportParts.traceability(p, sel.folder().toString(), counted, made);
    ReportParts.approval(p, counted);
  }

  private static void statistics(PdfLayout p, StudyResult r, GroupColours colours) {
    Metric metric = r.metric();
    p.heading(capital(metric.heading()), 340);
    p.chart(Charts.strip(r.comparison(), r.plainValues(), metric.heading(), colours),
        PdfLayout.TEXT_WIDTH * 0.8f, 190);
    p.table(statsHeads(metric.unit()), PdfReport.statisticsRows(r), new float[] {0.22f, 0.06f,
        0.14f, 0.14f, 0.1f, 0.17f, 0.17f}, 8.5f);
    p.paragraph(testLine(r), 9);
    p.paragraph(r.sentence(), 9);
    r.advice().ifPresent(a -> p.paragraph("Sample size: " + a.sentence(), 9));
    List<String> notes = new ArrayList<>();
    r.outliers().forEach(o -> notes.add("Possible outlier in group '" + o.group() + "': run "
        + o.runId() + " (" + o.specimen() + "), " + metric.format(o.value()) + " "
        + metric.unit() + " (Grubbs G = " + three(o.g()) + " above the critical "
        + three(o.critical()) + " at the 5 % level). Check that specimen before leaving it out."));
    r.leftOut().stream().filter(l -> l.kind() == LeftOut.Kind.NO_VALUE)
        .forEach(l -> notes.add("Not in this comparison: run " + l.line()));
    if (!notes.isEmpty()) {
      p.bullets(notes, 8.5f);
    }
  }

  static String[] specimenHeads() {
    List<String> h = new ArrayList<>(List.of("group", "specimen", "run id"));
    for (Metric f : SPECIMEN_FIGURES) {
      h.add(shortLabel(f) + " (" + f.unit() + ")");
    }
    h.add("ended by");
    h.add("calibration and SHA-256 start");
    return h.toArray(new String[0]);
  }

  /** One row per counted run, group by group: the figures as the catalogue formats them. */
  static List<String[]> specimenRows(Selection sel) {
    List<String[]> rows = new ArrayList<>();
    sel.groups().forEach((g, list) -> list.forEach(m -> {
      RunMetadata md = m.metadata();
      List<String> r = new ArrayList<>(List.of(g, md.specimen(), md.runId()));
      for (Metric f : SPECIMEN_FIGURES) {
        r.add(f.format(f.of(m)));
      }
      r.add(md.cause().wireName());
      r.add(ReportParts.calibration(md) + "\n" + ReportParts.shortHash(md));
      rows.add(r.toArray(new String[0]));
    }));
    return rows;
  }

  private static String shortLabel(Metric f) {
    return switch (f) {
      case PEAK -> "peak";
      case ENERGY -> "energy to peak";
      case SPECIFIC_PEAK -> "peak per gram";
      default -> f.label();
    };
  }

  private static String[] statsHeads(String unit) {
    return new String[] {"group", "n", "mean (" + unit + ")", "SD (" + unit + ")", "CV (%)",
        "95 % CI low (" + unit + ")", "95 % CI high (" + unit + ")"};
  }

  private static String testLine(StudyResult r) {
    return switch (r.test()) {
      case WELCH_T -> "Test: Welch t-test, t = " + three(r.comparison().statistic()
          .getAsDouble()) + ", df = " + three(r.comparison().degreesOfFreedom().getAsDouble())
          + ", " + PdfReport.formatP(r.pValue().getAsDouble());
      case ONE_WAY_ANOVA -> "Test: one-way ANOVA, F = " + three(r.comparison().statistic()
          .getAsDouble()) + ", within-group df = " + Metric.format(r.comparison()
          .degreesOfFreedom().getAsDouble(), 0) + ", " + PdfReport.formatP(r.pValue()
          .getAsDouble());
      case NONE -> "Test: none (see the reading below).";
    };
  }

  /** @return three significant digits, no exponent */
  private static String three(double v) {
    return Metric.format(v, 3);
  }

  private static String capital(String s) {
    return s.isEmpty() ? s : Character.toUpperCase(s.charAt(0)) + s.substring(1);
  }
}
