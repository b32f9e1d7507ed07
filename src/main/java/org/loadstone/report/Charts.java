package org.loadstone.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.geom.Ellipse2D;
import java.awt.geom.Rectangle2D;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.function.IntToDoubleFunction;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.annotations.XYLineAnnotation;
import org.jfree.chart.annotations.XYPointerAnnotation;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.SymbolAxis;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.title.TextTitle;
import org.jfree.chart.ui.RectangleInsets;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.loadstone.analysis.Curve;
import org.loadstone.analysis.RunResult;
import org.loadstone.analysis.StiffnessFit;
import org.loadstone.analysis.stats.ComparisonResult;
import org.loadstone.analysis.stats.GroupSummary;
import org.loadstone.study.Metric;
import org.loadstone.study.RunMetrics;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * JFreeChart charts of runs and groups, drawn for print: white background, light grid, the
 * colour-blind-safe group colours of {@link GroupColours}, the report font ({@link ReportFonts}).
 * No JavaFX.
 */
public final class Charts {
  private Charts() {}

  /**
   * Most runs a group chart names one by one in its legend, each in its own colour; a group with
   * more is drawn in the group's colour alone, without a per-run legend, so the curves stay
   * visible.
   */
  public static final int PER_RUN_LEGEND_MAX = 8;

  /** Series colours of a single run's chart, in order of use. */
  static final Color[] PALETTE = GroupColours.PALETTE.toArray(new Color[0]);
  private static final Color INK = new Color(0x2E, 0x34, 0x3B);
  private static final Color GRID = new Color(0xDD, 0xE1, 0xE6);
  private static final Color ACCENT = new Color(0xB0, 0x4A, 0x3A);
  private static final Font LABEL = ReportFonts.awt(false, 10);
  private static final Font TITLE = ReportFonts.awt(true, 12);

  /**
   * Force against displacement (from the first sample) for a run with position, otherwise force
   * against time; with the stiffness line (when fitted and with position), the break point and
   * the peak annotated.
   *
   * @param m the run's metrics, not null
   * @return a new chart
   */
  public static JFreeChart run(RunMetrics m) {
    Precondition.notNull(m, "metrics");
    Curve c = m.curve();
    RunResult r = m.analysis();
    IntToDoubleFunction x = xOf(c, c.hasPosition());
    TraceDataset ds = new TraceDataset();
    ds.add("force", c.size(), x, c::force_N, TraceDataset.DEFAULT_COLUMNS);
    XYLineAndShapeRenderer rend = new XYLineAndShapeRenderer(true, false);
    rend.setDrawSeriesLineAsPath(true); // one path per curve, not a call per segment
    rend.setSeriesPaint(0, PALETTE[0]);
    rend.setSeriesStroke(0, new BasicStroke(1.6f));
    int next = 1;
    if (c.hasPosition() && r.stiffness().isPresent()) {
      StiffnessFit fit = r.stiffness().get();
      double top = r.peakForce_N(); // up to the peak level, so the curve's departure shows
      ds.add("stiffness " + Metric.STIFFNESS.format(fit.slope_N_per_mm()) + " N/mm",
          new double[] {fit.toeOffset_mm(), (top - fit.intercept_N()) / fit.slope_N_per_mm()},
          new double[] {0.0, top});
      rend.setSeriesPaint(next, PALETTE[4]);
      rend.setSeriesStroke(next, new BasicStroke(1.4f, BasicStroke.CAP_ROUND,
          BasicStroke.JOIN_ROUND, 1f, new float[] {6f, 4f}, 0f));
      next++;
    }
    if (r.breakPoint().isPresent()) {
      int b = r.breakPoint().get().index();
      ds.add("break", new double[] {x.applyAsDouble(b)}, new double[] {c.force_N(b)});
      rend.setSeriesLinesVisible(next, false);
      rend.setSeriesShapesVisible(next, true);
      rend.setSeriesShape(next, new Rectangle2D.Double(-4, -4, 8, 8));
      rend.setSeriesPaint(next, ACCENT);
    }
    String xLabel = c.hasPosition() ? "displacement (mm)" : "time (s)";
    XYPlot plot = plot(ds, rend, new NumberAxis(xLabel), "force (N)");
    int p = r.peakIndex();
    XYPointerAnnotation peak = new XYPointerAnnotation(
        "peak " + Metric.PEAK.format(r.peakForce_N()) + " N", x.applyAsDouble(p),
        c.force_N(p), -2.6);
    peak.setFont(LABEL);
    peak.setPaint(INK);
    peak.setArrowPaint(INK);
    peak.setTextAnchor(TextAnchor.BOTTOM_RIGHT);
    peak.setBaseRadius(22);
    peak.setTipRadius(3);
    plot.addAnnotation(peak);
    plot.getRangeAxis().setUpperMargin(0.2);
    String title = m.metadata().specimen().isBlank() ? m.metadata().runId()
        : m.metadata().specimen();
    return chart(title, plot, ds.getSeriesCount() > 1);
  }

  /**
   * The curves of several runs on one chart, one colour per group (legend: one entry per group,
   * with its number of runs), the groups coloured in the order given.
   *
   * @param title chart title, not null
   * @param groups group name → runs, in order; at least one run in all
   * @return a new chart; force against displacement when every run has position, else time
   * @throws LoadstoneException when there is no run
   */
  public static JFreeChart overlay(String title, Map<String, List<RunMetrics>> groups) {
    Precondition.notNull(groups, "groups");
    return overlay(title, groups, GroupColours.of(groups.keySet()));
  }

  /**
   * {@link #overlay(String, Map)} with the report's colours, so a group has the same colour in
   * every chart.
   *
   * @param colours the report's group colours, not null
   */
  public static JFreeChart overlay(String title, Map<String, List<RunMetrics>> groups,
      GroupColours colours) {
    Precondition.notNull(groups, "groups");
    Precondition.notNull(colours, "colours");
    boolean allPosition = allPosition(groups.values().stream().flatMap(List::stream).toList());
    TraceDataset ds = new TraceDataset();
    XYLineAndShapeRenderer rend = new XYLineAndShapeRenderer(true, false);
    rend.setDrawSeriesLineAsPath(true); // one path per curve, not a call per segment
    int s = 0;
    int count = groups.values().stream().mapToInt(List::size).sum();
    float width = count > 4 * PER_RUN_LEGEND_MAX ? 0.7f : 1.1f;
    for (Map.Entry<String, List<RunMetrics>> e : groups.entrySet()) {
      // many curves in one colour: partly see-through, so where they bunch shows
      Color colour = thinned(colours.colour(e.getKey()), e.getValue().size());
      boolean first = true;
      for (RunMetrics m : e.getValue()) {
        Curve c = m.curve();
        ds.add(ReportFonts.printable(first ? legendName(e.getKey(), e.getValue().size())
            : e.getKey() + " #" + s),
            c.size(), xOf(c, allPosition), c::force_N, TraceDataset.DEFAULT_COLUMNS);
        rend.setSeriesPaint(s, colour);
        rend.setSeriesStroke(s, colours.line(e.getKey(), width));
        rend.setSeriesVisibleInLegend(s, first);
        first = false;
        s++;
      }
    }
    String xLabel = allPosition ? "displacement (mm)" : "time (s)";
    return chart(title, plot(ds, rend, new NumberAxis(xLabel), "force (N)"), true);
  }

  /**
   * The curves of one group, in the group's colour. Up to {@link #PER_RUN_LEGEND_MAX} runs: one
   * line pattern (and shade) per run, the legend naming the specimens. More: every curve in the group's colour and no per-run legend
   * (the group report's tables name the runs), the run count in the subtitle.
   *
   * @param group group name, used as the title, not null
   * @param runs the group's runs, at least one
   * @return a new chart; force against displacement when every run has position, else time
   * @throws LoadstoneException when there is no run
   */
  public static JFreeChart group(String group, List<RunMetrics> runs) {
    return group(group, runs, GroupColours.of(List.of(group)));
  }

  /**
   * {@link #group(String, List)} with the report's colours.
   *
   * @param colours the report's group colours, not null
   */
  public static JFreeChart group(String group, List<RunMetrics> runs, GroupColours colours) {
    Precondition.notNull(group, "group");
    Precondition.notNull(runs, "runs");
    Precondition.notNull(colours, "colours");
    if (runs.size() > PER_RUN_LEGEND_MAX) {
      JFreeChart ch = overlay(group, Map.of(group, runs), colours);
      ch.removeLegend();
      TextTitle sub = new TextTitle(runs.size() + " runs, each line one run (named in the "
          + "tables)", LABEL);
      sub.setPaint(INK);
      ch.addSubtitle(sub);
      return ch;
    }
    // a few runs: each named in the legend, in the group's colour, told apart by a line
    // pattern and a lighter shade
    boolean allPosition = allPosition(runs);
    TraceDataset ds = new TraceDataset();
    XYLineAndShapeRenderer rend = new XYLineAndShapeRenderer(true, false);
    rend.setDrawSeriesLineAsPath(true);
    java.util.Set<String> names = new java.util.HashSet<>();
    for (int i = 0; i < runs.size(); i++) {
      String name = runs.get(i).metadata().specimen();
      Curve c = runs.get(i).curve();
      ds.add(ReportFonts.printable(names.add(name) ? name : name + " (" + (i + 1) + ")"), c.size(),
          xOf(c, allPosition), c::force_N, TraceDataset.DEFAULT_COLUMNS);
      rend.setSeriesPaint(i, lighter(colours.colour(group), 0.07f * i));
      rend.setSeriesStroke(i, RUN_LINES.get(i % RUN_LINES.size()));
    }
    String xLabel = allPosition ? "displacement (mm)" : "time (s)";
    return chart(group, plot(ds, rend, new NumberAxis(xLabel), "force (N)"), true);
  }

  /** Line patterns that tell a group's runs apart: solid, dashes, dots and mixes. */
  private static final List<BasicStroke> RUN_LINES = List.of(
      new BasicStroke(1.3f),
      dashed(7f, 3f),
      dashed(1.5f, 2.5f),
      dashed(7f, 2.5f, 1.5f, 2.5f),
      dashed(12f, 3f),
      dashed(4f, 4f),
      dashed(12f, 2.5f, 1.5f, 2.5f, 1.5f, 2.5f),
      dashed(2.5f, 5f));

  static BasicStroke dashed(float... pattern) {
    return new BasicStroke(1.3f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 1f, pattern, 0f);
  }

  /** The colour moved toward white by {@code share} (0 to 1). */
  private static Color lighter(Color c, float share) {
    return new Color(Math.round(c.getRed() + (255 - c.getRed()) * share),
        Math.round(c.getGreen() + (255 - c.getGreen()) * share),
        Math.round(c.getBlue() + (255 - c.getBlue()) * share));
  }

  private static String legendName(String group, int runs) {
    return runs == 1 ? group : group + " (" + runs + " runs)";
  }

  /** The colour made partly see-through when many curves share it. */
  private static Color thinned(Color c, int curves) {
    if (curves <= PER_RUN_LEGEND_MAX) {
      return c;
    }
    return new Color(c.getRed(), c.getGreen(), c.getBlue(), 150);
  }

  static boolean allPosition(List<RunMetrics> runs) {
    if (runs.isEmpty()) {
      throw new LoadstoneException("An overlay chart needs at least one run; select runs first.");
    }
    return runs.stream().allMatch(m -> m.curve().hasPosition());
  }

  /**
   * One metric by group: each specimen as a point (spread sideways so equal values stay
   * visible), with the group mean as a bar and its 95 % confidence interval as a whisker.
   *
   * @param result the comparison (gives means and intervals), not null
   * @param values group name → per-specimen values, the same groups as the result
   * @param axisLabel value axis label with unit, e.g. "peak force (N)"
   * @return a new chart
   */
  public static JFreeChart strip(ComparisonResult result, Map<String, List<Double>> values,
      String axisLabel) {
    Precondition.notNull(result, "result");
    return strip(result, values, axisLabel,
        GroupColours.of(result.groups().stream().map(GroupSummary::name).toList()));
  }

  /**
   * {@link #strip(ComparisonResult, Map, String)} with the report's colours.
   *
   * @param colours the report's group colours, not null
   */
  public static JFreeChart strip(ComparisonResult result, Map<String, List<Double>> values,
      String axisLabel, GroupColours colours) {
    Precondition.notNull(result, "result");
    Precondition.notNull(values, "values");
    Precondition.notNull(colours, "colours");
    List<GroupSummary> groups = result.groups();
    String[] names = new String[groups.size()];
    XYSeriesCollection ds = new XYSeriesCollection();
    XYLineAndShapeRenderer rend = new XYLineAndShapeRenderer(false, true);
    List<XYLineAnnotation> bars = new ArrayList<>();
    BasicStroke thick = new BasicStroke(2.2f);
    BasicStroke thin = new BasicStroke(1.2f);
    for (int gi = 0; gi < groups.size(); gi++) {
      GroupSummary gs = groups.get(gi);
      names[gi] = ReportFonts.printable(gs.name());
      XYSeries pts = new XYSeries(gs.name(), false, true);
      List<Double> v = values.getOrDefault(gs.name(), List.of());
      for (int i = 0; i < v.size(); i++) {
        double off = v.size() == 1 ? 0 : -0.12 + 0.24 * i / (v.size() - 1);
        pts.add(gi - 0.1 + off, v.get(i));
      }
      ds.addSeries(pts);
      rend.setSeriesPaint(gi, colours.colour(gs.name()));
      rend.setSeriesShape(gi, new Ellipse2D.Double(-3.5, -3.5, 7, 7));
      double xm = gi + 0.25;
      bars.add(new XYLineAnnotation(xm - 0.12, gs.mean(), xm + 0.12, gs.mean(), thick, INK));
      if (gs.ci95Low().isPresent()) {
        double lo = gs.ci95Low().getAsDouble();
        double hi = gs.ci95High().getAsDouble();
        bars.add(new XYLineAnnotation(xm, lo, xm, hi, thin, INK));
        bars.add(new XYLineAnnotation(xm - 0.05, lo, xm + 0.05, lo, thin, INK));
        bars.add(new XYLineAnnotation(xm - 0.05, hi, xm + 0.05, hi, thin, INK));
      }
    }
    SymbolAxis xAxis = new SymbolAxis("group", names);
    xAxis.setGridBandsVisible(false);
    xAxis.setRange(-0.6, names.length - 0.4);
    XYPlot plot = plot(ds, rend, xAxis, axisLabel);
    ((NumberAxis) plot.getRangeAxis()).setAutoRangeIncludesZero(false);
    bars.forEach(plot::addAnnotation);
    // keep the whiskers inside the visible range
    double lo = Double.POSITIVE_INFINITY;
    double hi = Double.NEGATIVE_INFINITY;
    for (GroupSummary gs : groups) {
      lo = Math.min(lo, gs.ci95Low().orElse(gs.mean()));
      hi = Math.max(hi, gs.ci95High().orElse(gs.mean()));
      for (double v : values.getOrDefault(gs.name(), List.of())) {
        lo = Math.min(lo, v);
        hi = Math.max(hi, v);
      }
    }
    double pad = hi > lo ? 0.08 * (hi - lo) : Math.max(1e-9, Math.abs(hi) * 0.05 + 1e-9);
    plot.getRangeAxis().setRange(lo - pad, hi + pad);
    return chart(result.metric() + " by group (mean and 95 % interval)", plot, false);
  }

  /** Displacement from the first sample, or time; read from the curve, never copied. */
  static IntToDoubleFunction xOf(Curve c, boolean displacement) {
    if (!displacement) {
      return c::time_s;
    }
    double p0 = c.position_mm(0);
    return i -> c.position_mm(i) - p0;
  }

  static XYPlot plot(org.jfree.data.xy.XYDataset ds, XYLineAndShapeRenderer rend,
      org.jfree.chart.axis.ValueAxis xAxis, String yLabel) {
    NumberAxis yAxis = new NumberAxis(yLabel);
    for (org.jfree.chart.axis.ValueAxis a : new org.jfree.chart.axis.ValueAxis[] {xAxis, yAxis}) {
      a.setLabelFont(LABEL);
      a.setTickLabelFont(LABEL);
      a.setLabelPaint(INK);
      a.setTickLabelPaint(INK);
      a.setAxisLinePaint(INK);
    }
    if (xAxis instanceof NumberAxis n) {
      n.setAutoRangeIncludesZero(false);
    }
    rend.setLegendLine(new java.awt.geom.Line2D.Double(-11, 0, 11, 0)); // long enough to show a dash
    XYPlot plot = new XYPlot(ds, xAxis, yAxis, rend);
    plot.setBackgroundPaint(Color.WHITE);
    plot.setDomainGridlinePaint(GRID);
    plot.setRangeGridlinePaint(GRID);
    plot.setDomainGridlineStroke(new BasicStroke(0.6f));
    plot.setRangeGridlineStroke(new BasicStroke(0.6f));
    plot.setOutlinePaint(GRID);
    plot.setAxisOffset(new RectangleInsets(4, 4, 4, 4));
    return plot;
  }

  static JFreeChart chart(String title, XYPlot plot, boolean legend) {
    JFreeChart ch = new JFreeChart(ReportFonts.printable(title), TITLE, plot, legend);
    ch.setBackgroundPaint(Color.WHITE);
    ch.setAntiAlias(true);
    TextTitle t = ch.getTitle();
    t.setPaint(INK);
    if (ch.getLegend() != null) {
      ch.getLegend().setItemFont(LABEL);
      ch.getLegend().setItemPaint(INK);
      ch.getLegend().setFrame(new org.jfree.chart.block.BlockBorder(Color.WHITE));
    }
    return ch;
  }
}
