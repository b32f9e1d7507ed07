package org.loadstone.report;

import java.awt.Font;
import java.awt.FontFormatException;
import java.io.ByteArrayInputStream;
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

  /**
   * Text the report font can show: each character it has no glyph for written as its Unicode
   * number, e.g. {@code [U+8BD5]} (the same mark the PDF text gets from {@link PdfText}), so a
   * chart never prints empty boxes.
   */
  static String printable(String s) {
    StringBuilder b = new StringBuilder(s.length());
    s.codePoints().forEach(c -> {
      if (REGULAR.canDisplay(c) && BOLD.canDisplay(c)) {
        b.appendCodePoint(c);
      } else {
        b.append(code(c));
      }
    });
    return b.toString();
  }

  /** @return the mark of a character without a glyph, e.g. {@code [U+8BD5]} */
  static String code(int codePoint) {
    return String.format(java.util.Locale.ROOT, "[U+%04X]", codePoint);
  }

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
    try {
      return new PDType0Font[] {
        PDType0Font.load(doc, new ByteArrayInputStream(REGULAR_BYTES), true),
        PDType0Font.load(doc, new ByteArrayInputStream(BOLD_BYTES), true)};
    } catch (IOException e) {
      throw new UncheckedIOException("cannot load the report font", e);
    }
  }

  private static final byte[] REGULAR_BYTES = withoutLigatures(REGULAR_FILE);
  private static final byte[] BOLD_BYTES = withoutLigatures(BOLD_FILE);

  /**
   * The font file with its glyph-substitution table hidden: PDFBox applies a font's Latin
   * ligatures when it shows text, which would print "stiffness" with an ff glyph that a reader
   * searching or copying the PDF gets back as U+FB00. The table's tag in the file's table
   * directory (12 bytes of header, then 16 bytes per table, tag first; TrueType/OpenType "Table
   * directory") is renamed, so the table is not found, and a subset written into the PDF leaves
   * it out.
   */
  static byte[] withoutLigatures(String file) {
    byte[] b;
    try (InputStream in = stream(file)) {
      b = in.readAllBytes();
    } catch (IOException e) {
      throw new UncheckedIOException("cannot load the report font " + file, e);
    }
    int tables = ((b[4] & 0xFF) << 8) | (b[5] & 0xFF);
    for (int i = 0; i < tables; i++) {
      int at = 12 + 16 * i;
      if (b[at] == 'G' && b[at + 1] == 'S' && b[at + 2] == 'U' && b[at + 3] == 'B') {
        b[at] = 'g';
        b[at + 1] = 's';
        b[at + 2] = 'u';
        b[at + 3] = 'b';
      }
    }
    return b;
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
