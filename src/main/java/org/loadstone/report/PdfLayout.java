package org.loadstone.report;

import java.awt.Color;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.Calendar;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.pdmodel.PDDocumentInformation;
import org.apache.pdfbox.pdmodel.PDPage;
import org.apache.pdfbox.pdmodel.PDPageContentStream;
import org.apache.pdfbox.pdmodel.common.PDRectangle;
import org.apache.pdfbox.pdmodel.font.PDType0Font;
import org.apache.pdfbox.pdmodel.interactive.viewerpreferences.PDViewerPreferences;
import org.jfree.chart.JFreeChart;

/**
 * A top-to-bottom page flow over PDFBox: headings, wrapped paragraphs, tables, charts (as
 * vectors, {@link PdfChart}) and boxes, starting a new A4 page when the next block does not fit.
 * Text is set in the embedded report font ({@link ReportFonts}); a character the font has no
 * glyph for is printed as its Unicode number, {@code [U+8BD5]}, and {@link #replacedAny()} says
 * that happened so the report can explain it. Every page gets a footer with "page n of N" when
 * the document is saved.
 */
final class PdfLayout implements AutoCloseable {
  static final float MARGIN = 48;
  private static final float WIDTH = PDRectangle.A4.getWidth();
  private static final float HEIGHT = PDRectangle.A4.getHeight();
  static final float TEXT_WIDTH = WIDTH - 2 * MARGIN;
  private static final Color INK = new Color(0x2E, 0x34, 0x3B);
  private static final Color MUTED = new Color(0x6A, 0x72, 0x7B);
  private static final Color RULE = new Color(0xC9, 0xCF, 0xD6);
  private static final Color SHADE = new Color(0xF2, 0xF4, 0xF6);
  private static final Color CAUTION = new Color(0xFB, 0xF3, 0xE6);
  private static final Color CAUTION_EDGE = new Color(0xB8, 0x86, 0x4B);

  final PDDocument doc = new PDDocument();
  private final PDType0Font regular;
  private final PDType0Font bold;
  private final Map<Integer, Boolean> encodable = new HashMap<>();
  private final String footer;
  private PDPageContentStream cs;
  private float y;
  private boolean replaced;
  private java.util.function.Consumer<JFreeChart> chartsDrawn = c -> { };

  /**
   * A document whose pages carry {@code footer} and the page number.
   *
   * @param footer e.g. "Loadstone run report 20261202-101500-FO-17"
   * @param info title, author, subject and keywords of the PDF ({@link #describe})
   */
  PdfLayout(String footer, PdfInfo info) {
    this.footer = footer;
    PDType0Font[] fonts = ReportFonts.pdf(doc);
    regular = fonts[0];
    bold = fonts[1];
    describe(info);
    newPage();
  }

  /**
   * What a PDF says about itself (shown by viewers and file managers).
   *
   * @param title the document title, shown in the viewer's title bar
   * @param author who tested, e.g. the operators of the runs; empty when unknown
   * @param subject one line on what the report is about
   * @param keywords comma-separated words (specimens, groups)
   * @param producer the program and version, e.g. "Loadstone 0.1.0"
   */
  record PdfInfo(String title, String author, String subject, String keywords,
      String producer) {}

  private void describe(PdfInfo info) {
    PDDocumentInformation d = doc.getDocumentInformation();
    d.setTitle(info.title());
    if (!info.author().isBlank()) {
      d.setAuthor(info.author());
    }
    d.setSubject(info.subject());
    d.setKeywords(info.keywords());
    d.setProducer(info.producer());
    d.setCreator(info.producer());
    d.setCreationDate(Calendar.getInstance());
    PDViewerPreferences prefs = new PDViewerPreferences(new org.apache.pdfbox.cos.COSDictionary());
    prefs.setDisplayDocTitle(true);
    doc.getDocumentCatalog().setViewerPreferences(prefs);
    doc.getDocumentCatalog().setLanguage("en");
  }

  /** @return whether some character was printed as its Unicode number (no glyph in the font) */
  boolean replacedAny() {
    return replaced;
  }

  /** When some character had no glyph so far: a line saying how such characters are shown. */
  void glyphNote() {
    if (replaced) {
      paragraph("Some characters have no glyph in the report font (" + ReportFonts.REGULAR_NAME
          + ") and are shown as their Unicode number in brackets, e.g. [U+8BD5]; the run files "
          + "keep the text unchanged.", 8);
    }
  }

  void newPage() {
    try {
      if (cs != null) {
        cs.close();
      }
      PDPage page = new PDPage(PDRectangle.A4);
      doc.addPage(page);
      cs = new PDPageContentStream(doc, page);
      y = HEIGHT - MARGIN;
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  /** Starts a new page unless {@code height} points still fit. */
  void need(float height) {
    if (y - height < MARGIN) {
      newPage();
    }
  }

  void title(String s, String sub) {
    need(40);
    text(bold, 16, INK, MARGIN, y - 16, s);
    y -= 22;
    if (sub != null) {
      text(regular, 9, MUTED, MARGIN, y - 9, sub);
      y -= 14;
    }
    rule();
  }

  void heading(String s) {
    heading(s, 40);
  }

  /** A heading kept on the same page as the next {@code keep} points of content. */
  void heading(String s, float keep) {
    need(25 + keep);
    y -= 8;
    text(bold, 11.5f, INK, MARGIN, y - 11.5f, s);
    y -= 17;
  }

  void paragraph(String s, float size) {
    for (String line : wrap(s, regular, size, TEXT_WIDTH)) {
      need(size + 4);
      text(regular, size, INK, MARGIN, y - size, line);
      y -= size + 3.5f;
    }
    y -= 3;
  }

  void bullets(List<String> items, float size) {
    for (String item : items) {
      List<String> lines = wrap(item, regular, size, TEXT_WIDTH - 12);
      for (int i = 0; i < lines.size(); i++) {
        need(size + 4);
        if (i == 0) {
          text(regular, size, MUTED, MARGIN + 2, y - size, "-");
        }
        text(regular, size, INK, MARGIN + 12, y - size, lines.get(i));
        y -= size + 3.5f;
      }
    }
    y -= 3;
  }

  /**
   * A table with a shaded head row; cells wrap within their column. {@code widths} are fractions
   * of the text width.
   */
  void table(String[] heads, List<String[]> rows, float[] widths, float size) {
    float[] w = new float[widths.length];
    for (int i = 0; i < w.length; i++) {
      w[i] = widths[i] * TEXT_WIDTH;
    }
    row(heads, w, size, true);
    for (String[] r : rows) {
      row(r, w, size, false);
    }
    y -= 6;
  }

  private void row(String[] cells, float[] w, float size, boolean head) {
    PDType0Font font = head ? bold : regular;
    List<List<String>> wrapped = new ArrayList<>();
    int lines = 1;
    for (int i = 0; i < cells.length; i++) {
      List<String> l = wrap(cells[i] == null ? "" : cells[i], font, size, w[i] - 6);
      wrapped.add(l);
      lines = Math.max(lines, l.size());
    }
    float h = lines * (size + 3) + 4;
    need(h);
    try {
      if (head) {
        cs.setNonStrokingColor(SHADE);
        cs.addRect(MARGIN, y - h, TEXT_WIDTH, h);
        cs.fill();
      }
      cs.setStrokingColor(RULE);
      cs.setLineWidth(0.5f);
      cs.moveTo(MARGIN, y - h);
      cs.lineTo(MARGIN + TEXT_WIDTH, y - h);
      cs.stroke();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    float x = MARGIN;
    for (int i = 0; i < cells.length; i++) {
      float ly = y - 2 - size;
      for (String s : wrapped.get(i)) {
        text(font, size, INK, x + 3, ly, s);
        ly -= size + 3;
      }
      x += w[i];
    }
    y -= h;
  }

  /** Tells {@code seen} each chart drawn from now on (tests look at their legends). */
  void onChart(java.util.function.Consumer<JFreeChart> seen) {
    chartsDrawn = seen;
  }

  /** A chart drawn as vectors (lines, shapes and text in the report font), width × height pt. */
  void chart(JFreeChart chart, float width, float height) {
    chartsDrawn.accept(chart);
    need(height + 6);
    PdfChart.draw(doc, cs, chart, regular, bold, MARGIN + (TEXT_WIDTH - width) / 2, y - height,
        width, height);
    y -= height + 8;
  }

  /** A tinted, framed box with a bold heading and bullet lines. */
  void cautionBox(String head, List<String> items, float size) {
    List<List<String>> wrapped = new ArrayList<>();
    int lines = 0;
    for (String s : items) {
      List<String> l = wrap(s, regular, size, TEXT_WIDTH - 28);
      wrapped.add(l);
      lines += l.size();
    }
    float h = 22 + lines * (size + 3.5f) + 8;
    need(h + 8);
    y -= 4;
    try {
      cs.setNonStrokingColor(CAUTION);
      cs.addRect(MARGIN, y - h, TEXT_WIDTH, h);
      cs.fill();
      cs.setStrokingColor(CAUTION_EDGE);
      cs.setLineWidth(1.2f);
      cs.addRect(MARGIN, y - h, TEXT_WIDTH, h);
      cs.stroke();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    text(bold, 10.5f, INK, MARGIN + 10, y - 15, head);
    float ly = y - 22 - size;
    for (List<String> l : wrapped) {
      for (int i = 0; i < l.size(); i++) {
        if (i == 0) {
          text(regular, size, CAUTION_EDGE, MARGIN + 10, ly, "!");
        }
        text(regular, size, INK, MARGIN + 20, ly, l.get(i));
        ly -= size + 3.5f;
      }
    }
    y -= h + 8;
  }

  void space(float pt) {
    y -= pt;
  }

  private void rule() {
    rule(y - 2);
    y -= 10;
  }

  private void rule(float at) {
    try {
      cs.setStrokingColor(RULE);
      cs.setLineWidth(0.8f);
      cs.moveTo(MARGIN, at);
      cs.lineTo(MARGIN + TEXT_WIDTH, at);
      cs.stroke();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  private void text(PDType0Font font, float size, Color c, float x, float baseline, String s) {
    try {
      cs.beginText();
      cs.setFont(font, size);
      cs.setNonStrokingColor(c);
      cs.newLineAtOffset(x, baseline);
      cs.showText(safe(s));
      cs.endText();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  private List<String> wrap(String s, PDType0Font font, float size, float width) {
    List<String> out = new ArrayList<>();
    for (String para : safe(s).split("\n", -1)) {
      StringBuilder line = new StringBuilder();
      for (String word : para.split(" ")) {
        String trial = line.length() == 0 ? word : line + " " + word;
        if (width(font, size, trial) <= width || line.length() == 0) {
          line.setLength(0);
          line.append(trial);
          while (width(font, size, line.toString()) > width && line.length() > 1) {
            int cut = Math.max(1, (int) (line.length() * width / width(font, size, line.toString())) - 1);
            out.add(line.substring(0, cut));
            line.delete(0, cut);
          }
        } else {
          out.add(line.toString());
          line.setLength(0);
          line.append(word);
        }
      }
      out.add(line.toString());
    }
    return out;
  }

  private float width(PDType0Font font, float size, String s) {
    try {
      return font.getStringWidth(s) / 1000 * size;
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  /**
   * The text as the report font can print it: tabs and carriage returns as spaces, other control
   * characters dropped, and each character without a glyph as its Unicode number, e.g. {@code
   * [U+8BD5]}.
   */
  String safe(String s) {
    StringBuilder b = new StringBuilder(s.length());
    s.codePoints().forEach(c -> {
      if (c == '\n') {
        b.append('\n');
      } else if (c == '\t' || c == '\r') {
        b.append(' ');
      } else if (Character.isISOControl(c)) {
        replaced = true;
      } else if (encodable.computeIfAbsent(c, this::canEncode)) {
        b.appendCodePoint(c);
      } else {
        replaced = true;
        b.append(String.format(java.util.Locale.ROOT, "[U+%04X]", c));
      }
    });
    return b.toString();
  }

  private boolean canEncode(int c) {
    String one = new String(Character.toChars(c));
    try {
      regular.encode(one);
      bold.encode(one);
      return true;
    } catch (IOException | IllegalArgumentException e) {
      return false;
    }
  }

  @Override
  public void close() {
    try {
      if (cs != null) {
        cs.close();
        cs = null;
      }
      doc.close();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  /** Closes the last page, puts "page n of N" on every page and saves the document. */
  void save(java.io.OutputStream out) throws IOException {
    cs.close();
    cs = null;
    int n = doc.getNumberOfPages();
    for (int i = 0; i < n; i++) {
      PDPage page = doc.getPage(i);
      try (PDPageContentStream foot = new PDPageContentStream(doc, page,
          PDPageContentStream.AppendMode.APPEND, true, true)) {
        cs = foot;
        rule(MARGIN - 12);
        text(regular, 7.5f, MUTED, MARGIN, MARGIN - 22, footer);
        String num = "page " + (i + 1) + " of " + n;
        text(regular, 7.5f, MUTED, MARGIN + TEXT_WIDTH - width(regular, 7.5f, num), MARGIN - 22,
            num);
      } finally {
        cs = null;
      }
    }
    doc.save(out);
  }
}
