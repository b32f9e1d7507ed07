package org.loadstone.acquire;

/**
 * A bounded ring of raw samples with one writer and any number of readers. The writer never waits:
 * it overwrites the oldest slot. Each reader keeps its own {@link Cursor}; a reader that falls more
 * than {@link #capacity()} samples behind is told how many it lost and jumps ahead. The writer is
 * the device reader thread; readers are the journal, run control and display feeds.
 */
public final class SampleRing {
  private final int capacity;
  private final int mask;
  private final int[] seq;
  private final long[] deviceUs;
  private final long[] timeUs;
  private final int[] counts;
  private final int[] position;
  private final boolean[] hasPosition;
  private volatile long head; // number of samples ever written

  /** @param capacityPowerOfTwo slots, a power of two from 16 to 2^24 */
  public SampleRing(int capacityPowerOfTwo) {
    if (capacityPowerOfTwo < 16 || capacityPowerOfTwo > (1 << 24)
        || Integer.bitCount(capacityPowerOfTwo) != 1) {
      throw new IllegalArgumentException(
          "capacity must be a power of two from 16 to 2^24, was " + capacityPowerOfTwo);
    }
    capacity = capacityPowerOfTwo;
    mask = capacity - 1;
    seq = new int[capacity];
    deviceUs = new long[capacity];
    timeUs = new long[capacity];
    counts = new int[capacity];
    position = new int[capacity];
    hasPosition = new boolean[capacity];
  }

  /** @return number of slots */
  public int capacity() {
    return capacity;
  }

  /** @return samples ever written */
  public long written() {
    return head;
  }

  /**
   * Appends one sample. Only the single writer thread may call this.
   *
   * @param timeUs unwrapped device time in µs since the stream began
   */
  public void put(int seqNo, long deviceUsRaw, long timeUsUnwrapped, int loadCounts,
      boolean hasPos, int posCounts) {
    long h = head;
    int i = (int) (h & mask);
    seq[i] = seqNo;
    deviceUs[i] = deviceUsRaw;
    timeUs[i] = timeUsUnwrapped;
    counts[i] = loadCounts;
    position[i] = posCounts;
    hasPosition[i] = hasPos;
    head = h + 1;
  }

  /** @return index of the oldest sample still held */
  public long oldestIndex() {
    return Math.max(0, head - capacity);
  }

  /**
   * @param index the first sample to read; clamped to the oldest sample still held
   * @return a reader that starts at {@code index}
   */
  public Cursor cursorAt(long index) {
    return new Cursor(Math.max(oldestIndex(), Math.min(index, head)));
  }

  /**
   * @param index a sample index still held
   * @return its unwrapped device time in µs
   * @throws IllegalArgumentException when the sample is no longer (or not yet) held
   */
  public long timeUsAt(long index) {
    long h = head;
    if (index < Math.max(0, h - capacity) || index >= h) {
      throw new IllegalArgumentException("sample " + index + " is not held (held: "
          + Math.max(0, h - capacity) + "…" + (h - 1) + ")");
    }
    return timeUs[(int) (index & mask)];
  }

  /** @return a reader that starts at the next sample written */
  public Cursor cursorAtEnd() {
    return new Cursor(head);
  }

  /** @return a reader that starts at the oldest sample still held */
  public Cursor cursorAtOldest() {
    return new Cursor(Math.max(0, head - capacity));
  }

  /**
   * @return a reader that starts {@code samplesBack} samples before the end (or at the oldest
   *     held), e.g. for a pre-trigger history
   */
  public Cursor cursorBack(long samplesBack) {
    long h = head;
    return new Cursor(Math.max(Math.max(0, h - capacity), h - Math.max(0, samplesBack)));
  }

  /** Receives samples from {@link Cursor#drain}. */
  public interface Consumer {
    /** One sample; {@code index} counts samples ever written to the ring. */
    void accept(long index, int seq, long deviceUs, long timeUs, int counts, boolean hasPosition,
        int position);
  }

  /** One reader's position. Not shared between threads. */
  public final class Cursor {
    private long next;
    private long lost;

    private Cursor(long start) {
      next = start;
    }

    /** @return samples this reader missed because it fell behind */
    public long lost() {
      return lost;
    }

    /** @return samples waiting for this reader */
    public long available() {
      return head - next;
    }

    /** @return index of the next sample this reader will see */
    public long position() {
      return next;
    }

    /**
     * Hands every waiting sample (at most {@code max}) to {@code c}.
     *
     * @return samples delivered
     */
    public int drain(Consumer c, int max) {
      long h = head;
      if (h - next > capacity) {
        lost += h - capacity - next;
        next = h - capacity;
      }
      int n = 0;
      while (next < h && n < max) {
        int i = (int) (next & mask);
        int s = seq[i];
        long d = deviceUs[i];
        long t = timeUs[i];
        int k = counts[i];
        boolean hp = hasPosition[i];
        int p = position[i];
        if (head - next > capacity) {
          // overwritten while we read it: skip ahead and count the loss
          long nh = head;
          lost += nh - capacity - next;
          next = nh - capacity;
          continue;
        }
        c.accept(next, s, d, t, k, hp, p);
        next++;
        n++;
      }
      return n;
    }
  }
}
