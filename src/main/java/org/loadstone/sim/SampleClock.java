package org.loadstone.sim;

/**
 * Conversion instants, sequence numbers and the device's microsecond clock. Conversion n (n ≥ 1
 * since the last rate change) finishes at base + n·T plus an optional Gaussian jitter (cut at ±3σ
 * and at ±0.4·T, so samples stay in order); the jitter does not accumulate. T is the nominal
 * period times (1 + rate error): a converter running off its own oscillator converts slightly
 * faster or slower than nominal, while the device clock keeps true time.
 */
final class SampleClock {
  private final SimRandom random;
  private final double jitter_s;
  private final int firstSequence;
  private final long clockStart_us;
  private final double periodScale;
  private double period_s;
  private double base_s;
  private long index;
  private long count;
  private double next_s;

  SampleClock(double rateHz, double jitter_us, double rateError_pct, int firstSequence,
      long clockStart_us, SimRandom random) {
    this.random = random;
    this.jitter_s = jitter_us * 1e-6;
    this.firstSequence = firstSequence;
    this.clockStart_us = clockStart_us;
    this.periodScale = 1 / (1 + rateError_pct / 100);
    this.period_s = periodScale / rateHz;
    this.next_s = draw();
  }

  private double draw() {
    double nominal = base_s + (index + 1) * period_s;
    if (jitter_s <= 0) {
      return nominal;
    }
    double limit = Math.min(3 * jitter_s, 0.4 * period_s);
    double j = Math.max(-limit, Math.min(limit, jitter_s * random.nextGaussian()));
    return nominal + j;
  }

  double next_s() {
    return next_s;
  }

  int nextSequence() {
    return (int) ((firstSequence + count) & 0xFFFF);
  }

  long deviceTime_us(double time_s) {
    return (clockStart_us + (long) Math.floor(time_s * 1e6)) & 0xFFFF_FFFFL;
  }

  void advance() {
    count++;
    index++;
    next_s = draw();
  }

  /** Changes the period from the nominal instant of the last conversion on. */
  void setRate(double rateHz) {
    base_s = base_s + index * period_s;
    index = 0;
    period_s = periodScale / rateHz;
    next_s = draw();
  }

  long count() {
    return count;
  }
}
