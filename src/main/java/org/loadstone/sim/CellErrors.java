package org.loadstone.sim;

/**
 * The time-dependent errors of the cell and amplifier ({@link SimImperfections}): warm-up,
 * temperature-like zero drift, creep and spikes, advanced once per sample. Each random part
 * draws from its own stream, and only when switched on. Allocates nothing.
 */
final class CellErrors {
  private final double fullScale_counts;
  private final double countsPerN;
  private final double warmup_counts;
  private final double warmup_s;
  private final double driftSd_counts;
  private final double drift_s;
  private final double creepShare;
  private final double creep_s;
  private final double spikesPerS;
  private final double spike_counts;
  private final SimRandom driftRandom;
  private final SimRandom spikeRandom;

  private double time_s;
  private double drift_counts;
  private double creep_N;
  private boolean lastSpike;
  private long spikes;
  private double zeroShift_counts;

  CellErrors(SimImperfections imp, LoadCell cell, long seed) {
    fullScale_counts = cell.fullScaleOutput_counts();
    countsPerN = cell.countsPerN();
    warmup_counts = imp.warmup_pctFS() / 100 * fullScale_counts;
    warmup_s = imp.warmup_s();
    driftSd_counts = imp.drift_pctFS() / 100 * fullScale_counts;
    drift_s = imp.drift_s();
    creepShare = imp.creep_pct() / 100;
    creep_s = imp.creep_s();
    spikesPerS = imp.spikesPerMin() / 60;
    spike_counts = imp.spike_pctFS() / 100 * fullScale_counts;
    driftRandom = SimRandom.stream(seed, SimRandom.DRIFT);
    spikeRandom = SimRandom.stream(seed, SimRandom.SPIKES);
    if (driftSd_counts > 0) {
      drift_counts = driftSd_counts * driftRandom.nextGaussian(); // stationary from power-on
    }
    zeroShift_counts = warmup_counts + drift_counts;
  }

  /**
   * Advances to a sample and gives its error.
   *
   * @param t_s the sample's true time, s since power-on, not before the last one
   * @param force_N the true force on the cell at that time
   * @return counts to add to the cell's output
   */
  double counts(double t_s, double force_N) {
    double dt = Math.max(0, t_s - time_s);
    time_s = t_s;
    if (driftSd_counts > 0 && dt > 0) {
      // exact discretisation of the Ornstein–Uhlenbeck process: the stationary SD is kept
      double a = StrictMath.exp(-dt / drift_s);
      drift_counts = a * drift_counts
          + driftSd_counts * StrictMath.sqrt(1 - a * a) * driftRandom.nextGaussian();
    }
    if (creepShare != 0 && dt > 0) {
      creep_N += (creepShare * force_N - creep_N) * -StrictMath.expm1(-dt / creep_s);
    }
    double warm = warmup_counts == 0 ? 0 : warmup_counts * StrictMath.exp(-t_s / warmup_s);
    zeroShift_counts = warm + drift_counts;
    double error = zeroShift_counts + creep_N * countsPerN;
    lastSpike = false;
    if (spikesPerS > 0) {
      double u = spikeRandom.nextDouble();
      double size = spikeRandom.nextDouble();
      if (u < spikesPerS * dt) {
        lastSpike = true;
        spikes++;
        double sign = size < 0.5 ? -1 : 1;
        error += sign * (0.5 + 2 * Math.abs(size - 0.5)) * spike_counts;
      }
    }
    return error;
  }

  /** @return the zero's shift (warm-up plus drift) at the last sample, counts */
  double zeroShift_counts() {
    return zeroShift_counts;
  }

  /** @return the creep at the last sample, N of apparent force */
  double creep_N() {
    return creep_N;
  }

  boolean lastSpike() {
    return lastSpike;
  }

  long spikes() {
    return spikes;
  }
}
