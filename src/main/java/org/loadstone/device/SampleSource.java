package org.loadstone.device;

/**
 * What a simulated device measures, sample after sample in device-time order. The simulated frame
 * implements it; {@link SimTransport} turns it into protocol bytes, exactly as firmware would.
 */
public interface SampleSource {
  /** @return the converter's nominal sample rate in Hz */
  double rateHz();

  /** @return whether samples carry a position channel */
  boolean hasPosition();

  /** @return position counts per mm of crosshead travel (0 without position) */
  double countsPerMm();

  /** @return converter kind for the identity record, e.g. {@code hx711} */
  String adcKind();

  /**
   * What the device says about its load cell in its identity, as {@code key=value} pairs
   * separated by single spaces ({@code cell}, {@code cap}, {@code cpn}: see the protocol), or an
   * empty text when it says nothing.
   */
  default String cellFields() {
    return "";
  }

  /**
   * Produces the next sample.
   *
   * @param slot receives seq, device time, counts and position; reused by the caller
   */
  void next(SampleSlot slot);

  /** Stops the crosshead drive (the {@code HALT} command); the cell keeps converting. */
  default void halt() {}

  /** Chooses a sample rate; returns false when the converter cannot run at it. */
  default boolean setRateHz(int hz) {
    return hz == Math.round(rateHz());
  }

  /** A reusable holder for one sample's raw fields. */
  final class SampleSlot {
    /** wrapping sequence number, 0…65535 */
    public int seq;
    /** wrapping device time in µs, 0…4 294 967 295 */
    public long deviceUs;
    /** load counts */
    public int counts;
    /** position counts (ignored without position) */
    public int positionCounts;
  }
}
