package org.loadstone.bench;

import java.awt.Graphics2D;
import java.awt.geom.Rectangle2D;
import java.awt.image.BufferedImage;
import java.io.BufferedReader;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.SplittableRandom;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.jfree.chart.JFreeChart;
import org.loadstone.archive.FinishCause;
import org.loadstone.archive.JournalFormat;
import org.loadstone.archive.JournalStream;
import org.loadstone.archive.Run;
import org.loadstone.archive.RunMetadata;
import org.loadstone.archive.RunFixtures;
import org.loadstone.archive.RunReader;
import org.loadstone.report.Charts;
import org.loadstone.study.RunMetrics;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Warmup;

/**
 * What happens after a run, side by side with a plain read of the same file: analysing a
 * 1,000,000-sample run from its CSV, finishing it (journal → stored run → figures), and drawing
 * its chart beside the chart of a 1,000-sample run. A plain read is {@code BufferedReader.readLine}
 * over the run's CSV, every line, nothing parsed.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(value = 1, jvmArgsAppend = {"-Xmx512m"})
public class AfterRunBenchmark {
  static final int SAMPLES = 1_000_000;

  Path dir;
  Path journal;
  Path csv;
  RunMetadata meta;
  JFreeChart chartLong;
  JFreeChart chartShort;
  BufferedImage image;
  int finishes;

  @Setup
  public void setUp() throws IOException {
    dir = Files.createTempDirectory("afterrun");
    journal = journal(dir, "bench-1m", SAMPLES);
    meta = metadata("bench-1m").toBuilder().cause(FinishCause.BREAK).build();
    csv = JournalStream.store(dir, journal, Long.MAX_VALUE, meta).files().csv();
    Path shortJournal = journal(dir, "bench-1k", 1000);
    Path shortCsv = JournalStream.store(dir, shortJournal, Long.MAX_VALUE,
        metadata("bench-1k")).files().csv();
    chartLong = Charts.run(analyse(csv));
    chartShort = Charts.run(analyse(shortCsv));
    image = new BufferedImage(1200, 700, BufferedImage.TYPE_INT_RGB);
  }

  @TearDown
  public void tearDown() throws IOException {
    try (Stream<Path> s = Files.walk(dir)) {
      s.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
    }
  }

  /** The finish's run files go under a fresh id each time: runs are never overwritten. */
  @TearDown(Level.Invocation)
  public void removeFinished() throws IOException {
    Files.deleteIfExists(dir.resolve("fin-" + finishes + ".csv"));
    Files.deleteIfExists(dir.resolve("fin-" + finishes + ".json"));
  }

  static RunMetrics analyse(Path csv) {
    Run r = RunReader.read(csv);
    return RunMetrics.of(r.metadata(), r.data());
  }

  @Benchmark
  public long plainLineRead() throws IOException {
    long chars = 0;
    try (BufferedReader r = Files.newBufferedReader(csv, StandardCharsets.UTF_8)) {
      String line;
      while ((line = r.readLine()) != null) {
        chars += line.length();
      }
    }
    return chars;
  }

  @Benchmark
  public RunMetrics analyse1M() {
    return analyse(csv);
  }

  @Benchmark
  public RunMetrics finish1M() {
    finishes++;
    RunMetadata m = meta.toBuilder().runId("fin-" + finishes).build();
    JournalStream.Stored s = JournalStream.store(dir, journal, Long.MAX_VALUE, m);
    return analyse(s.files().csv());
  }

  @Benchmark
  public BufferedImage chartRedraw1M() {
    return draw(chartLong);
  }

  @Benchmark
  public BufferedImage chartRedraw1k() {
    return draw(chartShort);
  }

  private BufferedImage draw(JFreeChart c) {
    Graphics2D g = image.createGraphics();
    c.draw(g, new Rectangle2D.Double(0, 0, image.getWidth(), image.getHeight()));
    g.dispose();
    return image;
  }

  /** A shelf panel in three-point bending at 50 kS/s: rise, bend-over, break; noisy counts. */
  static Path journal(Path dir, String id, int n) throws IOException {
    SplittableRandom r = new SplittableRandom(17);
    double countsPerN = 8590; // the fixtures' nominal scale
    int peakAt = (int) (n * 0.7);
    try (FileChannel ch = JournalFormat.create(dir, metadata(id))) {
      ByteBuffer b = ByteBuffer.allocate(4096 * JournalFormat.RECORD_BYTES);
      for (int i = 0; i < n; i++) {
        double x_mm = 6.0 * i / n;
        double u = Math.min(1.0, (double) i / peakAt);
        double f = i <= peakAt ? 320 * (1 - Math.pow(1 - u, 2.2)) * (0.4 + 0.6 * u)
            : 320 * (1 - 0.8 * Math.min(1.0, (i - peakAt) / (0.01 * n)));
        int counts = (int) Math.round(812 + countsPerN * f + r.nextGaussian() * 300);
        long t = 3_000_000L + i * 20L;
        JournalFormat.putRecord(b, i, i & 0xFFFF, t & 0xFFFF_FFFFL, t, counts, true,
            (int) Math.round(x_mm * 400));
        if (!b.hasRemaining()) {
          write(ch, b);
        }
      }
      write(ch, b);
    }
    return JournalFormat.journalFile(dir, id);
  }

  private static void write(FileChannel ch, ByteBuffer b) throws IOException {
    b.flip();
    while (b.hasRemaining()) {
      ch.write(b);
    }
    b.clear();
  }

  static RunMetadata metadata(String id) {
    return RunFixtures.startMetadata(id, false).toBuilder().sampleRate_Hz(50_000.0).build();
  }
}
