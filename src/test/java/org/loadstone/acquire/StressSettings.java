package org.loadstone.acquire;

/**
 * How hard the concurrency stress tests push: {@code -Dloadstone.stress.scale=N} multiplies the
 * number of rounds (1 in the normal suite, a few seconds; the {@code stress} Maven profile sets
 * 200), {@code -Dloadstone.stress.seed} fixes the random pauses. The tests count samples and
 * rounds, never time, so a busy machine makes them slower, not different.
 */
final class StressSettings {
  private StressSettings() {}

  /** @return the round multiplier, at least 1 */
  static int scale() {
    return Math.max(1, Integer.getInteger("loadstone.stress.scale", 1));
  }

  /** @return the seed of the random pauses (printed by each test so a failure can be re-run) */
  static long seed() {
    return Long.getLong("loadstone.stress.seed", 20_261_203L);
  }
}
