package org.loadstone.acquire;

/**
 * A decimated, bounded copy of a live signal for drawing: samples are grouped into time buckets and
 * each full bucket contributes its minimum and maximum, so a spike narrower than a pixel still
 * shows. Holds at most {@code 2 × buckets} points covering the last {@code window_s} seconds. Single
 * thread.
 */
public final class DisplayTrace {
  private final double window_s;
  private final int buckets;
  private final double bucket_s;
  private final int capacity;
  private final double[] t;
  private final double[] v;
  private int start;
  private int size;
  private double bucketStart = Double.NaN;
  private double minV;
  private double maxV;
  private double minT;
  private double maxT;

  /**
   * @param window_s seconds of history kept, greater than 0
   * @param buckets number of time buckets across the window (about the chart's pixel width)
   */
  public DisplayTrace(double window_s, int buckets) {
    if (!(window_s > 0) || buckets < 10) {
      throw new IllegalArgumentException("window must be > 0 s and buckets ≥ 10");
    }
    this.window_s = window_s;
    this.buckets = buckets;
    this.bucket_s = window_s / buckets;
    this.capacity = 2 * buckets + 4;
    this.t = new double[capacity];
    this.v = new double[capacity];
  }

  /** Adds one sample; times must not decrease. */
  public void add(double time_s, double value) {
    if (Double.isNaN(bucketStart)) {
      startBucket(time_s, value);
      return;
    }
    if (time_s - bucketStart >= bucket_s) {
      flush();
      startBucket(time_s, value);
      return;
    }
    if (value < minV) {
      minV = value;
      minT = time_s;
    }
    if (value > maxV) {
      maxV = value;
      maxT = time_s;
    }
  }

  private void startBucket(double time_s, double value) {
    bucketStart = time_s;
    minV = maxV = value;
    minT = maxT = time_s;
  }

  private void flush() {
    if (minT <= maxT) {
      push(minT, minV);
      if (maxT != minT) {
        push(maxT, maxV);
      }
    } else {
      push(maxT, maxV);
      push(minT, minV);
    }
    double cutoff = bucketStart - window_s;
    while (size > 0 && t[start] < cutoff) {
      start = (start + 1) % capacity;
      size--;
    }
  }

  private void push(double time, double value) {
    if (size == capacity) {
      start = (start + 1) % capacity;
      size--;
    }
    int i = (start + size) % capacity;
    t[i] = time;
    v[i] = value;
    size++;
  }

  /** @return the seconds of history kept */
  public double window_s() {
    return window_s;
  }

  /**
   * A trace over another window with the same number of buckets, holding this one's points (the
   * open bucket included) as far back as the new window reaches.
   *
   * @param window_s seconds of history, greater than 0
   */
  public DisplayTrace resized(double window_s) {
    DisplayTrace d = new DisplayTrace(window_s, buckets);
    int n = size();
    double[] times = new double[n];
    double[] values = new double[n];
    int m = copyTo(times, values);
    for (int i = 0; i < m; i++) {
      d.add(times[i], values[i]);
    }
    return d;
  }

  /** Forgets everything. */
  public void clear() {
    size = 0;
    start = 0;
    bucketStart = Double.NaN;
  }

  /** @return number of points {@link #copyTo} will write (the open bucket included) */
  public int size() {
    return size + (Double.isNaN(bucketStart) ? 0 : (minT == maxT ? 1 : 2));
  }

  /**
   * Copies the points, oldest first, the open bucket last.
   *
   * @return the number written
   */
  public int copyTo(double[] times, double[] values) {
    int n = 0;
    for (int k = 0; k < size && n < times.length; k++) {
      int i = (start + k) % capacity;
      times[n] = t[i];
      values[n++] = v[i];
    }
    if (!Double.isNaN(bucketStart) && n < times.length) {
      boolean minFirst = minT <= maxT;
      times[n] = minFirst ? minT : maxT;
      values[n++] = minFirst ? minV : maxV;
      if (minT != maxT && n < times.length) {
        times[n] = minFirst ? maxT : minT;
        values[n++] = minFirst ? maxV : minV;
      }
    }
    return n;
  }
}
