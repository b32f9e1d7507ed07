package org.loadstone.report;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.regex.Pattern;
import org.apache.commons.math3.stat.descriptive.DescriptiveStatistics;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.text.PDFTextStripper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.archive.FinishCause;
import org.loadstone.archive.RunMetadata;
import org.loadstone.archive.ScaleSpec;
import org.loadstone.archive.TestRuns;
import org.loadstone.study.GroupStudy;
import org.loadstone.study.LeftOut;
import org.loadstone.study.Metric;
import org.loadstone.study.RunMetrics;
import org.loadstone.study.RunSelection;
import org.loadstone.study.Selection;

/** What a lab manager reads and signs: warnings first, formatted figures, tables, traceability. */
class ReportContentTest {
  @TempDir Path dir;

  /** No 16-digit floats and no exponents anywhere in a report. */
  private static final Pattern RAW = Pattern.compile("\\d\\.\\d{7,}|\\b\\d(\\.\\d+)?[eE][+-]?\\d+\\b");

  private static String[] pages(Path pdf) throws IOException {
    try (PDDocument d = Loader.loadPDF(pdf.toFile())) {
      String[] out = new String[d.getNumberOfPages()];
      for (int i = 0; i < out.length; i++) {
        PDFTextStripper s = new PDFTextStripper();
        s.setStartPage(i + 1);
        s.setEndPage(i + 1);
        out[i] = s.getText(d).replaceAll("\\s+", " ");
      }
      return out;
    }
  }

  @Test
  void aCrushRunReportLeadsWithItsCrushFiguresAndSaysHowItEnded() throws IOException {
    // rise at 1000 N/mm to 400 N, then teeth from 150 to 400 N every mm to 6 mm (each a 62 %
    // drop, past the 40 % break rule), 0.001 mm a sample; mean crush force = trapezoid area over
    // the stroke ÷ stroke (crashworthiness practice, from memory), summed here by hand
    int n = 6001;
    double[] t = new double[n];
    double[] f = new double[n];
    double[] x = new double[n];
    for (int i = 0; i < n; i++) {
      x[i] = i * 0.001;
      t[i] = i * 0.01;
      double phase = (x[i] - 0.4) % 1.0;
      f[i] = x[i] <= 0.4 ? 1000 * x[i] : phase < 0.8 ? 400 - 312.5 * phase
          : 150 + 1250 * (phase - 0.8);
    }
    double area = 0;
    for (int i = 1; i < n; i++) {
      area += 0.5 * (f[i] + f[i - 1]) * (x[i] - x[i - 1]);
    }
    int[] zeros = new int[n];
    RunMetadata md = TestRuns.meta("TU-04", "tubes", new org.loadstone.archive.Geometry(null,
        null, null, null, null, null, 80.0), 12.0).toBuilder()
        .testType(org.loadstone.archive.TestType.CRUSH).cause(FinishCause.TRAVEL_LIMIT)
        .extra(Map.of(RunMetadata.CRUSH_END_KEY, "at 6 mm of travel")).build();
    Path pdf = dir.resolve("crush.pdf");
    PdfReport.writeRun(RunMetrics.of(md, new org.loadstone.archive.RunData(t, f, x, zeros, zeros,
        zeros)), "/lab/archive", pdf);
    String[] p = pages(pdf);
    String key = p[0].substring(p[0].indexOf("Key figures"), p[0].indexOf("Force curve"));
    assertThat(key).contains("mean crush force " + Metric.CRUSH_MEAN.format(area / 6.0) + " N")
        .contains("crush-force efficiency " + Metric.CRUSH_EFFICIENCY.format(area / 6.0 / 400))
        .doesNotContain("stiffness");
    String all = String.join(" ", p);
    assertThat(all).contains("how it ended travel-limit: the crush ended by its own rule, at "
        + "its travel limit (at 6 mm of travel)").contains("break sample -")
        .contains("No break: a crush run goes on through its load drops");
  }

  @Test
  void aDoubtfulRunOpensWithABannerOfEveryConcern() throws IOException {
    RunMetadata md = TestRuns.meta("FO-21", "foam", TestRuns.panel(), 52.0).toBuilder()
        .checkWeight(TestRuns.checkWeight(false, -1.8432187))
        .warnings(List.of("Calibration cal-2026-11-20-500N of cell LC-500 expired on "
            + "2026-11-30. Forces will be computed with it, but recalibrate or verify with a "
            + "check weight before testing."))
        .zeroOffset_counts(18437.25)
        .build();
    Path pdf = dir.resolve("doubtful.pdf");
    PdfReport.writeRun(RunMetrics.of(md, TestRuns.bend(60, 460)), "/lab/archive", pdf);
    ReportPagesTest.keep(pdf);
    String[] p = pages(pdf);
    // the banner is on the first page, before the figures
    assertThat(p[0]).contains("Read before using these figures")
        .contains("check weight failed: the last check-weight verification of calibration "
            + "cal-2026-11-20-500N (2026-12-01 07:45 UTC) read -1.84 % against a tolerance "
            + "of 0.50 %")
        .contains("calibration expired: Calibration cal-2026-11-20-500N of cell LC-500 expired");
    assertThat(p[0].indexOf("Read before")).isLessThan(p[0].indexOf("Key figures"));
    String all = String.join(" ", p);
    // the check as a table row: when, calibration, kg, expected, indicated, error, tolerance
    assertThat(all).contains("2026-12-01 07:45 UTC cal-2026-11-20-500N 20 196.1 192.5 -1.84 "
        + "±0.50 FAILED");
    assertThat(all).contains("stiffness fit R2").contains("flexural modulus");
    // the zero as whole counts (18437.25 rounds to 18437), not 1.844e+04
    assertThat(all).contains("zero (tare) 18437 counts");
    assertThat(RAW.matcher(all).find()).as("raw float in: %s", all).isFalse();
    assertThat(all).contains("runs read from /lab/archive").contains(TestRuns.CAL_HASH)
        .contains("Tested by").contains("runs recorded by R. Okafor").contains("Checked by")
        .contains("Date");
  }

  @Test
  void anUncalibratedRunSaysSoAndACleanRunHasNoBanner() throws IOException {
    RunMetadata nominal = TestRuns.meta("FO-22", "foam", TestRuns.panel(), 52.0).toBuilder()
        .calibrationId(null).calibrationSha256(null).warnings(List.of())
        .scale("nominal 8590 counts/N (data sheet)")
        .scaleSpec(ScaleSpec.nominal(8590)).build();
    Path a = dir.resolve("nominal.pdf");
    PdfReport.writeRun(RunMetrics.of(nominal, TestRuns.bend(60, 460)), a);
    assertThat(pages(a)[0]).contains("uncalibrated: no calibration: force from a nominal scale "
        + "(nominal 8590 counts/N (data sheet)), a rough estimate");
    RunMetadata clean = TestRuns.meta("FO-23", "foam", TestRuns.panel(), 52.0).toBuilder()
        .warnings(List.of()).checkWeight(TestRuns.checkWeight(true, 0.12)).build();
    Path b = dir.resolve("clean.pdf");
    PdfReport.writeRun(RunMetrics.of(clean, TestRuns.bend(60, 460)), b);
    String[] p = pages(b);
    assertThat(p[0]).doesNotContain("Read before using these figures");
    assertThat(String.join(" ", p)).contains("+0.12 ±0.50 passed");
  }

  @Test
  void groupTablesShowTheCoresFiguresAndTheStatisticsOfThePlantedValues() throws IOException {
    Map<String, List<RunMetrics>> g = ReportFixtures.groups();
    RunMetadata manual = TestRuns.meta("BO-9", "board", TestRuns.panel(), 50.0).toBuilder()
        .cause(FinishCause.MANUAL).build();
    LeftOut left = RunSelection.DEFAULT.judge(manual).orElseThrow();
    // a nominal-scale run let in by the selection: counted, and named in the banner
    RunMetadata nominal = TestRuns.meta("BA-4", "balsa", TestRuns.panel(), 50.0).toBuilder()
        .calibrationId(null).calibrationSha256(null).scaleSpec(ScaleSpec.nominal(8590))
        .scale("nominal 8590 counts/N (data sheet)").build();
    List<RunMetrics> balsa = new ArrayList<>(g.get("balsa"));
    balsa.add(RunMetrics.of(nominal, TestRuns.bend(87, 633)));
    g.put("balsa", balsa);
    Selection sel = new Selection(Path.of("/lab/archive"), RunSelection.DEFAULT.admitting(
        LeftOut.Kind.UNCALIBRATED), g, List.of(left), List.copyOf(g.keySet()));
    Path pdf = dir.resolve("groups.pdf");
    PdfReport.writeGroups("Shelf panels", GroupStudy.compareEach(sel, PdfReport.DEFAULT_METRICS,
        0.10), pdf);
    ReportPagesTest.keep(pdf);
    String[] p = pages(pdf);
    String all = String.join(" ", p);
    assertThat(p[0]).contains("uncalibrated: 1 run counted (20261202-101500-BA-4)");
    for (List<RunMetrics> runs : g.values()) {
      for (RunMetrics m : runs) {
        String row = m.metadata().runId() + " " + Metric.PEAK.format(Metric.PEAK.of(m)) + " "
            + Metric.STIFFNESS.format(Metric.STIFFNESS.of(m)) + " "
            + Metric.ENERGY.format(Metric.ENERGY.of(m)) + " "
            + Metric.SPECIFIC_PEAK.format(Metric.SPECIFIC_PEAK.of(m)) + " break";
        assertThat(all).contains(row);
      }
    }
    // the figures are the planted ones: peak 455 N and stiffness 60 N/mm for FO-1 (TestRuns.bend
    // builds an exact line of that slope up to 80 % of that peak)
    assertThat(all).contains("20261202-101500-FO-1 455.0 60.00");
    // statistics of the foam peaks against Commons Math 3.6.1 (DescriptiveStatistics: mean and
    // the n − 1 standard deviation)
    DescriptiveStatistics foam = new DescriptiveStatistics(ReportFixtures.PEAKS[0]);
    assertThat(all).contains("foam 4 " + Metric.PEAK.format(foam.getMean()) + " "
        + Metric.PEAK.format(foam.getStandardDeviation()));
    assertThat(all).contains("Runs left out").contains("Run 20261202-101500-BO-9 (BO-9): "
        + "stopped by the operator, not ended by a break (group board)");
    assertThat(all).contains("runs read from /lab/archive")
        .contains("cal-2026-11-20-500N " + TestRuns.CAL_HASH)
        .contains("none (nominal scale)")
        .contains("Tested by").contains("Checked by");
    assertThat(RAW.matcher(all).find()).as("raw float").isFalse();
    // words come back as typed: no ligature glyphs (U+FB00 ff, U+FB01 fi, U+FB02 fl)
    assertThat(all).contains("stiffness (N/mm)").doesNotContain("\uFB00")
        .doesNotContain("\uFB01").doesNotContain("\uFB02");
  }
}
