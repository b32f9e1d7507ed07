package org.loadstone.archive;

import java.util.List;
import java.util.function.DoubleUnaryOperator;
import org.loadstone.calibration.CountsToForce;
import org.loadstone.calibration.Polynomial;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/** Derives force again from raw counts with a stored {@link ScaleSpec} (raw is truth). */
public final class ScaleForce {
  private ScaleForce() {}

  /**
   * A straight-line spec (two coefficients c0 + c1·F) gives F = (net − c0) / c1 exactly; a
   * curved one is inverted with {@link CountsToForce} over its valid range.
   *
   * @return net counts (counts minus the zero offset) → force in N
   * @throws LoadstoneException when the spec cannot be inverted (zero slope, a curve without a
   *     valid range, or a curve that is not monotonic)
   */
  public static DoubleUnaryOperator of(ScaleSpec spec) {
    Precondition.notNull(spec, "spec");
    List<Double> c = spec.responseCoefficients();
    if (c.size() == 2) {
      double c0 = c.get(0);
      double c1 = c.get(1);
      if (!(Double.isFinite(c1) && c1 != 0) || !Double.isFinite(c0)) {
        throw new LoadstoneException("scale_spec " + c + " has no usable slope: the counts per N"
            + " must be a non-zero number; choose a calibration or nominal sensitivity");
      }
      return net -> (net - c0) / c1;
    }
    if (c.size() < 2) {
      throw new LoadstoneException("scale_spec " + c + " is a constant: it cannot turn counts"
          + " into force; choose a calibration or nominal sensitivity");
    }
    if (spec.validFrom_N() == null || spec.validTo_N() == null) {
      throw new LoadstoneException("scale_spec of degree " + (c.size() - 1) + " has no valid"
          + " range (valid_from_N, valid_to_N): a curved scale cannot be inverted without it");
    }
    CountsToForce inv = new CountsToForce(Polynomial.of(c), spec.validFrom_N(), spec.validTo_N());
    return inv::force_N;
  }
}
