package org.loadstone.calibration;

import java.util.Locale;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * The inverse use of a calibration: net counts → force, by solving {@code counts = P(F)}.
 *
 * <p>{@code P} gives net counts (counts minus the zero reading) as a polynomial in force in N.
 * On construction P is checked to be strictly monotonic over the calibrated range; if it is not,
 * the inverse would be ambiguous and a {@link LoadstoneException} says so. Inside the range the
 * root is found by Newton iteration safeguarded by bisection (it cannot leave the bracket).
 * Outside the calibrated range the polynomial is not trusted: the force is extrapolated along
 * the tangent at the nearer end, which keeps the inverse monotonic and finite for overloads.
 */
public final class CountsToForce {
  private final Polynomial p;
  private final double lo_N;
  private final double hi_N;
  private final double pLo;
  private final double pHi;
  private final double slopeLo;
  private final double slopeHi;

  /**
   * @param countsOfForce net counts as a polynomial in force (N), lowest order first
   * @param minForce_N lower end of the calibrated range (usually 0)
   * @param maxForce_N upper end of the calibrated range, > minForce_N
   * @throws LoadstoneException when P is not strictly monotonic over the range
   */
  public CountsToForce(Polynomial countsOfForce, double minForce_N, double maxForce_N) {
    this.p = Precondition.notNull(countsOfForce, "countsOfForce");
    Precondition.finite(minForce_N, "minForce_N");
    Precondition.finite(maxForce_N, "maxForce_N");
    if (!(maxForce_N > minForce_N)) {
      throw new IllegalArgumentException(
          "calibrated range is empty: " + minForce_N + " to " + maxForce_N + " N");
    }
    this.lo_N = minForce_N;
    this.hi_N = maxForce_N;
    checkMonotonic();
    this.pLo = p.value(lo_N);
    this.pHi = p.value(hi_N);
    this.slopeLo = p.slope(lo_N);
    this.slopeHi = p.slope(hi_N);
  }

  private void checkMonotonic() {
    Polynomial d = p.derivative();
    double s0 = d.value(lo_N);
    int steps = 2000;
    double worst = s0;
    double worstAt = lo_N;
    boolean ok = s0 != 0;
    for (int i = 1; i <= steps && ok; i++) {
      double f = lo_N + (hi_N - lo_N) * i / steps;
      double s = d.value(f);
      if (s == 0 || Math.signum(s) != Math.signum(s0)) {
        ok = false;
        worst = s;
        worstAt = f;
      }
    }
    // stationary points of a cubic fall between samples only if the sign changes twice within
    // one step; check the vertex of the quadratic derivative exactly
    if (ok && p.degree() == 3) {
      double a = 3 * p.coefficient(3);
      double b = 2 * p.coefficient(2);
      double v = -b / (2 * a);
      if (v > lo_N && v < hi_N && Math.signum(d.value(v)) != Math.signum(s0)) {
        ok = false;
        worst = d.value(v);
        worstAt = v;
      }
    }
    if (!ok) {
      throw new LoadstoneException(String.format(Locale.ROOT,
          "the degree-%d fit is not monotonic over the calibrated range %.6g to %.6g N (slope"
              + " %.4g counts/N at %.6g N): counts would not map to one force; use a lower degree"
              + " or add points where the curve bends", p.degree(), lo_N, hi_N, worst, worstAt));
    }
  }

  /** @return the polynomial, net counts of force */
  public Polynomial polynomial() {
    return p;
  }

  /** @return lower end of the calibrated range, N */
  public double minForce_N() {
    return lo_N;
  }

  /** @return upper end of the calibrated range, N */
  public double maxForce_N() {
    return hi_N;
  }

  /**
   * @param netCounts counts minus the zero reading, finite
   * @return force in N; outside the calibrated range, extrapolated along the end tangent
   */
  public double force_N(double netCounts) {
    Precondition.finite(netCounts, "netCounts");
    boolean rising = pHi > pLo;
    if (rising ? netCounts <= pLo : netCounts >= pLo) {
      return lo_N + (netCounts - pLo) / slopeLo;
    }
    if (rising ? netCounts >= pHi : netCounts <= pHi) {
      return hi_N + (netCounts - pHi) / slopeHi;
    }
    double a = lo_N;
    double b = hi_N;
    double fa = pLo - netCounts;
    double f = a + (b - a) * (netCounts - pLo) / (pHi - pLo);
    double tol = 1e-13 * Math.max(Math.abs(lo_N), Math.abs(hi_N));
    for (int i = 0; i < 200; i++) {
      double fv = p.value(f) - netCounts;
      if (fv == 0) {
        return f;
      }
      if (Math.signum(fv) == Math.signum(fa)) {
        a = f;
        fa = fv;
      } else {
        b = f;
      }
      double next = f - fv / p.slope(f);
      if (!(next > Math.min(a, b) && next < Math.max(a, b))) {
        next = 0.5 * (a + b);
      }
      if (Math.abs(next - f) <= tol) {
        return next;
      }
      f = next;
    }
    return f;
  }
}
