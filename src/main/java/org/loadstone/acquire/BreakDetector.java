package org.loadstone.acquire;

import org.loadstone.units.Precondition;

/**
 * Declares the break from the force signal alone: once the running peak has exceeded the arming
 * level, a break is force at or below {@code (1 − drop) × peak} (or back below the absolute stop
 * level after having risen above it)
 * held for at least the debounce time. The break sample is the first sample of that held drop, so a
 * brittle fracture is placed at the first sample that meets the criterion. Pure; one thread.
 */
public final class BreakDetector {
  private final double dropFraction;
  private final double arming_N;
  private final double debounce_s;
  private final double absolute_N;

  private double peak_N = Double.NEGATIVE_INFINITY;
  private long peakIndex = -1;
  private long candidateIndex = -1;
  private double candidateTime_s;
  private double candidatePeak_N;
  private double candidateForce_N;
  private Break found;

  /** A declared break. */
  public record Break(long index, double time_s, double force_N, double peakBefore_N,
      long peakIndex, double dropPct) {}

  /** @param s run settings (drop %, arming level, debounce, absolute stop) */
  public BreakDetector(RunSettings s) {
    Precondition.notNull(s, "settings");
    dropFraction = s.breakDropPct() / 100;
    arming_N = s.armingLevel_N();
    debounce_s = s.debounce_s();
    absolute_N = s.absoluteStop_N();
  }

  /** @return the running peak, N, or −∞ before any sample */
  public double peak_N() {
    return peak_N;
  }

  /** @return the break once declared, else null */
  public Break result() {
    return found;
  }

  /**
   * Takes one sample.
   *
   * @param index sample index (increasing)
   * @param time_s sample time (non-decreasing)
   * @param force_N force
   * @return the break when this sample completes its declaration, else null
   */
  public Break offer(long index, double time_s, double force_N) {
    if (found != null) {
      return null;
    }
    if (force_N > peak_N) {
      peak_N = force_N;
      peakIndex = index;
    }
    boolean armed = peak_N >= arming_N;
    boolean dropped = armed
        && (force_N <= (1 - dropFraction) * peak_N
            || (absolute_N > 0 && peak_N > absolute_N && force_N < absolute_N));
    if (!dropped) {
      candidateIndex = -1;
      return null;
    }
    if (candidateIndex < 0) {
      candidateIndex = index;
      candidateTime_s = time_s;
      candidatePeak_N = peak_N;
      candidateForce_N = force_N;
    }
    if (time_s - candidateTime_s >= debounce_s) {
      found = new Break(candidateIndex, candidateTime_s, candidateForce_N, candidatePeak_N,
          peakIndex, 100 * (candidatePeak_N - candidateForce_N) / candidatePeak_N);
      return found;
    }
    return null;
  }
}
