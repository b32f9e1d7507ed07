package org.loadstone.ui;

import java.awt.Color;
import java.awt.Font;
import java.awt.Paint;
import java.util.ArrayList;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import javafx.scene.Node;
import javafx.scene.Parent;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.annotations.XYAnnotation;
import org.jfree.chart.annotations.XYLineAnnotation;
import org.jfree.chart.annotations.XYTextAnnotation;
import org.jfree.chart.axis.ValueAxis;
import org.jfree.chart.block.BlockBorder;
import org.jfree.chart.fx.ChartViewer;
import org.jfree.chart.plot.Marker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYItemRenderer;
import org.jfree.chart.title.LegendTitle;
import org.jfree.chart.title.TextTitle;
import org.jfree.chart.title.Title;

/**
 * Draws the console's JFreeChart charts in the look chosen: ground, grid, axes, titles, legend
 * and marks in the look's colours, text at the console's size, data colours moved to stand out
 * from the ground ({@link Theme#onGround}). The colours the chart was built with are kept, so a
 * change of look starts again from them. Charts built for print ({@code report.Charts}) and the
 * console's own are treated alike.
 */
final class ChartLook {
  private ChartLook() {}

  /** What a chart was last drawn in, and the colours it was built with. */
  private static final class Styled {
    final JFreeChart chart;
    String key = "";
    final Map<Object, Map<Integer, Paint>> series = new IdentityHashMap<>();
    final Map<Object, Paint> marks = new IdentityHashMap<>();

    Styled(JFreeChart chart) {
      this.chart = chart;
    }
  }

  /** Where a viewer keeps its chart's {@link Styled} (by identity: a chart's equals is deep). */
  private static final String STYLED = "loadstone.chart-look";

  /** Applies the look to every chart under {@code node} not already in it. */
  static void applyAll(Node node, Theme theme, double scale) {
    if (node instanceof ChartViewer v && v.getChart() != null) {
      Styled s = v.getProperties().get(STYLED) instanceof Styled was && was.chart == v.getChart()
          ? was : new Styled(v.getChart());
      v.getProperties().put(STYLED, s);
      apply(s, theme, scale);
    } else if (node instanceof Parent p && !heldInside(node)) {
      for (Node child : p.getChildrenUnmodifiable()) {
        applyAll(child, theme, scale);
      }
    }
  }

  /** Controls that hold no chart: their many cells are not walked on every layout. */
  private static boolean heldInside(Node n) {
    return n instanceof javafx.scene.control.Labeled || n instanceof javafx.scene.control.TableView
        || n instanceof javafx.scene.control.ListView
        || n instanceof javafx.scene.control.TextInputControl
        || n instanceof javafx.scene.control.ComboBoxBase;
  }

  /**
   * Draws one chart in the look (does nothing when it already is), with one redraw at the end.
   *
   * @param scale the console's text size, 1 for 100 %
   */
  private static void apply(Styled s, Theme theme, double scale) {
    String key = theme.word() + "@" + scale;
    if (key.equals(s.key)) {
      return;
    }
    s.key = key;
    JFreeChart chart = s.chart;
    chart.setNotify(false); // each change below would redraw the whole chart
    try {
      restyle(s, chart, theme, scale);
    } finally {
      chart.setNotify(true); // one redraw
    }
  }

  private static void restyle(Styled s, JFreeChart chart, Theme theme, double scale) {
    float size = (float) (13 * scale);
    Font text = new Font("DejaVu Sans", Font.PLAIN, Math.round(size));
    Font heading = new Font("DejaVu Sans", Font.BOLD, Math.round(size + 1));
    chart.setBackgroundPaint(theme.ground());
    for (int i = 0; i < chart.getSubtitleCount(); i++) {
      title(chart.getSubtitle(i), theme, text);
    }
    if (chart.getTitle() != null) {
      title(chart.getTitle(), theme, heading);
    }
    if (!(chart.getPlot() instanceof XYPlot plot)) {
      return;
    }
    plot.setBackgroundPaint(theme.ground());
    plot.setDomainGridlinePaint(theme.grid());
    plot.setRangeGridlinePaint(theme.grid());
    plot.setOutlinePaint(theme.grid());
    for (int i = 0; i < plot.getDomainAxisCount(); i++) {
      axis(plot.getDomainAxis(i), theme, text);
    }
    for (int i = 0; i < plot.getRangeAxisCount(); i++) {
      axis(plot.getRangeAxis(i), theme, text);
    }
    for (int r = 0; r < plot.getRendererCount(); r++) {
      XYItemRenderer rend = plot.getRenderer(r);
      if (rend == null || plot.getDataset(r) == null) {
        continue;
      }
      Map<Integer, Paint> built = s.series.computeIfAbsent(rend, k -> new java.util.HashMap<>());
      for (int i = 0; i < plot.getDataset(r).getSeriesCount(); i++) {
        Paint was = built.computeIfAbsent(i, k -> rend instanceof org.jfree.chart.renderer.AbstractRenderer a
            ? a.lookupSeriesPaint(k) : rend.getSeriesPaint(k));
        if (was instanceof Color c) {
          rend.setSeriesPaint(i, theme.onGround(c), false);
        }
      }
      rend.setDefaultItemLabelPaint(theme.ink());
    }
    marks(plot, s, theme, text);
  }

  private static void title(Title t, Theme theme, Font font) {
    if (t instanceof TextTitle tt) {
      tt.setPaint(theme.ink());
      tt.setFont(font);
      tt.setBackgroundPaint(null);
    } else if (t instanceof LegendTitle legend) {
      legend.setItemPaint(theme.ink());
      legend.setItemFont(font);
      legend.setBackgroundPaint(theme.ground());
      legend.setFrame(new BlockBorder(theme.ground()));
    }
  }

  private static void axis(ValueAxis a, Theme theme, Font font) {
    if (a == null) {
      return;
    }
    a.setLabelPaint(theme.ink());
    a.setTickLabelPaint(theme.ink());
    a.setAxisLinePaint(theme.grid());
    a.setTickMarkPaint(theme.grid());
    a.setLabelFont(font);
    a.setTickLabelFont(font);
  }

  /**
   * Annotations and markers: grey ones (text, arrows, the strip chart's means) take the look's
   * ink, coloured ones stand out from the ground as the series do.
   */
  private static void marks(XYPlot plot, Styled s, Theme theme, Font font) {
    List<XYAnnotation> replaced = new ArrayList<>();
    for (XYAnnotation a : List.copyOf(plot.getAnnotations())) {
      if (a instanceof XYTextAnnotation t) { // pointer annotations are text annotations too
        t.setPaint(shown(s.marks.computeIfAbsent(t, k -> t.getPaint()), theme));
        t.setFont(font);
        if (t instanceof org.jfree.chart.annotations.XYPointerAnnotation p) {
          p.setArrowPaint(t.getPaint());
        }
      } else if (a instanceof XYLineAnnotation l) {
        Paint built = s.marks.getOrDefault(l, l.getPaint());
        XYLineAnnotation now = new XYLineAnnotation(l.getX1(), l.getY1(), l.getX2(), l.getY2(),
            l.getStroke(), shown(built, theme));
        s.marks.put(now, built);
        plot.removeAnnotation(l, false);
        replaced.add(now);
      }
    }
    replaced.forEach(a -> plot.addAnnotation(a, false));
    List<Marker> markers = new ArrayList<>();
    for (var layer : org.jfree.chart.ui.Layer.values()) {
      var d = plot.getDomainMarkers(layer);
      var r = plot.getRangeMarkers(layer);
      if (d != null) {
        d.forEach(m -> markers.add((Marker) m));
      }
      if (r != null) {
        r.forEach(m -> markers.add((Marker) m));
      }
    }
    for (Marker m : markers) {
      m.setPaint(shown(s.marks.computeIfAbsent(m, k -> m.getPaint()), theme));
      m.setLabelPaint(theme.ink());
      m.setLabelFont(font);
    }
  }

  private static Paint shown(Paint built, Theme theme) {
    if (!(built instanceof Color c)) {
      return built;
    }
    float[] hsb = Color.RGBtoHSB(c.getRed(), c.getGreen(), c.getBlue(), null);
    return hsb[1] < 0.2f ? theme.ink() : theme.onGround(c);
  }
}
