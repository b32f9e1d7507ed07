package org.loadstone.archive;

import java.time.Instant;
import java.util.Arrays;
import java.util.List;
import java.util.Map;

/** Synthetic shelf-panel runs for tests: exact curves with known stiffness and peak. */
public final class TestRuns {
  private TestRuns() {}

  /** A calibration hash as stored in run metadata (64 hex digits). */
  public static final String CAL_HASH =
      "3f7a9c0e5b2d4186a0c3e9f17b25d8c4e6a1f03b97d2c58e4a6b1d0f9e3c7a25";

  /**
   * A three-point run: straight rise of {@code k_N_per_mm} from 0 to {@code peak_N} at 0.01 mm
   * steps, rounded (a parabola meeting the line's slope) from 80 % of the peak, then a drop to 20 % of the peak.
   * Time is 30 s per mm (2 mm/min crosshead).
   */
  public static RunData bend(double k_N_per_mm, double peak_N) {
    double xLin = 0.8 * peak_N / k_N_per_mm;
    int nLin = (int) Math.round(xLin / 0.01);
    // the rounded part starts with the same slope k, so the straight rise ends smoothly
    int nRound = (int) Math.round(2 * (0.2 * peak_N) / k_N_per_mm / 0.01);
    int nDrop = 20;
    int n = nLin + nRound + nDrop + 1;
    double[] x = new double[n];
    double[] f = new double[n];
    for (int i = 0; i <= nLin; i++) {
      x[i] = i * 0.01;
      f[i] = k_N_per_mm * x[i];
    }
    double f0 = f[nLin];
    for (int j = 1; j <= nRound; j++) {
      int i = nLin + j;
      x[i] = x[nLin] + j * 0.01;
      double u = j / (double) nRound; // quadratic from slope k... to the peak with zero slope
      f[i] = j == nRound ? peak_N : f0 + (peak_N - f0) * (1 - (1 - u) * (1 - u));
    }
    for (int j = 1; j <= nDrop; j++) {
      int i = nLin + nRound + j;
      x[i] = x[i - 1] + 0.01;
      f[i] = peak_N * (1 - 0.8 * j / nDrop);
    }
    double[] t = new double[n];
    for (int i = 0; i < n; i++) {
      t[i] = x[i] * 30;
    }
    int[] raw = new int[n];
    int[] seq = new int[n];
    Arrays.setAll(raw, i -> (int) Math.round(f[i] * 8590));
    Arrays.setAll(seq, i -> i);
    int[] rawPos = new int[n];
    Arrays.setAll(rawPos, i -> (int) Math.round(x[i] * 400));
    return new RunData(t, f, x, raw, rawPos, seq);
  }

  /** Metadata with every field filled, for a three-point bend of a sandwich panel. */
  public static RunMetadata meta(String specimen, String group, Geometry g, Double mass_g) {
    return RunMetadata.builder()
        .runId("20261202-101500-" + specimen)
        .startedAt(Instant.parse("2026-12-02T10:15:00Z"))
        .specimen(specimen)
        .group(group)
        .tags(List.of("shelf", "batch-7"))
        .operator("R. Okafor")
        .notes("edge glued by hand")
        .mass_g(mass_g)
        .geometry(g)
        .testType(TestType.THREE_POINT_BEND)
        .device(Map.of("name", "bench-frame", "fw", "0.4.1", "adc", "hx711", "port", "/dev/ttyACM0"))
        .sampleRate_Hz(80.0)
        .calibrationId("cal-2026-11-20-500N")
        .calibrationSha256(CAL_HASH)
        .scale("linear 8590 counts/N (calibration)")
        .scaleSpec(new ScaleSpec("calibration", List.of(12.0, 8590.0), 0.0, 500.0))
        .zeroOffset_counts(1234.5)
        .dropped(0)
        .checksumErrors(1)
        .cause(FinishCause.BREAK)
        .pretrigger_s(0.5)
        .startThreshold_N(5.0)
        .warnings(List.of("calibration is 12 days old"))
        .softwareVersion("0.1.0-test")
        .extra(Map.of())
        .build();
  }

  /**
   * A check-weight verification as a run stores it: 20 kg expected at 196.133 N, read {@code
   * errorPct} off, tolerance 0.5 %, on 2026-12-01 07:45:12.345 UTC, of calibration
   * cal-2026-11-20-500N.
   */
  public static Map<String, Object> checkWeight(boolean pass, double errorPct) {
    Map<String, Object> c = new java.util.LinkedHashMap<>();
    c.put("time", "2026-12-01T07:45:12.345Z");
    c.put("calibration_id", "cal-2026-11-20-500N");
    c.put("calibration_sha256", CAL_HASH);
    c.put("mass_kg", 20.0);
    c.put("expected_N", 196.133);
    c.put("indicated_N", 196.133 * (1 + errorPct / 100));
    c.put("error_pct", errorPct);
    c.put("tolerance_pct", 0.5);
    c.put("pass", pass);
    return c;
  }

  /** A sandwich panel geometry: span 400, width 50, depth 26, core 20, facings 3 (mm). */
  public static Geometry panel() {
    return new Geometry(400.0, null, 50.0, 26.0, 3.0, 20.0, null);
  }
}
