package org.loadstone.report;

import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import org.loadstone.archive.RunMetadata;
import org.loadstone.study.Metric;
import org.loadstone.study.RunConcerns;
import org.loadstone.study.RunMetrics;

/**
 * The report of one run: title, warnings, the figures that matter first, the force curve, every
 * figure of the catalogue, the specimen and run facts, the check-weight verification, notes,
 * traceability, approval and cautions.
 */
final class RunReport {
  private RunReport() {}

  static void write(PdfLayout p, RunMetrics m, String source, Instant made) {
    RunMetadata md = m.metadata();
    p.title("Run report: " + md.specimen(), "run " + md.runId() + "  ·  "
        + (md.group().isBlank() ? "no group" : "group " + md.group()) + "  ·  started "
        + RunFacts.when(md.startedAt()) + "  ·  " + md.cause().wireName());
    ReportParts.banner(p, md);
    p.heading("Key figures", 40);
    List<String[]> key = new ArrayList<>();
    for (Metric f : Metric.keyFigures(md.testType())) { // shown large at the top
      key.add(new String[] {f.label(), f.format(f.of(m)), f.unit()});
    }
    p.table(new String[] {"figure", "value", "unit"}, key, new float[] {0.5f, 0.3f, 0.2f}, 10);
    p.heading("Force curve", 270);
    p.chart(Charts.run(m), PdfLayout.TEXT_WIDTH, 260);
    p.heading("All figures", 120);
    p.table(new String[] {"figure", "value", "unit"}, figures(m),
        new float[] {0.5f, 0.3f, 0.2f}, 8.5f);
    if (!m.notes().isEmpty()) {
      p.heading("How the figures were found");
      p.bullets(m.notes(), 8.5f);
    }
    p.heading("Specimen and run", 120);
    p.table(new String[] {"item", "value"}, RunFacts.rows(md), new float[] {0.28f, 0.72f}, 8.5f);
    p.heading("Check-weight verification", 50);
    RunConcerns.lastCheck(md).ifPresentOrElse(
        c -> p.table(RunFacts.CHECK_HEADS, List.<String[]>of(RunFacts.checkRow(c)),
            new float[] {0.16f, 0.2f, 0.1f, 0.1f, 0.1f, 0.09f, 0.12f, 0.13f}, 8),
        () -> p.paragraph(md.calibrationId() == null
            ? "None: the run used no calibration." : "None stored with the run: calibration "
                + md.calibrationId() + " had not been verified with a check weight.", 8.5f));
    ReportParts.close(p);
    ReportParts.traceability(p, source, List.of(md), made);
    ReportParts.approval(p, List.of(md));
  }

  /** Every figure of the catalogue: label, value with its digits, unit. */
  static List<String[]> figures(RunMetrics m) {
    List<String[]> rows = new ArrayList<>();
    for (Metric f : Metric.values()) {
      rows.add(new String[] {f.label(), f.format(f.of(m)), f.unit()});
    }
    return rows;
  }
}
