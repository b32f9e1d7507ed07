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

  /**
   * The frame stiffness from a run against a rigid block: the stiffness fit of that run.
   *
   * @param rigidBlockRun the analysis of the rigid-block run
   * @return frame stiffness, N/mm
   * @throws LoadstoneException when the run has no stiffness fit
   */
  public static double frameStiffness_N_per_mm(RunResult rigidBlockRun) {
    Precondition.notNull(rigidBlockRun, "rigidBlockRun");
    return rigidBlockRun
        .stiffness_N_per_mm()
        .orElseThrow(
            () ->
                new LoadstoneException(
                    "The rigid-block run has no stiffness fit, so the frame stiffness is unknown. "
                        + "Repeat the run with a position channel, or set manual stiffness bounds"
                        + (rigidBlockRun.notes().isEmpty() ? "." : " (" + rigidBlockRun.notes().get(0) + ")")));
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
