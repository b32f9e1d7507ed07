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
import org.jfree.chart.title.TextTitle;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;

/**
 * The live chart: force against time or against crosshead travel, one trace, redrawn from a
 * decimated snapshot a few times a second.
 */
final class ForceChart {
  static final Color BACKGROUND = new Color(0x17, 0x22, 0x26);
  static final Color GRID = new Color(0x2e, 0x3d, 0x42);
  static final Color INK = new Color(0xc9, 0xd6, 0xd2);
  static final Color TRACE = new Color(0xff, 0x8a, 0x5b);

  static final String TIME = "time (s)";
  static final String TRAVEL = "crosshead travel (mm)";

  private final XYSeries series = new XYSeries("force", false, true);
  private final JFreeChart chart;
  private final ChartViewer viewer;
  private final TextTitle note = new TextTitle("");

  ForceChart() {
    XYSeriesCollection data = new XYSeriesCollection(series);
    chart = ChartFactory.createXYLineChart(null, TIME, "force (N)", data,
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
      a.setAutoRangeMinimumSize(2.0);
    }
    note.setPaint(INK);
    note.setFont(label);
    note.setVisible(false);
    chart.addSubtitle(note);
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

  /** @return the quantity on the horizontal axis, {@link #TIME} or {@link #TRAVEL} */
  String xAxis() {
    return chart.getXYPlot().getDomainAxis().getLabel();
  }

  /** Force against time since the stream began. */
  void showAgainstTime(double[] t_s, double[] force_N, int n) {
    show(TIME, t_s, force_N, n, null);
  }

  /**
   * Force against crosshead travel since the curve began.
   *
   * @param why shown over the chart when there is no curve to draw, or null
   */
  void showAgainstTravel(double[] travel_mm, double[] force_N, int n, String why) {
    show(TRAVEL, travel_mm, force_N, n, why);
  }

  private void show(String xLabel, double[] x, double[] y, int n, String why) {
    if (!xLabel.equals(xAxis())) {
      NumberAxis axis = (NumberAxis) chart.getXYPlot().getDomainAxis();
      axis.setLabel(xLabel);
      // a still crosshead or a fresh stream must not blow a few nanometres up to the full width
      axis.setAutoRangeMinimumSize(xLabel.equals(TRAVEL) ? 1.0 : 2.0);
    }
    note.setText(why == null ? "" : why);
    note.setVisible(why != null);
    series.setNotify(false);
    series.clear();
    for (int i = 0; i < n; i++) {
      series.add(x[i], y[i], false);
    }
    series.setNotify(true);
    series.fireSeriesChanged();
  }
}
