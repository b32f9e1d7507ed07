package org.loadstone.report;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import javax.imageio.ImageIO;
import org.jfree.chart.JFreeChart;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.analysis.stats.ComparisonResult;
import org.loadstone.analysis.stats.GroupComparison;
import org.loadstone.intake.ColumnMap;
import org.loadstone.intake.CsvImport;
import org.loadstone.intake.ImportSettings;
import org.loadstone.intake.ImportedRun;
import org.loadstone.archive.RunData;
import org.loadstone.study.RunMetrics;
import org.loadstone.archive.TestRuns;
import org.loadstone.units.LoadstoneException;

class ExportTest {
  @TempDir Path dir;

  @Test
  void pngHasTheAskedSizeAndIsNeverOverwritten() throws IOException {
    RunMetrics m = RunMetrics.of(TestRuns.meta("BO-2", "board", TestRuns.panel(), null),
        TestRuns.bend(42, 390));
    Path png = dir.resolve("curve.png");
    PngExport.write(Charts.run(m), png, 800, 500);
    BufferedImage img = ImageIO.read(png.toFile());
    assertThat(img).isNotNull();
    assertThat(img.getWidth()).isEqualTo(800);
    assertThat(img.getHeight()).isEqualTo(500);
    long size = Files.size(png);
    assertThatThrownBy(() -> PngExport.write(Charts.run(m), png, 300, 200))
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("never overwrites");
    assertThat(Files.size(png)).isEqualTo(size);
    try (var s = Files.list(dir)) {
      assertThat(s).hasSize(1); // no temporary file left behind
    }
  }

  @Test
  void stripAndOverlayChartsRender() throws IOException {
    Map<String, List<RunMetrics>> g = ReportFixtures.groups();
    Map<String, List<Double>> v = new LinkedHashMap<>();
    g.forEach((k, l) -> v.put(k, l.stream().map(m -> m.analysis().peakForce_N()).toList()));
    ComparisonResult r = GroupComparison.compare("peak force", v);
    JFreeChart strip = Charts.strip(r, v, "peak force (N)");
    PngExport.write(strip, dir.resolve("strip.png"), 640, 400);
    PngExport.write(Charts.overlay("all", g), dir.resolve("overlay.png"), 640, 400);
    assertThat(ImageIO.read(dir.resolve("strip.png").toFile()).getWidth()).isEqualTo(640);
    // the strip plot holds one point per specimen: 4 + 3 + 4
    int points = 0;
    for (int i = 0; i < strip.getXYPlot().getDataset().getSeriesCount(); i++) {
      points += strip.getXYPlot().getDataset().getItemCount(i);
    }
    assertThat(points).isEqualTo(11);
  }

  @Test
  void csvRoundTripWithSemicolonAndDecimalComma() throws IOException {
    RunData d = TestRuns.bend(60, 460);
    Path csv = dir.resolve("run.csv");
    CsvExport.write(d, csv, ';', ',');
    ImportedRun back = CsvImport.read(csv, ImportSettings.of(ColumnMap.PLAIN)
        .withDelimiter(';').withDecimalComma(true));
    assertThat(back.data().time_s()).containsExactly(d.time_s());
    assertThat(back.data().force_N()).containsExactly(d.force_N());
    assertThat(back.data().position_mm()).containsExactly(d.position_mm());
    List<String> lines = Files.readAllLines(csv);
    assertThat(lines.get(0)).isEqualTo("time_s;force_N;position_mm;raw_counts;raw_position;seq");

    RunData small = new RunData(new double[] {0, 0.5}, new double[] {1.25, 2.5e-7}, null,
        new int[] {10, 21}, null, new int[] {4, 5});
    Path c2 = dir.resolve("small.csv");
    CsvExport.write(small, c2, ';', ',');
    assertThat(Files.readAllLines(c2).get(2)).isEqualTo("0,5;0,00000025;;21;;5");
    Path c3 = dir.resolve("small-point.csv");
    CsvExport.write(small, c3, ',', '.');
    assertThat(CsvImport.plain(c3).data().force_N()).containsExactly(1.25, 2.5e-7);
  }

  @Test
  void randomValuesSurviveTheSpreadsheetRoundTripExactly() throws IOException {
    java.util.Random rnd = new java.util.Random(20261202L); // fixed seed
    int n = 500;
    double[] t = new double[n];
    double[] f = new double[n];
    double[] x = new double[n];
    double now = 0;
    for (int i = 0; i < n; i++) {
      now += Math.pow(10, -6 + 6 * rnd.nextDouble());
      t[i] = now;
      f[i] = (rnd.nextDouble() - 0.3) * Math.pow(10, -9 + 15 * rnd.nextDouble());
      x[i] = rnd.nextGaussian() * 50;
    }
    int[] zeros = new int[n];
    int[] seq = new int[n];
    java.util.Arrays.setAll(seq, i -> i);
    RunData d = new RunData(t, f, x, zeros, zeros.clone(), seq);
    Path csv = dir.resolve("random.csv");
    CsvExport.write(d, csv, ';', ',');
    ImportedRun back = CsvImport.plain(csv);
    assertThat(back.data().force_N()).containsExactly(f);
    assertThat(back.data().position_mm()).containsExactly(x);
    // plain() shifts time to start at 0; the differences survive within one ulp of the sum
    for (int i = 0; i < n; i++) {
      assertThat(back.data().time_s()[i]).isCloseTo(t[i] - t[0], within(Math.ulp(t[i]) * 2));
    }
  }

  @Test
  void csvRefusesDelimiterEqualToDecimalMark() {
    RunData d = TestRuns.bend(60, 460);
    assertThatThrownBy(() -> CsvExport.write(d, dir.resolve("x.csv"), ',', ','))
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("both ','");
    assertThat(dir.resolve("x.csv")).doesNotExist();
  }
}
