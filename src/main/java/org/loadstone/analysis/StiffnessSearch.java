package org.loadstone.analysis;

import java.util.ArrayList;
import java.util.List;
import org.loadstone.analysis.AnalysisSettings.StiffnessBounds;
import org.loadstone.units.LoadstoneException;

/**
 * Finds the initial linear region of the rise (samples 0..peak) of a force–displacement curve.
 *
 * <p>Automatic search: window lengths grow geometrically (factor 1.2) from max(3, rise/50)
 * samples to the whole rise, and every start index is tried, so about n·k windows for k ≈ 22
 * lengths, each fitted in O(1) from prefix sums ({@link LinearWindows}). A window qualifies when
 * its R² reaches the criterion, its slope is positive and its force span is at least the given
 * fraction of the rise. The steepest qualifying window — steepest by slope less two standard
 * errors, so that a short window cannot win on noise alone — is the seed. The seed is then grown
 * to the whole straight region: blocks of samples on either side are added while their mean
 * residual from the current line stays within three residual standard deviations (scaled by
 * √block); the line is refitted as it grows (O(n) more). Growing keeps the toe and the
 * bend-over before the peak out, and averages the noise over the longest straight stretch, where
 * the single steepest short window would be biased high by noise.
 */
final class StiffnessSearch {
  private StiffnessSearch() {}

  /**
   * @param x displacement, mm
   * @param y force, N
   * @param peakIndex last sample of the rise
   * @return the fit, or {@code null} when no window meets the criterion
   */
  static StiffnessFit automatic(
      double[] x, double[] y, int peakIndex, double minR2, double minFractionOfRise) {
    int count = peakIndex + 1;
    if (count < 3) {
      return null;
    }
    LinearWindows sums = new LinearWindows(x, y, count);
    double minSpan = minFractionOfRise * (y[peakIndex] - y[0]);
    List<Integer> lengths = new ArrayList<>();
    int len = Math.max(3, count / 50);
    while (len < count) {
      lengths.add(len);
      len = Math.max(len + 1, (int) Math.ceil(len * 1.2));
    }
    lengths.add(count);

    // windows are scored without making a Line; only a new best becomes one
    int seedFrom = -1;
    int seedTo = -1;
    double best = Double.NEGATIVE_INFINITY;
    for (int length : lengths) {
      for (int i = 0; i + length <= count; i++) {
        int to = i + length - 1;
        if (y[to] - y[i] < minSpan) {
          continue;
        }
        double score = sums.score(i, to, minR2);
        if (!Double.isNaN(score) && (seedFrom < 0 || score > best)) {
          best = score;
          seedFrom = i;
          seedTo = to;
        }
      }
    }
    if (seedFrom < 0) {
      return null;
    }
    LinearWindows.Line seed = sums.fit(seedFrom, seedTo);
    LinearWindows.Line chosen = grow(sums, seed, count, y[peakIndex] - y[0]);
    if (chosen.rSquared() < minR2) {
      chosen = seed;
    }
    return toFit(chosen, y, StiffnessFit.Method.AUTOMATIC);
  }

  /**
   * Extends the window left, then right, in blocks while each block's mean residual from the
   * current line stays within 3 residual SDs / √(block length); a rejected block is halved down
   * to one sample. The line is refitted after every accepted block.
   */
  private static LinearWindows.Line grow(
      LinearWindows sums, LinearWindows.Line seed, int count, double rise) {
    double floor = 1e-9 * Math.abs(rise);
    LinearWindows.Line cur = seed;
    for (int side = 0; side < 2; side++) {
      int block = Math.max(1, cur.length() / 10);
      while (block >= 1) {
        int from = side == 0 ? cur.from() - block : cur.to() + 1;
        int to = side == 0 ? cur.from() - 1 : cur.to() + block;
        if (from < 0 || to >= count) {
          block /= 2;
          continue;
        }
        double limit = 3 * Math.max(cur.residualSd(), floor) / Math.sqrt(block);
        double r = sums.meanResidual(from, to, cur.slope(), cur.intercept());
        LinearWindows.Line next =
            Math.abs(r) <= limit
                ? sums.fit(Math.min(from, cur.from()), Math.max(to, cur.to()))
                : null;
        if (next != null && next.slope() > 0) {
          cur = next;
        } else {
          block /= 2;
        }
      }
    }
    return cur;
  }

  /**
   * The fit over the first contiguous run of rise samples whose force (or displacement) lies in
   * the bounds.
   *
   * @throws LoadstoneException when fewer than 3 rise samples lie in the bounds
   */
  static StiffnessFit manual(
      double[] x, double[] y, int peakIndex, StiffnessBounds bounds, double position0_mm) {
    double[] basis = bounds.basis() == AnalysisSettings.Basis.FORCE_N ? y : x;
    double shift = bounds.basis() == AnalysisSettings.Basis.POSITION_MM ? position0_mm : 0;
    String unit = bounds.basis() == AnalysisSettings.Basis.FORCE_N ? " N" : " mm";
    int from = -1;
    int to = -1;
    for (int i = 0; i <= peakIndex; i++) {
      boolean inside = basis[i] + shift >= bounds.low() && basis[i] + shift <= bounds.high();
      if (inside && from < 0) {
        from = i;
      }
      if (from >= 0) {
        if (!inside) {
          break;
        }
        to = i;
      }
    }
    if (from < 0 || to - from + 1 < 3) {
      throw new LoadstoneException(
          "Stiffness bounds [" + bounds.low() + ", " + bounds.high() + "]" + unit + " hold "
              + (from < 0 ? 0 : to - from + 1) + " consecutive samples before the peak; a fit "
              + "needs at least 3. Widen the bounds or move them onto the rising part.");
    }
    LinearWindows.Line line = new LinearWindows(x, y, peakIndex + 1).fit(from, to);
    if (line == null) {
      throw new LoadstoneException(
          "Stiffness bounds [" + bounds.low() + ", " + bounds.high() + "]" + unit + " select "
              + "samples " + from + " to " + to + " over which displacement does not change; "
              + "choose bounds where the specimen deflects.");
    }
    StiffnessFit.Method method =
        switch (bounds.basis()) {
          case FORCE_N -> StiffnessFit.Method.FORCE_BOUNDS;
          case DISPLACEMENT_MM -> StiffnessFit.Method.DISPLACEMENT_BOUNDS;
          case POSITION_MM -> StiffnessFit.Method.POSITION_BOUNDS;
        };
    return toFit(line, y, method);
  }

  private static StiffnessFit toFit(LinearWindows.Line line, double[] y, StiffnessFit.Method m) {
    return new StiffnessFit(
        line.from(), line.to(), y[line.from()], y[line.to()], line.slope(), line.intercept(),
        line.rSquared(), m);
  }
}
