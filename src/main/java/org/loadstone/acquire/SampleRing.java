package org.loadstone.acquire;

import java.lang.invoke.VarHandle;

/**
 * A bounded ring of raw samples with one writer and any number of readers. The writer never waits:
 * it overwrites the oldest slot. Each reader keeps its own {@link Cursor}; a reader that falls
 * {@link #capacity()} or more samples behind is told how many it lost and jumps to the oldest
 * intact sample. A reader never receives a torn sample (fields from two different samples) or a
 * sample under the wrong index. The writer is the device reader thread; readers are the journal,
 * run control and display feeds.
 *
 * <h2>Why no reader can see a torn sample</h2>
 *
 * {@code head} counts the samples ever written. Sample {@code j} lives in slot {@code j mod
 * capacity}; the writer stores its fields, then publishes {@code head = j + 1}.
 *
 * <ol>
 *   <li><b>A published sample is complete.</b> {@code head} is volatile: its store is a release
 *       and its load an acquire, so a reader that reads {@code head > j} also sees every field
 *       the writer stored for sample {@code j} (or a later store to the same slot).
 *   <li><b>The writer announces a rewrite before it starts it.</b> Sample {@code j + capacity}
 *       reuses sample {@code j}'s slot. The writer stores into that slot only after it has
 *       published {@code head = j + capacity}, and a {@link VarHandle#storeStoreFence()} at the
 *       top of {@link #put} keeps that publication ahead of the slot stores that follow (a
 *       volatile store alone lets later plain stores move before it).
 *   <li><b>The reader copies, then checks.</b> A reader copies sample {@code j}'s fields into
 *       locals, then (after a {@link VarHandle#loadLoadFence()}, which keeps the copy ahead of the
 *       check; a volatile load alone lets earlier plain loads move after it) reads {@code head}
 *       again as {@code after}. If the copy saw even one store of a rewrite (sample {@code j +
 *       capacity} or later), that store came after {@code head = j + capacity} on the writer's
 *       side, so by the two fences {@code after >= j + capacity}. Therefore, when {@code after
 *       - j < capacity}, the copy holds sample {@code j} and nothing else; otherwise it is
 *       discarded and counted as lost. This is the same copy-then-validate order as {@link
 *       java.util.concurrent.locks.StampedLock#validate}.
 * </ol>
 *
 * Consequences: after reading {@code head = h}, the writer may already be rewriting the slot of
 * sample {@code h - capacity}, so the oldest sample a reader can still take intact is {@code h -
 * capacity + 1}: the ring holds {@code capacity - 1} readable samples. A reader at {@code next}
 * with {@code h - next >= capacity} skips to {@code h - capacity + 1} and adds the skipped samples
 * to {@link Cursor#lost()}. Every index from a cursor's start to the head is either delivered
 * once, in order, or counted lost once, so delivered + lost = samples written since the start,
 * exactly ({@code SampleRingStressTest}). Java reads of plain {@code long} fields may tear on
 * 32-bit virtual machines; a torn long is caught by the same check.
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

  /** Heap bytes one slot takes: the six columns. */
  static final int BYTES_PER_SLOT = 4 + 8 + 8 + 4 + 4 + 1;

  /**
   * The slots to ask for, given what the program may use: {@code wanted}, or the largest power
   * of two at or below it whose columns take at most a quarter of the heap the program was
   * given ({@code Runtime.maxMemory()}), never below 2^16 (1.3 s at 50,000 samples/s; the
   * journal writer reads the ring continuously, so a smaller ring loses nothing at the rates a
   * load frame produces while the writer keeps up).
   *
   * @param wanted a power of two from 2^16 to 2^24
   * @param maxHeapBytes the heap the program may use
   */
  public static int capacityFor(int wanted, long maxHeapBytes) {
    int c = wanted;
    while (c > (1 << 16) && (long) c * BYTES_PER_SLOT > maxHeapBytes / 4) {
      c >>= 1;
    }
    return c;
  }

  /**
   * @param capacityPowerOfTwo slots, a power of two from 16 to 2^24; a reader can take up to
   *     {@code capacityPowerOfTwo - 1} samples behind the writer intact (class comment)
   */
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
    long h = head; // only this thread stores head
    // head = h (the previous put) is published before this slot, which holds sample h - capacity,
    // is touched: a reader whose copy sees any store below then reads head >= h (class comment, 2)
    VarHandle.storeStoreFence();
    int i = (int) (h & mask);
    seq[i] = seqNo;
    deviceUs[i] = deviceUsRaw;
    timeUs[i] = timeUsUnwrapped;
    counts[i] = loadCounts;
    position[i] = posCounts;
    hasPosition[i] = hasPos;
    head = h + 1; // release: the stores above are visible to whoever reads head > h
  }

  /** @return index of the oldest sample a reader can still take intact */
  public long oldestIndex() {
    return oldestIntact(head);
  }

  /** The oldest sample intact when head is {@code h}: the writer may be rewriting h - capacity. */
  private long oldestIntact(long h) {
    return Math.max(0, h - capacity + 1);
  }

  /** Whether a copy of sample {@code index} made before head read {@code after} is intact. */
  private boolean intact(long index, long after) {
    return after - index < capacity;
  }

  /**
   * @param index the first sample to read; clamped to the oldest sample still held
   * @return a reader that starts at {@code index}
   */
  public Cursor cursorAt(long index) {
    long h = head;
    return new Cursor(Math.max(oldestIntact(h), Math.min(index, h)));
  }

  /**
   * @param index a sample index still held
   * @return its unwrapped device time in µs
   * @throws IllegalArgumentException when the sample is no longer (or not yet) held
   */
  public long timeUsAt(long index) {
    long h = head;
    if (index < oldestIntact(h) || index >= h) {
      throw notHeld(index, h);
    }
    long t = timeUs[(int) (index & mask)];
    VarHandle.loadLoadFence(); // the copy is read before head (class comment, 3)
    long after = head;
    if (!intact(index, after)) {
      throw notHeld(index, after);
    }
    return t;
  }

  private IllegalArgumentException notHeld(long index, long h) {
    return new IllegalArgumentException("sample " + index + " is not held (held: "
        + oldestIntact(h) + "…" + (h - 1) + ")");
  }

  /** @return a reader that starts at the next sample written */
  public Cursor cursorAtEnd() {
    return new Cursor(head);
  }

  /** @return a reader that starts at the oldest sample still held */
  public Cursor cursorAtOldest() {
    return new Cursor(oldestIndex());
  }

  /**
   * @return a reader that starts {@code samplesBack} samples before the end (or at the oldest
   *     held), e.g. for a pre-trigger history
   */
  public Cursor cursorBack(long samplesBack) {
    long h = head;
    return new Cursor(Math.max(oldestIntact(h), h - Math.max(0, samplesBack)));
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
     * Hands every waiting sample (at most {@code max}) to {@code c}, in index order. Samples the
     * writer overwrote before this reader took them are skipped and added to {@link #lost()}.
     *
     * @return samples delivered
     */
    public int drain(Consumer c, int max) {
      long h = head; // acquire: every sample below h is complete (class comment, 1)
      skipOverwritten(h);
      int n = 0;
      while (next < h && n < max) {
        int i = (int) (next & mask);
        int s = seq[i];
        long d = deviceUs[i];
        long t = timeUs[i];
        int k = counts[i];
        boolean hp = hasPosition[i];
        int p = position[i];
        VarHandle.loadLoadFence(); // the copy above is read before head below (class comment, 3)
        long after = head;
        if (!intact(next, after)) {
          // the writer may have reached this slot while we copied it: drop the copy
          skipOverwritten(after);
          h = after;
          continue;
        }
        c.accept(next, s, d, t, k, hp, p);
        next++;
        n++;
      }
      return n;
    }

    /** Moves past the samples the writer may be overwriting when head is {@code h}. */
    private void skipOverwritten(long h) {
      long oldest = oldestIntact(h);
      if (next < oldest) {
        lost += oldest - next;
        next = oldest;
      }
    }
  }
}
