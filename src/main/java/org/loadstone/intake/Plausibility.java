package org.loadstone.intake;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.loadstone.archive.Geometry;
import org.loadstone.archive.RunData;
import org.loadstone.archive.RunMetadata;
import org.loadstone.units.Precondition;

/**
 * Warnings for magnitudes a bench test of a specimen does not give, the usual sign of a unit read
 * wrong (kN read as N, µm as mm, kg as g). The bounds are wide on purpose (common practice for
 * bench frames of 10 N to 1 MN testing specimens of a few mm to a few m); a warning names the
 * value, the likely mix-up and the fix, and never refuses the run.
 */
public final class Plausibility {
  /** Peak forces below this (N) are implausible for a specimen test. */
  static final double MIN_PEAK_N = 1;
  /** Peak forces above this (N) are beyond bench frames. */
  static final double MAX_PEAK_N = 1e6;
  /** Travel beyond this (mm) is beyond a bench frame's stroke. */
  static final double MAX_TRAVEL_MM = 1000;
  /** Travel below this (mm) over a whole test is below what a frame resolves. */
  static final double MIN_TRAVEL_MM = 0.001;
  /** Lengths of a specimen outside these (mm). */
  static final double MIN_LENGTH_MM = 0.1;
  static final double MAX_LENGTH_MM = 5000;
  /** Masses of a specimen outside these (g). */
  static final double MIN_MASS_G = 0.01;
  static final double MAX_MASS_G = 100_000;
  /** Test durations outside these (s). */
  static final double MIN_DURATION_S = 0.01;
  static final double MAX_DURATION_S = 24 * 3600;

  private Plausibility() {}

  /**
   * @param m the run's metadata (mass and geometry as given), not null
   * @param d its samples in s, N and mm, not null
   * @return the warnings, empty when every magnitude is plausible
   */
  public static List<String> warnings(RunMetadata m, RunData d) {
    Precondition.notNull(m, "metadata");
    Precondition.notNull(d, "data");
    List<String> w = new ArrayList<>();
    double peak = 0;
    for (double f : d.force_N()) {
      peak = Math.max(peak, Math.abs(f));
    }
    if (peak < MIN_PEAK_N) {
      w.add("the peak force is " + num(peak) + " N, too small for a specimen test: the force "
          + "column may be in kN (or another larger unit) read as N; give its unit");
    } else if (peak > MAX_PEAK_N) {
      w.add("the peak force is " + num(peak) + " N, beyond a bench frame: the force column may "
          + "be in mN or in N read as kN; give its unit");
    }
    if (d.hasPosition()) {
      double lo = Double.POSITIVE_INFINITY;
      double hi = Double.NEGATIVE_INFINITY;
      for (double x : d.position_mm()) {
        lo = Math.min(lo, x);
        hi = Math.max(hi, x);
      }
      double travel = hi - lo;
      if (travel > MAX_TRAVEL_MM) {
        w.add("the position spans " + num(travel) + " mm, beyond a frame's stroke: the column "
            + "may be in µm read as mm; give its unit");
      } else if (travel < MIN_TRAVEL_MM) {
        w.add("the position spans only " + num(travel) + " mm: the column may be in m (or "
            + "another larger unit) read as mm; give its unit");
      }
    }
    double duration = d.time_s()[d.size() - 1] - d.time_s()[0];
    if (duration < MIN_DURATION_S || duration > MAX_DURATION_S) {
      w.add("the test lasts " + num(duration) + " s: the time column may be in another unit (ms,"
          + " min); give its unit");
    }
    if (m.mass_g() != null && (m.mass_g() < MIN_MASS_G || m.mass_g() > MAX_MASS_G)) {
      w.add("the specimen mass " + num(m.mass_g()) + " g is implausible: give it in grams");
    }
    Geometry g = m.geometry();
    length(w, "span", g.span_mm());
    length(w, "load span", g.loadSpan_mm());
    length(w, "width", g.width_mm());
    length(w, "depth", g.depth_mm());
    length(w, "facing", g.facing_mm());
    length(w, "core", g.core_mm());
    return w;
  }

  private static void length(List<String> w, String what, Double v_mm) {
    if (v_mm != null && (v_mm < MIN_LENGTH_MM || v_mm > MAX_LENGTH_MM)) {
      w.add("the specimen " + what + " " + num(v_mm) + " mm is implausible: give it in mm");
    }
  }

  private static String num(double v) {
    return String.format(Locale.ROOT, "%.4g", v);
  }
}
