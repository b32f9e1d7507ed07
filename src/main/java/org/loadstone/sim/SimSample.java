package org.loadstone.sim;

/**
 * One simulated sample with its ground truth (an allocating convenience; high rates use {@link
 * SimulatedFrame#next(SampleSink)} or {@link SimulatedFrame#fill(SampleBlock, int)}).
 *
 * @param seq sequence number, 0…65535, wrapping
 * @param deviceTime_us device clock at conversion, µs, 0…2³²−1, wrapping
 * @param loadCounts load-cell counts inside the 24-bit range
 * @param positionCounts crosshead encoder counts
 * @param time_s true time since the start, s
 * @param crosshead_mm true crosshead displacement, mm
 * @param deflection_mm true specimen deflection from first contact, mm (0 before contact)
 * @param force_N true force on the cell at {@code time_s}, N (instantaneous; an HX711-class
 *     converter's counts are the mean over its conversion period, see {@link SimulatedFrame})
 * @param saturated whether the converter clipped this sample at a 24-bit limit
 */
public record SimSample(
    int seq,
    long deviceTime_us,
    int loadCounts,
    int positionCounts,
    double time_s,
    double crosshead_mm,
    double deflection_mm,
    double force_N,
    boolean saturated) {

  /** @throws IllegalArgumentException when a field is outside its wire range */
  public SimSample {
    if (seq < 0 || seq > 0xFFFF) {
      throw new IllegalArgumentException("'seq' must be 0…65535, was " + seq);
    }
    if (deviceTime_us < 0 || deviceTime_us > 0xFFFF_FFFFL) {
      throw new IllegalArgumentException("'deviceTime_us' must be 0…4294967295, was " + deviceTime_us);
    }
    if (loadCounts < LoadCell.MIN_COUNTS || loadCounts > LoadCell.MAX_COUNTS) {
      throw new IllegalArgumentException("'loadCounts' outside the 24-bit range: " + loadCounts);
    }
  }
}
