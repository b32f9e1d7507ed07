package org.loadstone.archive;

import java.time.Instant;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;

/** Runs made for tests: a balsa-core shelf panel in three-point bending, simulated numbers. */
public final class RunFixtures {
  private RunFixtures() {}

  /** Metadata with every field set, including unknown extra fields. */
  public static RunMetadata fullMetadata(String runId) {
    Map<String, String> device = new LinkedHashMap<>();
    device.put("proto", "1");
    device.put("fw", "0.3.0");
    device.put("adc", "hx711");
    device.put("rate", "80");
    device.put("ch", "2");
    device.put("cpm", "400");
    device.put("port", "sim");
    Map<String, Object> check = new LinkedHashMap<>();
    check.put("mass_g", 2000.0);
    check.put("error_pct", 0.12);
    check.put("at", "2026-11-30T09:00:00Z");
    Map<String, Object> extra = new LinkedHashMap<>();
    extra.put("humidity_pct", 48.5);
    extra.put("rig", Map.of("name", "bench-2", "fixtures", List.of("rollers-10mm", "nose-10mm")));
    return RunMetadata.builder()
        .runId(runId)
        .startedAt(Instant.parse("2026-12-02T18:12:33.417Z"))
        .specimen("Balsa core #7")
        .group("balsa-12mm")
        .tags(List.of("batch-A", "dry"))
        .operator("kim")
        .notes("first panel of the batch\nedge chipped")
        .mass_g(186.4)
        .geometry(new Geometry(200.0, null, 50.0, 14.2, 1.1, 12.0, null))
        .testType(TestType.THREE_POINT_BEND)
        .device(device)
        .sampleRate_Hz(80.02)
        .sampleRateSource("device-clock")
        .calibrationId("cal-500N-2026-11")
        .calibrationSha256("ab".repeat(32))
        .scale("linear 8590 counts/N (calibration)")
        .scaleSpec(new ScaleSpec("calibration", List.of(1.5, 8590.25, -0.0031), 0.0, 500.0))
        .zeroOffset_counts(-1234.5)
        .dropped(3)
        .checksumErrors(1)
        .cause(FinishCause.BREAK)
        .breakIndex(2)
        .breakTime_s(0.025)
        .peakBeforeBreak_N(412.7)
        .dropAtBreak_pct(38.5)
        .pretrigger_s(1.5)
        .startThreshold_N(5.0)
        .returnToZero_N(-0.042)
        .checkWeight(check)
        .warnings(List.of("calibration expires in 9 days"))
        .softwareVersion("0.1.0-SNAPSHOT")
        .extra(extra)
        .build();
  }

  /** Start-of-run metadata with a nominal linear scale (no cause yet: MANUAL as placeholder). */
  public static RunMetadata startMetadata(String runId, boolean curved) {
    ScaleSpec spec = curved
        ? new ScaleSpec("calibration", List.of(3.0, 8590.25, -0.0031), 0.0, 500.0)
        : ScaleSpec.nominal(8590.0);
    return RunMetadata.builder()
        .runId(runId)
        .startedAt(Instant.parse("2026-12-02T18:12:33.417Z"))
        .specimen("Foam core 3")
        .group("foam-20mm")
        .tags(List.of())
        .operator("kim")
        .notes("")
        .geometry(Geometry.NONE)
        .testType(TestType.THREE_POINT_BEND)
        .device(Map.of("cpm", "400", "port", "sim"))
        .sampleRate_Hz(1000.0)
        .scale("linear 8590 counts/N (nominal)")
        .scaleSpec(spec)
        .zeroOffset_counts(812.0)
        .dropped(0)
        .checksumErrors(0)
        .cause(FinishCause.MANUAL)
        .pretrigger_s(0.5)
        .startThreshold_N(5.0)
        .warnings(List.of())
        .softwareVersion("0.1.0-SNAPSHOT")
        .extra(Map.of())
        .build();
  }

  /** Random but valid columns from a fixed seed. */
  public static RunData randomData(long seed, int n, boolean position) {
    SplittableRandom r = new SplittableRandom(seed);
    double[] t = new double[n];
    double[] f = new double[n];
    double[] p = position ? new double[n] : null;
    int[] k = new int[n];
    int[] rp = position ? new int[n] : null;
    int[] s = new int[n];
    double time = r.nextDouble() * 1e-3;
    int seq = r.nextInt(65536);
    for (int i = 0; i < n; i++) {
      time += 1e-6 + r.nextDouble() * 0.02;
      t[i] = time;
      // wide range of magnitudes and signs, including values with long decimal expansions
      f[i] = (r.nextDouble() - 0.3) * Math.pow(10, r.nextInt(-6, 5));
      k[i] = r.nextInt();
      s[i] = seq;
      seq = (seq + 1 + (r.nextInt(50) == 0 ? r.nextInt(5) : 0)) & 0xFFFF;
      if (position) {
        rp[i] = r.nextInt(-2_000_000, 2_000_000);
        p[i] = rp[i] / 400.0 + (r.nextInt(10) == 0 ? Math.ulp(1.0) : 0);
      }
    }
    return new RunData(t, f, p, k, rp, s);
  }
}
