package org.loadstone.protocol;

/**
 * One decoded sample as the device sent it. Raw is truth: these values are stored with every
 * sample of a run, and force and position are derived from them.
 *
 * @param seq wrapping sample counter, 0…65535
 * @param deviceUs wrapping device clock in microseconds, 0…4 294 967 295
 * @param counts signed load-cell counts
 * @param hasPosition whether the device sent a position channel
 * @param positionCounts signed position counts; 0 when {@code hasPosition} is false
 */
public record RawSample(int seq, long deviceUs, int counts, boolean hasPosition, int positionCounts) {
  /** Largest sequence number before it wraps to 0. */
  public static final int SEQ_MAX = 0xFFFF;
  /** Largest device time before it wraps to 0, in microseconds. */
  public static final long TIME_MAX_US = 0xFFFF_FFFFL;

  public RawSample {
    if (seq < 0 || seq > SEQ_MAX) {
      throw new IllegalArgumentException("seq must be 0…65535, was " + seq);
    }
    if (deviceUs < 0 || deviceUs > TIME_MAX_US) {
      throw new IllegalArgumentException("deviceUs must be 0…4294967295, was " + deviceUs);
    }
    if (!hasPosition && positionCounts != 0) {
      throw new IllegalArgumentException("positionCounts must be 0 without a position channel");
    }
  }
}
