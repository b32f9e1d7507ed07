package org.loadstone.report;

import static org.assertj.core.api.Assertions.assertThat;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import javax.imageio.ImageIO;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.cos.COSName;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.pdmodel.PDDocumentInformation;
import org.apache.pdfbox.pdmodel.PDPage;
import org.apache.pdfbox.pdmodel.PDResources;
import org.apache.pdfbox.pdmodel.font.PDFont;
import org.apache.pdfbox.pdmodel.graphics.PDXObject;
import org.apache.pdfbox.pdmodel.graphics.form.PDFormXObject;
import org.apache.pdfbox.pdmodel.graphics.image.PDImageXObject;
import org.apache.pdfbox.rendering.PDFRenderer;
import org.apache.pdfbox.text.PDFTextStripper;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.LegendItemCollection;
import org.jfree.chart.title.LegendTitle;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.archive.TestRuns;
import org.loadstone.study.RunMetrics;

/**
 * The group report of a large study, read back as a reader would: pages rendered to images, text
 * extracted, the fonts and images inside the file inspected. Three groups of 50 shelf-panel runs
 * each (foam, balsa and corrugated-board cores), peaks drawn from a seeded generator.
 */
class ReportPagesTest {
  private static final String[] GROUPS = {"foam", "balsa", "board"};
  private static final int RUNS = 50;

  @TempDir static Path dir;
  static Path pdf;
  static final List<JFreeChart> charts = new ArrayList<>();

  @BeforeAll
  static void writeTheLargeReport() throws IOException {
    Random rnd = new Random(20261204L); // fixed seed: the same report every run
    double[] peak = {460, 630, 385};
    double[] k = {60, 88, 42};
    Map<String, List<RunMetrics>> groups = new LinkedHashMap<>();
    for (int g = 0; g < GROUPS.length; g++) {
      List<RunMetrics> runs = new ArrayList<>();
      for (int i = 1; i <= RUNS; i++) {
        String id = GROUPS[g].substring(0, 2).toUpperCase() + "-" + i;
        runs.add(RunMetrics.of(TestRuns.meta(id, GROUPS[g], TestRuns.panel(), 48.0 + g + i % 5),
            TestRuns.bend(k[g] * (1 + 0.04 * rnd.nextGaussian()),
                peak[g] * (1 + 0.05 * rnd.nextGaussian()))));
      }
      groups.put(GROUPS[g], runs);
    }
    pdf = dir.resolve("large.pdf");
    PdfReport.writeGroups("Shelf panels, batch 7", ReportFixtures.study(groups,
        PdfReport.DEFAULT_METRICS), pdf, charts::add);
    keep(pdf);
  }

  /** Copies a file for looking at when -Dloadstone.reportSamples=DIR is set. */
  static void keep(Path file) throws IOException {
    String to = System.getProperty("loadstone.reportSamples");
    if (to != null) {
      Files.createDirectories(Path.of(to));
      Files.copy(file, Path.of(to).resolve(file.getFileName()),
          java.nio.file.StandardCopyOption.REPLACE_EXISTING);
    }
  }

  @Test
  void everyChartsLegendHasAtMostOneEntryPerGroup() throws IOException {
    assertThat(charts).hasSizeGreaterThanOrEqualTo(1 + GROUPS.length);
    for (JFreeChart c : charts) {
      LegendTitle legend = c.getLegend();
      if (legend != null) {
        LegendItemCollection items = c.getPlot().getLegendItems();
        assertThat(items.getItemCount()).as(c.getTitle().getText())
            .isBetween(1, GROUPS.length);
      }
    }
    // the curves' chart on the first page: its legend, real text in the PDF, names each group
    // once with its run count, and no single specimen
    try (PDDocument d = Loader.loadPDF(pdf.toFile())) {
      PDFTextStripper strip = new PDFTextStripper();
      strip.setStartPage(1);
      strip.setEndPage(1);
      String first = strip.getText(d);
      for (String g : GROUPS) {
        assertThat(count(first, g + " (50 runs)")).as(g).isEqualTo(1);
      }
      assertThat(first).doesNotContain("FO-1").doesNotContain("BA-7");
      BufferedImage page = new PDFRenderer(d).renderImageWithDPI(0, 110);
      Path png = dir.resolve("large-page-1.png");
      ImageIO.write(page, "png", png.toFile());
      keep(png);
      // the legend takes a line, not the page: the chart's curves are drawn in the group
      // colours over most of the chart (coloured pixels well beyond the legend's few swatches)
      assertThat(colouredPixels(page)).isGreaterThan(4000);
    }
  }

  @Test
  void everyPageSaysWhichOfHowManyItIs() throws IOException {
    try (PDDocument d = Loader.loadPDF(pdf.toFile())) {
      int n = d.getNumberOfPages();
      assertThat(n).isGreaterThan(3);
      for (int i = 1; i <= n; i++) {
        PDFTextStripper strip = new PDFTextStripper();
        strip.setStartPage(i);
        strip.setEndPage(i);
        assertThat(strip.getText(d)).contains("page " + i + " of " + n);
      }
    }
  }

  @Test
  void theFileSaysWhatItIsAndWhoMadeIt() throws IOException {
    try (PDDocument d = Loader.loadPDF(pdf.toFile())) {
      PDDocumentInformation info = d.getDocumentInformation();
      assertThat(info.getTitle()).isEqualTo("Shelf panels, batch 7");
      assertThat(info.getProducer()).startsWith("Loadstone ");
      assertThat(info.getAuthor()).isEqualTo("R. Okafor");
      assertThat(info.getSubject()).contains("foam, balsa, board").contains("150 runs");
      assertThat(info.getCreationDate()).isNotNull();
    }
  }

  @Test
  void everyFontIsEmbeddedAndChartsAreVectors() throws IOException {
    try (PDDocument d = Loader.loadPDF(pdf.toFile())) {
      List<String> fonts = new ArrayList<>();
      int[] images = {0};
      int[] forms = {0};
      for (PDPage page : d.getPages()) {
        walk(page.getResources(), fonts, images, forms);
      }
      // PDF 32000-1:2008, 9.9: an embedded font carries its program in the font descriptor
      assertThat(fonts).isNotEmpty().allMatch(f -> f.startsWith("embedded "), "embedded");
      assertThat(fonts).anyMatch(f -> f.contains("DejaVuSans"));
      assertThat(images[0]).as("bitmap images").isZero();
      assertThat(forms[0]).as("charts drawn as forms").isGreaterThanOrEqualTo(charts.size());
    }
  }

  @Test
  void aUnicodeSpecimenNameRoundTripsThroughTheFile() throws IOException {
    String name = "Ørsted-Łódź-Жёсткость-Ω-ß";
    Map<String, List<RunMetrics>> g = new LinkedHashMap<>();
    g.put("foam", List.of(RunMetrics.of(TestRuns.meta(name, "foam", TestRuns.panel(), 50.0),
        TestRuns.bend(60, 460)), RunMetrics.of(TestRuns.meta("FO-2", "foam", TestRuns.panel(),
        50.0), TestRuns.bend(61, 470))));
    g.put("balsa", List.of(RunMetrics.of(TestRuns.meta("BA-1", "balsa", TestRuns.panel(), 50.0),
        TestRuns.bend(88, 630)), RunMetrics.of(TestRuns.meta("BA-2", "balsa", TestRuns.panel(),
        50.0), TestRuns.bend(86, 640))));
    Path out = dir.resolve("unicode.pdf");
    PdfReport.writeGroups("Names", ReportFixtures.study(g, PdfReport.DEFAULT_METRICS), out);
    Path run = dir.resolve("unicode-run.pdf");
    PdfReport.writeRun(g.get("foam").get(0), run);
    for (Path p : List.of(out, run)) {
      try (PDDocument d = Loader.loadPDF(p.toFile())) {
        assertThat(new PDFTextStripper().getText(d)).contains(name)
            .doesNotContain("[U+");
      }
    }
  }

  private static void walk(PDResources res, List<String> fonts, int[] images, int[] forms)
      throws IOException {
    if (res == null) {
      return;
    }
    for (COSName n : res.getFontNames()) {
      PDFont f = res.getFont(n);
      fonts.add((f.isEmbedded() ? "embedded " : "referenced ") + f.getName());
    }
    for (COSName n : res.getXObjectNames()) {
      PDXObject x = res.getXObject(n);
      if (x instanceof PDImageXObject) {
        images[0]++;
      } else if (x instanceof PDFormXObject form) {
        forms[0]++;
        walk(form.getResources(), fonts, images, forms);
      }
    }
  }

  private static int count(String text, String what) {
    int n = 0;
    for (int i = text.indexOf(what); i >= 0; i = text.indexOf(what, i + 1)) {
      n++;
    }
    return n;
  }

  /** Pixels clearly coloured (not grey, black or white): curves, swatches, points. */
  private static int colouredPixels(BufferedImage img) {
    int n = 0;
    for (int y = 0; y < img.getHeight(); y++) {
      for (int x = 0; x < img.getWidth(); x++) {
        int rgb = img.getRGB(x, y);
        int r = (rgb >> 16) & 0xFF;
        int gg = (rgb >> 8) & 0xFF;
        int b = rgb & 0xFF;
        if (Math.max(r, Math.max(gg, b)) - Math.min(r, Math.min(gg, b)) > 60) {
          n++;
        }
      }
    }
    return n;
  }
}
