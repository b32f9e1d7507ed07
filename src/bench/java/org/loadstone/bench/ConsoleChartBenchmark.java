package org.loadstone.bench;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Graphics2D;
import java.awt.geom.Rectangle2D;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.List;
import java.util.SplittableRandom;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.jfree.chart.ChartFactory;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.loadstone.acquire.DisplayTrace;
import org.loadstone.archive.FinishCause;
import org.loadstone.archive.JournalStream;
import org.loadstone.archive.Run;
import org.loadstone.archive.RunReader;
import org.loadstone.report.Charts;
import org.loadstone.report.RunCurves;
import org.loadstone.study.RunMetrics;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Warmup;

/**
 * The console's charts redrawn at 1200×700, for a run of 1,000 and of 1,000,000 samples side by
 * side (the target: at most 16 ms a redraw, one frame at 60 Hz, whatever the run's length):
 * the post-run chart ({@code Charts.run}, as the run figures and the run report draw it), the
 * archive's overlay of picked runs ({@code RunCurves}, the run with two others) and the live
 * chart's snapshot (a {@link DisplayTrace} of the last 30 s fed every sample at 50 kS/s, copied
 * out and drawn as {@code ui.ForceChart} draws it, the copy included in each redraw).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(value = 1, jvmArgsAppend = {"-Xmx768m", "-Djava.awt.headless=true"})
public class ConsoleChartBenchmark {
  @Param({"1000", "1000000"})
  int samples;

  Path dir;
  JFreeChart postRun;
  JFreeChart overlay;
  DisplayTrace trace;
  XYSeries liveSeries;
  JFreeChart live;
  double[] t;
  double[] f;
  BufferedImage image;

  @Setup
  public void setUp() throws IOException {
    dir = Files.createTempDirectory("consolecharts");
    List<RunMetrics> runs = new java.util.ArrayList<>();
    for (int k = 0; k < 3; k++) {
      String id = "bench-" + k;
      Path journal = AfterRunBenchmark.journal(dir, id, samples);
      Path csv = JournalStream.store(dir, journal, Long.MAX_VALUE,
          AfterRunBenchmark.metadata(id).toBuilder().cause(FinishCause.BREAK).build())
          .files().csv();
      Run r = RunReader.read(csv);
      runs.add(RunMetrics.of(r.metadata(), r.data()));
    }
    postRun = Charts.run(runs.get(0));
    overlay = RunCurves.of("3 runs picked", runs);
    // the live view: 30 s window, 1200 buckets (as LiveFeed), every sample at 50 kS/s
    trace = new DisplayTrace(30, 1200);
    SplittableRandom r = new SplittableRandom(5);
    for (int i = 0; i < samples; i++) {
      double u = (double) i / samples;
      trace.add(i / 50_000.0, 300 * u * (1 - u) * 4 + r.nextGaussian());
    }
    t = new double[trace.size()];
    f = new double[trace.size()];
    liveSeries = new XYSeries("force", false, true);
    live = ChartFactory.createXYLineChart(null, "time (s)", "force (N)",
        new XYSeriesCollection(liveSeries), PlotOrientation.VERTICAL, false, false, false);
    XYLineAndShapeRenderer rend = new XYLineAndShapeRenderer(true, false);
    rend.setSeriesPaint(0, new Color(0xff, 0x8a, 0x5b));
    rend.setSeriesStroke(0, new BasicStroke(2.0f));
    live.getXYPlot().setRenderer(rend);
    image = new BufferedImage(1200, 700, BufferedImage.TYPE_INT_RGB);
  }

  @TearDown
  public void tearDown() throws IOException {
    try (Stream<Path> s = Files.walk(dir)) {
      s.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
    }
  }

  @Benchmark
  public BufferedImage postRunChart() {
    return draw(postRun);
  }

  @Benchmark
  public BufferedImage archiveOverlayOfThree() {
    return draw(overlay);
  }

  /** A live frame: the trace copied out, the series refilled with one notice, the chart drawn. */
  @Benchmark
  public BufferedImage liveSnapshot() {
    int n = trace.copyTo(t, f);
    liveSeries.setNotify(false);
    liveSeries.clear();
    for (int i = 0; i < n; i++) {
      liveSeries.add(t[i], f[i], false);
    }
    liveSeries.setNotify(true);
    liveSeries.fireSeriesChanged();
    return draw(live);
  }

  /**
   * The same redraws in a plain loop, the 1,000,000- and the 1,000-sample runs in turn, timed by
   * the thread's CPU time (a figure a busy machine spoils less than wall time): per redraw, min,
   * median and max over the rounds, and the ratio of the two pair by pair. Run with
   * {@code mvn -P bench test -Dbench.main=org.loadstone.bench.ConsoleChartBenchmark
   * -Dbench.args="ROUNDS"}.
   */
  public static void main(String[] args) throws IOException {
    int rounds = args.length > 0 ? Integer.parseInt(args[0]) : 15;
    int redraws = 20;
    ConsoleChartBenchmark big = new ConsoleChartBenchmark();
    big.samples = 1_000_000;
    big.setUp();
    ConsoleChartBenchmark small = new ConsoleChartBenchmark();
    small.samples = 1000;
    small.setUp();
    java.lang.management.ThreadMXBean mx =
        java.lang.management.ManagementFactory.getThreadMXBean();
    String[] names = {"postRunChart", "archiveOverlayOfThree", "liveSnapshot"};
    java.util.function.Function<ConsoleChartBenchmark, Runnable>[] what = new
        java.util.function.Function[] {
          (java.util.function.Function<ConsoleChartBenchmark, Runnable>) b -> b::postRunChart,
          (java.util.function.Function<ConsoleChartBenchmark, Runnable>) b ->
              b::archiveOverlayOfThree,
          (java.util.function.Function<ConsoleChartBenchmark, Runnable>) b -> b::liveSnapshot};
    double[][][] ms = new double[names.length][2][rounds];
    for (int r = -3; r < rounds; r++) { // three rounds of warm-up first
      for (int k = 0; k < names.length; k++) {
        for (int which = 0; which < 2; which++) {
          Runnable redraw = what[k].apply(which == 0 ? big : small);
          long c0 = mx.getCurrentThreadCpuTime();
          for (int i = 0; i < redraws; i++) {
            redraw.run();
          }
          if (r >= 0) {
            ms[k][which][r] = (mx.getCurrentThreadCpuTime() - c0) / 1e6 / redraws;
          }
        }
      }
    }
    System.out.println("| chart | 1 M samples, CPU ms a redraw (min / median / max) | "
        + "1 k samples | 1 M ÷ 1 k pair by pair (min / median / max) |");
    System.out.println("|---|---|---|---|");
    for (int k = 0; k < names.length; k++) {
      double[] ratio = new double[rounds];
      for (int r = 0; r < rounds; r++) {
        ratio[r] = ms[k][0][r] / ms[k][1][r];
      }
      System.out.println("| " + names[k] + " | " + spread(ms[k][0], "%.2f") + " | "
          + spread(ms[k][1], "%.2f") + " | " + spread(ratio, "%.2f ×") + " |");
    }
    big.tearDown();
    small.tearDown();
  }

  private static String spread(double[] v, String f) {
    double[] s = v.clone();
    java.util.Arrays.sort(s);
    return String.format(java.util.Locale.ROOT, f + " / " + f + " / " + f, s[0],
        s[s.length / 2], s[s.length - 1]);
  }

  private BufferedImage draw(JFreeChart c) {
    Graphics2D g = image.createGraphics();
    c.draw(g, new Rectangle2D.Double(0, 0, image.getWidth(), image.getHeight()));
    g.dispose();
    return image;
  }
}
