package org.loadstone.archive;

import java.util.List;
import org.loadstone.units.Precondition;

/**
 * How raw counts became force, precisely enough to derive force again from the raw counts (raw is
 * truth). Force = P⁻¹(counts − zero) where P is the response polynomial (counts as a polynomial in
 * force in N, lowest order first); for a nominal sensitivity P(F) = k·F.
 *
 * @param kind {@code nominal} (a data-sheet sensitivity) or {@code calibration}
 * @param responseCoefficients P's coefficients, lowest order first, counts per N^i
 * @param validFrom_N lowest force of the calibrated range (extrapolated linearly below), or null
 * @param validTo_N highest force of the calibrated range (extrapolated linearly above), or null
 */
public record ScaleSpec(String kind, List<Double> responseCoefficients, Double validFrom_N,
    Double validTo_N) {
  public ScaleSpec {
    Precondition.notNull(kind, "kind");
    if (responseCoefficients == null || responseCoefficients.isEmpty()) {
      throw new IllegalArgumentException("a scale needs at least one response coefficient");
    }
    responseCoefficients = List.copyOf(responseCoefficients);
  }

  /** A straight line through zero with a data-sheet sensitivity. */
  public static ScaleSpec nominal(double countsPerN) {
    return new ScaleSpec("nominal", List.of(0.0, countsPerN), null, null);
  }
}
