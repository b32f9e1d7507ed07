package org.loadstone.cli;

import org.loadstone.sim.SimImperfections;
import picocli.CommandLine.Option;

/**
 * The simulated cell's and amplifier's imperfections, shared by the commands that can run the
 * simulator. The defaults are {@link SimImperfections#TYPICAL} (the contributor guide says where
 * each figure comes from).
 */
public final class SimImperfectionOptions {
  @Option(names = "--sim-noise-counts", paramLabel = "COUNTS",
      description = "Simulator: converter noise, counts RMS (default: the converter's at the "
          + "rate, 21 at 10/s, 39 at 80/s, growing as the square root of faster rates).")
  Double noise_counts;

  @Option(names = "--sim-warmup-pct-fs", defaultValue = "0.02", paramLabel = "PCT-FS",
      description = "Simulator: zero shift at power-on that settles away, %% of full scale "
          + "(default: ${DEFAULT-VALUE}).")
  double warmup_pctFS;

  @Option(names = "--sim-warmup-s", defaultValue = "600", paramLabel = "S",
      description = "Simulator: time constant of that warm-up, s (default: ${DEFAULT-VALUE}).")
  double warmup_s;

  @Option(names = "--sim-drift-pct-fs", defaultValue = "0.002", paramLabel = "PCT-FS",
      description = "Simulator: slow, temperature-like wander of the zero, standard deviation, "
          + "%% of full scale (default: ${DEFAULT-VALUE}).")
  double drift_pctFS;

  @Option(names = "--sim-drift-s", defaultValue = "1800", paramLabel = "S",
      description = "Simulator: correlation time of that wander, s (default: ${DEFAULT-VALUE}).")
  double drift_s;

  @Option(names = "--sim-creep-pct", defaultValue = "0.025", paramLabel = "PCT",
      description = "Simulator: creep under a constant load, approached as a first-order lag, "
          + "%% of the load (default: ${DEFAULT-VALUE}).")
  double creep_pct;

  @Option(names = "--sim-creep-s", defaultValue = "600", paramLabel = "S",
      description = "Simulator: time constant of the creep, s (default: ${DEFAULT-VALUE}).")
  double creep_s;

  @Option(names = "--sim-spikes-per-min", defaultValue = "0", paramLabel = "SPIKES-PER-MIN",
      description = "Simulator: mean number of single-sample spikes per minute, drawn from the "
          + "seed (default: ${DEFAULT-VALUE}).")
  double spikesPerMin;

  @Option(names = "--sim-spike-pct-fs", defaultValue = "5", paramLabel = "PCT-FS",
      description = "Simulator: typical size of a spike, %% of full scale; each is 0.5 to 1.5 "
          + "times it, up or down (default: ${DEFAULT-VALUE}).")
  double spike_pctFS;

  /** The names of these options, for commands that refuse them in some modes. */
  static final java.util.List<String> NAMES = java.util.List.of("--sim-noise-counts",
      "--sim-warmup-pct-fs", "--sim-warmup-s", "--sim-drift-pct-fs", "--sim-drift-s",
      "--sim-creep-pct", "--sim-creep-s", "--sim-spikes-per-min", "--sim-spike-pct-fs");

  /** @return the imperfections these options describe */
  public SimImperfections imperfections() {
    return new SimImperfections(noise_counts == null ? Double.NaN : noise_counts, warmup_pctFS,
        warmup_s, drift_pctFS, drift_s, creep_pct, creep_s, spikesPerMin, spike_pctFS);
  }
}
