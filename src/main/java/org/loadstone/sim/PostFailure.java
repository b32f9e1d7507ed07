package org.loadstone.sim;

/** Behaviour of a specimen after its failure began: the force envelope from then on. */
abstract class PostFailure {
  /** Failure begins at this deflection, force and time. */
  abstract void start(double deflection_mm, double force_N, double time_s);

  /** @return envelope force at a trial deflection and time, N, ≥ 0 */
  abstract double force_N(double deflection_mm, double time_s);

  /** Accepts a solved state (for behaviours with their own history). */
  void commit(double deflection_mm, double force_N, double time_s) {}

  /** Fracture: the force falls within {@code drop_s} (a raised-cosine fall) to a residual. */
  static final class SuddenDrop extends PostFailure {
    private final double residualFraction;
    private final double drop_s;
    private double from_N;
    private double start_s;

    SuddenDrop(double residualFraction, double drop_s) {
      this.residualFraction = residualFraction;
      this.drop_s = drop_s;
    }

    @Override
    void start(double deflection_mm, double force_N, double time_s) {
      from_N = force_N;
      start_s = time_s;
    }

    @Override
    double force_N(double deflection_mm, double time_s) {
      double residual = residualFraction * from_N;
      double s = (time_s - start_s) / drop_s;
      if (s >= 1) {
        return residual;
      }
      return residual + (from_N - residual) * 0.5 * (1 + StrictMath.cos(Math.PI * Math.max(0, s)));
    }
  }

  /**
   * Gradual failure (e.g. a foam core yielding in shear): the force decays exponentially with
   * further deflection, over a length {@code decay_mm}, towards {@code residualFraction} of the
   * failure force.
   */
  static final class Gradual extends PostFailure {
    private final double residualFraction;
    private final double decay_mm;
    private double from_N;
    private double from_mm;

    Gradual(double residualFraction, double decay_mm) {
      this.residualFraction = residualFraction;
      this.decay_mm = decay_mm;
    }

    @Override
    void start(double deflection_mm, double force_N, double time_s) {
      from_N = force_N;
      from_mm = deflection_mm;
    }

    @Override
    double force_N(double deflection_mm, double time_s) {
      double beyond = Math.max(0, deflection_mm - from_mm);
      return from_N
          * (residualFraction + (1 - residualFraction) * StrictMath.exp(-beyond / decay_mm));
    }
  }

  /**
   * Progressive crushing: the force falls by {@code dropFraction} within {@code drop_s}, rises
   * again with {@code reloadStiffness} to the next tooth peak, falls again, and so on. Tooth i
   * peaks at the failure force times floor + (plateauRatio − floor)·decay^i (a progressive
   * collapse towards {@code floorRatio}; with decay 1 a steady plateau), each scattered with
   * {@code cv} from the seed.
   */
  static final class SawTooth extends PostFailure {
    private final double dropFraction;
    private final double drop_s;
    private final double reloadStiffness_N_per_mm;
    private final double plateauRatio;
    private final double decay;
    private final double floorRatio;
    private final double cv;
    private final SimRandom random;
    private boolean dropping;
    private double high_N;
    private double low_N;
    private double dropStart_s;
    private double base_mm;
    private double nextPeak_N;
    private double firstPeak_N;
    private double decayFactor = 1;

    SawTooth(
        double dropFraction,
        double drop_s,
        double reloadStiffness_N_per_mm,
        double plateauRatio,
        double decay,
        double floorRatio,
        double cv,
        SimRandom random) {
      this.dropFraction = dropFraction;
      this.drop_s = drop_s;
      this.reloadStiffness_N_per_mm = reloadStiffness_N_per_mm;
      this.plateauRatio = plateauRatio;
      this.decay = decay;
      this.floorRatio = floorRatio;
      this.cv = cv;
      this.random = random;
    }

    @Override
    void start(double deflection_mm, double force_N, double time_s) {
      firstPeak_N = force_N;
      beginDrop(force_N, time_s);
    }

    private void beginDrop(double force_N, double time_s) {
      dropping = true;
      high_N = force_N;
      low_N = force_N * (1 - dropFraction);
      dropStart_s = time_s;
      decayFactor *= decay; // a running product: StrictMath.pow allocates until compiled
      double ratio = floorRatio + (plateauRatio - floorRatio) * decayFactor;
      double peak = firstPeak_N * ratio * random.scatter(cv);
      // a tooth must rise above where the drop ends, or the crushing would stall
      nextPeak_N = Math.max(peak, low_N * 1.05);
    }

    @Override
    double force_N(double deflection_mm, double time_s) {
      if (dropping) {
        double s = Math.min(1, (time_s - dropStart_s) / drop_s);
        return high_N - (high_N - low_N) * s;
      }
      double f = low_N + reloadStiffness_N_per_mm * (deflection_mm - base_mm);
      return Math.max(0, Math.min(f, nextPeak_N));
    }

    @Override
    void commit(double deflection_mm, double force_N, double time_s) {
      if (dropping) {
        if (time_s - dropStart_s >= drop_s) {
          dropping = false;
          base_mm = deflection_mm;
        }
      } else if (force_N >= nextPeak_N * (1 - 1e-12)) {
        beginDrop(force_N, time_s);
      }
    }
  }
}
