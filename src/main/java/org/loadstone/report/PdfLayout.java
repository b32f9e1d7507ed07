package org.loadstone.report;

import java.awt.Color;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.pdmodel.PDPage;
import org.apache.pdfbox.pdmodel.PDPageContentStream;
import org.apache.pdfbox.pdmodel.common.PDRectangle;
import org.apache.pdfbox.pdmodel.font.PDType1Font;
import org.apache.pdfbox.pdmodel.font.Standard14Fonts;
import org.apache.pdfbox.pdmodel.graphics.image.LosslessFactory;
import org.apache.pdfbox.pdmodel.graphics.image.PDImageXObject;
import org.jfree.chart.JFreeChart;

/**
 * A top-to-bottom page flow over PDFBox: headings, wrapped paragraphs, tables, chart images and
 * boxes, starting a new A4 page when the next block does not fit. Text is made safe for the
 * standard Helvetica font (WinAnsi) first, so no character can make drawing fail.
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

  /**
   * The standard PDF fonts are referenced, not embedded; PDFBox warns once per font that it would
   * render them with a substitute from this machine, which does not affect the file written.
   */
  private static final java.util.logging.Logger FONT_LOG =
      java.util.logging.Logger.getLogger("org.apache.pdfbox.pdmodel.font");

  static {
    FONT_LOG.setLevel(java.util.logging.Level.SEVERE);
  }

  final PDDocument doc = new PDDocument();
  private final PDType1Font regular = new PDType1Font(Standard14Fonts.FontName.HELVETICA);
  private final PDType1Font bold = new PDType1Font(Standard14Fonts.FontName.HELVETICA_BOLD);
  private final Map<Character, Boolean> encodable = new HashMap<>();
  private final String footer;
  private PDPageContentStream cs;
  private float y;
  private int pages;

  PdfLayout(String footer) {
    this.footer = footer;
    newPage();
  }

  void newPage() {
    try {
      if (cs != null) {
        cs.close();
      }
      PDPage page = new PDPage(PDRectangle.A4);
      doc.addPage(page);
      cs = new PDPageContentStream(doc, page);
      pages++;
      y = HEIGHT - MARGIN;
      text(regular, 7.5f, MUTED, MARGIN, MARGIN - 20, footer + "  -  page " + pages);
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
    PDType1Font font = head ? bold : regular;
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

  /** A chart rendered at twice the resolution and drawn {@code width × height} points. */
  void chart(JFreeChart chart, float width, float height) {
    need(height + 6);
    // drawn at a logical size a little larger than the page size, so chart text comes out
    // near 9 pt, and at twice that in pixels (about 160 dpi on paper)
    double logicalW = width / 0.9;
    double logicalH = height / 0.9;
    int scale = 2;
    BufferedImage img = new BufferedImage((int) (logicalW * scale), (int) (logicalH * scale),
        BufferedImage.TYPE_INT_RGB);
    java.awt.Graphics2D g2 = img.createGraphics();
    g2.setRenderingHint(java.awt.RenderingHints.KEY_ANTIALIASING,
        java.awt.RenderingHints.VALUE_ANTIALIAS_ON);
    g2.setRenderingHint(java.awt.RenderingHints.KEY_TEXT_ANTIALIASING,
        java.awt.RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
    g2.scale(scale, scale);
    chart.draw(g2, new java.awt.geom.Rectangle2D.Double(0, 0, logicalW, logicalH));
    g2.dispose();
    try {
      PDImageXObject x = LosslessFactory.createFromImage(doc, img);
      cs.drawImage(x, MARGIN + (TEXT_WIDTH - width) / 2, y - height, width, height);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
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
    try {
      cs.setStrokingColor(RULE);
      cs.setLineWidth(0.8f);
      cs.moveTo(MARGIN, y - 2);
      cs.lineTo(MARGIN + TEXT_WIDTH, y - 2);
      cs.stroke();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    y -= 10;
  }

  private void text(PDType1Font font, float size, Color c, float x, float baseline, String s) {
    try {
      cs.beginText();
      cs.setFont(font, size);
      cs.setNonStrokingColor(c);
      cs.newLineAtOffset(x, baseline);
      cs.showText(safe(s).replace('\n', ' ')); // one drawn line: a name may hold a line break
      cs.endText();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  private List<String> wrap(String s, PDType1Font font, float size, float width) {
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

  private float width(PDType1Font font, float size, String s) {
    try {
      return font.getStringWidth(s) / 1000 * size;
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  /** Replaces characters Helvetica (WinAnsi) cannot show with ASCII words or signs. */
  String safe(String s) {
    String t = s.replace("≥", ">=").replace("≤", "<=").replace("²", "2").replace("³", "3")
        .replace("µ", "u").replace("σ", "sigma").replace("τ", "tau").replace("Δ", "delta")
        .replace("ε", "eps").replace("−", "-").replace("≈", "~").replace("⁻¹", "^-1")
        .replace("α", "alpha").replace('\t', ' ').replace('\r', ' ');
    StringBuilder b = new StringBuilder(t.length());
    for (int i = 0; i < t.length(); i++) {
      char c = t.charAt(i);
      if (c == '\n') {
        b.append(c);
        continue;
      }
      b.append(encodable.computeIfAbsent(c, this::canEncode) ? c : '?');
    }
    return b.toString();
  }

  private boolean canEncode(char c) {
    if (Character.isISOControl(c) || Character.isSurrogate(c)) {
      return false;
    }
    try {
      regular.encode(String.valueOf(c));
      bold.encode(String.valueOf(c));
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

  /** Closes the last page stream and saves the document to the stream. */
  void save(java.io.OutputStream out) throws IOException {
    cs.close();
    cs = null;
    doc.save(out);
  }
}
