package org.loadstone.acquire;

/**
 * A bounded copy of a force–crosshead curve for drawing, from its start however long the test
 * runs: samples are taken in groups, and each group contributes its lowest and its highest force
 * (in the order they came), so a load drop shorter than a pixel still shows. When the copy is full,
 * neighbouring groups are merged the same way and groups become twice as long. Holds at most
 * {@code capacity} points. Single thread.
 */
public final class CurveTrace {
  private final int capacity;
  private final double[] x;
  private final double[] y;
  private int size;
  /** Samples per group. */
  private long groupSamples = 1;
  /** The open group: samples in it, its lowest and highest points and where in it they came. */
  private long open;
  private double loX;
  private double loY;
  private double hiX;
  private double hiY;
  private long loAt;
  private long hiAt;

  /**
   * @param capacity most points kept, a multiple of 4, at least 8 (about twice the chart's pixel
   *     width)
   */
  public CurveTrace(int capacity) {
    if (capacity < 8 || capacity % 4 != 0) {
      throw new IllegalArgumentException("capacity must be a multiple of 4, at least 8: " + capacity);
    }
    this.capacity = capacity;
    this.x = new double[capacity];
    this.y = new double[capacity];
  }

  /** Adds one sample: crosshead position (any unit) and force. */
  public void add(double position, double force) {
    if (open == 0 || force < loY) {
      loX = position;
      loY = force;
      loAt = open;
    }
    if (open == 0 || force > hiY) {
      hiX = position;
      hiY = force;
      hiAt = open;
    }
    open++;
    if (open == groupSamples) {
      if (size + 2 > capacity) {
        merge();
      }
      size = put(x, y, size);
      open = 0;
    }
  }

  /** Writes the open group's two points in the order they came, from {@code at}; returns the end. */
  private int put(double[] xs, double[] ys, int at) {
    boolean loFirst = loAt <= hiAt;
    xs[at] = loFirst ? loX : hiX;
    ys[at] = loFirst ? loY : hiY;
    xs[at + 1] = loFirst ? hiX : loX;
    ys[at + 1] = loFirst ? hiY : loY;
    return at + 2;
  }

  /** Halves the points: each pair of neighbouring groups keeps its lowest and highest point. */
  private void merge() {
    int n = 0;
    for (int i = 0; i + 3 < size; i += 4) {
      int lo = i;
      int hi = i;
      for (int k = i + 1; k < i + 4; k++) {
        if (y[k] < y[lo]) {
          lo = k;
        }
        if (y[k] > y[hi]) {
          hi = k;
        }
      }
      int first = Math.min(lo, hi);
      int second = Math.max(lo, hi);
      double fx = x[first];
      double fy = y[first];
      double sx = x[second];
      double sy = y[second];
      x[n] = fx;
      y[n++] = fy;
      x[n] = sx;
      y[n++] = sy;
    }
    size = n;
    groupSamples *= 2;
  }

  /** Forgets the curve, to start a new one. */
  public void clear() {
    size = 0;
    open = 0;
    groupSamples = 1;
  }

  /** @return the number of points {@link #copyTo} writes (the open group included) */
  public int size() {
    return size + (open == 0 ? 0 : 2);
  }

  /**
   * Copies the points in the order they came, the open group last.
   *
   * @return the number written
   */
  public int copyTo(double[] xs, double[] ys) {
    int n = Math.min(size, xs.length);
    System.arraycopy(x, 0, xs, 0, n);
    System.arraycopy(y, 0, ys, 0, n);
    if (open > 0 && n == size && n + 2 <= xs.length) {
      n = put(xs, ys, n);
    }
    return n;
  }
}
