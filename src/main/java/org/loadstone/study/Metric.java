package org.loadstone.study;

import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.OptionalDouble;
import java.util.function.Function;
import java.util.stream.Collectors;
import org.loadstone.units.LoadstoneException;

/**
 * The figures of a stored run, one catalogue for the command line, the console and the reports:
 * each has a name (the word used to ask for it), a key (its field in JSON output), a label, a
 * unit, the significant digits it is shown with, and a typed accessor on {@link RunMetrics}.
 *
 * <p>Figures a group comparison makes sense of are {@linkplain #comparable() comparable}; the
 * break sample index, the fit's R², its 95 % interval and its window, and the crush stroke's ends
 * are shown but not compared.
 */
public enum Metric {
  PEAK("peak", "peak_N", "peak force", "N", 4, m -> some(m.analysis().peakForce_N())),
  PEAK_TIME("peak-time", "peak_time_s", "time of peak", "s", 4,
      m -> some(m.analysis().peakTime_s())),
  BREAK_SAMPLE("break-sample", "break_index", "break sample", "", 0,
      m -> m.analysis().breakPoint().map(b -> some(b.index())).orElse(OptionalDouble.empty())),
  BREAK_TIME("break-time", "break_time_s", "break time", "s", 4,
      m -> m.analysis().breakPoint().map(b -> some(b.time_s())).orElse(OptionalDouble.empty())),
  BREAK_FORCE("break-force", "break_force_N", "break force", "N", 4,
      m -> m.analysis().breakPoint().map(b -> some(b.force_N())).orElse(OptionalDouble.empty())),
  STIFFNESS("stiffness", "stiffness_N_per_mm", "stiffness", "N/mm", 4,
      m -> m.analysis().stiffness_N_per_mm()),
  STIFFNESS_R2("stiffness-r2", "stiffness_r_squared", "stiffness fit R2", "", 4,
      m -> m.analysis().stiffness().map(s -> some(s.rSquared())).orElse(OptionalDouble.empty())),
  STIFFNESS_CI95_LOW("stiffness-ci95-low", "stiffness_ci95_low_N_per_mm",
      "stiffness 95 % from", "N/mm", 4,
      m -> m.analysis().stiffness().map(s -> some(s.ci95Low_N_per_mm()))
          .orElse(OptionalDouble.empty())),
  STIFFNESS_CI95_HIGH("stiffness-ci95-high", "stiffness_ci95_high_N_per_mm",
      "stiffness 95 % to", "N/mm", 4,
      m -> m.analysis().stiffness().map(s -> some(s.ci95High_N_per_mm()))
          .orElse(OptionalDouble.empty())),
  STIFFNESS_WINDOW_FROM("stiffness-window-from", "stiffness_window_from_N",
      "stiffness window from", "N", 4,
      m -> m.analysis().stiffness().map(s -> some(s.fromForce_N()))
          .orElse(OptionalDouble.empty())),
  STIFFNESS_WINDOW_TO("stiffness-window-to", "stiffness_window_to_N", "stiffness window to",
      "N", 4, m -> m.analysis().stiffness().map(s -> some(s.toForce_N()))
          .orElse(OptionalDouble.empty())),
  TOE_OFFSET("toe-offset", "toe_offset_mm", "toe offset", "mm", 3,
      m -> m.analysis().toeOffset_mm()),
  DISPLACEMENT_AT_PEAK("displacement-at-peak", "displacement_at_peak_mm", "displacement at peak",
      "mm", 4, m -> m.analysis().displacementAtPeak_mm()),
  DISPLACEMENT_AT_BREAK("displacement-at-break", "displacement_at_break_mm",
      "displacement at break", "mm", 4, m -> m.analysis().displacementAtBreak_mm()),
  ENERGY("energy", "energy_to_peak_J", "energy to peak", "J", 4,
      m -> m.analysis().energyToPeak_J()),
  ENERGY_TO_BREAK("energy-to-break", "energy_to_break_J", "energy to break", "J", 4,
      m -> m.analysis().energyToBreak_J()),
  ENERGY_TOE_COMPENSATED("energy-toe-compensated", "energy_to_peak_toe_compensated_J",
      "energy to peak, toe-compensated", "J", 4,
      m -> m.analysis().energyToPeakToeCompensated_J()),
  ENERGY_TO_BREAK_TOE_COMPENSATED("energy-to-break-toe-compensated",
      "energy_to_break_toe_compensated_J", "energy to break, toe-compensated", "J", 4,
      m -> m.analysis().energyToBreakToeCompensated_J()),
  FLEXURAL_STRESS("flexural-stress", "flexural_stress_at_peak_MPa", "flexural stress at peak",
      "MPa", 4, RunMetrics::flexuralStressAtPeak_MPa),
  FLEXURAL_STRESS_LARGE_DEFLECTION("flexural-stress-large-deflection",
      "flexural_stress_at_peak_large_deflection_MPa", "flexural stress at peak, large deflection",
      "MPa", 4, RunMetrics::flexuralStressAtPeakLargeDeflection_MPa),
  FLEXURAL_MODULUS("flexural-modulus", "flexural_modulus_MPa", "flexural modulus", "MPa", 4,
      RunMetrics::flexuralModulus_MPa),
  CORE_SHEAR("core-shear", "core_shear_stress_at_peak_MPa", "core shear stress at peak", "MPa",
      4, RunMetrics::coreShearStressAtPeak_MPa),
  FACING_STRESS("facing-stress", "facing_stress_at_peak_MPa", "facing stress at peak", "MPa", 4,
      RunMetrics::facingStressAtPeak_MPa),
  COMPRESSION_STRESS("compression-stress", "compression_stress_at_peak_MPa",
      "compression stress at peak", "MPa", 4, RunMetrics::compressionStressAtPeak_MPa),
  CRUSH_MEAN("crush-mean", "mean_crush_force_N", "mean crush force", "N", 4,
      m -> m.analysis().crush().map(c -> some(c.meanForce_N())).orElse(OptionalDouble.empty())),
  CRUSH_EFFICIENCY("crush-efficiency", "crush_force_efficiency", "crush-force efficiency", "", 3,
      m -> m.analysis().crush().map(c -> some(c.efficiency())).orElse(OptionalDouble.empty())),
  CRUSH_ENERGY("crush-energy", "crush_energy_J", "energy over the crush stroke", "J", 4,
      m -> m.analysis().crush().map(c -> some(c.energy_J())).orElse(OptionalDouble.empty())),
  CRUSH_FROM("crush-from", "crush_from_mm", "crush stroke from", "mm", 4,
      m -> m.analysis().crush().map(c -> some(c.from_mm())).orElse(OptionalDouble.empty())),
  CRUSH_TO("crush-to", "crush_to_mm", "crush stroke to", "mm", 4,
      m -> m.analysis().crush().map(c -> some(c.to_mm())).orElse(OptionalDouble.empty())),
  SPECIFIC_PEAK("specific-peak", "specific_peak_N_per_g", "peak force per gram", "N/g", 3,
      RunMetrics::specificPeak_N_per_g),
  SPECIFIC_ENERGY("specific-energy", "specific_energy_to_peak_J_per_g", "energy to peak per gram",
      "J/g", 3, RunMetrics::specificEnergyToPeak_J_per_g),
  SPECIFIC_ENERGY_TO_BREAK("specific-energy-to-break", "specific_energy_to_break_J_per_g",
      "energy to break per gram", "J/g", 3, RunMetrics::specificEnergyToBreak_J_per_g),
  SPECIFIC_STIFFNESS("specific-stiffness", "specific_stiffness_N_per_mm_per_g",
      "stiffness per gram", "N/mm/g", 3, RunMetrics::specificStiffness_N_per_mm_per_g),
  SPECIFIC_CRUSH_ENERGY("specific-crush-energy", "specific_crush_energy_J_per_g",
      "crush energy per gram", "J/g", 3, RunMetrics::specificCrushEnergy_J_per_g);

  private final String word;
  private final String key;
  private final String label;
  private final String unit;
  private final int digits;
  private final Function<RunMetrics, OptionalDouble> accessor;

  Metric(String word, String key, String label, String unit, int digits,
      Function<RunMetrics, OptionalDouble> accessor) {
    this.word = word;
    this.key = key;
    this.label = label;
    this.unit = unit;
    this.digits = digits;
    this.accessor = accessor;
  }

  /** @return the word that asks for this figure, e.g. {@code specific-peak} */
  public String word() {
    return word;
  }

  /** @return its field name in JSON output, unit in the name, e.g. {@code specific_peak_N_per_g} */
  public String key() {
    return key;
  }

  /** @return a plain name for sentences and headings, e.g. "peak force per gram" */
  public String label() {
    return label;
  }

  /** @return the unit, e.g. "N/g"; empty for a count or a ratio */
  public String unit() {
    return unit;
  }

  /** @return significant digits the figure is shown with; 0 for a whole number (a count) */
  public int digits() {
    return digits;
  }

  /** @return the label with the unit in brackets when there is one, e.g. "peak force (N)" */
  public String heading() {
    return unit.isEmpty() ? label : label + " (" + unit + ")";
  }

  /**
   * @return whether groups can be compared on it (a sample index, a fit quality or the bounds of
   *     a fit's interval or window cannot)
   */
  public boolean comparable() {
    return this != BREAK_SAMPLE && this != STIFFNESS_R2 && this != STIFFNESS_CI95_LOW
        && this != STIFFNESS_CI95_HIGH && this != STIFFNESS_WINDOW_FROM
        && this != STIFFNESS_WINDOW_TO && this != CRUSH_FROM && this != CRUSH_TO;
  }

  /**
   * The figure of one run.
   *
   * @param m the run's metrics, not null
   * @return the value in {@link #unit()}, empty when the run lacks it ({@link RunMetrics#notes()}
   *     says why)
   */
  public OptionalDouble of(RunMetrics m) {
    return accessor.apply(m);
  }

  /**
   * A value as text with this figure's significant digits ({@code Locale.ROOT}, no exponent):
   * 331.97 N as {@code 332.0}, 0.2 MPa as {@code 0.2000}; a count as a whole number; a value
   * within 1e-12 of zero as {@code 0} (rounding noise, e.g. the toe offset of a clean line).
   */
  public String format(double v) {
    return format(v, digits);
  }

  /** {@link #format(double)} of a value that may be absent: {@code -} when absent. */
  public String format(OptionalDouble v) {
    return v.isPresent() ? format(v.getAsDouble()) : "-";
  }

  /** A value with {@code digits} significant digits, as {@link #format(double)} describes. */
  public static String format(double v, int digits) {
    if (!Double.isFinite(v)) {
      return Double.toString(v);
    }
    if (digits == 0) {
      return String.format(Locale.ROOT, "%d", Math.round(v));
    }
    if (Math.abs(v) < 1e-12) {
      return "0";
    }
    int exponent = (int) Math.floor(Math.log10(Math.abs(v)));
    int decimals = Math.max(0, digits - 1 - exponent);
    return String.format(Locale.ROOT, "%." + decimals + "f", v);
  }

  /**
   * The figures that matter first for a run of this type (the run report's key figures): a crush
   * run is read by its peak, mean crush force, crush-force efficiency, energy over the stroke and
   * that energy per gram (crashworthiness practice, from memory); any other run by its peak,
   * stiffness, energy to peak and peak per gram.
   *
   * @param type the run's test type, not null
   * @return the figures, in the order to show them
   */
  public static List<Metric> keyFigures(org.loadstone.archive.TestType type) {
    return type == org.loadstone.archive.TestType.CRUSH
        ? List.of(PEAK, CRUSH_MEAN, CRUSH_EFFICIENCY, CRUSH_ENERGY, SPECIFIC_CRUSH_ENERGY)
        : List.of(PEAK, STIFFNESS, ENERGY, SPECIFIC_PEAK);
  }

  /** @return the figures groups can be compared on, in catalogue order */
  public static List<Metric> comparableOnes() {
    return Arrays.stream(values()).filter(Metric::comparable).toList();
  }

  /**
   * The comparable figure with this word (or JSON key), any case.
   *
   * @throws LoadstoneException naming the text and the valid words
   */
  public static Metric parse(String text) {
    String t = text == null ? "" : text.trim().toLowerCase(Locale.ROOT);
    for (Metric m : comparableOnes()) {
      if (m.word.equals(t) || m.key.toLowerCase(Locale.ROOT).equals(t)) {
        return m;
      }
    }
    throw new LoadstoneException("unknown metric '" + text + "': groups can be compared on "
        + comparableOnes().stream().map(Metric::word).collect(Collectors.joining(", ")));
  }

  private static OptionalDouble some(double v) {
    return OptionalDouble.of(v);
  }
}
