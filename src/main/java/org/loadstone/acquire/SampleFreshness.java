package org.loadstone.acquire;

/**
 * When a live reading stops being live: a display must say "no data" instead of showing the last
 * value as if it were current. The rule, one for the console and the command line: a reading is
 * stale when no sample has arrived for five sample periods, but never sooner than 0.25 s (a serial
 * link and a display frame deliver in bursts) and never later than 1 s (so a stopped stream is
 * shown within a second at any rate). Before the first sample a reading is stale. Pure: the caller
 * passes the arrival time of the last sample and the time now, both from the same monotonic clock
 * (for example {@link System#nanoTime()}), so tests use their own clock.
 */
public final class SampleFreshness {
  /** Sample periods without a sample after which a reading is stale. */
  public static final int PERIODS = 5;
  /** Shortest wait before a reading is called stale, ns. */
  public static final long MIN_NS = 250_000_000L;
  /** Longest wait before a reading is called stale, ns. */
  public static final long MAX_NS = 1_000_000_000L;

  private SampleFreshness() {}

  /**
   * @param rate_Hz the stream's sample rate (measured or stated); 0 or less when unknown
   * @return how long after the last sample a reading becomes stale, ns (0.25 s to 1 s)
   */
  public static long staleAfter_ns(double rate_Hz) {
    if (!(rate_Hz > 0) || !Double.isFinite(rate_Hz)) {
      return MAX_NS;
    }
    double ns = PERIODS * 1e9 / rate_Hz;
    return Math.max(MIN_NS, Math.min(MAX_NS, Math.round(ns)));
  }

  /**
   * @param samples samples received so far
   * @param lastArrival_ns when the last one arrived, on the caller's clock
   * @param now_ns now, on the same clock
   * @param rate_Hz the stream's sample rate, 0 or less when unknown
   * @return whether the reading is stale: no sample yet, or none for longer than {@link
   *     #staleAfter_ns}
   */
  public static boolean stale(long samples, long lastArrival_ns, long now_ns, double rate_Hz) {
    return samples <= 0 || now_ns - lastArrival_ns > staleAfter_ns(rate_Hz);
  }

  /**
   * @return how long ago the last sample arrived, s (0 when it is in the future of {@code now_ns})
   */
  public static double age_s(long lastArrival_ns, long now_ns) {
    return Math.max(0, now_ns - lastArrival_ns) / 1e9;
  }
}
