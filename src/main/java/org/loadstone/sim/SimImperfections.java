package org.loadstone.sim;

import java.util.Locale;
import org.loadstone.units.LoadstoneException;

/**
 * What makes the simulated cell and its bridge amplifier less than ideal, beyond the converter's
 * non-linearity: converter noise, zero drift (warm-up after power-on and a slow temperature-like
 * wander), creep under constant load and occasional spikes. Every figure is settable; {@link
 * #TYPICAL} is a typical 24-bit bridge amplifier on an inexpensive strain-gauge cell, {@link
 * #NONE} the ideal cell (noise only).
 *
 * <p>The model, added to the cell's counts at each sample time t (s since power-on, the frame's
 * time zero), with full-scale output FS = s·C counts:
 *
 * <pre>
 *   warm-up   w(t) = (warmup_pctFS/100)·FS·exp(−t/warmup_s)
 *   drift     d(t): Ornstein–Uhlenbeck, standard deviation (drift_pctFS/100)·FS, correlation
 *             time drift_s (a room temperature wandering around its mean, through the cell's
 *             temperature effect on zero)
 *   creep     y(t): dy/dt = ((creep_pct/100)·F − y)/creep_s, counts += s·y (first order toward a
 *             fixed share of the load; unloading recovers the same way)
 *   spike     with probability spikesPerMin/60·Δt per sample, one sample off by
 *             ±(0.5…1.5)·(spike_pctFS/100)·FS, random sign
 * </pre>
 *
 * Each has its own seeded random stream, so the same seed gives the same drift and spikes, and
 * switching one off leaves the others (and the converter noise) unchanged.
 *
 * @param noiseRms_counts converter noise, counts RMS, ≥ 0; NaN for the converter's figure at its
 *     rate ({@link LoadCell#defaultNoiseRms_counts})
 * @param warmup_pctFS zero shift at power-on that settles away, % of full-scale output, −1…1
 * @param warmup_s time constant of the warm-up, s, &gt; 0
 * @param drift_pctFS standard deviation of the slow zero wander, % of full-scale output, 0…1
 * @param drift_s correlation time of the slow zero wander, s, &gt; 0
 * @param creep_pct creep approached under a constant load, % of that load, −1…1
 * @param creep_s time constant of the creep, s, &gt; 0
 * @param spikesPerMin mean number of spikes per minute, 0…600
 * @param spike_pctFS typical size of a spike, % of full-scale output, 0…100
 */
public record SimImperfections(
    double noiseRms_counts,
    double warmup_pctFS,
    double warmup_s,
    double drift_pctFS,
    double drift_s,
    double creep_pct,
    double creep_s,
    double spikesPerMin,
    double spike_pctFS) {

  /** The ideal cell: converter noise at its rate, nothing else. */
  public static final SimImperfections NONE =
      new SimImperfections(Double.NaN, 0, 600, 0, 1800, 0, 600, 0, 5);

  /**
   * A typical 24-bit bridge amplifier (HX711 class) on an inexpensive C3-class strain-gauge cell;
   * where each figure comes from:
   *
   * <ul>
   *   <li>noise: the converter's at its rate, from the HX711 data sheet (see {@link
   *       LoadCell#defaultNoiseRms_counts}; from memory);
   *   <li>warm-up 0.02 % FS settling with a 10 min time constant: indicator and amplifier manuals
   *       ask for 15–30 min of warm-up before a zero is trusted (common practice; the size is
   *       illustrative);
   *   <li>drift 0.002 % FS with a 30 min correlation time: a temperature effect on zero of
   *       0.02 % FS per 10 °C (typical of C3-class cell data sheets; from memory) times a
   *       workshop's temperature wandering by about 1 °C (common practice);
   *   <li>creep 0.025 % of the load with a 10 min time constant (0.0238 % after 30 min):
   *       OIML R 60's creep test for a class C3 cell allows 0.7 × the maximum permissible error
   *       at full load over 30 min, 0.7 × 0.7 × 1.5 / 3000 = 0.0245 % of the capacity, the figure
   *       such data sheets quote (from memory);
   *   <li>no spikes: a sound installation shows none; set a rate to see how the program copes
   *       with a loose connector or interference.
   * </ul>
   */
  public static final SimImperfections TYPICAL =
      new SimImperfections(Double.NaN, 0.02, 600, 0.002, 1800, 0.025, 600, 0, 5);

  /** @throws LoadstoneException naming the figure, the value and the accepted range */
  public SimImperfections {
    check(Double.isNaN(noiseRms_counts) || (noiseRms_counts >= 0 && noiseRms_counts <= 1e6),
        "converter noise", noiseRms_counts, "0 to 1000000 counts RMS");
    check(Math.abs(warmup_pctFS) <= 1, "warm-up zero shift", warmup_pctFS, "-1 to 1 % of full scale");
    check(warmup_s > 0 && warmup_s <= 1e6, "warm-up time constant", warmup_s, "more than 0 s");
    check(drift_pctFS >= 0 && drift_pctFS <= 1, "zero drift", drift_pctFS, "0 to 1 % of full scale");
    check(drift_s > 0 && drift_s <= 1e6, "zero drift's correlation time", drift_s, "more than 0 s");
    check(Math.abs(creep_pct) <= 1, "creep", creep_pct, "-1 to 1 % of the load");
    check(creep_s > 0 && creep_s <= 1e6, "creep time constant", creep_s, "more than 0 s");
    check(spikesPerMin >= 0 && spikesPerMin <= 600, "spike rate", spikesPerMin,
        "0 to 600 per minute");
    check(spike_pctFS >= 0 && spike_pctFS <= 100, "spike size", spike_pctFS,
        "0 to 100 % of full scale");
  }

  private static void check(boolean ok, String what, double value, String range) {
    if (!ok) { // NaN fails every comparison above, so it lands here too
      throw new LoadstoneException(String.format(Locale.ROOT,
          "the simulated cell's %s must be %s, was %s", what, range, value));
    }
  }

  /** @return a copy with another converter noise, counts RMS (NaN: the converter's) */
  public SimImperfections withNoiseRms_counts(double v) {
    return new SimImperfections(v, warmup_pctFS, warmup_s, drift_pctFS, drift_s, creep_pct,
        creep_s, spikesPerMin, spike_pctFS);
  }

  /** @return a copy with another warm-up shift (% FS) and time constant (s) */
  public SimImperfections withWarmup(double pctFS, double s) {
    return new SimImperfections(noiseRms_counts, pctFS, s, drift_pctFS, drift_s, creep_pct,
        creep_s, spikesPerMin, spike_pctFS);
  }

  /** @return a copy with another zero drift (% FS) and correlation time (s) */
  public SimImperfections withDrift(double pctFS, double s) {
    return new SimImperfections(noiseRms_counts, warmup_pctFS, warmup_s, pctFS, s, creep_pct,
        creep_s, spikesPerMin, spike_pctFS);
  }

  /** @return a copy with another creep (% of load) and time constant (s) */
  public SimImperfections withCreep(double pct, double s) {
    return new SimImperfections(noiseRms_counts, warmup_pctFS, warmup_s, drift_pctFS, drift_s,
        pct, s, spikesPerMin, spike_pctFS);
  }

  /** @return a copy with another spike rate (per minute) and size (% FS) */
  public SimImperfections withSpikes(double perMin, double pctFS) {
    return new SimImperfections(noiseRms_counts, warmup_pctFS, warmup_s, drift_pctFS, drift_s,
        creep_pct, creep_s, perMin, pctFS);
  }
}
