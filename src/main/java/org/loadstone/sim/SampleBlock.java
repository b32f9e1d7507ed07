package org.loadstone.sim;

/**
 * A reusable buffer of samples and their ground truth, filled by {@link
 * SimulatedFrame#fill(SampleBlock, int)}. Mutable on purpose (like a reused token in a parser):
 * one block is allocated once and refilled, so a fast run allocates nothing per sample. Index
 * {@code i} runs from 0 to {@link #size()} − 1; values are those of the last fill.
 */
public final class SampleBlock {
  private final int[] seq;
  private final long[] deviceTime_us;
  private final int[] loadCounts;
  private final int[] positionCounts;
  private final double[] time_s;
  private final double[] crosshead_mm;
  private final double[] deflection_mm;
  private final double[] force_N;
  private final boolean[] saturated;
  private int size;

  /** @param capacity samples per fill, 1…10 000 000 */
  public SampleBlock(int capacity) {
    if (capacity < 1 || capacity > 10_000_000) {
      throw new IllegalArgumentException("'capacity' must be 1…10000000, was " + capacity);
    }
    seq = new int[capacity];
    deviceTime_us = new long[capacity];
    loadCounts = new int[capacity];
    positionCounts = new int[capacity];
    time_s = new double[capacity];
    crosshead_mm = new double[capacity];
    deflection_mm = new double[capacity];
    force_N = new double[capacity];
    saturated = new boolean[capacity];
  }

  void put(
      int i, int sq, long us, int load, int pos, double t, double x, double d, double f,
      boolean sat) {
    seq[i] = sq;
    deviceTime_us[i] = us;
    loadCounts[i] = load;
    positionCounts[i] = pos;
    time_s[i] = t;
    crosshead_mm[i] = x;
    deflection_mm[i] = d;
    force_N[i] = f;
    saturated[i] = sat;
  }

  void setSize(int n) {
    size = n;
  }

  /** @return how many samples the block can hold */
  public int capacity() {
    return seq.length;
  }

  /** @return how many samples the last fill wrote */
  public int size() {
    return size;
  }

  private int check(int i) {
    if (i < 0 || i >= size) {
      throw new IndexOutOfBoundsException("sample index " + i + " outside 0…" + (size - 1));
    }
    return i;
  }

  /** @return sequence number of sample i, 0…65535 */
  public int seq(int i) {
    return seq[check(i)];
  }

  /** @return device time of sample i, µs, wrapping at 2³² */
  public long deviceTime_us(int i) {
    return deviceTime_us[check(i)];
  }

  /** @return load counts of sample i */
  public int loadCounts(int i) {
    return loadCounts[check(i)];
  }

  /** @return position counts of sample i */
  public int positionCounts(int i) {
    return positionCounts[check(i)];
  }

  /** @return true time of sample i, s */
  public double time_s(int i) {
    return time_s[check(i)];
  }

  /** @return true crosshead displacement of sample i, mm */
  public double crosshead_mm(int i) {
    return crosshead_mm[check(i)];
  }

  /** @return true specimen deflection of sample i, mm */
  public double deflection_mm(int i) {
    return deflection_mm[check(i)];
  }

  /** @return true force of sample i, N */
  public double force_N(int i) {
    return force_N[check(i)];
  }

  /** @return whether sample i was clipped by the converter */
  public boolean saturated(int i) {
    return saturated[check(i)];
  }

  /** @return a record of sample i (allocates) */
  public SimSample sample(int i) {
    check(i);
    return new SimSample(
        seq[i], deviceTime_us[i], loadCounts[i], positionCounts[i], time_s[i], crosshead_mm[i],
        deflection_mm[i], force_N[i], saturated[i]);
  }
}
