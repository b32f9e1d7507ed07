package org.loadstone.sim;

/**
 * Seeded pseudo-random source of the simulator: xoshiro256** (Blackman and Vigna, 2018) seeded
 * through SplitMix64, with Gaussian deviates by Marsaglia's polar method. Implemented here so the
 * stream is fixed by this code alone (not by a JDK version) and draws allocate nothing.
 *
 * <p>Each part of the model (specimen scatter, drive, noise, timing) takes its own stream, so
 * changing the sample rate does not change which specimen a seed gives.
 */
final class SimRandom {
  /** Stream numbers, one per consumer. */
  static final long SPECIMEN = 1;
  static final long DRIVE = 2;
  static final long NOISE = 3;
  static final long TIMING = 4;
  static final long FAILURE = 5;
  static final long DRIFT = 6;
  static final long SPIKES = 7;

  private long s0;
  private long s1;
  private long s2;
  private long s3;
  private double spareGaussian;
  private boolean hasSpare;

  private SimRandom(long seed) {
    long x = seed;
    x += 0x9E3779B97F4A7C15L;
    s0 = mix(x);
    x += 0x9E3779B97F4A7C15L;
    s1 = mix(x);
    x += 0x9E3779B97F4A7C15L;
    s2 = mix(x);
    x += 0x9E3779B97F4A7C15L;
    s3 = mix(x);
  }

  /** A stream for one consumer of one run seed. */
  static SimRandom stream(long seed, long streamId) {
    return new SimRandom(mix(seed ^ mix(streamId * 0xD1B54A32D192ED03L)));
  }

  private static long mix(long z) {
    z = (z ^ (z >>> 30)) * 0xBF58476D1CE4E5B9L;
    z = (z ^ (z >>> 27)) * 0x94D049BB133111EBL;
    return z ^ (z >>> 31);
  }

  long nextLong() {
    long result = Long.rotateLeft(s1 * 5, 7) * 9;
    long t = s1 << 17;
    s2 ^= s0;
    s3 ^= s1;
    s1 ^= s2;
    s0 ^= s3;
    s2 ^= t;
    s3 = Long.rotateLeft(s3, 45);
    return result;
  }

  /** @return uniform in [0, 1) */
  double nextDouble() {
    return (nextLong() >>> 11) * 0x1.0p-53;
  }

  /** @return uniform in [lo, hi) */
  double uniform(double lo, double hi) {
    return lo + (hi - lo) * nextDouble();
  }

  /** @return a standard normal deviate */
  double nextGaussian() {
    if (hasSpare) {
      hasSpare = false;
      return spareGaussian;
    }
    double u;
    double v;
    double s;
    do {
      u = 2 * nextDouble() - 1;
      v = 2 * nextDouble() - 1;
      s = u * u + v * v;
    } while (s >= 1 || s == 0);
    double m = StrictMath.sqrt(-2 * StrictMath.log(s) / s);
    spareGaussian = v * m;
    hasSpare = true;
    return u * m;
  }

  /**
   * A scatter factor {@code 1 + cv·z} with z standard normal cut at ±3, for specimen-to-specimen
   * variation with coefficient of variation {@code cv} (a fraction, e.g. 0.05).
   */
  double scatter(double cv) {
    double z = Math.max(-3, Math.min(3, nextGaussian()));
    return 1 + cv * z;
  }
}
