package org.loadstone.calibration;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Collectors;
import org.loadstone.units.LoadstoneException;

/** The computations behind {@link CalibrationService#fitFromPoints}; package-private. */
final class CurveFitting {
  private CurveFitting() {}

  /**
   * Zero reading of each series: the ascending zero point. Counts are taken relative to it
   * ("deflection" in ASTM E74 terms), so that zero drift between series is not read as force.
   */
  static Map<Integer, Double> zeroCounts(List<CalibrationPoint> points) {
    Map<Integer, Double> zero = new TreeMap<>();
    for (CalibrationPoint p : points) {
      if (p.isZero() && p.direction() == Direction.UP) {
        if (zero.putIfAbsent(p.series(), p.counts_mean()) != null) {
          throw new LoadstoneException("series " + p.series() + " has two ascending zero points:"
              + " keep one zero (no load) reading per series and direction");
        }
      }
    }
    for (CalibrationPoint p : points) {
      if (!zero.containsKey(p.series())) {
        throw new LoadstoneException("series " + p.series() + " has no ascending zero point:"
            + " start each series with a reading at no load (0 g, direction up)");
      }
    }
    return zero;
  }

  /**
   * Fits {@code kind} to the ascending readings (every series together) and evaluates it at
   * every reading. The curve, its degrees of freedom and its residual SDs come from the
   * ascending readings alone, as ASTM E74 takes them: a test loads the cell upwards, and the
   * descending readings carry the hysteresis, reported on its own. The residuals of descending
   * readings are listed too (they show the hysteresis through the curve).
   *
   * @throws LoadstoneException when the ascending readings have too few distinct loads, or the
   *     curve is not monotonic over their range
   */
  static FitResult fit(FitKind kind, List<CalibrationPoint> points, double[] net, double fs_N) {
    List<Integer> up = ascending(points);
    double[] x = up.stream().mapToDouble(i -> points.get(i).force_N()).toArray();
    double[] y = up.stream().mapToDouble(i -> net[i]).toArray();
    LeastSquares.Result ls = LeastSquares.polynomial(x, y, kind.degree(), kind.hasOffset());
    double max = Arrays.stream(x).max().orElseThrow();
    double min = Arrays.stream(x).min().orElseThrow();
    CountsToForce inv = new CountsToForce(ls.polynomial(), min, max);
    List<PointResidual> res = new ArrayList<>();
    double ss = 0;
    double worst = 0;
    for (int i = 0; i < points.size(); i++) {
      double f = points.get(i).force_N();
      double ind = inv.force_N(net[i]);
      double err = ind - f;
      double pctFs = 100 * err / fs_N;
      if (points.get(i).direction() == Direction.UP) {
        ss += err * err;
        worst = Math.max(worst, Math.abs(pctFs));
      }
      res.add(new PointResidual(points.get(i), net[i], ind, err,
          f == 0 ? null : 100 * err / f, pctFs));
    }
    int dof = ls.degreesOfFreedom();
    return new FitResult(kind, ls.polynomial(), inv, dof, ls.residualSd(),
        dof > 0 ? Math.sqrt(ss / dof) : Double.NaN, worst, res);
  }

  /** @return the indices of the ascending readings, in order */
  static List<Integer> ascending(List<CalibrationPoint> points) {
    List<Integer> up = new ArrayList<>();
    for (int i = 0; i < points.size(); i++) {
      if (points.get(i).direction() == Direction.UP) {
        up.add(i);
      }
    }
    return up;
  }

  static LinearityMetrics linearity(List<CalibrationPoint> points, double[] net, double fs_N) {
    List<Integer> upIdx = ascending(points);
    double[] x = upIdx.stream().mapToDouble(i -> points.get(i).force_N()).toArray();
    double[] y = upIdx.stream().mapToDouble(i -> net[i]).toArray();
    Polynomial line = LeastSquares.polynomial(x, y, 1, true).polynomial();
    double slope = line.coefficient(1);
    Map<Double, double[]> meanByLoad = new TreeMap<>();
    for (int k = 0; k < x.length; k++) {
      double[] acc = meanByLoad.computeIfAbsent(x[k], f -> new double[2]);
      acc[0] += y[k];
      acc[1]++;
    }
    double nonlin = 0;
    for (Map.Entry<Double, double[]> e : meanByLoad.entrySet()) {
      double mean = e.getValue()[0] / e.getValue()[1];
      nonlin = Math.max(nonlin, Math.abs(mean - line.value(e.getKey())) / Math.abs(slope));
    }
    Map<String, Double> upAt = new HashMap<>();
    Map<String, List<Double>> bySeries = new HashMap<>();
    for (int i = 0; i < points.size(); i++) {
      CalibrationPoint p = points.get(i);
      if (p.direction() == Direction.UP) {
        upAt.put(p.series() + "@" + p.force_N(), net[i]);
      }
      bySeries.computeIfAbsent(p.direction() + "@" + p.force_N(), k -> new ArrayList<>())
          .add(net[i]);
    }
    Double hyst = null;
    for (int i = 0; i < points.size(); i++) {
      CalibrationPoint p = points.get(i);
      Double u = upAt.get(p.series() + "@" + p.force_N());
      if (p.direction() == Direction.DOWN && !p.isZero() && u != null) {
        double h = Math.abs(net[i] - u) / Math.abs(slope);
        hyst = hyst == null ? h : Math.max(hyst, h);
      }
    }
    long series = points.stream().mapToInt(CalibrationPoint::series).distinct().count();
    Double rep = null;
    if (series > 1) {
      rep = 0.0;
      for (List<Double> v : bySeries.values()) {
        if (v.size() > 1) {
          double spread = v.stream().mapToDouble(d -> d).max().orElseThrow()
              - v.stream().mapToDouble(d -> d).min().orElseThrow();
          rep = Math.max(rep, spread / Math.abs(slope));
        }
      }
    }
    return new LinearityMetrics(slope, 100 * nonlin / fs_N,
        hyst == null ? null : 100 * hyst / fs_N, rep == null ? null : 100 * rep / fs_N);
  }

  /** @return how many distinct loads the ascending readings have */
  static long distinctLoads(List<CalibrationPoint> points) {
    return points.stream().filter(p -> p.direction() == Direction.UP)
        .map(CalibrationPoint::force_N).distinct().count();
  }

  static List<CalibrationPoint> sorted(List<CalibrationPoint> points) {
    return points.stream()
        .sorted(Comparator.comparingInt(CalibrationPoint::series)
            .thenComparing(CalibrationPoint::direction)
            .thenComparing(p -> p.direction() == Direction.UP ? p.force_N() : -p.force_N()))
        .collect(Collectors.toList());
  }
}
