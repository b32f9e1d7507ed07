package org.loadstone.analysis;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.loadstone.analysis.RunResult.BreakPoint;
import org.loadstone.analysis.RunResult.CrushResult;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/** Peak, break, stiffness, toe compensation, energy and crush figures of one run. */
public final class RunAnalyzer {
  private RunAnalyzer() {}

  /**
   * Analyses one run.
   *
   * <ul>
   *   <li>Peak: the first sample of highest force.
   *   <li>Break: {@link AnalysisSettings#breakIndex()} when given, else none when {@link
   *       AnalysisSettings#noBreak()} says why (a crush run), else the first sample after the
   *       peak whose force is at most {@code peak − breakDropFraction·|peak|}.
   *   <li>Stiffness: slope of force against displacement over the initial straight region, found
   *       automatically ({@link StiffnessSearch}: windows in force span, before the first yield,
   *       long enough for the required precision at the noise seen) or over the user's band
   *       ({@link StiffnessBand}: every sample between two forces, fractions of the peak or
   *       travels). When the search refuses, {@link RunResult#stiffnessRefusal()} says why.
   *   <li>Toe compensation: the fitted line meets zero force at the toe offset; corrected
   *       displacement = displacement − toe offset (ASTM D790 annex A1, ISO 178).
   *   <li>Jumps: a jump in the position column up to the break ({@link PositionJumps}: a break,
   *       slip or lost count) is a break in the record, not travel: the path goes on across it
   *       at the speed before it, and a note names it.
   *   <li>Energy: trapezoidal area under force–displacement, N·mm / 1000 = J; to the peak and to
   *       the break both as measured and toe-compensated ({@link #toeCompensatedArea_Nmm}).
   *   <li>Crush ({@link CrushFigures}): energy over the forward stroke in the window, mean crush
   *       force = that energy / the window's length, efficiency = mean / peak.
   * </ul>
   *
   * <p>A run has "no rise" when the peak is the first sample, or the rise (peak − first force) is
   * at most 1 % of the largest absolute force, or (from 20 samples on) the rise is under four
   * times the median absolute sample-to-sample change, i.e. within the noise.
   *
   * @param curve the run, not null
   * @param settings how to read it, not null
   * @return the figures; position-based ones are empty when the curve has no position
   * @throws LoadstoneException when the run has no rise, the given break index is outside the run
   *     or before the peak, a stiffness band is given without position, lies outside the rise or
   *     holds too few samples, or the crush window lies outside the run's displacement
   */
  public static RunResult analyze(Curve curve, AnalysisSettings settings) {
    Precondition.notNull(curve, "curve");
    Precondition.notNull(settings, "settings");
    double[] t = curve.timeColumn(); // read only, never changed here
    double[] f = curve.forceColumn();
    double[] pos = curve.positionColumn();
    int n = f.length;
    List<String> notes = new ArrayList<>();

    int peak = 0;
    double maxAbs = 0;
    for (int i = 0; i < n; i++) {
      if (f[i] > f[peak]) {
        peak = i;
      }
      maxAbs = Math.max(maxAbs, Math.abs(f[i]));
    }
    double[] scratch = new double[n]; // the sample steps first, then the displacements
    requireRise(f, peak, maxAbs, scratch);

    Optional<BreakPoint> brk = findBreak(t, f, peak, settings, notes);

    if (pos == null) {
      if (settings.stiffnessBounds() != null || settings.crushWindow() != null) {
        throw new LoadstoneException(
            "The analysis settings ask for "
                + (settings.stiffnessBounds() != null ? "a stiffness band" : "a crush window")
                + " but the run has no position channel. Add a position source (encoder, "
                + "crosshead rate or imported table) or clear that setting.");
      }
      notes.add("No position channel: displacement, stiffness, toe offset and energy are absent.");
      return new RunResult(
          n, f[0], peak, f[peak], t[peak], OptionalDouble.empty(), brk, OptionalDouble.empty(),
          OptionalDouble.empty(), Optional.empty(), Optional.empty(), OptionalDouble.empty(),
          OptionalDouble.empty(), OptionalDouble.empty(), OptionalDouble.empty(),
          OptionalDouble.empty(), OptionalDouble.empty(), Optional.empty(), notes);
    }

    double[] x = scratch;
    double[] path = withoutJumps(t, pos, brk.map(BreakPoint::index).orElse(n - 1), notes);
    for (int i = 0; i < n; i++) {
      x[i] = path[i] - path[0];
    }
    RiseProfile rise = new RiseProfile(x, f, peak);
    StiffnessFit fit;
    StiffnessRefusal refusal = null;
    if (settings.stiffnessBounds() != null) {
      fit = StiffnessBand.fit(rise, settings.stiffnessBounds(), pos[0]);
      if (fit.relativeHalfWidth95() > settings.stiffnessPrecision()) {
        notes.add(String.format(java.util.Locale.ROOT, "The stiffness band %s knows the slope "
            + "only to ±%.1f %% (95 %%), coarser than the ±%.1f %% the automatic search "
            + "requires.", settings.stiffnessBounds().words(), 100 * fit.relativeHalfWidth95(),
            100 * settings.stiffnessPrecision()));
      }
    } else {
      StiffnessSearch.Outcome o = StiffnessSearch.automatic(rise, settings.stiffnessPrecision());
      fit = o.fit();
      refusal = o.refusal();
      if (refusal != null) {
        notes.add(String.format(java.util.Locale.ROOT, "No stiffness: %s. Closest band: %.4g to "
            + "%.4g N (samples %d to %d); stiffness and toe offset are absent. Choose a band "
            + "to fit one anyway.", refusal.reason(), refusal.closestFromForce_N(),
            refusal.closestToForce_N(), refusal.closestFromIndex(), refusal.closestToIndex()));
      }
    }
    OptionalDouble toe = fit == null ? OptionalDouble.empty() : OptionalDouble.of(fit.toeOffset_mm());

    OptionalDouble dispBreak = OptionalDouble.empty();
    OptionalDouble corrBreak = OptionalDouble.empty();
    OptionalDouble energyBreak = OptionalDouble.empty();
    OptionalDouble toeEnergyBreak = OptionalDouble.empty();
    if (brk.isPresent()) {
      int b = brk.get().index();
      dispBreak = OptionalDouble.of(x[b]);
      energyBreak = OptionalDouble.of(area_Nmm(x, f, b) / 1000.0);
      if (toe.isPresent()) {
        corrBreak = OptionalDouble.of(x[b] - toe.getAsDouble());
        toeEnergyBreak = OptionalDouble.of(toeCompensatedArea_Nmm(x, f, fit, b) / 1000.0);
      }
    }
    OptionalDouble toeEnergyPeak = fit == null ? OptionalDouble.empty()
        : OptionalDouble.of(toeCompensatedArea_Nmm(x, f, fit, peak) / 1000.0);
    OptionalDouble corrPeak =
        toe.isPresent() ? OptionalDouble.of(x[peak] - toe.getAsDouble()) : OptionalDouble.empty();
    Optional<CrushResult> crush =
        settings.crushWindow() == null
            ? Optional.empty()
            : Optional.of(CrushFigures.over(x, f, settings.crushWindow(), f[peak]));

    return new RunResult(
        n, f[0], peak, f[peak], t[peak], OptionalDouble.of(pos[peak]), brk,
        OptionalDouble.of(x[peak]), dispBreak, Optional.ofNullable(fit),
        Optional.ofNullable(refusal), corrPeak, corrBreak,
        OptionalDouble.of(area_Nmm(x, f, peak) / 1000.0), energyBreak, toeEnergyPeak,
        toeEnergyBreak, crush, notes);
  }

  /**
   * Area under the toe-compensated curve from the corrected zero to sample {@code last}, N·mm:
   * the toe (the samples before the straight window) is replaced by the fitted line from where it
   * meets zero force (the toe offset) to the window's first sample, and the measured curve is
   * followed from there (ASTM D790 annex A1 and ASTM D638 annex A1, toe compensation; from
   * memory). Without a toe the two energies agree; with a soft toe the compensated one is lower.
   */
  static double toeCompensatedArea_Nmm(double[] x, double[] f, StiffnessFit fit, int last) {
    int j = Math.min(fit.fromIndex(), last);
    double run_mm = Math.max(0, x[j] - fit.toeOffset_mm());
    double line_Nmm = 0.5 * fit.slope_N_per_mm() * run_mm * run_mm;
    double after = 0;
    for (int i = j + 1; i <= last; i++) {
      after += 0.5 * (f[i] + f[i - 1]) * (x[i] - x[i - 1]);
    }
    return line_Nmm + after;
  }

  /**
   * The position column with its jumps up to the last sample the figures use ({@link
   * PositionJumps}) taken out, each with a note: a jump is a break or a slip in the record, so
   * no travel and no energy is counted across it. The column itself when it has none.
   */
  private static double[] withoutJumps(double[] t, double[] pos, int last, List<String> notes) {
    boolean[] jump = PositionJumps.of(t, pos);
    boolean any = false;
    for (int j = 0; j < last && j < jump.length; j++) {
      if (jump[j]) {
        any = true;
        notes.add(String.format(java.util.Locale.ROOT, "The position jumps by %.4g mm between "
            + "samples %d and %d (%.4g s): a break or slip in the position record, not travel; "
            + "displacement, stiffness and energy leave it out (the path goes on across it at "
            + "the speed before it).", pos[j + 1] - pos[j], j, j + 1, t[j + 1]));
      }
    }
    return any ? PositionJumps.mended(t, pos, jump, last) : pos;
  }

  /** Analyses with {@link AnalysisSettings#DEFAULTS}. */
  public static RunResult analyze(Curve curve) {
    return analyze(curve, AnalysisSettings.DEFAULTS);
  }

  private static void requireRise(double[] f, int peak, double maxAbs, double[] steps) {
    double rise = f[peak] - f[0];
    boolean flat = peak == 0 || !(rise > 0.01 * maxAbs);
    if (!flat && f.length >= 20) {
      int m = f.length - 1;
      for (int i = 1; i < f.length; i++) {
        steps[i - 1] = Math.abs(f[i] - f[i - 1]);
      }
      double median = Selection.kth(steps, m, m / 2); // the element a sort would put at m / 2
      flat = rise < 4 * median;
    }
    if (flat) {
      throw new LoadstoneException(
          String.format(
              "Run has no rise: the peak force %.6g N (sample %d) is hardly above the start force "
                  + "%.6g N. Check that the specimen was loaded, the load cell is connected and "
                  + "the force sign is positive in the loading direction.",
              f[peak], peak, f[0]));
    }
  }

  private static Optional<BreakPoint> findBreak(
      double[] t, double[] f, int peak, AnalysisSettings s, List<String> notes) {
    if (s.breakIndex() != null) {
      int b = s.breakIndex();
      if (b >= f.length || b < peak) {
        throw new LoadstoneException(
            "Break index " + b + " is outside the run after the peak (peak at sample " + peak
                + ", last sample " + (f.length - 1) + "). Give an index from " + peak + " to "
                + (f.length - 1) + ", or leave it empty to detect the break.");
      }
      return Optional.of(new BreakPoint(b, t[b], f[b], false));
    }
    if (s.noBreak() != null) {
      notes.add("No break: " + s.noBreak() + "; break values are absent.");
      return Optional.empty();
    }
    double threshold = f[peak] - s.breakDropFraction() * Math.abs(f[peak]);
    for (int i = peak + 1; i < f.length; i++) {
      if (f[i] <= threshold) {
        return Optional.of(new BreakPoint(i, t[i], f[i], true));
      }
    }
    notes.add(
        "No break: force never fell by " + Math.round(s.breakDropFraction() * 100)
            + " % of the peak after the peak; break values are absent.");
    return Optional.empty();
  }

  /** Trapezoidal area under force over displacement, samples 0..last, N·mm. */
  static double area_Nmm(double[] x, double[] f, int last) {
    double sum = 0;
    for (int i = 1; i <= last; i++) {
      sum += 0.5 * (f[i] + f[i - 1]) * (x[i] - x[i - 1]);
    }
    return sum;
  }
}
