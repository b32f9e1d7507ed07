package org.loadstone.report;

import de.rototor.pdfbox.graphics2d.PdfBoxGraphics2D;
import de.rototor.pdfbox.graphics2d.PdfBoxGraphics2DFontTextDrawer;
import java.awt.geom.Rectangle2D;
import java.io.IOException;
import java.io.UncheckedIOException;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.pdmodel.PDPageContentStream;
import org.apache.pdfbox.pdmodel.font.PDFont;
import org.apache.pdfbox.pdmodel.graphics.form.PDFormXObject;
import org.apache.pdfbox.util.Matrix;
import org.jfree.chart.JFreeChart;

/**
 * A JFreeChart drawn into a PDF as vectors: the chart paints onto a Graphics2D that writes PDF
 * path and text operators into a form (pdfbox-graphics2d), and the form is placed on the page.
 * Curves stay sharp at any zoom and cost the decimated points of {@link TraceDataset}, not
 * pixels; chart text is real text in the report font, so it can be searched and copied.
 */
final class PdfChart {
  private PdfChart() {}

  /**
   * The size the chart is laid out at, relative to its size on the page: a little larger, so its
   * 10 pt labels come out near 9 pt on paper.
   */
  private static final float LAYOUT_SCALE = 1 / 0.9f;

  /**
   * Draws the chart with its lower left corner at (x, y), {@code width × height} points.
   *
   * @param regular the document's report font, regular
   * @param bold the document's report font, bold
   */
  static void draw(PDDocument doc, PDPageContentStream cs, JFreeChart chart, PDFont regular,
      PDFont bold, float x, float y, float width, float height) {
    float w = width * LAYOUT_SCALE;
    float h = height * LAYOUT_SCALE;
    try {
      PdfBoxGraphics2D g = new PdfBoxGraphics2D(doc, w, h);
      PdfBoxGraphics2DFontTextDrawer text = new PdfBoxGraphics2DFontTextDrawer();
      text.registerFont(ReportFonts.REGULAR_NAME, regular);
      text.registerFont(ReportFonts.BOLD_NAME, bold);
      g.setFontTextDrawer(text);
      try {
        chart.draw(g, new Rectangle2D.Double(0, 0, w, h));
      } finally {
        g.dispose();
      }
      PDFormXObject form = g.getXFormObject();
      cs.saveGraphicsState();
      cs.transform(new Matrix(1 / LAYOUT_SCALE, 0, 0, 1 / LAYOUT_SCALE, x, y));
      cs.drawForm(form);
      cs.restoreGraphicsState();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }
}
