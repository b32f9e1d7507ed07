package org.loadstone.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.loadstone.analysis.Curve;
import org.loadstone.study.ArchiveRuns;
import org.loadstone.study.RunMetrics;
import org.loadstone.units.Precondition;

/**
 * A few runs on one chart, each in its own colour and named in the legend ("specimen · group"),
 * so the curves can be told apart and matched to the table's rows. The colours are taken in turn
 * from {@link #PALETTE}; past its ten colours they come round again with a dashed line, so no
 * two runs of a chart look alike. For more than {@link #MAX_RUNS} runs, colour by group
 * ({@link Charts#overlay}).
 */
public final class RunCurves {
  private RunCurves() {}

  /** Most runs drawn in colours of their own; more are drawn by group. */
  public static final int MAX_RUNS = 12;

  /**
   * The run colours in order of use: the ten-colour category scheme of d3 and Vega
   * ("category10", from memory), mid-tone hues that stay visible on white and dark grounds.
   */
  public static final List<Color> PALETTE = List.of(
      new Color(0x1F, 0x77, 0xB4), new Color(0xFF, 0x7F, 0x0E), new Color(0x2C, 0xA0, 0x2C),
      new Color(0xD6, 0x27, 0x28), new Color(0x94, 0x67, 0xBD), new Color(0x8C, 0x56, 0x4B),
      new Color(0xE3, 0x77, 0xC2), new Color(0x7F, 0x7F, 0x7F), new Color(0xBC, 0xBD, 0x22),
      new Color(0x17, 0xBE, 0xCF));

  /**
   * @param i the run's place in the chart, from 0
   * @return its colour
   */
  public static Color colour(int i) {
    if (i < 0) {
      throw new IllegalArgumentException("a run's place is 0 or more, not " + i);
    }
    return PALETTE.get(i % PALETTE.size());
  }

  /** @return the run's line: solid for the first ten runs, then ever longer dashes */
  static BasicStroke line(int i) {
    int round = i / PALETTE.size();
    return round == 0 ? new BasicStroke(1.4f) : Charts.dashed(4f + 3f * round, 3f);
  }

  /**
   * @param title the chart's title, not null
   * @param runs the runs in the order their colours are given, 1 to {@link #MAX_RUNS}
   * @return a new chart, force against displacement when every run has position, else time
   */
  public static JFreeChart of(String title, List<RunMetrics> runs) {
    Precondition.notNull(title, "title");
    Precondition.notNull(runs, "runs");
    if (runs.size() > MAX_RUNS) {
      throw new IllegalArgumentException("at most " + MAX_RUNS + " runs in colours of their own");
    }
    boolean allPosition = Charts.allPosition(runs);
    TraceDataset ds = new TraceDataset();
    XYLineAndShapeRenderer rend = new XYLineAndShapeRenderer(true, false);
    rend.setDrawSeriesLineAsPath(true);
    Set<String> names = new HashSet<>();
    for (int i = 0; i < runs.size(); i++) {
      RunMetrics m = runs.get(i);
      String name = legendName(m);
      Curve c = m.curve();
      ds.add(ReportFonts.printable(names.add(name) ? name : name + " (" + (i + 1) + ")"),
          c.size(), Charts.xOf(c, allPosition), c::force_N, TraceDataset.DEFAULT_COLUMNS);
      rend.setSeriesPaint(i, colour(i));
      rend.setSeriesStroke(i, line(i));
    }
    String xLabel = allPosition ? "displacement (mm)" : "time (s)";
    return Charts.chart(title, Charts.plot(ds, rend, new NumberAxis(xLabel), "force (N)"), true);
  }

  /** @return "specimen · group", the run id where the specimen has no name */
  static String legendName(RunMetrics m) {
    String who = m.metadata().specimen().isBlank() ? m.metadata().runId()
        : m.metadata().specimen();
    return who + " · " + ArchiveRuns.groupName(m.metadata().group());
  }
}
