package org.loadstone.study;

import org.loadstone.archive.Geometry;
import org.loadstone.archive.RunData;
import org.loadstone.archive.RunMetadata;
import org.loadstone.archive.TestType;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import org.loadstone.analysis.AnalysisSettings;
import org.loadstone.analysis.BendFigures;
import org.loadstone.analysis.PositionSource;
import org.loadstone.analysis.Curve;
import org.loadstone.analysis.Flexure;
import org.loadstone.analysis.RunAnalyzer;
import org.loadstone.analysis.RunResult;
import org.loadstone.analysis.Sandwich;
import org.loadstone.analysis.SandwichGeometry;
import org.loadstone.analysis.Specific;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * Everything analysis says about one stored run: the {@link RunAnalyzer} figures plus the values
 * that need the specimen's geometry and mass. Pure: no files are read.
 *
 * <p>It lives in {@code study} rather than {@code analysis} because it reads the archive's
 * {@link RunMetadata} and {@link RunData}; the package map lets study use analysis and archive,
 * not the reverse. Its figures are named, with units and digits, by the {@link Metric} catalogue.
 *
 * <p>Stresses and moduli are in MPa (N/mm²), computed at the peak force. Empty values are
 * explained in {@link #notes()}.
 *
 * @param metadata the run's metadata, not null
 * @param curve the curve analysed (with position when the run has it), not null
 * @param analysis the run analysis, not null
 * @param settings the analysis settings used (with a recorded break when one was used), not null
 * @param flexuralStressAtPeak_MPa three- or four-point flexural stress at peak (ASTM D790/D6272)
 * @param flexuralStressAtPeakLargeDeflection_MPa three-point flexural stress at peak corrected
 *     for a mid-span deflection beyond a tenth of the span (ASTM D790); empty otherwise
 * @param flexuralModulus_MPa flexural modulus from the stiffness (apparent, for a sandwich), with
 *     the formula for what the run's position channel measures ({@link #positionSource})
 * @param coreShearStressAtPeak_MPa sandwich core shear stress P/((d + c)b) at peak (ASTM C393)
 * @param facingStressAtPeak_MPa sandwich facing stress PL/(2t(d + c)b) at peak (ASTM C393)
 * @param compressionStressAtPeak_MPa P/A at peak for a compression test
 * @param specificPeak_N_per_g peak force per gram of specimen
 * @param specificEnergyToPeak_J_per_g energy to peak per gram
 * @param specificEnergyToBreak_J_per_g energy to break per gram
 * @param specificStiffness_N_per_mm_per_g stiffness per gram
 * @param notes the analysis notes followed by the reasons for any empty value here; never null
 */
public record RunMetrics(
    RunMetadata metadata,
    Curve curve,
    RunResult analysis,
    AnalysisSettings settings,
    OptionalDouble flexuralStressAtPeak_MPa,
    OptionalDouble flexuralStressAtPeakLargeDeflection_MPa,
    OptionalDouble flexuralModulus_MPa,
    OptionalDouble coreShearStressAtPeak_MPa,
    OptionalDouble facingStressAtPeak_MPa,
    OptionalDouble compressionStressAtPeak_MPa,
    OptionalDouble specificPeak_N_per_g,
    OptionalDouble specificEnergyToPeak_J_per_g,
    OptionalDouble specificEnergyToBreak_J_per_g,
    OptionalDouble specificStiffness_N_per_mm_per_g,
    List<String> notes) {

  /** Checks that nothing is null and copies the notes. */
  public RunMetrics {
    Precondition.notNull(metadata, "metadata");
    Precondition.notNull(curve, "curve");
    Precondition.notNull(analysis, "analysis");
    Precondition.notNull(settings, "settings");
    for (OptionalDouble o : new OptionalDouble[] {flexuralStressAtPeak_MPa,
        flexuralStressAtPeakLargeDeflection_MPa, flexuralModulus_MPa,
        coreShearStressAtPeak_MPa, facingStressAtPeak_MPa, compressionStressAtPeak_MPa,
        specificPeak_N_per_g, specificEnergyToPeak_J_per_g, specificEnergyToBreak_J_per_g,
        specificStiffness_N_per_mm_per_g}) {
      Precondition.notNull(o, "optional value");
    }
    notes = List.copyOf(notes);
  }

  /** {@link #of(RunMetadata, RunData, AnalysisSettings)} with the default settings. */
  public static RunMetrics of(RunMetadata metadata, RunData data) {
    return of(metadata, data, AnalysisSettings.DEFAULTS);
  }

  /**
   * Analyses a run. The curve uses the run's position channel when present. A crush run has no
   * break (it ends by its own rule, {@link RunEnd}) unless the settings give a break index. When
   * the metadata records a break index and the settings give none, the recorded break is used;
   * if it lies outside the run or before the peak, the break is detected instead and a note says
   * so.
   *
   * @param metadata the run's metadata (geometry, mass, test type, break), not null
   * @param data the samples, not null
   * @param settings analysis settings, not null
   * @return the figures
   * @throws LoadstoneException when the curve is not analysable (see {@link Curve} and {@link
   *     RunAnalyzer#analyze}) or the sandwich thicknesses disagree
   */
  public static RunMetrics of(RunMetadata metadata, RunData data, AnalysisSettings settings) {
    org.loadstone.units.SlowWork.check("analysing a run");
    Precondition.notNull(metadata, "metadata");
    Precondition.notNull(data, "data");
    Precondition.notNull(settings, "settings");
    Curve curve = curveOf(data);
    List<String> notes = new ArrayList<>();
    AnalysisSettings used = settings;
    if (metadata.testType() == TestType.CRUSH && settings.crushWindow() == null
        && data.position_mm() != null) {
      used = used.withCrushWindow(AnalysisSettings.CrushWindow.WHOLE_STROKE);
      notes.add("Crush figures over the whole stroke; choose a stroke to leave out the first "
          + "collapse or the densification.");
    }
    Integer recorded = metadata.breakIndex();
    String noBreak = RunEnd.noBreak(metadata);
    if (settings.breakIndex() == null && noBreak != null) {
      used = used.withoutBreak(noBreak);
    } else if (settings.breakIndex() == null && recorded != null) {
      int peak = firstPeak(data.force_N());
      if (recorded >= peak && recorded < data.size()) {
        used = used.withBreakIndex(recorded);
      } else {
        notes.add("The recorded break index " + recorded + " lies outside the run after the peak "
            + "(peak at sample " + peak + "); the break was detected from the force drop instead.");
      }
    }
    RunResult r = RunAnalyzer.analyze(curve, used);
    List<String> all = new ArrayList<>(r.notes());
    all.addAll(notes);
    return new Builder(metadata, curve, r, used, all).build();
  }

  /**
   * Energy absorbed over the crush stroke per gram of specimen (the specific energy absorption of
   * the crashworthiness literature, common practice).
   *
   * @return J/g; empty without crush figures (not a crush run and no stroke chosen, or no
   *     position) or without the specimen's mass
   */
  public OptionalDouble specificCrushEnergy_J_per_g() {
    Double mass = metadata.mass_g();
    return analysis.crush().isPresent() && mass != null
        ? OptionalDouble.of(Specific.energy_J_per_g(analysis.crush().get().energy_J(), mass))
        : OptionalDouble.empty();
  }

  /**
   * The curve of a run: time, force and, when the run has one, position.
   *
   * @throws LoadstoneException when the columns are not a valid curve
   */
  public static Curve curveOf(RunData data) {
    Precondition.notNull(data, "data");
    return Curve.over(data.time_s(), data.force_N(), data.position_mm());
  }

  /**
   * What the run's position channel measures, as recorded in its metadata under {@link
   * PositionSource#METADATA_KEY}; a run that records nothing has the crosshead's position.
   *
   * @throws LoadstoneException when the recorded name is not a known source
   */
  public static PositionSource positionSource(RunMetadata metadata) {
    Object v = metadata.extra().get(PositionSource.METADATA_KEY);
    return v == null ? PositionSource.CROSSHEAD : PositionSource.parse(v.toString());
  }

  private static int firstPeak(double[] f) {
    int p = 0;
    for (int i = 1; i < f.length; i++) {
      if (f[i] > f[p]) {
        p = i;
      }
    }
    return p;
  }

  /**
   * A JSON-friendly view with units in the keys: the run's identity ({@code run_id, specimen,
   * group, test_type}), {@code sample_count, peak_index, break_detected}, then every figure of the
   * {@link Metric} catalogue under its {@link Metric#key()} (always present, {@code null} when
   * absent; a count as a whole number), then how the stiffness was taken ({@code
   * stiffness_method, stiffness_se_N_per_mm}, the window in mm and samples, {@code
   * stiffness_refused} with the reason when there is none), {@code notes} and the {@code
   * analysis_settings}. Key order is fixed.
   */
  public Map<String, Object> toJsonMap() {
    RunResult r = analysis;
    Map<String, Object> m = new LinkedHashMap<>();
    m.put("run_id", metadata.runId());
    m.put("specimen", metadata.specimen());
    m.put("group", metadata.group());
    m.put("test_type", metadata.testType().wireName());
    m.put("sample_count", r.sampleCount());
    m.put("peak_index", r.peakIndex());
    m.put("break_detected", r.breakPoint().map(b -> b.detected()).orElse(null));
    for (Metric metric : Metric.values()) {
      OptionalDouble v = metric.of(this);
      m.put(metric.key(), v.isEmpty() ? null
          : metric.digits() == 0 ? (Object) Math.round(v.getAsDouble()) : v.getAsDouble());
    }
    m.put("stiffness_method", r.stiffness().map(s -> s.method().words()).orElse(null));
    m.put("stiffness_se_N_per_mm", r.stiffness().map(s -> s.slopeSe_N_per_mm()).orElse(null));
    m.put("stiffness_window_from_mm", r.stiffness().map(s -> s.fromDisplacement_mm()).orElse(null));
    m.put("stiffness_window_to_mm", r.stiffness().map(s -> s.toDisplacement_mm()).orElse(null));
    m.put("stiffness_window_from_index", r.stiffness().map(s -> s.fromIndex()).orElse(null));
    m.put("stiffness_window_to_index", r.stiffness().map(s -> s.toIndex()).orElse(null));
    m.put("stiffness_refused", r.stiffnessRefusal().map(s -> s.reason()).orElse(null));
    m.put("notes", notes);
    m.put("analysis_settings", settings.toMap());
    return m;
  }

  /** Collects the geometry-dependent values and their notes. */
  private static final class Builder {
    private final RunMetadata meta;
    private final Curve curve;
    private final RunResult r;
    private final AnalysisSettings settings;
    private final List<String> notes;
    private final Geometry g;
    private final double peak;
    private OptionalDouble flexStress = OptionalDouble.empty();
    private OptionalDouble flexStressLarge = OptionalDouble.empty();
    private OptionalDouble flexModulus = OptionalDouble.empty();
    private OptionalDouble coreShear = OptionalDouble.empty();
    private OptionalDouble facing = OptionalDouble.empty();
    private OptionalDouble compression = OptionalDouble.empty();

    Builder(RunMetadata meta, Curve curve, RunResult r, AnalysisSettings settings,
        List<String> notes) {
      this.meta = meta;
      this.curve = curve;
      this.r = r;
      this.settings = settings;
      this.notes = notes;
      this.g = meta.geometry();
      this.peak = r.peakForce_N();
    }

    RunMetrics build() {
      switch (meta.testType()) {
        case THREE_POINT_BEND, FOUR_POINT_BEND -> bend(meta.testType() == TestType.FOUR_POINT_BEND);
        case COMPRESSION, CRUSH -> {
          if (g.area_mm2() != null) {
            compression = OptionalDouble.of(Flexure.compressionStress_MPa(peak, g.area_mm2()));
          } else {
            notes.add("No loaded area (area_mm2) in the geometry: compression stress is absent.");
          }
        }
        case TENSION -> notes.add("Tension test: no bending or sandwich values apply.");
        default -> throw new IllegalStateException("unhandled test type " + meta.testType());
      }
      Double mass = meta.mass_g();
      OptionalDouble sPeak = OptionalDouble.empty();
      OptionalDouble sEp = OptionalDouble.empty();
      OptionalDouble sEb = OptionalDouble.empty();
      OptionalDouble sK = OptionalDouble.empty();
      if (mass == null) {
        notes.add("No specimen mass: values per gram are absent.");
      } else {
        sPeak = OptionalDouble.of(Specific.force_N_per_g(peak, mass));
        if (r.energyToPeak_J().isPresent()) {
          sEp = OptionalDouble.of(Specific.energy_J_per_g(r.energyToPeak_J().getAsDouble(), mass));
        }
        if (r.energyToBreak_J().isPresent()) {
          sEb = OptionalDouble.of(Specific.energy_J_per_g(r.energyToBreak_J().getAsDouble(), mass));
        }
        if (r.stiffness_N_per_mm().isPresent()) {
          sK = OptionalDouble.of(
              Specific.stiffness_N_per_mm_per_g(r.stiffness_N_per_mm().getAsDouble(), mass));
        }
      }
      return new RunMetrics(meta, curve, r, settings, flexStress, flexStressLarge, flexModulus,
          coreShear, facing,
          compression, sPeak, sEp, sEb, sK, notes);
    }

    private void bend(boolean four) {
      List<String> missing = new ArrayList<>();
      if (g.span_mm() == null) {
        missing.add("span_mm");
      }
      if (g.width_mm() == null) {
        missing.add("width_mm");
      }
      if (g.depth_mm() == null) {
        missing.add("depth_mm");
      }
      if (four && g.loadSpan_mm() == null) {
        missing.add("load_span_mm");
      }
      if (!missing.isEmpty()) {
        notes.add("Geometry lacks " + String.join(", ", missing)
            + ": flexural stress and modulus are absent.");
      } else {
        OptionalDouble deflection = r.correctedDisplacementAtPeak_mm().isPresent()
            ? r.correctedDisplacementAtPeak_mm() : r.displacementAtPeak_mm();
        BendFigures b = BendFigures.of(g.span_mm(), four ? g.loadSpan_mm() : null,
            g.width_mm(), g.depth_mm(), peak, r.stiffness_N_per_mm(), deflection,
            positionSource(meta));
        flexStress = OptionalDouble.of(b.stressAtPeak_MPa());
        flexStressLarge = b.stressAtPeakLargeDeflection_MPa();
        flexModulus = b.modulus_MPa();
        notes.addAll(b.notes());
      }
      if (missing.isEmpty() && r.stiffness_N_per_mm().isEmpty()) {
        notes.add("No stiffness: flexural modulus is absent.");
      }
      sandwich(four);
    }

    private void sandwich(boolean four) {
      if (g.facing_mm() == null && g.core_mm() == null) {
        return; // a solid specimen: sandwich values do not apply
      }
      if (g.facing_mm() == null || g.core_mm() == null || g.width_mm() == null
          || g.depth_mm() == null) {
        notes.add("Sandwich values need depth_mm, core_mm, facing_mm and width_mm; one is "
            + "missing, so core shear and facing stress are absent.");
        return;
      }
      if (four) {
        notes.add("Core shear and facing stress are given for three-point bend only (ASTM C393 "
            + "centre load); this run is four-point.");
        return;
      }
      SandwichGeometry sg =
          new SandwichGeometry(g.depth_mm(), g.core_mm(), g.facing_mm(), g.width_mm());
      coreShear = OptionalDouble.of(Sandwich.coreShearStress_MPa(peak, sg));
      if (g.span_mm() != null) {
        facing = OptionalDouble.of(Sandwich.facingStress_MPa(peak, g.span_mm(), sg));
      } else {
        notes.add("No span: sandwich facing stress is absent.");
      }
      if (flexModulus.isPresent()) {
        notes.add("Flexural modulus of a sandwich is an apparent value: it includes core shear "
            + "deflection.");
      }
    }
  }
}
