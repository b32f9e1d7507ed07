package org.loadstone.protocol;

/**
 * Receives decoded records from a {@link StreamDecoder}, on the thread that feeds it. Samples come
 * as primitives so the hot path allocates nothing.
 */
public interface DecodeListener {
  /**
   * One sample.
   *
   * @param seq 0…65535
   * @param deviceUs 0…4 294 967 295
   * @param counts signed load counts
   * @param hasPosition whether a position channel was sent
   * @param positionCounts position counts; 0 without position
   */
  void onSample(int seq, long deviceUs, int counts, boolean hasPosition, int positionCounts);

  /** One non-sample record. */
  void onMessage(DeviceMessage message);
}
