package org.loadstone.analysis;

import java.util.Locale;
import org.loadstone.analysis.AnalysisSettings.CrushWindow;
import org.loadstone.analysis.RunResult.CrushResult;
import org.loadstone.units.LoadstoneException;

/**
 * The figures of a progressive crush over a stroke window: the energy absorbed (the area under
 * force over forward displacement), the mean crush force (that energy over the window's length)
 * and the crush-force efficiency (mean crush force over the peak force). These are the usual
 * crashworthiness measures (common practice; e.g. the energy-absorber literature's "mean crushing
 * force" and "crush force efficiency", from memory).
 */
final class CrushFigures {
  private CrushFigures() {}

  /**
   * @param x displacement from the first sample, mm
   * @param f force, N
   * @param w the stroke window; an end of {@code +∞} is the largest displacement
   * @param peak_N the run's peak force, N, for the efficiency
   * @return the figures over the window
   * @throws LoadstoneException when the window reaches past the largest displacement, or starts
   *     at or after it
   */
  static CrushResult over(double[] x, double[] f, CrushWindow w, double peak_N) {
    double max = Double.NEGATIVE_INFINITY;
    for (double v : x) {
      max = Math.max(max, v);
    }
    double a = w.from_mm();
    double b = w.toTheEnd() ? max : w.to_mm();
    if (b > max || a >= b) {
      throw new LoadstoneException(String.format(Locale.ROOT,
          "The crush stroke %s for the mean crush force reaches past the largest displacement "
              + "of the run, %.4g mm: the run is shorter than the stroke. Choose a stroke that "
              + "ends at or before %.4g mm, or leave the stroke out to take the whole run.",
          w.words(), max, max));
    }
    double area_Nmm = 0;
    for (int i = 1; i < x.length; i++) {
      double x0 = x[i - 1];
      double x1 = x[i];
      if (x1 <= x0) {
        continue; // only forward stroke contributes; rebound or pauses are skipped
      }
      double lo = Math.max(x0, a);
      double hi = Math.min(x1, b);
      if (hi <= lo) {
        continue;
      }
      double flo = f[i - 1] + (f[i] - f[i - 1]) * (lo - x0) / (x1 - x0);
      double fhi = f[i - 1] + (f[i] - f[i - 1]) * (hi - x0) / (x1 - x0);
      area_Nmm += 0.5 * (flo + fhi) * (hi - lo);
    }
    double mean = area_Nmm / (b - a);
    return new CrushResult(a, b, mean, mean / peak_N, area_Nmm / 1000.0);
  }
}
