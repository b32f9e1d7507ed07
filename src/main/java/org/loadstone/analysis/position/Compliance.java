package org.loadstone.analysis.position;

import org.loadstone.analysis.RunResult;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * Machine compliance correction: the frame, fixtures and load cell deflect under load, so the
 * crosshead travels further than the specimen deflects. With the frame stiffness k measured by
 * loading a rigid block, position_corrected = position − F/k.
 */
public final class Compliance {
  private Compliance() {}

  /** The peak may lie this far (share of the peak) off the straight line through the rise. */
  static final double MAX_PEAK_OFF_LINE = 0.05;

  /**
   * The frame stiffness from a run against a rigid block: the stiffness fit of that run, once the
   * run is seen to look like a rigid block. A block (with the frame) is a linear spring up to the
   * peak (common practice: the frame and a steel block stay elastic at a bench frame's loads),
   * so the peak must lie on the straight line fitted to the rise within 5 %; a specimen bends
   * over, yields, crushes or breaks first, and its slope is not the frame's.
   *
   * @param rigidBlockRun the analysis of the rigid-block run
   * @return frame stiffness, N/mm
   * @throws LoadstoneException when the run has no stiffness fit or does not look like a rigid
   *     block (the message says which figure and what to do)
   */
  public static double frameStiffness_N_per_mm(RunResult rigidBlockRun) {
    Precondition.notNull(rigidBlockRun, "rigidBlockRun");
    org.loadstone.analysis.StiffnessFit fit = rigidBlockRun.stiffness().orElseThrow(() ->
        new LoadstoneException(
            "The rigid-block run has no stiffness fit, so the frame stiffness is unknown. "
                + "Repeat the run with a position channel, or set manual stiffness bounds"
                + (rigidBlockRun.notes().isEmpty() ? "." : " (" + rigidBlockRun.notes().get(0)
                    + ")")));
    double peak = rigidBlockRun.peakForce_N();
    String not = "The run does not look like a rigid block: ";
    String fix = ". A block against the frame loads in a straight line to its peak: check that a"
        + " rigid block, not a specimen, was loaded, and that it sat flat in the fixture.";
    java.util.OptionalDouble xPeak = rigidBlockRun.displacementAtPeak_mm();
    if (xPeak.isPresent()) {
      double onLine = fit.slope_N_per_mm() * xPeak.getAsDouble() + fit.intercept_N();
      double off = Math.abs(onLine - peak) / peak;
      if (off > MAX_PEAK_OFF_LINE) {
        throw new LoadstoneException(String.format(java.util.Locale.ROOT, not + "its peak of "
            + "%.4g N lies %.0f %% off the straight line through its rise (%.4g N at the "
            + "peak's travel), so it bent over or gave way before the peak" + fix, peak,
            100 * off, onLine));
      }
    }
    return fit.slope_N_per_mm();
  }

  /**
   * Subtracts the frame deflection from each position.
   *
   * @param position_mm positions, mm, not null
   * @param force_N forces, N, same length
   * @param frameStiffness_N_per_mm frame stiffness, finite and above zero
   * @return corrected positions, mm: {@code position_mm[i] − force_N[i] / frameStiffness}
   * @throws LoadstoneException when the lengths differ or the stiffness is not above zero
   */
  public static double[] correct(
      double[] position_mm, double[] force_N, double frameStiffness_N_per_mm) {
    Precondition.notNull(position_mm, "position_mm");
    Precondition.notNull(force_N, "force_N");
    if (position_mm.length != force_N.length) {
      throw new LoadstoneException(
          "Compliance correction needs one force per position; got " + position_mm.length
              + " positions and " + force_N.length + " forces.");
    }
    if (!(Double.isFinite(frameStiffness_N_per_mm) && frameStiffness_N_per_mm > 0)) {
      throw new LoadstoneException(
          "Frame stiffness is " + frameStiffness_N_per_mm + " N/mm; it must be above zero. "
              + "Measure it with a run against a rigid block.");
    }
    double[] out = new double[position_mm.length];
    for (int i = 0; i < out.length; i++) {
      out[i] = position_mm[i] - force_N[i] / frameStiffness_N_per_mm;
    }
    return out;
  }
}
