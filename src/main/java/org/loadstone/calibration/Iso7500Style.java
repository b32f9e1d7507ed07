package org.loadstone.calibration;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * Computes the ISO 7500-1 style figures from the residuals of the adopted fit.
 *
 * <p>Class limits, in %, as in the class table of ISO 7500-1:2018 (Table 2, "Characteristic
 * values of the force-measuring system"). These values are quoted from memory, not copied from
 * the standard; check them against your copy before relying on a class:
 *
 * <pre>
 * class   q (accuracy)  b (repeat.)  v (revers.)  f0 (zero)  a (resolution)
 * 0.5     ±0.5          0.5          ±0.75        ±0.05      0.25
 * 1       ±1.0          1.0          ±1.5         ±0.1       0.5
 * 2       ±2.0          2.0          ±3.0         ±0.2       1.0
 * 3       ±3.0          3.0          ±4.5         ±0.3       1.5
 * </pre>
 *
 * <p>Zero error f0 (ISO 7500-1's relative zero error, from memory): the indication after the
 * force is removed, relative to the zero set before the series, in % of full scale; the largest
 * in magnitude over the series. Not the adopted curve's intercept.
 *
 * <p>Resolution r of our digital indication: one count, or when the reading fluctuates, half the
 * fluctuation range, taken here as 2 × the standard deviation of the captured counts (a ±2 SD band
 * holds about 95 % of the samples); converted to N with the sensitivity. ISO 7500-1 asks for three
 * series; with one series b cannot be assessed and no class is given.
 */
final class Iso7500Style {
  static final String[] CLASSES = {"0.5", "1", "2", "3"};
  static final double[] Q = {0.5, 1.0, 2.0, 3.0};
  static final double[] B = {0.5, 1.0, 2.0, 3.0};
  static final double[] V = {0.75, 1.5, 3.0, 4.5};
  static final double[] F0 = {0.05, 0.1, 0.2, 0.3};
  static final double[] A = {0.25, 0.5, 1.0, 1.5};

  private Iso7500Style() {}

  /**
   * @param fit the adopted fit, with a residual for every point
   * @param sensitivity_counts_per_N slope of the best straight line, for the resolution
   * @param fullScale_N reference of the zero error
   */
  static Iso7500Result evaluate(
      FitResult fit, double sensitivity_counts_per_N, double fullScale_N) {
    List<PointResidual> residuals = fit.residuals();
    // the indicator is zeroed at each series' start (its ascending zero reading, net counts 0),
    // so the indication after unloading is the curve's force at the returned counts less its
    // force at the start: the curve's own intercept is no zero error
    double indicatedAtStart_N = fit.inverse().force_N(0);
    List<String> notes = new ArrayList<>();
    notes.add("computed in the style of ISO 7500-1 — not a substitute for an accredited"
        + " calibration; class limits quoted from memory");
    Map<Double, List<PointResidual>> up = new TreeMap<>();
    Map<Double, List<PointResidual>> down = new TreeMap<>();
    Double f0 = null;
    int series = (int) residuals.stream().mapToInt(r -> r.point().series()).distinct().count();
    for (PointResidual r : residuals) {
      CalibrationPoint p = r.point();
      if (p.isZero()) {
        if (p.direction() == Direction.DOWN) {
          double v = 100 * (r.indicated_N() - indicatedAtStart_N) / fullScale_N;
          f0 = f0 == null || Math.abs(v) > Math.abs(f0) ? v : f0;
        }
        continue;
      }
      (p.direction() == Direction.UP ? up : down)
          .computeIfAbsent(p.force_N(), k -> new ArrayList<>()).add(r);
    }
    List<Iso7500Result.Point> out = new ArrayList<>();
    int worst = -1;
    for (Map.Entry<Double, List<PointResidual>> e : up.entrySet()) {
      double f = e.getKey();
      List<PointResidual> rs = e.getValue();
      double mean = rs.stream().mapToDouble(PointResidual::indicated_N).average().orElseThrow();
      double q = 100 * (mean - f) / f;
      Double b = null;
      if (rs.size() >= 2) {
        double max = rs.stream().mapToDouble(PointResidual::indicated_N).max().orElseThrow();
        double min = rs.stream().mapToDouble(PointResidual::indicated_N).min().orElseThrow();
        b = 100 * (max - min) / mean;
      }
      Double v = null;
      for (PointResidual d : down.getOrDefault(f, List.of())) {
        for (PointResidual u : rs) {
          if (u.point().series() == d.point().series()) {
            double vi = 100 * (d.indicated_N() - u.indicated_N()) / f;
            v = v == null || Math.abs(vi) > Math.abs(v) ? vi : v;
          }
        }
      }
      double sd = rs.stream().mapToDouble(r -> r.point().counts_sd()).max().orElse(0);
      double r_N = Math.max(1.0, 2 * sd) / Math.abs(sensitivity_counts_per_N);
      double a = 100 * r_N / f;
      int cls = classOf(q, b, v, a);
      worst = cls < 0 || worst == Integer.MAX_VALUE ? Integer.MAX_VALUE : Math.max(worst, cls);
      out.add(new Iso7500Result.Point(f, q, b, v, a, cls < 0 ? "none" : CLASSES[cls]));
    }
    if (f0 != null) {
      int c0 = firstWithin(Math.abs(f0), F0);
      worst = c0 < 0 ? Integer.MAX_VALUE : Math.max(worst, c0);
    } else {
      notes.add("zero error f0 not assessed: no descending zero point");
    }
    if (down.isEmpty()) {
      notes.add("reversibility v not assessed: no descending points");
    }
    String cls;
    if (out.isEmpty()) {
      cls = "none";
      notes.add("no class: no loads above zero");
    } else if (series < 2) {
      cls = "none";
      notes.add("no class: repeatability b needs at least two series (ISO 7500-1 asks for"
          + " three)");
    } else {
      cls = worst == Integer.MAX_VALUE || worst < 0 ? "none" : CLASSES[worst];
      if (series < 3) {
        notes.add("only " + series + " series; ISO 7500-1 asks for three");
      }
    }
    return new Iso7500Result(out, f0, cls, notes);
  }

  /** @return index of the best class whose limits all figures meet, −1 if none */
  static int classOf(double q, Double b, Double v, double a) {
    for (int i = 0; i < CLASSES.length; i++) {
      if (Math.abs(q) <= Q[i] && (b == null || b <= B[i]) && (v == null || Math.abs(v) <= V[i])
          && a <= A[i]) {
        return i;
      }
    }
    return -1;
  }

  private static int firstWithin(double value, double[] limits) {
    for (int i = 0; i < limits.length; i++) {
      if (value <= limits[i]) {
        return i;
      }
    }
    return -1;
  }
}
