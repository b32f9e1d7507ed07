package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.awt.image.BufferedImage;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.pdmodel.PDPage;
import org.apache.pdfbox.pdmodel.font.PDFont;
import org.apache.pdfbox.rendering.PDFRenderer;
import org.apache.pdfbox.text.PDFTextStripper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A specimen named outside WinAnsi, end to end: imported with a Japanese specimen id, a Danish
 * group and a Polish operator, then reported. Latin letters beyond WinAnsi (Ø, ł, Ł) print as
 * typed in the embedded font; ideographs the font has no glyph for print as their Unicode number
 * with a note, never as garbage or a crash. Checked on the PDF read back by PDFBox's text
 * extraction and rendered to an image.
 */
class UnicodeReportTest {
  @TempDir Path tmp;

  /** The mark of a character printed by its number: "[U+" + hex code point + "]". */
  private static String mark(String ch) {
    return String.format(Locale.ROOT, "[U+%04X]", ch.codePointAt(0));
  }

  @Test
  void aSpecimenIdInJapaneseAndNamesWithPolishAndDanishLettersPrint() throws Exception {
    // a linear rise to 300 N at 3 mm, then a break to 20 N
    StringBuilder csv = new StringBuilder("time_s,force_N,position_mm\n");
    for (int i = 0; i <= 80; i++) {
      csv.append(String.format(Locale.ROOT, "%.2f,%.1f,%.3f%n", i * 0.05,
          i <= 60 ? i * 5.0 : 20.0, i * 0.05));
    }
    Path src = Files.writeString(tmp.resolve("curve.csv"), csv.toString());
    Path arc = tmp.resolve("arc");
    CliRun imp = CliRun.run("", "import", src.toString(), "--map",
        "time=time_s,force=force_N,position=position_mm", "--specimen", "試料-07", "--group",
        "Ø-core", "--operator", "Michał Łukasz", "--notes", "łamanie Ø 25", "--mass-g", "12",
        "--archive", arc.toString(), "--json");
    assertThat(imp.exit()).as(imp.toString()).isZero();

    Path pdf = tmp.resolve("run.pdf");
    CliRun rep = CliRun.run("", "report", "試料-07", "--archive", arc.toString(), "--out",
        pdf.toString());
    assertThat(rep.exit()).as(rep.toString()).isZero();

    try (PDDocument d = Loader.loadPDF(pdf.toFile())) {
      String text = new PDFTextStripper().getText(d);
      // 試 is U+8A66 and 料 is U+6599 (Unicode Character Database, CJK Unified Ideographs)
      assertThat(mark("試")).isEqualTo("[U+8A66]");
      assertThat(text).contains("Run report: " + mark("試") + mark("料") + "-07")
          .contains("Ø-core").contains("Michał Łukasz").contains("łamanie Ø 25")
          .contains("shown as their Unicode number")
          .doesNotContain("試").doesNotContain("?-07");
      // every font is embedded, so the letters print the same on any reader
      for (PDPage page : d.getPages()) {
        for (org.apache.pdfbox.cos.COSName n : page.getResources().getFontNames()) {
          PDFont f = page.getResources().getFont(n);
          assertThat(f.isEmbedded()).as(f.getName()).isTrue();
        }
      }
      // the first page renders, and draws something (not a blank page)
      BufferedImage img = new PDFRenderer(d).renderImageWithDPI(0, 40);
      int dark = 0;
      for (int y = 0; y < img.getHeight(); y++) {
        for (int x = 0; x < img.getWidth(); x++) {
          if ((img.getRGB(x, y) & 0xFF) < 128) {
            dark++;
          }
        }
      }
      assertThat(dark).isGreaterThan(1000);
    }
  }
}
