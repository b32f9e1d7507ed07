package org.loadstone.calibration;

import java.util.Locale;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * Decides when a live reading has settled, so that a calibration point can be captured.
 *
 * <p>Feed it counts one at a time with {@link #offer}. Over the last {@code window} samples it
 * computes the standard deviation and the drift (least-squares slope over the window, converted
 * to counts per second). The reading is stable when both are at or below their limits. If the
 * reading has not become stable after {@code timeoutSamples} samples, {@link #offer} throws a
 * {@link LoadstoneException} telling the operator what was seen and what to check. Pure: no
 * clock, no threads; not thread-safe (one feeding thread).
 */
public final class StabilityDetector {

  /**
   * @param window number of samples judged together, 3 to 100000
   * @param maxSd_counts largest standard deviation accepted, ≥ 0
   * @param maxDrift_counts_per_s largest |slope| accepted, ≥ 0
   * @param timeoutSamples give up after this many samples, ≥ window
   * @param sampleRate_Hz nominal sample rate, used to express drift and time-out in seconds
   */
  public record Settings(
      int window,
      double maxSd_counts,
      double maxDrift_counts_per_s,
      int timeoutSamples,
      double sampleRate_Hz) {
    /** Validates ranges. */
    public Settings {
      if (window < 3 || window > 100_000) {
        throw new IllegalArgumentException("'window' must be 3 to 100000 samples, was " + window);
      }
      Precondition.nonNegative(maxSd_counts, "maxSd_counts");
      Precondition.nonNegative(maxDrift_counts_per_s, "maxDrift_counts_per_s");
      if (timeoutSamples < window) {
        throw new IllegalArgumentException(
            "'timeoutSamples' (" + timeoutSamples + ") must be at least 'window' (" + window + ")");
      }
      Precondition.positive(sampleRate_Hz, "sampleRate_Hz");
    }

    /** Seconds of samples judged together by default. */
    public static final double DEFAULT_WINDOW_S = 1;
    /** Largest standard deviation accepted by default, counts. */
    public static final double DEFAULT_MAX_SD_COUNTS = 100;
    /** Largest drift accepted by default, counts per second. */
    public static final double DEFAULT_MAX_DRIFT_COUNTS_PER_S = 50;
    /** Seconds to wait for a settled reading by default. */
    public static final double DEFAULT_TIMEOUT_S = 30;

    /**
     * Settings in seconds, for a device sampling at {@code rate_Hz}.
     *
     * @throws org.loadstone.units.LoadstoneException when a value is out of range
     */
    public static Settings ofSeconds(double window_s, double maxSd_counts,
        double maxDrift_counts_per_s, double timeout_s, double rate_Hz) {
      if (!(window_s > 0) || !(timeout_s >= window_s) || !(maxSd_counts >= 0)
          || !(maxDrift_counts_per_s >= 0) || !(rate_Hz > 0)) {
        throw new org.loadstone.units.LoadstoneException("stability settings out of range: the"
            + " window must be > 0 s, the time-out at least the window, the largest SD and"
            + " drift 0 or more");
      }
      int window = (int) Math.max(3, Math.min(100_000, Math.round(window_s * rate_Hz)));
      int timeout = (int) Math.max(window,
          Math.min(Integer.MAX_VALUE, Math.round(timeout_s * rate_Hz)));
      return new Settings(window, maxSd_counts, maxDrift_counts_per_s, timeout, rate_Hz);
    }

    /** The default settings for a device sampling at {@code rate_Hz}. */
    public static Settings defaults(double rate_Hz) {
      return ofSeconds(DEFAULT_WINDOW_S, DEFAULT_MAX_SD_COUNTS, DEFAULT_MAX_DRIFT_COUNTS_PER_S,
          DEFAULT_TIMEOUT_S, rate_Hz);
    }
  }

  /** What {@link #offer} found. */
  public enum State {
    /** fewer samples than the window so far */
    FILLING,
    /** window full, but SD or drift above the limit */
    SETTLING,
    /** SD and drift within the limits; {@link #reading()} is available */
    STABLE
  }

  private final Settings settings;
  private final double[] ring;
  private int count;
  private long offered;
  private double lastSd;
  private double lastDrift;

  /** @param settings limits and window; not null */
  public StabilityDetector(Settings settings) {
    this.settings = Precondition.notNull(settings, "settings");
    this.ring = new double[settings.window()];
  }

  /**
   * Adds one sample and judges the window.
   *
   * @param counts raw counts, finite
   * @return the state after this sample
   * @throws LoadstoneException when the time-out has been reached without a stable window; the
   *     message gives the time, the last SD and drift, and what to check
   */
  public State offer(double counts) {
    Precondition.finite(counts, "counts");
    ring[(int) (offered % ring.length)] = counts;
    offered++;
    count = Math.min(count + 1, ring.length);
    if (count < ring.length) {
      checkTimeout();
      return State.FILLING;
    }
    judge();
    if (lastSd <= settings.maxSd_counts()
        && Math.abs(lastDrift) <= settings.maxDrift_counts_per_s()) {
      return State.STABLE;
    }
    checkTimeout();
    return State.SETTLING;
  }

  private void checkTimeout() {
    if (offered >= settings.timeoutSamples()) {
      double seconds = settings.timeoutSamples() / settings.sampleRate_Hz();
      String seen = count < ring.length
          ? "the window of " + ring.length + " samples never filled"
          : String.format(Locale.ROOT,
              "sd=%.3g counts (limit %.3g), drift=%.3g counts/s (limit %.3g)",
              lastSd, settings.maxSd_counts(), lastDrift, settings.maxDrift_counts_per_s());
      throw new LoadstoneException(String.format(Locale.ROOT,
          "reading did not settle within %.1f s: %s; check for vibration, a touching cable or a"
              + " swinging weight, then capture the point again", seconds, seen));
    }
  }

  private void judge() {
    int n = ring.length;
    long start = offered - n;
    double mean = 0;
    for (int i = 0; i < n; i++) {
      mean += ring[(int) ((start + i) % n)];
    }
    mean /= n;
    double tMean = (n - 1) / 2.0;
    double ss = 0;
    double sty = 0;
    double stt = 0;
    for (int i = 0; i < n; i++) {
      double d = ring[(int) ((start + i) % n)] - mean;
      ss += d * d;
      sty += (i - tMean) * d;
      stt += (i - tMean) * (i - tMean);
    }
    lastSd = Math.sqrt(ss / (n - 1));
    lastDrift = sty / stt * settings.sampleRate_Hz();
  }

  /**
   * @return mean, SD and count of the current window
   * @throws IllegalStateException when the window is not full yet
   */
  public CapturedReading reading() {
    if (count < ring.length) {
      throw new IllegalStateException(
          "the window is not full yet: " + count + " of " + ring.length);
    }
    judge();
    int n = ring.length;
    double mean = 0;
    for (double v : ring) {
      mean += v;
    }
    return new CapturedReading(mean / n, lastSd, n);
  }

  /** @return SD of the last full window in counts, NaN before the window filled */
  public double lastSd_counts() {
    return count < ring.length ? Double.NaN : lastSd;
  }

  /** @return drift of the last full window in counts per second, NaN before the window filled */
  public double lastDrift_counts_per_s() {
    return count < ring.length ? Double.NaN : lastDrift;
  }

  /** Forgets all samples and restarts the time-out, e.g. after a new weight is placed. */
  public void reset() {
    count = 0;
    offered = 0;
    lastSd = Double.NaN;
    lastDrift = Double.NaN;
  }
}
