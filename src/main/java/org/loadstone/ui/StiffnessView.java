package org.loadstone.ui;

import java.awt.BasicStroke;
import java.awt.Color;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.function.Consumer;
import javafx.scene.control.Button;
import javafx.scene.control.Label;
import javafx.scene.control.TextField;
import javafx.scene.layout.HBox;
import javafx.scene.layout.VBox;
import org.jfree.chart.ChartFactory;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.fx.ChartViewer;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.loadstone.analysis.AnalysisSettings.StiffnessBounds;
import org.loadstone.analysis.StiffnessFit;
import org.loadstone.report.TraceDataset;
import org.loadstone.study.RunMetrics;
import org.loadstone.units.ForceUnit;

/**
 * The post-run chart: the stored run's force against displacement with its peak and break
 * marked, the fitted stiffness line drawn over its window and the window's force bounds marked,
 * and two fields for a force band of one's own (or back to the automatic search). Forces in the
 * display unit. Thin: the figures are {@link RunMetrics}' with the band as an analysis setting;
 * this view only draws them ({@link #prepare} off the JavaFX thread, as a long run's curve takes
 * a pass over every sample) and passes the typed band on in N.
 */
final class StiffnessView {
  private static final Color WINDOW = new Color(0x56, 0xb4, 0xe9); // Okabe–Ito sky blue
  private static final Color BREAK = new Color(0xd5, 0x5e, 0x00); // Okabe–Ito vermillion

  private final VBox root = new VBox(4);
  private final ChartViewer viewer;
  private final JFreeChart chart;
  private final TextField from = new TextField();
  private final TextField to = new TextField();
  private final Label bandUnit = new Label("N");
  private final Label note = new Label();
  private ForceUnit unit = ForceUnit.N;
  /** The marks drawn: name → (displacement mm, force in the display unit). */
  private Map<String, double[]> marks = Map.of();

  /**
   * @param onBand told the force band typed (in N), or null for the automatic search, on the
   *     JavaFX thread
   */
  StiffnessView(Consumer<StiffnessBounds> onBand) {
    chart = ChartFactory.createXYLineChart(null, "displacement (mm)", "force (N)",
        new TraceDataset(), PlotOrientation.VERTICAL, false, false, false);
    chart.setBackgroundPaint(ForceChart.BACKGROUND);
    XYPlot plot = chart.getXYPlot();
    plot.setBackgroundPaint(ForceChart.BACKGROUND);
    plot.setDomainGridlinePaint(ForceChart.GRID);
    plot.setRangeGridlinePaint(ForceChart.GRID);
    plot.getDomainAxis().setTickLabelPaint(ForceChart.INK);
    plot.getDomainAxis().setLabelPaint(ForceChart.INK);
    plot.getRangeAxis().setTickLabelPaint(ForceChart.INK);
    plot.getRangeAxis().setLabelPaint(ForceChart.INK);
    XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(true, false);
    r.setSeriesPaint(0, ForceChart.TRACE);
    r.setSeriesPaint(1, WINDOW);
    r.setSeriesStroke(1, new BasicStroke(3.0f));
    plot.setRenderer(r);
    viewer = new ChartViewer(chart);
    viewer.setId("stiffness-chart");
    viewer.setPrefSize(380, 230);
    from.setId("stiffness-from-field");
    to.setId("stiffness-to-field");
    from.setPrefColumnCount(6);
    to.setPrefColumnCount(6);
    Button band = new Button("Fit band");
    band.setId("stiffness-band-button");
    band.setOnAction(e -> {
      try {
        onBand.accept(StiffnessBounds.force_N(unit.toNewtons(number(from, "from")),
            unit.toNewtons(number(to, "to"))));
      } catch (IllegalArgumentException bad) {
        note.setText(bad.getMessage());
      }
    });
    Button auto = new Button("Automatic");
    auto.setId("stiffness-auto-button");
    auto.setOnAction(e -> onBand.accept(null));
    note.setId("stiffness-note");
    note.setWrapText(true);
    note.setMaxWidth(380);
    Label name = new Label("CURVE AND STIFFNESS WINDOW");
    name.getStyleClass().add("figure-name");
    root.getChildren().addAll(name, viewer, new HBox(6, new Label("band"), from,
        new Label("to"), to, bandUnit, band, auto), note);
    root.setId("stiffness-view");
  }

  VBox node() {
    return root;
  }

  /** What to draw for one analysis, made off the JavaFX thread. */
  record Drawing(RunMetrics metrics, ForceUnit unit, TraceDataset data,
      Map<String, double[]> marks) {}

  /**
   * Builds the curve (decimated to the chart's width), the stiffness line and the marks, in
   * {@code u}. Off the JavaFX thread: it reads every sample once.
   */
  static Drawing prepare(RunMetrics m, ForceUnit u) {
    org.loadstone.units.SlowWork.check("building a chart from a run");
    TraceDataset data = new TraceDataset();
    Map<String, double[]> marks = new LinkedHashMap<>();
    var c = m.curve();
    if (!c.hasPosition()) {
      return new Drawing(m, u, data, marks);
    }
    double x0 = c.position_mm(0);
    data.add("force", c.size(), i -> c.position_mm(i) - x0, i -> u.fromNewtons(c.force_N(i)),
        TraceDataset.DEFAULT_COLUMNS);
    var r = m.analysis();
    m.analysis().stiffness().ifPresent(s -> {
      double[] lx = {s.fromDisplacement_mm(), s.toDisplacement_mm()};
      double[] ly = {u.fromNewtons(s.slope_N_per_mm() * lx[0] + s.intercept_N()),
          u.fromNewtons(s.slope_N_per_mm() * lx[1] + s.intercept_N())};
      data.add("window", lx, ly);
    });
    r.displacementAtPeak_mm().ifPresent(x -> marks.put("peak",
        new double[] {x, u.fromNewtons(r.peakForce_N())}));
    r.breakPoint().ifPresent(b -> r.displacementAtBreak_mm().ifPresent(x -> marks.put("break",
        new double[] {x, u.fromNewtons(b.force_N())})));
    return new Drawing(m, u, data, marks);
  }

  /** Draws the run, its marks and its stiffness window (or says why there is none). */
  void show(Drawing d) {
    RunMetrics m = d.metrics();
    unit = d.unit();
    bandUnit.setText(unit.symbol());
    XYPlot plot = chart.getXYPlot();
    plot.getRangeAxis().setLabel("force (" + unit.symbol() + ")");
    plot.clearRangeMarkers();
    plot.getRenderer().removeAnnotations();
    marks = Map.copyOf(d.marks());
    if (!m.curve().hasPosition()) {
      note.setText("no position channel: no curve or stiffness window to draw");
      plot.setDataset(d.data());
      return;
    }
    d.marks().forEach((what, at) -> plot.getRenderer().addAnnotation(mark(what, at)));
    var fit = m.analysis().stiffness();
    if (fit.isPresent()) {
      StiffnessFit s = fit.get();
      for (double level : new double[] {s.fromForce_N(), s.toForce_N()}) {
        plot.addRangeMarker(new ValueMarker(unit.fromNewtons(level), WINDOW,
            new BasicStroke(1.0f)));
      }
      from.setText(num(unit.fromNewtons(s.fromForce_N())));
      to.setText(num(unit.fromNewtons(s.toForce_N())));
      note.setText(String.format(Locale.ROOT, "%s, %s to %s %s (samples %d to %d), R² %.4f,"
          + " 95 %% %.4g to %.4g %s/mm", s.method().words(), num(unit.fromNewtons(
              s.fromForce_N())), num(unit.fromNewtons(s.toForce_N())), unit.symbol(),
          s.fromIndex(), s.toIndex(), s.rSquared(), unit.fromNewtons(s.ci95Low_N_per_mm()),
          unit.fromNewtons(s.ci95High_N_per_mm()), unit.symbol()));
    } else {
      note.setText(m.analysis().stiffnessRefusal().map(no -> "no stiffness: " + no.reason()
          + String.format(Locale.ROOT, "; closest band %s to %s %s",
              num(unit.fromNewtons(no.closestFromForce_N())),
              num(unit.fromNewtons(no.closestToForce_N())), unit.symbol()))
          .orElse("no stiffness"));
      m.analysis().stiffnessRefusal().ifPresent(no -> {
        from.setText(num(unit.fromNewtons(no.closestFromForce_N())));
        to.setText(num(unit.fromNewtons(no.closestToForce_N())));
      });
    }
    plot.setDataset(d.data());
  }

  /** @return the marks drawn: name ("peak", "break") → (displacement mm, force, display unit) */
  Map<String, double[]> marks() {
    return marks;
  }

  /** @return the force axis' label, e.g. {@code force (kN)} */
  String yAxis() {
    return chart.getXYPlot().getRangeAxis().getLabel();
  }

  /** A ring and its name at a point of the curve. */
  private org.jfree.chart.annotations.XYAnnotation mark(String what, double[] at) {
    Color c = what.equals("break") ? BREAK : ForceChart.PEAK;
    return new org.jfree.chart.annotations.AbstractXYAnnotation() {
      @Override
      public void draw(java.awt.Graphics2D g2, XYPlot plot, java.awt.geom.Rectangle2D area,
          org.jfree.chart.axis.ValueAxis domain, org.jfree.chart.axis.ValueAxis range, int index,
          org.jfree.chart.plot.PlotRenderingInfo info) {
        double sx = domain.valueToJava2D(at[0], area, plot.getDomainAxisEdge());
        double sy = range.valueToJava2D(at[1], area, plot.getRangeAxisEdge());
        g2.setPaint(c);
        g2.setStroke(new BasicStroke(2.5f));
        g2.draw(new java.awt.geom.Ellipse2D.Double(sx - 6, sy - 6, 12, 12));
        g2.setFont(new java.awt.Font("DejaVu Sans", java.awt.Font.PLAIN, 12));
        String text = what + " " + Readout.fmt(at[1]) + " " + unit.symbol();
        // the peak's name to its left, the break's to its right, both held inside the plot
        int w = g2.getFontMetrics().stringWidth(text);
        int h = g2.getFontMetrics().getAscent();
        double tx = what.equals("break") ? sx + 10 : sx - 10 - w;
        tx = Math.max(area.getMinX() + 2, Math.min(tx, area.getMaxX() - w - 2));
        double ty = Math.max(area.getMinY() + h + 2, Math.min(sy + h / 2.0, area.getMaxY() - 4));
        if (what.equals("break") && tx < sx + 6 && tx + w > sx - 6) {
          ty = Math.min(sy + 8 + h, area.getMaxY() - 4); // no room beside it: under the ring
        }
        g2.drawString(text, (float) tx, (float) ty);
      }
    };
  }

  /** Shows why a band was not fitted. */
  void refuse(String why) {
    note.setText(why);
  }

  private static String num(double v) {
    return String.format(Locale.ROOT, "%.4g", v);
  }

  private double number(TextField field, String which) {
    String t = field.getText().trim().replace(',', '.');
    try {
      return Double.parseDouble(t);
    } catch (NumberFormatException e) {
      throw new IllegalArgumentException("the band's " + which + " force '" + t
          + "' is not a number: type it in " + unit.symbol() + ", e.g. 20");
    }
  }
}
