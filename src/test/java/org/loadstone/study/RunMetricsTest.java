package org.loadstone.study;

import org.loadstone.archive.FinishCause;
import org.loadstone.archive.Geometry;
import org.loadstone.archive.RunData;
import org.loadstone.archive.RunMetadata;
import org.loadstone.archive.TestRuns;
import org.loadstone.archive.TestType;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Map;
import org.junit.jupiter.api.Test;

class RunMetricsTest {

  @Test
  void threePointModulusRecoversTheBeamModulus() {
    // Simply supported beam, centre load: k = 48EI/L³ with I = bd³/12 (any strength-of-materials
    // text, e.g. Gere & Timoshenko, Mechanics of Materials, beam deflection table).
    double e_MPa = 3200;
    double span = 200;
    double b = 40;
    double d = 8;
    double k = 48 * e_MPa * (b * d * d * d / 12) / (span * span * span);
    RunData data = TestRuns.bend(k, 300);
    Geometry g = new Geometry(span, null, b, d, null, null, null);
    RunMetrics m = RunMetrics.of(TestRuns.meta("B-01", "balsa", g, 41.0), data);
    assertThat(m.flexuralModulus_MPa().getAsDouble()).isCloseTo(e_MPa, within(0.005 * e_MPa));
    // σ = 3PL/(2bd²) (ASTM D790): 3·300·200/(2·40·64) = 35.15625 MPa
    assertThat(m.flexuralStressAtPeak_MPa().getAsDouble()).isCloseTo(35.15625, within(1e-9));
    assertThat(m.coreShearStressAtPeak_MPa()).isEmpty();
    // per gram: 300 N / 41 g
    assertThat(m.specificPeak_N_per_g().getAsDouble()).isCloseTo(300 / 41.0, within(1e-12));
  }

  @Test
  void aCrushRunIsReadOverTheWholeStrokeAndPerGram() {
    // Rise at 1000 N/mm to 400 N (0.4 mm), then teeth between 300 and 340 N every 0.5 mm to 6 mm,
    // sampled every 0.001 mm. The figures are checked against the same trapezoid sums done here
    // by hand over the samples: mean crush force = energy / stroke, efficiency = mean / peak
    // (crashworthiness practice, from memory), energy per gram = energy / mass.
    int n = 6001;
    double[] t = new double[n];
    double[] f = new double[n];
    double[] x = new double[n];
    for (int i = 0; i < n; i++) {
      x[i] = i * 0.001;
      t[i] = i * 0.002;
      double tooth = ((x[i] - 0.4) % 0.5) / 0.5;
      f[i] = x[i] <= 0.4 ? 1000 * x[i] : 300 + 40 * tooth;
    }
    double area = 0;
    for (int i = 1; i < n; i++) {
      area += 0.5 * (f[i] + f[i - 1]) * (x[i] - x[i - 1]);
    }
    int[] zeros = new int[n];
    RunData data = new RunData(t, f, x, zeros, zeros, zeros);
    RunMetadata md = TestRuns.meta("C-01", "tubes", new Geometry(null, null, null, null, null,
        null, 80.0), 12.5).toBuilder().testType(TestType.CRUSH).cause(FinishCause.TRAVEL_LIMIT)
        .build();
    RunMetrics m = RunMetrics.of(md, data);
    var c = m.analysis().crush().orElseThrow();
    assertThat(c.from_mm()).isZero();
    assertThat(c.to_mm()).isCloseTo(6.0, within(1e-9));
    assertThat(c.energy_J()).isCloseTo(area / 1000, within(1e-12));
    assertThat(c.meanForce_N()).isCloseTo(area / 6.0, within(1e-9));
    assertThat(c.efficiency()).isCloseTo(area / 6.0 / 400, within(1e-9));
    assertThat(m.specificCrushEnergy_J_per_g().getAsDouble())
        .isCloseTo(area / 1000 / 12.5, within(1e-12));
    // P/A at the peak, as for compression: 400 N / 80 mm² = 5 MPa
    assertThat(m.compressionStressAtPeak_MPa().getAsDouble()).isCloseTo(5.0, within(1e-12));
    assertThat(Metric.CRUSH_MEAN.of(m).getAsDouble()).isEqualTo(c.meanForce_N());
    assertThat(m.toJsonMap().get("specific_crush_energy_J_per_g"))
        .isEqualTo(m.specificCrushEnergy_J_per_g().getAsDouble());
    assertThat(m.notes()).anyMatch(s -> s.contains("whole stroke"));
    // a run of another type shows no crush figures unless a stroke is asked for
    RunMetrics bend = RunMetrics.of(TestRuns.meta("C-02", "tubes", new Geometry(null, null, null,
        null, null, null, 80.0), 12.5), data);
    assertThat(bend.analysis().crush()).isEmpty();
    assertThat(bend.specificCrushEnergy_J_per_g()).isEmpty();
  }

  @Test
  void aCrushRunHasNoBreakAndSaysItEndedByItsOwnRule() {
    // A saw-tooth whose teeth fall from 400 N to 150 N (a 62 % drop, past the 40 % break rule)
    // every 1 mm over 8 mm of stroke, 0.002 mm a sample. Read as a bend test, the drop rule
    // finds a break at the first tooth; read as a crush run, no break: the crush ends by its own
    // rule (its travel limit here) and every break figure is absent, with the reason in a note.
    int n = 4001;
    double[] t = new double[n];
    double[] f = new double[n];
    double[] x = new double[n];
    for (int i = 0; i < n; i++) {
      x[i] = i * 0.002;
      t[i] = i * 0.01;
      double phase = x[i] % 1.0; // rise 0.8 mm at 312.5 N/mm from 150 N, fall in 0.2 mm
      f[i] = x[i] < 0.8 ? 500 * x[i] : phase < 0.8 ? 150 + 312.5 * phase
          : 400 - 1250 * (phase - 0.8);
    }
    int[] zeros = new int[n];
    RunData data = new RunData(t, f, x, zeros, zeros, zeros);
    RunMetadata bendMd = TestRuns.meta("T-01", "tubes", new Geometry(null, null, null, null,
        null, null, 80.0), 9.0);
    RunMetrics asBend = RunMetrics.of(bendMd, data);
    assertThat(asBend.analysis().breakPoint()).isPresent(); // the first tooth: x just over 0.8 mm
    assertThat(asBend.analysis().displacementAtBreak_mm().getAsDouble()).isLessThan(1.0);
    Map<String, Object> extra = Map.of(RunMetadata.CRUSH_END_KEY, "at 8 mm of travel, or when "
        + "force stays below 5 % of the peak for 1 s, at the time limit or by hand");
    RunMetadata crushMd = bendMd.toBuilder().testType(TestType.CRUSH)
        .cause(FinishCause.TRAVEL_LIMIT).extra(extra).build();
    RunMetrics crush = RunMetrics.of(crushMd, data);
    assertThat(crush.analysis().breakPoint()).isEmpty();
    for (Metric m : new Metric[] {Metric.BREAK_SAMPLE, Metric.BREAK_TIME, Metric.BREAK_FORCE,
        Metric.DISPLACEMENT_AT_BREAK, Metric.ENERGY_TO_BREAK, Metric.SPECIFIC_ENERGY_TO_BREAK}) {
      assertThat(m.of(crush)).as(m.label()).isEmpty();
    }
    assertThat(crush.notes()).anyMatch(s -> s.startsWith("No break: a crush run goes on through "
        + "its load drops and has no break; it ended by its own rule (travel-limit)"));
    assertThat(crush.toJsonMap().get("break_detected")).isNull();
    assertThat(RunEnd.words(crushMd)).isEqualTo("travel-limit: the crush ended by its own rule, "
        + "at its travel limit (at 8 mm of travel, or when force stays below 5 % of the peak for "
        + "1 s, at the time limit or by hand)");
    assertThat(RunEnd.words(bendMd)).isEqualTo("break");
    // its key figures are the crush's own
    assertThat(Metric.keyFigures(TestType.CRUSH)).contains(Metric.CRUSH_MEAN,
        Metric.CRUSH_EFFICIENCY).doesNotContain(Metric.STIFFNESS);
    assertThat(Metric.CRUSH_MEAN.of(crush)).isPresent();
    // a break index given by hand is still honoured
    RunMetrics given = RunMetrics.of(crushMd, data,
        org.loadstone.analysis.AnalysisSettings.DEFAULTS.withBreakIndex(n - 1));
    assertThat(given.analysis().breakPoint().orElseThrow().index()).isEqualTo(n - 1);
  }

  @Test
  void sandwichCoreShearAndFacingStressAsAstmC393() {
    // ASTM C393: τ = P/((d + c)b), σ_f = PL/(2t(d + c)b). Hand-computed for P = 460 N,
    // d = 26, c = 20, t = 3, b = 50, L = 400 mm: τ = 460/(46·50) = 0.2 MPa,
    // σ_f = 460·400/(2·3·46·50) = 184000/13800 = 13.3333 MPa.
    RunMetrics m = RunMetrics.of(TestRuns.meta("F-03", "foam", TestRuns.panel(), 52.0),
        TestRuns.bend(60, 460));
    assertThat(m.analysis().peakForce_N()).isEqualTo(460.0);
    assertThat(m.coreShearStressAtPeak_MPa().getAsDouble()).isCloseTo(0.2, within(1e-12));
    assertThat(m.facingStressAtPeak_MPa().getAsDouble()).isCloseTo(184000 / 13800.0,
        within(1e-9));
    assertThat(m.notes()).anyMatch(n -> n.contains("apparent"));
  }

  @Test
  void fourPointModulusRecoversTheBeamModulus() {
    // Two loads P/2 at a = (L − load span)/2 from the supports: midspan deflection
    // δ = P·a·(3L² − 4a²)/(48EI) (standard beam table, e.g. Roark's Formulas for Stress and
    // Strain), so k = 48EI/(a(3L² − 4a²)). Stress σ = 3P(L − load span)/(2bd²) (ASTM D6272).
    double e = 2800;
    double l = 240;
    double ls = 80;
    double a = (l - ls) / 2;
    double b = 50;
    double d = 12;
    double k = 48 * e * (b * d * d * d / 12) / (a * (3 * l * l - 4 * a * a));
    Geometry g = new Geometry(l, ls, b, d, null, null, null);
    RunMetadata meta = TestRuns.meta("B-4P", "balsa", g, null);
    meta = RunMetadata.builder()
        .runId(meta.runId())
        .startedAt(meta.startedAt())
        .specimen(meta.specimen())
        .group(meta.group())
        .tags(meta.tags())
        .operator(meta.operator())
        .notes(meta.notes())
        .geometry(g)
        .testType(TestType.FOUR_POINT_BEND)
        .device(meta.device())
        .sampleRate_Hz(meta.sampleRate_Hz())
        .scale(meta.scale())
        .scaleSpec(meta.scaleSpec())
        .zeroOffset_counts(0)
        .dropped(0)
        .checksumErrors(0)
        .cause(FinishCause.BREAK)
        .pretrigger_s(0)
        .softwareVersion("t")
        // the slope above is the mid-span one, so the run's position is a mid-span gauge (on the
        // crosshead the load-point formula applies, see FourPointRunTest)
        .extra(java.util.Map.of("position_source", "mid-span-gauge"))
        .build();
    RunMetrics m = RunMetrics.of(meta, TestRuns.bend(k, 500));
    assertThat(m.flexuralModulus_MPa().getAsDouble()).isCloseTo(e, within(0.005 * e));
    // 3·500·160/(2·50·144) = 16.6667 MPa
    assertThat(m.flexuralStressAtPeak_MPa().getAsDouble()).isCloseTo(240000 / 14400.0,
        within(1e-9));
  }

  @Test
  void compressionStressIsForceOverArea() {
    // σ = P/A: 460 N on 50 mm × 50 mm = 2500 mm² gives 0.184 MPa (hand-computed)
    Geometry g = new Geometry(null, null, null, null, null, null, 2500.0);
    RunMetadata base = TestRuns.meta("C-01", "foam", g, null);
    RunMetadata meta = RunMetadata.builder()
        .runId(base.runId())
        .startedAt(base.startedAt())
        .specimen(base.specimen())
        .group(base.group())
        .tags(base.tags())
        .operator(base.operator())
        .notes(base.notes())
        .geometry(g)
        .testType(TestType.COMPRESSION)
        .device(base.device())
        .sampleRate_Hz(base.sampleRate_Hz())
        .scale(base.scale())
        .scaleSpec(base.scaleSpec())
        .zeroOffset_counts(0)
        .dropped(0)
        .checksumErrors(0)
        .cause(FinishCause.BREAK)
        .pretrigger_s(0)
        .softwareVersion("t")
        .build();
    RunMetrics m = RunMetrics.of(meta, TestRuns.bend(60, 460));
    assertThat(m.compressionStressAtPeak_MPa().getAsDouble()).isCloseTo(0.184, within(1e-12));
    assertThat(m.flexuralStressAtPeak_MPa()).isEmpty();
  }

  @Test
  void jsonMapHasTheAgreedKeysAndNullsForAbsentValues() {
    RunData d = TestRuns.bend(60, 460);
    RunData noPos = new RunData(d.time_s(), d.force_N(), null, d.rawCounts(), null, d.seq());
    RunMetrics m = RunMetrics.of(TestRuns.meta("C-01", "board", Geometry.NONE, null), noPos);
    Map<String, Object> j = m.toJsonMap();
    assertThat(j).containsKeys("peak_N", "peak_time_s", "stiffness_N_per_mm",
        "energy_to_peak_J", "energy_to_break_J", "break_index");
    assertThat(j.get("peak_N")).isEqualTo(460.0);
    assertThat(j.get("stiffness_N_per_mm")).isNull();
    assertThat(j.get("energy_to_peak_J")).isNull();
    assertThat(j.get("break_index")).isNotNull();
    assertThat(m.notes()).anyMatch(n -> n.contains("No position"))
        .anyMatch(n -> n.contains("No specimen mass"))
        .anyMatch(n -> n.contains("span_mm"));
  }

  @Test
  void recordedBreakIndexIsUsedAndABadOneIsNoted() {
    RunData d = TestRuns.bend(60, 460);
    int last = d.size() - 1;
    RunMetadata base = TestRuns.meta("F-04", "foam", TestRuns.panel(), null);
    RunMetrics given = RunMetrics.of(withBreak(base, last), d);
    assertThat(given.analysis().breakPoint().get().index()).isEqualTo(last);
    assertThat(given.analysis().breakPoint().get().detected()).isFalse();
    RunMetrics bad = RunMetrics.of(withBreak(base, 3), d);
    assertThat(bad.analysis().breakPoint().get().detected()).isTrue();
    assertThat(bad.notes()).anyMatch(n -> n.contains("recorded break index 3"));
    // energy to break is the trapezoid area to the break: more than to the peak
    assertThat(given.analysis().energyToBreak_J().getAsDouble())
        .isGreaterThan(given.analysis().energyToPeak_J().getAsDouble());
  }

  private static RunMetadata withBreak(RunMetadata m, int index) {
    return RunMetadata.builder()
        .runId(m.runId())
        .startedAt(m.startedAt())
        .specimen(m.specimen())
        .group(m.group())
        .tags(m.tags())
        .operator(m.operator())
        .notes(m.notes())
        .mass_g(m.mass_g())
        .geometry(m.geometry())
        .testType(m.testType())
        .device(m.device())
        .sampleRate_Hz(m.sampleRate_Hz())
        .calibrationId(m.calibrationId())
        .calibrationSha256(m.calibrationSha256())
        .scale(m.scale())
        .scaleSpec(m.scaleSpec())
        .zeroOffset_counts(m.zeroOffset_counts())
        .dropped(m.dropped())
        .checksumErrors(m.checksumErrors())
        .cause(m.cause())
        .breakIndex(index)
        .pretrigger_s(m.pretrigger_s())
        .startThreshold_N(m.startThreshold_N())
        .checkWeight(m.checkWeight())
        .warnings(m.warnings())
        .softwareVersion(m.softwareVersion())
        .extra(m.extra())
        .build();
  }
}
