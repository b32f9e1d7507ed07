package org.loadstone.sim;

/** Receives one simulated sample as primitives (no allocation per sample). */
@FunctionalInterface
public interface SampleSink {
  /**
   * @param seq sequence number, 0…65535, +1 per sample, wrapping
   * @param deviceTime_us device clock when the conversion finished, µs, 0…4 294 967 295, wrapping
   * @param loadCounts load-cell counts, −8 388 608…8 388 607
   * @param positionCounts crosshead encoder counts
   */
  void sample(int seq, long deviceTime_us, int loadCounts, int positionCounts);
}
