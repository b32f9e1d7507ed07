package org.loadstone.bench;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import org.loadstone.archive.FinishCause;
import org.loadstone.archive.Geometry;
import org.loadstone.archive.RunData;
import org.loadstone.archive.RunMetadata;
import org.loadstone.archive.RunWriter;
import org.loadstone.archive.ScaleSpec;
import org.loadstone.archive.TestType;

/**
 * Fills an archive folder with {@code N} stored shelf-panel runs for the archive benchmarks
 * ({@code compare-scale.sh}): three groups (foam, balsa, board), 1,500 samples each at 100
 * samples/s, a straight rise with seeded converter-like noise, a rounded top and a break; a
 * calibration on every run so the default selection counts them. Seeded: the same N gives the
 * same files. Usage: {@code ArchiveFill DIR N}.
 */
public final class ArchiveFill {
  private static final String[] GROUPS = {"foam", "balsa", "board"};

  private ArchiveFill() {}

  public static void main(String[] args) throws Exception {
    Path dir = Path.of(args[0]);
    int n = Integer.parseInt(args[1]);
    Files.createDirectories(dir);
    Instant t0 = Instant.parse("2026-01-05T08:00:00Z");
    for (int i = 0; i < n; i++) {
      SplittableRandom rnd = new SplittableRandom(1000 + i);
      String group = GROUPS[i % 3];
      double k = (group.equals("foam") ? 60 : group.equals("balsa") ? 140 : 35)
          * (1 + 0.08 * rnd.nextGaussian());
      double peak = (group.equals("foam") ? 420 : group.equals("balsa") ? 900 : 260)
          * (1 + 0.06 * rnd.nextGaussian());
      String specimen = group + "-" + (i / 3 + 1);
      RunMetadata m = RunMetadata.builder()
          .runId(String.format("2026%06d-%s", i, specimen)).startedAt(t0.plusSeconds(600L * i))
          .specimen(specimen).group(group).tags(List.of("shelf")).operator("bench")
          .notes("").mass_g(50.0 + rnd.nextDouble() * 5)
          .geometry(new Geometry(400.0, null, 50.0, 26.0, 3.0, 20.0, null))
          .testType(TestType.THREE_POINT_BEND)
          .device(Map.of("name", "bench-frame", "port", "sim")).sampleRate_Hz(100.0)
          .calibrationId("cal-bench").calibrationSha256("0".repeat(64))
          .scale("linear 8590 counts/N (calibration)")
          .scaleSpec(new ScaleSpec("calibration", List.of(0.0, 8590.0), 0.0, 2000.0))
          .zeroOffset_counts(0).dropped(0).checksumErrors(0).cause(FinishCause.BREAK)
          .pretrigger_s(0.5).startThreshold_N(5.0).warnings(List.of())
          .softwareVersion("bench").extra(Map.of()).build();
      RunWriter.write(dir, m, curve(k, peak, rnd));
    }
  }

  private static RunData curve(double k_N_per_mm, double peak_N, SplittableRandom rnd) {
    int n = 1500;
    int top = 1300;
    double[] t = new double[n];
    double[] f = new double[n];
    double[] x = new double[n];
    double xPeak = 1.25 * peak_N / k_N_per_mm;
    for (int i = 0; i < n; i++) {
      t[i] = i / 100.0;
      x[i] = xPeak * i / top;
      double u = Math.min(1, (double) i / top);
      double clean = i <= top
          ? (u < 0.6 ? k_N_per_mm * x[i] : peak_N - (peak_N - 0.6 * xPeak * k_N_per_mm)
              * Math.pow((1 - u) / 0.4, 2))
          : peak_N * Math.max(0.1, 1 - 0.9 * (i - top) / 20.0);
      f[i] = clean + 0.15 * rnd.nextGaussian();
    }
    int[] raw = new int[n];
    int[] rawPos = new int[n];
    int[] seq = new int[n];
    for (int i = 0; i < n; i++) {
      raw[i] = (int) Math.round(f[i] * 8590);
      rawPos[i] = (int) Math.round(x[i] * 400);
      seq[i] = i;
    }
    return new RunData(t, f, x, raw, rawPos, seq);
  }
}
