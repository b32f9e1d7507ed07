package org.loadstone.ui;

import java.awt.BasicStroke;
import java.awt.Color;
import java.util.Locale;
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

/**
 * The post-run stiffness window: the stored run's force against displacement with the fitted
 * line drawn over its window and the window's force bounds marked, and two fields for a force band
 * of one's own (or back to the automatic search). Thin: the fit is {@link RunMetrics}' with the
 * band as an analysis setting; this view only draws it and passes the typed band on.
 */
final class StiffnessView {
  private static final Color WINDOW = new Color(0x56, 0xb4, 0xe9); // Okabe–Ito sky blue

  private final VBox root = new VBox(4);
  private final ChartViewer viewer;
  private final JFreeChart chart;
  private final TextField from = new TextField();
  private final TextField to = new TextField();
  private final Label note = new Label();

  /**
   * @param onBand told the force band typed, or null for the automatic search, on the JavaFX
   *     thread
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
        onBand.accept(StiffnessBounds.force_N(number(from, "from"), number(to, "to")));
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
    Label name = new Label("STIFFNESS WINDOW");
    name.getStyleClass().add("figure-name");
    root.getChildren().addAll(name, viewer, new HBox(6, new Label("band"), from,
        new Label("to"), to, new Label("N"), band, auto), note);
    root.setId("stiffness-view");
  }

  VBox node() {
    return root;
  }

  /** Draws the run and its stiffness window (or says why there is none). */
  void show(RunMetrics m) {
    TraceDataset data = new TraceDataset();
    var c = m.curve();
    XYPlot plot = chart.getXYPlot();
    plot.clearRangeMarkers();
    if (!c.hasPosition()) {
      note.setText("no position channel: no stiffness window to draw");
      plot.setDataset(data);
      return;
    }
    double x0 = c.position_mm(0);
    data.add("force", c.size(), i -> c.position_mm(i) - x0, c::force_N,
        TraceDataset.DEFAULT_COLUMNS);
    var fit = m.analysis().stiffness();
    if (fit.isPresent()) {
      StiffnessFit s = fit.get();
      double[] lx = {s.fromDisplacement_mm(), s.toDisplacement_mm()};
      double[] ly = {s.slope_N_per_mm() * lx[0] + s.intercept_N(),
          s.slope_N_per_mm() * lx[1] + s.intercept_N()};
      data.add("window", lx, ly);
      for (double level : new double[] {s.fromForce_N(), s.toForce_N()}) {
        ValueMarker mark = new ValueMarker(level, WINDOW, new BasicStroke(1.0f));
        plot.addRangeMarker(mark);
      }
      from.setText(String.format(Locale.ROOT, "%.4g", s.fromForce_N()));
      to.setText(String.format(Locale.ROOT, "%.4g", s.toForce_N()));
      note.setText(String.format(Locale.ROOT, "%s, %.4g to %.4g N (samples %d to %d), R² %.4f,"
          + " 95 %% %.4g to %.4g N/mm", s.method().words(), s.fromForce_N(), s.toForce_N(),
          s.fromIndex(), s.toIndex(), s.rSquared(), s.ci95Low_N_per_mm(),
          s.ci95High_N_per_mm()));
    } else {
      note.setText(m.analysis().stiffnessRefusal().map(no -> "no stiffness: " + no.reason()
          + String.format(Locale.ROOT, "; closest band %.4g to %.4g N",
              no.closestFromForce_N(), no.closestToForce_N())).orElse("no stiffness"));
      m.analysis().stiffnessRefusal().ifPresent(no -> {
        from.setText(String.format(Locale.ROOT, "%.4g", no.closestFromForce_N()));
        to.setText(String.format(Locale.ROOT, "%.4g", no.closestToForce_N()));
      });
    }
    plot.setDataset(data);
  }

  /** Shows why a band was not fitted. */
  void refuse(String why) {
    note.setText(why);
  }

  private static double number(TextField field, String which) {
    String t = field.getText().trim().replace(',', '.');
    try {
      return Double.parseDouble(t);
    } catch (NumberFormatException e) {
      throw new IllegalArgumentException("the band's " + which + " force '" + t
          + "' is not a number: type it in N, e.g. 20");
    }
  }
}
