package org.loadstone.acquire;

import java.util.Locale;
import java.util.Optional;
import org.loadstone.units.LoadstoneException;

/**
 * The device's sample rate for a run, and where it comes from. One rule for the command line and
 * the console: the rate the device states in its identity; without one, the rate its own clock
 * shows over the first samples (sequence numbers over device time, so samples lost on the way do
 * not lower it). Sample counts of a run (the zero, the pre-trigger history, the debounce) are sized
 * from it.
 *
 * @param rate_Hz samples per second, finite and positive
 * @param source where the figure comes from
 */
public record SampleRate(double rate_Hz, Source source) {
  /** Samples whose device timestamps measure the rate of a device that stated none. */
  public static final int FIRST_SAMPLES = 20;

  /** Where a sample rate comes from; the wire name is stored with the run. */
  public enum Source {
    /** The rate the device stated in its identity. */
    IDENTITY("identity"),
    /** Measured from the device's timestamps of its first samples. */
    DEVICE_CLOCK("device-clock");

    private final String wireName;

    Source(String wireName) {
      this.wireName = wireName;
    }

    /** @return the name stored in a run's {@code sample_rate_source} */
    public String wireName() {
      return wireName;
    }
  }

  public SampleRate {
    if (!(Double.isFinite(rate_Hz) && rate_Hz > 0)) {
      throw new IllegalArgumentException("sample rate must be positive, was " + rate_Hz);
    }
    org.loadstone.units.Precondition.notNull(source, "source");
  }

  /**
   * Samples in a stretch of time at this rate, at least {@code atLeast}.
   *
   * @param seconds the stretch, s
   * @param atLeast the fewest samples to use
   */
  public int samplesIn(double seconds, int atLeast) {
    return (int) Math.max(atLeast, Math.round(rate_Hz * seconds));
  }

  /** @return the rate in words, e.g. "1000 samples/s (measured by the device's clock)" */
  public String describe() {
    return new java.math.BigDecimal(String.format(Locale.ROOT, "%.6g", rate_Hz))
        .stripTrailingZeros().toPlainString() + " samples/s"
        + (source == Source.IDENTITY ? " (stated by the device)"
            : " (measured by the device's clock: the device did not state its rate)");
  }

  /**
   * The rate from device timestamps: the sequence numbers advanced over the device time passed.
   *
   * @param seq sequence numbers as sent (0…65535, wrapping)
   * @param timeUs device times, µs, unwrapped (never decreasing)
   * @param n samples to use from the start of the arrays, at least 2
   * @return the measured rate, or empty when the device time did not advance or the sequence
   *     numbers did not
   */
  public static Optional<SampleRate> fromDeviceClock(int[] seq, long[] timeUs, int n) {
    if (n < 2) {
      return Optional.empty();
    }
    long steps = 0;
    for (int i = 1; i < n; i++) {
      steps += (seq[i] - seq[i - 1]) & 0xFFFF;
    }
    long dt = timeUs[n - 1] - timeUs[0];
    if (dt <= 0 || steps <= 0) {
      return Optional.empty();
    }
    return Optional.of(new SampleRate(steps * 1e6 / dt, Source.DEVICE_CLOCK));
  }

  /**
   * The rate as far as it is known now, without waiting: the identity's rate, else the rate from
   * the oldest {@link #FIRST_SAMPLES} samples held in the ring.
   *
   * @return the rate, or empty while the device has neither stated it nor sent enough samples
   */
  public static Optional<SampleRate> known(DeviceReader reader) {
    Optional<SampleRate> stated = reader.identity().map(id -> id.rateHz())
        .filter(r -> Double.isFinite(r) && r > 0).map(r -> new SampleRate(r, Source.IDENTITY));
    if (stated.isPresent()) {
      return stated;
    }
    int[] seq = new int[FIRST_SAMPLES];
    long[] time = new long[FIRST_SAMPLES];
    int[] n = {0};
    reader.ring().cursorAtOldest().drain((i, s, d, t, c, hp, p) -> {
      seq[n[0]] = s;
      time[n[0]] = t;
      n[0]++;
    }, FIRST_SAMPLES);
    return n[0] < FIRST_SAMPLES ? Optional.empty() : fromDeviceClock(seq, time, n[0]);
  }

  /**
   * The rate, waiting for the first samples when the device stated none.
   *
   * @param reader a started reader
   * @param timeoutMs how long to wait for the samples
   * @throws LoadstoneException when the samples do not come in time, or the device is lost
   */
  public static SampleRate await(DeviceReader reader, long timeoutMs) {
    long until = System.nanoTime() + timeoutMs * 1_000_000;
    while (true) {
      Optional<SampleRate> r = known(reader);
      if (r.isPresent()) {
        return r.get();
      }
      reader.lostReason().ifPresent(why -> {
        throw new DeviceLostException(why);
      });
      if (System.nanoTime() > until) {
        throw new LoadstoneException("the device on " + reader.transport().name()
            + " did not state its sample rate, and fewer than " + FIRST_SAMPLES
            + " samples with distinct times arrived in " + timeoutMs / 1000.0
            + " s to measure it: check that the device is streaming");
      }
      DeviceIdentity.pause();
    }
  }
}
