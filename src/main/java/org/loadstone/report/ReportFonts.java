package org.loadstone.report;

import java.awt.Font;
import java.awt.FontFormatException;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.pdmodel.font.PDType0Font;

/**
 * The one typeface of every report and chart: DejaVu Sans (regular and bold), shipped in the jar
 * under {@code org/loadstone/report/fonts/} with its licence (Bitstream Vera terms, DejaVu changes
 * in the public domain), so a report looks the same on every machine and embeds the font. It
 * covers Latin, Greek, Cyrillic and many signs; characters it lacks (Chinese, Japanese, Korean…)
 * are printed as their Unicode number by {@link PdfLayout}, which says so in the report.
 */
final class ReportFonts {
  private ReportFonts() {}

  /** The typeface's name as Java and the PDF know it. */
  static final String REGULAR_NAME = "DejaVu Sans";
  static final String BOLD_NAME = "DejaVu Sans Bold";

  private static final String REGULAR_FILE = "fonts/DejaVuSans.ttf";
  private static final String BOLD_FILE = "fonts/DejaVuSans-Bold.ttf";
  private static final Font REGULAR = awtFont(REGULAR_FILE);
  private static final Font BOLD = awtFont(BOLD_FILE);

  /** @return the chart font at {@code size} points */
  static Font awt(boolean bold, float size) {
    return (bold ? BOLD : REGULAR).deriveFont(size);
  }

  /**
   * Loads the typeface into a document, to be embedded as a subset of the glyphs used.
   *
   * @return regular, then bold
   */
  static PDType0Font[] pdf(PDDocument doc) {
    try (InputStream r = stream(REGULAR_FILE); InputStream b = stream(BOLD_FILE)) {
      return new PDType0Font[] {PDType0Font.load(doc, r, true), PDType0Font.load(doc, b, true)};
    } catch (IOException e) {
      throw new UncheckedIOException("cannot load the report font", e);
    }
  }

  private static InputStream stream(String file) {
    InputStream in = ReportFonts.class.getResourceAsStream(file);
    if (in == null) {
      throw new IllegalStateException("the report font " + file + " is missing from the jar");
    }
    return in;
  }

  private static Font awtFont(String file) {
    try (InputStream in = stream(file)) {
      return Font.createFont(Font.TRUETYPE_FONT, in);
    } catch (IOException e) {
      throw new UncheckedIOException("cannot load the report font " + file, e);
    } catch (FontFormatException e) {
      throw new IllegalStateException("the report font " + file + " is damaged", e);
    }
  }
}
