package org.loadstone.analysis;

import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * What {@link RunAnalyzer} found in one run. Values that need a position channel (displacements,
 * stiffness, toe offset, energy, crush) are empty when the run has none; {@link #notes()} says
 * why any value is empty. Displacements are measured from the first sample.
 *
 * @param sampleCount number of samples analysed
 * @param startForce_N force at the first sample, newtons
 * @param peakIndex sample index of the (first) highest force
 * @param peakForce_N highest force, newtons
 * @param peakTime_s time of the peak, seconds
 * @param peakPosition_mm position at the peak (raw channel value), millimetres
 * @param breakPoint the break, given or detected; empty when no sample after the peak fell far
 *     enough
 * @param displacementAtPeak_mm displacement from the first sample to the peak, millimetres
 * @param displacementAtBreak_mm displacement from the first sample to the break, millimetres
 * @param stiffness the initial linear fit (or the user's band); empty without position or when
 *     the search refuses
 * @param stiffnessRefusal why the automatic search gave no stiffness and the band that came
 *     closest; empty when there is a stiffness or no position
 * @param correctedDisplacementAtPeak_mm displacement at peak less the toe offset, millimetres
 * @param correctedDisplacementAtBreak_mm displacement at break less the toe offset, millimetres
 * @param energyToPeak_J area under force–displacement from the first sample to the peak, joules
 * @param energyToBreak_J the same to the break, joules
 * @param energyToPeakToeCompensated_J area under the toe-compensated curve (the toe replaced by
 *     the stiffness line from the toe offset; ASTM D790/D638 annex A1 practice) to the peak,
 *     joules; empty without a stiffness
 * @param energyToBreakToeCompensated_J the same to the break; empty without a stiffness or break
 * @param crush mean crush force over the settings' stroke window; empty when none was asked for
 * @param notes plain sentences on what is absent and why; never null
 */
public record RunResult(
    int sampleCount,
    double startForce_N,
    int peakIndex,
    double peakForce_N,
    double peakTime_s,
    OptionalDouble peakPosition_mm,
    Optional<BreakPoint> breakPoint,
    OptionalDouble displacementAtPeak_mm,
    OptionalDouble displacementAtBreak_mm,
    Optional<StiffnessFit> stiffness,
    Optional<StiffnessRefusal> stiffnessRefusal,
    OptionalDouble correctedDisplacementAtPeak_mm,
    OptionalDouble correctedDisplacementAtBreak_mm,
    OptionalDouble energyToPeak_J,
    OptionalDouble energyToBreak_J,
    OptionalDouble energyToPeakToeCompensated_J,
    OptionalDouble energyToBreakToeCompensated_J,
    Optional<CrushResult> crush,
    List<String> notes) {

  /** Checks that no field is null and copies the notes. */
  public RunResult {
    for (Object o :
        new Object[] {
          peakPosition_mm, breakPoint, displacementAtPeak_mm, displacementAtBreak_mm, stiffness,
          stiffnessRefusal, correctedDisplacementAtPeak_mm, correctedDisplacementAtBreak_mm, energyToPeak_J,
          energyToBreak_J, energyToPeakToeCompensated_J, energyToBreakToeCompensated_J, crush,
          notes
        }) {
      if (o == null) {
        throw new IllegalArgumentException("RunResult fields must not be null; use empty.");
      }
    }
    notes = List.copyOf(notes);
  }

  /** @return the stiffness in N/mm, empty when there is no fit */
  public OptionalDouble stiffness_N_per_mm() {
    return stiffness.isPresent()
        ? OptionalDouble.of(stiffness.get().slope_N_per_mm())
        : OptionalDouble.empty();
  }

  /** @return the toe offset in mm (see {@link StiffnessFit#toeOffset_mm()}), empty without fit */
  public OptionalDouble toeOffset_mm() {
    return stiffness.isPresent()
        ? OptionalDouble.of(stiffness.get().toeOffset_mm())
        : OptionalDouble.empty();
  }

  /**
   * The break sample.
   *
   * @param index sample index, at or after the peak
   * @param time_s time, seconds
   * @param force_N force at the break sample, newtons
   * @param detected {@code true} when found by the force-drop rule, {@code false} when given
   */
  public record BreakPoint(int index, double time_s, double force_N, boolean detected) {}

  /**
   * Crushing figures over a stroke window.
   *
   * @param from_mm window start, displacement in millimetres
   * @param to_mm window end, displacement in millimetres
   * @param meanForce_N area under force–displacement over the window divided by its length, N
   * @param efficiency crush-force efficiency, mean crush force divided by peak force
   * @param energy_J energy absorbed over the window's forward stroke, joules
   */
  public record CrushResult(double from_mm, double to_mm, double meanForce_N, double efficiency,
      double energy_J) {}
}
