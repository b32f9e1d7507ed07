package org.loadstone.analysis.position;

import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/** Position from an encoder channel: counts divided by the encoder's counts per millimetre. */
public final class EncoderScale {
  private EncoderScale() {}

  /**
   * Converts encoder counts to millimetres.
   *
   * @param counts raw position counts per sample, not null
   * @param countsPerMm counts per millimetre, finite and non-zero; a negative value reverses the
   *     direction (for an encoder mounted the other way round)
   * @return position in mm, one per count, {@code counts[i] / countsPerMm}
   * @throws LoadstoneException when {@code countsPerMm} is zero or not finite
   */
  public static double[] toPosition_mm(long[] counts, double countsPerMm) {
    Precondition.notNull(counts, "counts");
    if (!Double.isFinite(countsPerMm) || countsPerMm == 0) {
      throw new LoadstoneException(
          "Encoder scale is " + countsPerMm + " counts/mm; it must be a finite, non-zero number. "
              + "Enter the counts per millimetre from the encoder's data or its identity line.");
    }
    double[] mm = new double[counts.length];
    for (int i = 0; i < counts.length; i++) {
      mm[i] = counts[i] / countsPerMm;
    }
    return mm;
  }
}
