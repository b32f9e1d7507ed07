package org.loadstone.report;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.apache.commons.math3.stat.inference.OneWayAnova;
import org.apache.commons.math3.stat.inference.TTest;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.text.PDFTextStripper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.study.Metric;
import org.loadstone.study.RunMetrics;
import org.loadstone.archive.TestRuns;
import org.loadstone.files.FakeDisk;
import org.loadstone.units.LoadstoneException;

class PdfReportTest {
  @TempDir Path dir;

  /** Where to keep copies for looking at: -Dloadstone.reportSamples=/some/dir (optional). */
  private static void keep(Path pdf) throws IOException {
    String to = System.getProperty("loadstone.reportSamples");
    if (to != null) {
      Files.createDirectories(Path.of(to));
      Files.copy(pdf, Path.of(to).resolve(pdf.getFileName()),
          java.nio.file.StandardCopyOption.REPLACE_EXISTING);
    }
  }

  private static String text(Path pdf) throws IOException {
    try (PDDocument d = Loader.loadPDF(pdf.toFile())) {
      return new PDFTextStripper().getText(d).replaceAll("\\s+", " ");
    }
  }

  @Test
  void runReportHoldsTheFactsResultsAndCautions() throws IOException {
    RunMetrics m = RunMetrics.of(TestRuns.meta("FO-17", "foam", TestRuns.panel(), 52.0),
        TestRuns.bend(60, 460));
    Path pdf = dir.resolve("run.pdf");
    PdfReport.writeRun(m, pdf);
    keep(pdf);
    String t = text(pdf);
    assertThat(t).contains("Run report: FO-17")
        .contains(TestRuns.CAL_HASH)
        .contains("cal-2026-11-20-500N")
        .contains("peak force (N) 460.0")
        // C393 core shear stress 460/((26+20)·50) = 0.2 MPa, printed with 4 digits
        .contains("core shear stress at peak (MPa) 0.2000")
        .contains("R. Okafor")
        .contains("shield and eye protection")
        .contains("does not replace the press's own mechanical limits or an emergency stop")
        .contains("not an accredited calibration or certification");
    assertThatThrownBy(() -> PdfReport.writeRun(m, pdf))
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("already exists");
  }

  @Test
  void aRunReportIsWrittenToAStickWithoutHardLinksAndNeverOverAnother() throws IOException {
    RunMetrics m = RunMetrics.of(TestRuns.meta("FO-18", "foam", TestRuns.panel(), 52.0),
        TestRuns.bend(61, 455));
    FakeDisk stick = FakeDisk.create().withoutLinks(); // FAT/exFAT refuse hard links (EPERM)
    PdfReport.writeRun(m, stick.path(dir.resolve("stick.pdf")));
    assertThat(stick.linksRefused()).isEqualTo(1);
    assertThat(text(dir.resolve("stick.pdf"))).contains("Run report: FO-18");
    byte[] before = Files.readAllBytes(dir.resolve("stick.pdf"));
    assertThatThrownBy(() -> PdfReport.writeRun(m, stick.path(dir.resolve("stick.pdf"))))
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("already exists");
    assertThat(Files.readAllBytes(dir.resolve("stick.pdf"))).isEqualTo(before);
  }

  @Test
  void groupReportHoldsStatisticsAndTheIndependentPValue() throws IOException {
    Map<String, List<RunMetrics>> g = ReportFixtures.groups();
    Path pdf = dir.resolve("groups.pdf");
    // title with characters outside WinAnsi: must not throw
    PdfReport.writeGroups("Shelf panels: core shear ≥ 0.2 MPa, σ in N/mm² — 试验",
        ReportFixtures.study(g, PdfReport.DEFAULT_METRICS), pdf);
    keep(pdf);
    String t = text(pdf);
    // reference p-value of the one-way ANOVA on the peak forces from Commons Math 3.6.1
    double p = new OneWayAnova().anovaPValue(List.of(ReportFixtures.PEAKS));
    assertThat(t).contains("one-way ANOVA").contains(PdfReport.formatP(p))
        .contains("core shear ≥ 0.2 MPa, σ in N/mm² — [U+8BD5][U+9A8C]")
        .contains("Peak force (N)")
        .contains("95 % CI low (N)")
        .contains("Sample size:")
        .contains("FO-1").contains("BA-3").contains("BO-4")
        .contains("shield and eye protection");
  }

  @Test
  void twoGroupReportPrintsTheWelchPValueOfCommonsMath() throws IOException {
    double[] a = {455, 470, 462, 448};
    // the last specimen of B stands out: Grubbs G = 1.79 against the two-sided 5 % critical
    // value 1.715 for n = 5 (NIST/SEMATECH e-Handbook of Statistical Methods, 1.3.5.17; from
    // memory of its table)
    double[] b = {466, 468, 467, 469, 520};
    Map<String, List<RunMetrics>> g = new java.util.LinkedHashMap<>();
    g.put("foam A", runs("FA", a));
    g.put("foam B", runs("FB", b));
    Path pdf = dir.resolve("two.pdf");
    PdfReport.writeGroups("Foam batches", ReportFixtures.study(g, List.of(Metric.PEAK)), pdf);
    // reference: Welch's two-sided t-test of Commons Math 3.6.1 (TTest.tTest, unequal variances)
    double p = new TTest().tTest(a, b);
    assertThat(p).isBetween(0.01, 0.9); // a p-value the report must print as digits
    String t = text(pdf);
    assertThat(t).contains("Welch t-test").contains(PdfReport.formatP(p))
        .contains("Possible outlier in group 'foam B': run 20261202-101500-FB-5 (FB-5), 520.0 N");
  }

  private static List<RunMetrics> runs(String prefix, double[] peaks) {
    List<RunMetrics> l = new java.util.ArrayList<>();
    for (int i = 0; i < peaks.length; i++) {
      l.add(RunMetrics.of(TestRuns.meta(prefix + "-" + (i + 1), prefix, TestRuns.panel(), 50.0),
          TestRuns.bend(60, peaks[i])));
    }
    return l;
  }

  @Test
  void charactersOutsideTheFontArePrintedAsTheirNumberWithANote() throws IOException {
    RunMetrics m = RunMetrics.of(TestRuns.meta("σ-µ²-≥-试", "foam", TestRuns.panel(), null),
        TestRuns.bend(60, 460));
    Path pdf = dir.resolve("odd.pdf");
    PdfReport.writeRun(m, pdf);
    // U+8BD5 is the code point of 试 (Unicode Character Database, CJK Unified Ideographs)
    assertThat(text(pdf)).contains("Run report: σ-µ²-≥-[U+8BD5]")
        .contains("shown as their Unicode number");
  }

  @Test
  void groupReportRefusesOneGroup() {
    Map<String, List<RunMetrics>> one = Map.of("foam", ReportFixtures.groups().get("foam"));
    assertThatThrownBy(() -> PdfReport.writeGroups("x", ReportFixtures.study(one,
        PdfReport.DEFAULT_METRICS), dir.resolve("x.pdf"))).hasMessageContaining("at least 2 groups");
  }
}
