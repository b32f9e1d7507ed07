package org.loadstone.analysis;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.OptionalDouble;

/**
 * Flexural stress and modulus of a solid beam in three- or four-point bending, with the formula
 * chosen by what the position channel measures ({@link PositionSource}) and the stress corrected
 * for a large deflection where the standard does so. See {@link Flexure} for the formulas and
 * their sources.
 *
 * @param stressAtPeak_MPa flexural stress at the peak force (small-deflection formula)
 * @param stressAtPeakLargeDeflection_MPa the three-point stress at peak corrected for a
 *     mid-span deflection beyond a tenth of the span (ASTM D790); empty when the deflection is
 *     smaller, unknown, or the test is four-point (flagged in the notes instead)
 * @param modulus_MPa flexural modulus from the stiffness, empty without stiffness
 * @param notes which formula was used and why a value is empty or corrected
 */
public record BendFigures(
    double stressAtPeak_MPa,
    OptionalDouble stressAtPeakLargeDeflection_MPa,
    OptionalDouble modulus_MPa,
    List<String> notes) {

  /** Large deflection: beyond this fraction of the span (ASTM D790, from memory). */
  public static final double LARGE_DEFLECTION_SHARE = 0.10;

  /** Copies the notes. */
  public BendFigures {
    notes = List.copyOf(notes);
  }

  /**
   * @param loadSpan_mm distance between the two loading noses for four-point, {@code null} for
   *     three-point
   * @param peak_N the peak force
   * @param stiffness_N_per_mm slope of force against the position channel, may be empty
   * @param deflectionAtPeak_mm the position channel's deflection at the peak (toe-compensated
   *     when known), may be empty
   * @param source what the position channel measures
   * @throws org.loadstone.units.LoadstoneException for dimensions that are not positive, or a load
   *     span not inside the span
   */
  public static BendFigures of(double span_mm, Double loadSpan_mm, double width_mm,
      double depth_mm, double peak_N, OptionalDouble stiffness_N_per_mm,
      OptionalDouble deflectionAtPeak_mm, PositionSource source) {
    List<String> notes = new ArrayList<>();
    boolean four = loadSpan_mm != null;
    double stress = four
        ? Flexure.fourPointStress_MPa(peak_N, span_mm, loadSpan_mm, width_mm, depth_mm)
        : Flexure.threePointStress_MPa(peak_N, span_mm, width_mm, depth_mm);
    OptionalDouble modulus = OptionalDouble.empty();
    if (stiffness_N_per_mm.isPresent()) {
      double m = stiffness_N_per_mm.getAsDouble();
      if (!four) {
        modulus = OptionalDouble.of(Flexure.threePointModulus_MPa(m, span_mm, width_mm, depth_mm));
      } else if (source.atMidSpan()) {
        modulus = OptionalDouble.of(
            Flexure.fourPointModulus_MPa(m, span_mm, loadSpan_mm, width_mm, depth_mm));
        notes.add("Four-point modulus from the mid-span deflection (" + source.wireName()
            + "): E = m·a·(3L² − 4a²)/(4bd³).");
      } else {
        modulus = OptionalDouble.of(Flexure.fourPointModulusFromLoadPoints_MPa(
            m, span_mm, loadSpan_mm, width_mm, depth_mm));
        notes.add("Four-point modulus from the deflection at the loading noses ("
            + source.wireName() + "): E = m·a²·(3L − 4a)/(bd³); the mid-span form would read "
            + String.format(Locale.ROOT, "%.1f",
                100 * (Flexure.fourPointMidSpanPerLoadPoint(span_mm, loadSpan_mm) - 1))
            + " % higher on this travel.");
      }
    }
    OptionalDouble corrected = OptionalDouble.empty();
    if (deflectionAtPeak_mm.isPresent()) {
      double d = deflectionAtPeak_mm.getAsDouble();
      double mid = four && !source.atMidSpan()
          ? d * Flexure.fourPointMidSpanPerLoadPoint(span_mm, loadSpan_mm) : d;
      if (mid > LARGE_DEFLECTION_SHARE * span_mm) {
        String share = String.format(Locale.ROOT, "%.1f", 100 * mid / span_mm);
        if (four) {
          notes.add("The mid-span deflection at peak is " + share + " % of the span, beyond "
              + "the tenth where the small-deflection stress no longer holds; ASTM D6272 has a "
              + "large-deflection correction for this (not applied here: it is stated for a "
              + "load span of a third and the measured mid-span deflection, and its clause is "
              + "not checked). Treat the flexural stress as approximate.");
        } else {
          corrected = OptionalDouble.of(Flexure.threePointStressLargeDeflection_MPa(
              peak_N, span_mm, width_mm, depth_mm, mid));
          notes.add("The mid-span deflection at peak is " + share + " % of the span, beyond a "
              + "tenth: the flexural stress is also given corrected for large deflection, "
              + "3PL/(2bd²)·[1 + 6(D/L)² − 4(d/L)(D/L)] (ASTM D790, clause for deflections "
              + "beyond 10 % of the span; formula quoted from memory).");
        }
      }
    }
    return new BendFigures(stress, corrected, modulus, notes);
  }
}
