package org.loadstone.calibration;

import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * Polynomial least squares by Householder QR on a centred and scaled abscissa.
 *
 * <p>The abscissa is mapped to {@code t = (x − centre) / scale} with the centre at the middle of
 * the data range and the scale at half the range, so that the powers of {@code t} stay within
 * [−1, 1] and the design matrix is far better conditioned than one in raw {@code x}. The normal
 * equations are never formed: their condition number is the square of the design matrix's. A fit
 * through the origin is scaled but not centred, since centring would bring back a constant term.
 */
public final class LeastSquares {
  private LeastSquares() {}

  /**
   * The result of a polynomial least-squares fit.
   *
   * @param polynomial the fitted polynomial in raw {@code x}, lowest order first
   * @param residualSumOfSquares sum of squared residuals, in units of y²
   * @param degreesOfFreedom number of observations minus number of fitted parameters (≥ 0)
   * @param residualSd residual standard deviation sqrt(SSE / dof), in units of y (NaN when dof
   *     is 0)
   */
  public record Result(
      Polynomial polynomial,
      double residualSumOfSquares,
      int degreesOfFreedom,
      double residualSd) {}

  /**
   * Fits {@code y ≈ Σ b_k x^k} for k = 0 (or 1 without an intercept) up to {@code degree}.
   *
   * @param x abscissae, finite, at least as many as parameters
   * @param y ordinates, same length, finite
   * @param degree 1 or more
   * @param intercept whether a constant term is fitted; without it the fit passes through zero
   * @throws IllegalArgumentException on mismatched lengths or non-finite values
   * @throws LoadstoneException when there are too few distinct abscissae for the degree
   */
  public static Result polynomial(double[] x, double[] y, int degree, boolean intercept) {
    Precondition.notNull(x, "x");
    Precondition.notNull(y, "y");
    if (x.length != y.length) {
      throw new IllegalArgumentException(
          "x and y differ in length: " + x.length + " vs " + y.length);
    }
    if (degree < 1) {
      throw new IllegalArgumentException("degree must be 1 or more, was " + degree);
    }
    int n = x.length;
    int first = intercept ? 0 : 1;
    int p = degree + 1 - first;
    long distinct = java.util.Arrays.stream(x).distinct().count();
    if (n < p || distinct < p) {
      throw new LoadstoneException(
          "a degree-" + degree + " fit needs at least " + p + " distinct loads, got " + distinct
              + ": add calibration points or choose a lower degree");
    }
    double min = Double.POSITIVE_INFINITY;
    double max = Double.NEGATIVE_INFINITY;
    for (int i = 0; i < n; i++) {
      Precondition.finite(x[i], "x[" + i + "]");
      Precondition.finite(y[i], "y[" + i + "]");
      min = Math.min(min, x[i]);
      max = Math.max(max, x[i]);
    }
    double centre = intercept ? 0.5 * (min + max) : 0.0;
    double scale = intercept ? 0.5 * (max - min) : Math.max(Math.abs(min), Math.abs(max));
    if (scale == 0) {
      scale = 1;
    }

    double[][] a = new double[n][p];
    double[] b = y.clone();
    for (int i = 0; i < n; i++) {
      double t = (x[i] - centre) / scale;
      double tk = intercept ? 1.0 : t;
      for (int j = 0; j < p; j++) {
        a[i][j] = tk;
        tk *= t;
      }
    }
    double[] coefT = householderSolve(a, b, n, p, degree);
    double sse = 0;
    for (int i = p; i < n; i++) {
      sse += b[i] * b[i];
    }
    int dof = n - p;

    double[] inT = new double[degree + 1];
    System.arraycopy(coefT, 0, inT, first, p);
    Polynomial poly = new Polynomial(unscale(inT, centre, scale));
    return new Result(poly, sse, dof, dof > 0 ? Math.sqrt(sse / dof) : Double.NaN);
  }

  /**
   * Householder QR of {@code a} (n × p), applied in place to {@code b}; returns the solution of
   * R·c = (Qᵀb)[0..p). After the call, b[p..n) holds the residual components.
   */
  private static double[] householderSolve(double[][] a, double[] b, int n, int p, int degree) {
    double[] rDiag = new double[p];
    double firstNorm = 0;
    for (int k = 0; k < p; k++) {
      double norm = 0;
      for (int i = k; i < n; i++) {
        norm = Math.hypot(norm, a[i][k]);
      }
      if (k == 0) {
        firstNorm = norm;
      }
      if (norm <= 1e-13 * Math.max(firstNorm, Double.MIN_NORMAL)) {
        throw new LoadstoneException(
            "the degree-" + degree + " fit is rank deficient (the loads do not determine all "
                + "coefficients): add calibration points at more distinct loads or choose a lower"
                + " degree");
      }
      double alpha = a[k][k] > 0 ? -norm : norm;
      // v = a[k..n)[k] − alpha·e1, stored in place
      a[k][k] -= alpha;
      double vtv = 0;
      for (int i = k; i < n; i++) {
        vtv += a[i][k] * a[i][k];
      }
      for (int j = k + 1; j < p; j++) {
        double s = 0;
        for (int i = k; i < n; i++) {
          s += a[i][k] * a[i][j];
        }
        double f = 2 * s / vtv;
        for (int i = k; i < n; i++) {
          a[i][j] -= f * a[i][k];
        }
      }
      double s = 0;
      for (int i = k; i < n; i++) {
        s += a[i][k] * b[i];
      }
      double f = 2 * s / vtv;
      for (int i = k; i < n; i++) {
        b[i] -= f * a[i][k];
      }
      rDiag[k] = alpha;
    }
    double[] c = new double[p];
    for (int k = p - 1; k >= 0; k--) {
      double s = b[k];
      for (int j = k + 1; j < p; j++) {
        s -= a[k][j] * c[j];
      }
      c[k] = s / rDiag[k];
    }
    return c;
  }

  /** Converts Σ a_k t^k with t = (x − centre)/scale into Σ b_j x^j. */
  private static double[] unscale(double[] a, double centre, double scale) {
    int m = a.length;
    double[] out = new double[m];
    // Horner in t: p = a_{m-1}; p = p·t + a_k, with t = (x − centre)/scale as a polynomial in x
    double[] acc = {a[m - 1]};
    for (int k = m - 2; k >= 0; k--) {
      double[] next = new double[acc.length + 1];
      for (int j = 0; j < acc.length; j++) {
        next[j + 1] += acc[j] / scale;
        next[j] -= acc[j] * centre / scale;
      }
      next[0] += a[k];
      acc = next;
    }
    System.arraycopy(acc, 0, out, 0, m);
    return out;
  }
}
