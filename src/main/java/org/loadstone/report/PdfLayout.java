package org.loadstone.report;

import java.awt.Color;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.List;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.pdmodel.PDPage;
import org.apache.pdfbox.pdmodel.PDPageContentStream;
import org.apache.pdfbox.pdmodel.common.PDRectangle;
import org.apache.pdfbox.pdmodel.font.PDType0Font;
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
  private final PdfText fonts;
  private final String footer;
  private PDPageContentStream cs;
  private float y;
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
    this.fonts = new PdfText(regular, bold);
    PdfPages.describe(doc, info);
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

  /** @return whether some character was printed as its Unicode number (no glyph in the font) */
  boolean replacedAny() {
    return fonts.replacedAny();
  }

  /** When some character had no glyph so far: a line saying how such characters are shown. */
  void glyphNote() {
    if (fonts.replacedAny()) {
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

  /** Colours of a framed box: its fill, its frame and its marks. */
  record Tone(Color fill, Color edge) {}

  static final Tone CAUTION_TONE = new Tone(CAUTION, CAUTION_EDGE);
  static final Tone ALERT_TONE = new Tone(new Color(0xFB, 0xEA, 0xE8), new Color(0xA8, 0x32, 0x2B));

  /** A tinted, framed box with a bold heading and marked lines. */
  void cautionBox(String head, List<String> items, float size) {
    box(head, items.stream().map(i -> new String[] {"", i}).toList(), CAUTION_TONE, size);
  }

  /**
   * A tinted, framed box with a bold heading and one marked line per item; an item is {lead,
   * text}, the lead (may be empty) in bold before the text.
   */
  void box(String head, List<String[]> items, Tone tone, float size) {
    List<List<String>> wrapped = new ArrayList<>();
    int lines = 0;
    for (String[] item : items) {
      String lead = item[0].isEmpty() ? "" : item[0] + ": ";
      List<String> l = wrap(lead + item[1], regular, size, TEXT_WIDTH - 28);
      wrapped.add(l);
      lines += l.size();
    }
    float h = 22 + lines * (size + 3.5f) + 8;
    need(h + 8);
    y -= 4;
    try {
      cs.setNonStrokingColor(tone.fill());
      cs.addRect(MARGIN, y - h, TEXT_WIDTH, h);
      cs.fill();
      cs.setStrokingColor(tone.edge());
      cs.setLineWidth(1.2f);
      cs.addRect(MARGIN, y - h, TEXT_WIDTH, h);
      cs.stroke();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    text(bold, 10.5f, INK, MARGIN + 10, y - 15, head);
    float ly = y - 22 - size;
    for (int k = 0; k < wrapped.size(); k++) {
      List<String> l = wrapped.get(k);
      String lead = items.get(k)[0].isEmpty() ? "" : safe(items.get(k)[0] + ":");
      for (int i = 0; i < l.size(); i++) {
        if (i == 0) {
          text(bold, size, tone.edge(), MARGIN + 10, ly, "!");
        }
        if (i == 0 && !lead.isEmpty() && l.get(0).startsWith(lead)) {
          // the lead in bold, the rest of the first line after it
          text(bold, size, INK, MARGIN + 20, ly, lead);
          text(regular, size, INK, MARGIN + 20 + width(bold, size, lead), ly,
              l.get(0).substring(lead.length()));
        } else {
          text(regular, size, INK, MARGIN + 20, ly, l.get(i));
        }
        ly -= size + 3.5f;
      }
    }
    y -= h + 8;
  }

  /**
   * Boxes side by side to be signed: each with its label, what is known already (may be empty)
   * and a line to sign on.
   *
   * @param fields {label, known, what goes on the line} per box
   */
  void signatures(List<String[]> fields, float size) {
    float h = 58;
    need(h + 10);
    float w = TEXT_WIDTH / fields.size();
    try {
      cs.setStrokingColor(RULE);
      cs.setLineWidth(0.8f);
      cs.addRect(MARGIN, y - h, TEXT_WIDTH, h);
      for (int i = 1; i < fields.size(); i++) {
        cs.moveTo(MARGIN + i * w, y);
        cs.lineTo(MARGIN + i * w, y - h);
      }
      cs.stroke();
      cs.setStrokingColor(MUTED);
      cs.setLineWidth(0.5f);
      for (int i = 0; i < fields.size(); i++) {
        cs.moveTo(MARGIN + i * w + 8, y - h + 14);
        cs.lineTo(MARGIN + (i + 1) * w - 8, y - h + 14);
      }
      cs.stroke();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    for (int i = 0; i < fields.size(); i++) {
      float x = MARGIN + i * w + 8;
      text(bold, size, INK, x, y - 4 - size, fields.get(i)[0]);
      List<String> known = wrap(fields.get(i)[1], regular, size - 1, w - 16);
      if (!known.isEmpty() && !known.get(0).isEmpty()) {
        text(regular, size - 1, MUTED, x, y - 8 - 2 * size, known.get(0));
      }
      text(regular, size - 1.5f, MUTED, x, y - h + 5, fields.get(i)[2]);
    }
    y -= h + 10;
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
    // one drawn line: a name may hold a line break
    fonts.show(cs, font, size, c, x, baseline, s == null ? "" : s.replace('\n', ' '));
  }

  private List<String> wrap(String s, PDType0Font font, float size, float width) {
    return fonts.wrap(s, font, size, width);
  }

  private float width(PDType0Font font, float size, String s) {
    return fonts.width(font, size, s);
  }

  String safe(String s) {
    return fonts.safe(s);
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
