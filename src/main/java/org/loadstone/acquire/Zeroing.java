package org.loadstone.acquire;

import java.util.Arrays;
import java.util.Locale;
import java.util.function.Consumer;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Setting;

/**
 * The zero (tare) before a run ({@link Tare}, with how still it was): the next samples from the stream averaged, taken again while the
 * reading is still moving, and refused after {@link #MAX_TRIES} tries that never came to rest.
 *
 * <p>At rest means: the means of the first and second half of the zero's samples differ by no
 * more than the larger of the zero-drift limit and six standard errors of that difference, the
 * noise estimated from successive differences (1.4826·median|Δ|/√2, blind to a slow trend and to
 * a spike). A press loading the specimen, a cell still settling fast after power-on or a reading
 * that wanders by more than the limit within one zero fails it; converter noise does not.
 */
public final class Zeroing {
  /** How many zeros are tried before one at rest is given up on. */
  public static final int MAX_TRIES = 10;
  /** Standard errors of the halves' difference that noise alone may give. */
  static final double NOISE_ALLOWANCE_SE = 6;

  private Zeroing() {}

  /**
   * A zero taken from the stream.
   *
   * @param counts mean counts of the samples averaged
   * @param nextIndex ring index of the first sample after them: a run armed on this zero is
   *     decided from there, so load that comes on while the run is being set up is not missed
   * @param samples how many samples were averaged
   * @param halfShift_counts mean of the second half minus mean of the first, counts (0 for fewer
   *     than 4 samples)
   * @param noise_counts the samples' noise SD from successive differences, counts (0 for fewer
   *     than 4 samples)
   */
  public record Zero(double counts, long nextIndex, int samples, double halfShift_counts,
      double noise_counts) {
    /**
     * @param limit_counts the largest shift accepted, counts, ≥ 0
     * @return the largest half-to-half shift accepted: the limit or the noise allowance
     */
    public double tolerance_counts(double limit_counts) {
      int first = samples / 2;
      int second = samples - first;
      double se = noise_counts * Math.sqrt(1.0 / Math.max(1, first) + 1.0 / Math.max(1, second));
      return Math.max(limit_counts, NOISE_ALLOWANCE_SE * se);
    }

    /** @return whether the reading was at rest within the limit, counts */
    public boolean atRest(double limit_counts) {
      return samples < 4 || Math.abs(halfShift_counts) <= tolerance_counts(limit_counts);
    }
  }

  /**
   * Averages the next {@code samples} samples from the ring, waiting for them.
   *
   * @return the mean counts, where the samples after them begin, and how still they were
   * @throws LoadstoneException when the samples do not come in time (device silent or lost)
   */
  public static Zero take(DeviceReader reader, int samples, long timeoutMs) {
    SampleRing.Cursor c = reader.ring().cursorAtEnd();
    double[] values = new double[samples];
    int[] n = {0};
    long until = System.nanoTime() + timeoutMs * 1_000_000;
    while (n[0] < samples) {
      c.drain((i, s, d, t, counts, hp, p) -> {
        if (n[0] < samples) {
          values[n[0]++] = counts;
        }
      }, samples - n[0]);
      if (n[0] < samples) {
        if (reader.lostReason().isPresent()) {
          throw new DeviceLostException("zeroing failed: only " + n[0] + " of " + samples
              + " samples arrived from " + reader.transport().name() + " ("
              + reader.lostReason().get() + ")");
        }
        if (System.nanoTime() > until) {
          throw new LoadstoneException("zeroing failed: only " + n[0] + " of " + samples
              + " samples arrived from " + reader.transport().name() + " in "
              + timeoutMs / 1000.0 + " s"
              + reader.lostReason().map(w -> " (" + w + ")").orElse(
                  "; check that the device is streaming samples"));
        }
        sleep(5);
      }
    }
    return of(values, c.position());
  }

  /**
   * @param values the zero's samples, counts, at least 1
   * @param nextIndex ring index after them
   * @return the zero they give
   */
  static Zero of(double[] values, long nextIndex) {
    int n = values.length;
    double sum = 0;
    double firstSum = 0;
    for (int i = 0; i < n; i++) {
      sum += values[i];
      if (i < n / 2) {
        firstSum += values[i];
      }
    }
    if (n < 4) {
      return new Zero(sum / n, nextIndex, n, 0, 0);
    }
    int first = n / 2;
    double shift = (sum - firstSum) / (n - first) - firstSum / first;
    double[] steps = new double[n - 1];
    for (int i = 1; i < n; i++) {
      steps[i - 1] = Math.abs(values[i] - values[i - 1]);
    }
    Arrays.sort(steps);
    int m = steps.length;
    double median = m % 2 == 1 ? steps[m / 2] : 0.5 * (steps[m / 2 - 1] + steps[m / 2]);
    // the median absolute difference of two independent normal samples is 0.6745·√2·σ
    double noise = 1.4826 * median / Math.sqrt(2);
    return new Zero(sum / n, nextIndex, n, shift, noise);
  }

  /**
   * Takes zeros until one is at rest, at most {@link #MAX_TRIES}.
   *
   * @param reader the device
   * @param samples samples per zero
   * @param timeoutMs how long one zero may wait for its samples
   * @param limit_N the zero-drift limit: the largest shift accepted within one zero, N
   * @param scale counts above zero → force, for the limit and messages
   * @param say told when a zero is taken again
   * @return the first zero at rest
   * @throws LoadstoneException when none comes to rest, naming the movement and the fixes; or as
   *     {@link #take}
   */
  public static Zero settled(DeviceReader reader, int samples, long timeoutMs, double limit_N,
      ForceScale scale, Consumer<String> say) {
    double countsPerN = countsPerN(scale);
    double limit_counts = limit_N * countsPerN;
    Zero z = null;
    for (int attempt = 1; attempt <= MAX_TRIES; attempt++) {
      z = take(reader, samples, timeoutMs);
      if (z.atRest(limit_counts)) {
        return z;
      }
      if (attempt < MAX_TRIES) {
        say.accept(String.format(Locale.ROOT, "the zero is still moving (%+.3g N within one "
            + "zero): keep the cell unloaded, zeroing again (%d of %d)",
            z.halfShift_counts() / countsPerN, attempt + 1, MAX_TRIES));
      }
    }
    throw new LoadstoneException(String.format(Locale.ROOT, "the zero did not settle: in %d "
        + "tries of %d samples the unloaded reading kept moving, the last time by %+.3g N "
        + "between the first and second half (accepted: %.3g N); something may rest on or "
        + "touch the cell, the press may be moving, or the cell may still be warming up: unload "
        + "the cell, stop the press, wait until the reading is at rest and arm again, or accept "
        + "a larger zero-drift limit", MAX_TRIES, samples, z.halfShift_counts() / countsPerN,
        z.tolerance_counts(limit_counts) / countsPerN), Setting.ZERO_DRIFT_LIMIT);
  }

  /** @return the scale's slope at zero, counts per N (a calibration's curve is near-linear) */
  private static double countsPerN(ForceScale scale) {
    double perCount = scale.force_N(1000) / 1000;
    if (!(Double.isFinite(perCount) && perCount != 0)) {
      throw new IllegalArgumentException("the scale gives no force for counts: " + scale.describe());
    }
    return Math.abs(1 / perCount);
  }

  private static void sleep(long ms) {
    try {
      Thread.sleep(ms);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    }
  }
}
