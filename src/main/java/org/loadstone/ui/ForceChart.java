package org.loadstone.ui;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import org.jfree.chart.ChartFactory;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.fx.ChartViewer;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;

/** The live force–time chart: one trace, redrawn from a decimated snapshot a few times a second. */
final class ForceChart {
  static final Color BACKGROUND = new Color(0x17, 0x22, 0x26);
  static final Color GRID = new Color(0x2e, 0x3d, 0x42);
  static final Color INK = new Color(0xc9, 0xd6, 0xd2);
  static final Color TRACE = new Color(0xff, 0x8a, 0x5b);

  private final XYSeries series = new XYSeries("force", false, true);
  private final JFreeChart chart;
  private final ChartViewer viewer;

  ForceChart(String xLabel) {
    XYSeriesCollection data = new XYSeriesCollection(series);
    chart = ChartFactory.createXYLineChart(null, xLabel, "force (N)", data,
        PlotOrientation.VERTICAL, false, false, false);
    chart.setBackgroundPaint(BACKGROUND);
    chart.setAntiAlias(true);
    XYPlot plot = chart.getXYPlot();
    plot.setBackgroundPaint(BACKGROUND);
    plot.setDomainGridlinePaint(GRID);
    plot.setRangeGridlinePaint(GRID);
    plot.setOutlineVisible(false);
    XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(true, false);
    r.setSeriesPaint(0, TRACE);
    r.setSeriesStroke(0, new BasicStroke(2.0f));
    plot.setRenderer(r);
    Font tick = new Font("DejaVu Sans", Font.PLAIN, 13);
    Font label = new Font("DejaVu Sans", Font.PLAIN, 14);
    for (NumberAxis a : new NumberAxis[] {(NumberAxis) plot.getDomainAxis(),
        (NumberAxis) plot.getRangeAxis()}) {
      a.setTickLabelPaint(INK);
      a.setLabelPaint(INK);
      a.setTickLabelFont(tick);
      a.setLabelFont(label);
      a.setAxisLinePaint(GRID);
      a.setTickMarkPaint(GRID);
      a.setAutoRangeIncludesZero(true);
    }
    viewer = new ChartViewer(chart);
    viewer.setId("force-chart");
  }

  ChartViewer node() {
    return viewer;
  }

  /** @return number of points drawn, for tests */
  int pointCount() {
    return series.getItemCount();
  }

  void show(double[] x, double[] y, int n) {
    series.setNotify(false);
    series.clear();
    for (int i = 0; i < n; i++) {
      series.add(x[i], y[i], false);
    }
    series.setNotify(true);
    series.fireSeriesChanged();
  }
}
