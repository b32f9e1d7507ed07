package org.loadstone.acquire;

/** Samples made from their index alone, so a test can check what a journal kept bit for bit. */
final class JournalSamples {
  private JournalSamples() {}

  static int seq(long i) {
    return (int) (i & 0xFFFF);
  }

  static long timeUs(long i) {
    return 250_000L + i * 1000;
  }

  static long deviceUs(long i) {
    return timeUs(i) & 0xFFFF_FFFFL;
  }

  static int counts(long i) {
    long h = i * 0x9E3779B97F4A7C15L;
    return (int) (h >>> 40) - (1 << 23) + 812;
  }

  static int position(long i) {
    return (int) (i * 7 - 3000);
  }

  static void put(SampleRing ring, long i) {
    ring.put(seq(i), deviceUs(i), timeUs(i), counts(i), true, position(i));
  }
}
