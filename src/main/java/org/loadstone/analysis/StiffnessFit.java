package org.loadstone.analysis;

import org.loadstone.analysis.stats.Distributions;
import org.loadstone.units.LoadstoneException;

/**
 * The straight line fitted to a window of the rise: force against displacement from the first
 * sample, {@code force_N = slope_N_per_mm · displacement_mm + intercept_N}, with its window and how
 * well the slope is known.
 *
 * @param fromIndex first sample of the window (inclusive), at least 0
 * @param toIndex last sample of the window (inclusive), greater than {@code fromIndex}
 * @param fromForce_N force at {@code fromIndex}, newtons
 * @param toForce_N force at {@code toIndex}, newtons
 * @param fromDisplacement_mm displacement at {@code fromIndex}, millimetres from the first sample
 * @param toDisplacement_mm displacement at {@code toIndex}, millimetres from the first sample
 * @param slope_N_per_mm the stiffness, newtons per millimetre, finite and greater than zero
 * @param intercept_N force of the fitted line at zero displacement, newtons
 * @param rSquared coefficient of determination of the fit, in [0, 1]
 * @param slopeSe_N_per_mm standard error of the slope, N/mm, at least 0; widened for residuals
 *     that follow one another (lag-one autocorrelation ρ &gt; 0, factor √((1 + ρ)/(1 − ρ)))
 * @param ci95Low_N_per_mm lower end of the slope's 95 % interval (Student t, n − 2 degrees)
 * @param ci95High_N_per_mm upper end of the slope's 95 % interval
 * @param noise_N the force noise seen in the window: residual standard deviation of the fit, N
 * @param method how the window was chosen
 */
public record StiffnessFit(
    int fromIndex,
    int toIndex,
    double fromForce_N,
    double toForce_N,
    double fromDisplacement_mm,
    double toDisplacement_mm,
    double slope_N_per_mm,
    double intercept_N,
    double rSquared,
    double slopeSe_N_per_mm,
    double ci95Low_N_per_mm,
    double ci95High_N_per_mm,
    double noise_N,
    Method method) {

  /** How the stiffness window was chosen. */
  public enum Method {
    /** the initial straight region found by the search */
    AUTOMATIC("automatic"),
    /** every sample of the rise between two forces */
    FORCE_BOUNDS("force band"),
    /** every sample of the rise between two fractions of the peak force */
    PEAK_FRACTION_BOUNDS("fraction-of-peak band"),
    /** every sample of the rise between two displacements from the first sample */
    DISPLACEMENT_BOUNDS("travel band"),
    /** every sample of the rise between two raw position-channel values */
    POSITION_BOUNDS("position band");

    private final String words;

    Method(String words) {
      this.words = words;
    }

    /** @return the method in words, e.g. {@code force band} */
    public String words() {
      return words;
    }
  }

  /** Checks the fit. */
  public StiffnessFit {
    if (method == null) {
      throw new IllegalArgumentException("Null 'method' argument.");
    }
    if (fromIndex < 0 || toIndex <= fromIndex) {
      throw new IllegalArgumentException(
          "Stiffness window [" + fromIndex + ", " + toIndex + "] is not an increasing index range");
    }
    if (!(Double.isFinite(slope_N_per_mm) && slope_N_per_mm > 0)) {
      throw new LoadstoneException(
          "Stiffness window samples " + fromIndex + " to " + toIndex + " gives a slope of "
              + slope_N_per_mm + " N/mm; force must rise with displacement there. Choose a window "
              + "on the loading part of the curve.");
    }
    if (!(slopeSe_N_per_mm >= 0) || !(ci95Low_N_per_mm <= ci95High_N_per_mm)) {
      throw new IllegalArgumentException("Stiffness standard error or interval is not valid");
    }
  }

  /**
   * Fits every sample {@code from..to} of (x, y) by least squares, computed directly (two passes,
   * about the window's means).
   *
   * @param x displacement from the first sample, mm
   * @param y force, N
   * @return the fit, or {@code null} when the displacement does not change over the window or the
   *     slope is not above zero
   */
  static StiffnessFit over(double[] x, double[] y, int from, int to, Method method) {
    int n = to - from + 1;
    double mx = 0;
    double my = 0;
    for (int i = from; i <= to; i++) {
      mx += x[i];
      my += y[i];
    }
    mx /= n;
    my /= n;
    double sxx = 0;
    double sxy = 0;
    double syy = 0;
    for (int i = from; i <= to; i++) {
      double u = x[i] - mx;
      double v = y[i] - my;
      sxx += u * u;
      sxy += u * v;
      syy += v * v;
    }
    if (!(sxx > 0) || !(sxy > 0)) {
      return null;
    }
    double slope = sxy / sxx;
    double intercept = my - slope * mx;
    double sse = 0;
    double lagged = 0;
    double previous = Double.NaN;
    for (int i = from; i <= to; i++) {
      double r = y[i] - (slope * x[i] + intercept);
      sse += r * r;
      if (i > from) {
        lagged += r * previous;
      }
      previous = r;
    }
    double r2 = syy > 0 ? Math.min(1.0, sxy * sxy / (sxx * syy)) : 1.0;
    double resSd = n > 2 ? Math.sqrt(sse / (n - 2)) : 0.0;
    double rho = sse > 0 ? Math.max(0.0, Math.min(0.95, lagged / sse)) : 0.0;
    double se = resSd / Math.sqrt(sxx) * Math.sqrt((1 + rho) / (1 - rho));
    double t = n > 2 ? Distributions.studentTQuantile(0.975, n - 2) : Double.POSITIVE_INFINITY;
    double half = se == 0 ? 0 : t * se;
    return new StiffnessFit(from, to, y[from], y[to], x[from], x[to], slope, intercept, r2, se,
        slope - half, slope + half, resSd, method);
  }

  /**
   * The toe offset: where the fitted line reaches zero force, as a displacement from the first
   * sample. This is the corrected zero of displacement of the toe-compensation construction
   * (ASTM D790 annex A1, ISO 178): corrected displacement = displacement − toe offset.
   *
   * @return millimetres; positive when the line meets zero force after the first sample
   */
  public double toeOffset_mm() {
    return -intercept_N / slope_N_per_mm;
  }

  /** @return half the 95 % interval as a fraction of the slope, e.g. 0.012 for ±1.2 % */
  public double relativeHalfWidth95() {
    return (ci95High_N_per_mm - ci95Low_N_per_mm) / (2 * slope_N_per_mm);
  }

  /** @return the number of samples in the window */
  public int sampleCount() {
    return toIndex - fromIndex + 1;
  }
}
