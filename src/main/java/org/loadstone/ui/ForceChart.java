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
 * decimated snapshot a few times a second. Against time it shows the last seconds (chosen over
 * the chart), its time axis moving with the newest sample; the peak is marked with a line and a
 * point. Forces are drawn in the display unit.
 */
final class ForceChart {
  /** The windows one may choose, s. */
  static final Integer[] WINDOWS_S = {5, 10, 30, 60, 120, 300};
  static final Color PEAK = new Color(0xff, 0xd1, 0x66);

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
  private final javafx.scene.control.ComboBox<Integer> window = new javafx.scene.control.ComboBox<>(
      javafx.collections.FXCollections.observableArrayList(WINDOWS_S));
  private final javafx.scene.layout.BorderPane root;
  private final org.jfree.chart.plot.ValueMarker peakLine = new org.jfree.chart.plot.ValueMarker(
      0, PEAK, new BasicStroke(1.2f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10,
          new float[] {6, 4}, 0));
  private PeakRing peakPoint;
  private org.loadstone.units.ForceUnit unit = org.loadstone.units.ForceUnit.N;
  private double peakShown = Double.NaN;

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
    peakLine.setLabelPaint(PEAK);
    peakLine.setLabelFont(label);
    peakLine.setLabelAnchor(org.jfree.chart.ui.RectangleAnchor.TOP_LEFT);
    peakLine.setLabelTextAnchor(org.jfree.chart.ui.TextAnchor.BOTTOM_LEFT);
    viewer = new ChartViewer(chart);
    viewer.setId("force-chart");
    window.setId("chart-window");
    window.setValue(30);
    window.setFocusTraversable(false); // the one-key commands keep the keyboard
    javafx.scene.control.Label shows = new javafx.scene.control.Label("time axis: last");
    javafx.scene.control.Label seconds = new javafx.scene.control.Label("s");
    javafx.scene.layout.HBox bar = new javafx.scene.layout.HBox(8, shows, window, seconds);
    bar.setAlignment(javafx.geometry.Pos.CENTER_RIGHT);
    bar.getStyleClass().add("chart-bar");
    root = new javafx.scene.layout.BorderPane(viewer);
    root.setTop(bar);
  }

  /** @return the chart with its window choice above it */
  javafx.scene.layout.BorderPane node() {
    return root;
  }

  /** @return the seconds the time axis spans */
  double window_s() {
    return window.getValue();
  }

  /** Shows the last {@code s} seconds against time (as if chosen). */
  void setWindow(int s) {
    window.setValue(s);
  }

  /** @param listener told each window chosen, s, on the JavaFX thread */
  void onWindow(java.util.function.IntConsumer listener) {
    window.valueProperty().addListener((o, was, now) -> {
      if (now != null) {
        listener.accept(now);
      }
    });
  }

  /** Draws forces in {@code u} from the next redraw on. */
  void setUnit(org.loadstone.units.ForceUnit u) {
    unit = u;
    chart.getXYPlot().getRangeAxis().setLabel("force (" + u.symbol() + ")");
  }

  /** @return the force axis' label, e.g. {@code force (kN)} */
  String yAxis() {
    return chart.getXYPlot().getRangeAxis().getLabel();
  }

  /** @return the time (or travel) axis' lower and upper bounds as drawn */
  double[] xRange() {
    var r = chart.getXYPlot().getDomainAxis().getRange();
    return new double[] {r.getLowerBound(), r.getUpperBound()};
  }

  /** @return the newest point drawn (x, force in the display unit), or null when none */
  double[] lastPoint() {
    int n = series.getItemCount();
    return n == 0 ? null : new double[] {series.getX(n - 1).doubleValue(),
        series.getY(n - 1).doubleValue()};
  }

  /** @return the peak marked, in the display unit, or NaN when none is */
  double peakMark() {
    return peakShown;
  }

  /**
   * Marks the peak: a line at its force and, against time, a point where it was reached (while
   * it is in the window).
   *
   * @param peak_N the peak, NaN for none
   * @param peakTime_s when it was reached on the stream's clock, NaN if not known
   */
  void showPeak(double peak_N, double peakTime_s) {
    XYPlot plot = chart.getXYPlot();
    double p = Double.isNaN(peak_N) ? Double.NaN : unit.fromNewtons(peak_N);
    boolean timed = TIME.equals(xAxis()) && !Double.isNaN(peakTime_s) && !Double.isNaN(p);
    if (Double.compare(p, peakShown) == 0 && (peakPoint == null) != timed
        && (!timed || ((PeakRing) peakPoint).x == peakTime_s)) {
      return; // as drawn
    }
    if (peakPoint != null) {
      plot.getRenderer().removeAnnotation(peakPoint);
      peakPoint = null;
    }
    peakShown = p;
    if (Double.isNaN(p)) {
      plot.removeRangeMarker(0, peakLine, org.jfree.chart.ui.Layer.FOREGROUND, true);
      return;
    }
    peakLine.setValue(p);
    peakLine.setLabel("peak " + Readout.fmt(p) + " " + unit.symbol());
    var drawn = plot.getRangeMarkers(org.jfree.chart.ui.Layer.FOREGROUND); // null for none
    if (drawn == null || !drawn.contains(peakLine)) {
      plot.addRangeMarker(0, peakLine, org.jfree.chart.ui.Layer.FOREGROUND, true);
    }
    if (timed) {
      peakPoint = new PeakRing(peakTime_s, p);
      plot.getRenderer().addAnnotation(peakPoint);
    }
  }

  /** A ring of fixed size in screen points around a data point. */
  private static final class PeakRing extends org.jfree.chart.annotations.XYShapeAnnotation {
    private final double x;
    private final double y;

    PeakRing(double x, double y) {
      super(new java.awt.geom.Rectangle2D.Double(), new BasicStroke(2f), PEAK);
      this.x = x;
      this.y = y;
    }

    @Override
    public void draw(java.awt.Graphics2D g2, XYPlot plot, java.awt.geom.Rectangle2D area,
        org.jfree.chart.axis.ValueAxis domain, org.jfree.chart.axis.ValueAxis range, int index,
        org.jfree.chart.plot.PlotRenderingInfo info) {
      double sx = domain.valueToJava2D(x, area, plot.getDomainAxisEdge());
      double sy = range.valueToJava2D(y, area, plot.getRangeAxisEdge());
      if (!area.contains(sx, sy)) {
        return;
      }
      g2.setPaint(PEAK);
      g2.setStroke(new BasicStroke(2.5f));
      g2.draw(new java.awt.geom.Ellipse2D.Double(sx - 6, sy - 6, 12, 12));
    }
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
    NumberAxis axis = (NumberAxis) chart.getXYPlot().getDomainAxis();
    if (!xLabel.equals(xAxis())) {
      axis.setLabel(xLabel);
      // a still crosshead or a fresh stream must not blow a few nanometres up to the full width
      axis.setAutoRangeMinimumSize(xLabel.equals(TRAVEL) ? 1.0 : 2.0);
      axis.setAutoRange(xLabel.equals(TRAVEL));
    }
    if (xLabel.equals(TIME)) {
      // the last seconds, moving with the newest sample; from 0 until the window is filled
      double w = window_s();
      double end = n > 0 ? x[n - 1] : 0;
      double from = Math.max(0, end - w);
      axis.setRange(from, from + w);
    }
    note.setText(why == null ? "" : why);
    note.setVisible(why != null);
    series.setNotify(false);
    series.clear();
    for (int i = 0; i < n; i++) {
      series.add(x[i], unit.fromNewtons(y[i]), false);
    }
    series.setNotify(true);
    series.fireSeriesChanged();
  }
}
