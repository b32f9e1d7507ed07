package org.loadstone.acquire;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.concurrent.CyclicBarrier;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicLong;
import java.util.concurrent.locks.LockSupport;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;

/**
 * One writer and three readers on a 16-slot ring, running freely against each other. Every field
 * of sample {@code i} is a different function of {@code i}, so a reader can tell a torn sample
 * (fields from two samples) from a mislabelled one (a whole sample handed out under another
 * index). Each reader must see none of either, indices strictly increasing, and delivered + lost
 * equal to the samples written, exactly.
 *
 * <p>The readers lag in three ways: one drains as fast as it can, one pauses at random (yields,
 * spins, short parks), one waits until it is 14 to 17 samples behind — at the edge where the
 * writer rewrites the slot being read — before taking a few. Rounds and samples are counted, not
 * timed ({@link StressSettings}); before the fix, the same harness found thousands of torn and
 * mislabelled samples per round.
 */
class SampleRingStressTest {
  private static final int CAPACITY = 16;
  private static final int SAMPLES_PER_ROUND = 50_000;
  private static final int ROUNDS = 4;

  static int seqOf(long i) {
    return (int) i;
  }

  static long deviceUsOf(long i) {
    return i * 1_000_003L + 17;
  }

  static long timeUsOf(long i) {
    return ~i ^ 0x5A5A_5A5A_0000_0000L;
  }

  static int countsOf(long i) {
    return (int) (i * 0x9E37_79B9L) ^ 0x0F0F_0F0F;
  }

  static boolean hasPositionOf(long i) {
    return (i & 1) == 0;
  }

  static int positionOf(long i) {
    return (int) (i * 31 + 7);
  }

  /** What one reader saw in one round. */
  static final class Tally implements SampleRing.Consumer {
    long delivered;
    long torn;
    long mislabelled;
    long outOfOrder;
    long last = -1;

    @Override
    public void accept(long index, int seq, long deviceUs, long timeUs, int counts,
        boolean hasPosition, int position) {
      delivered++;
      if (index <= last) {
        outOfOrder++;
      }
      last = index;
      long j = seq & 0xFFFF_FFFFL; // the sample the seq field came from (indices stay < 2^32)
      boolean whole = deviceUs == deviceUsOf(j) && timeUs == timeUsOf(j)
          && counts == countsOf(j) && hasPosition == hasPositionOf(j)
          && position == positionOf(j);
      if (!whole) {
        torn++;
      } else if (j != index) {
        mislabelled++;
      }
    }
  }

  private interface Lag {
    /** Waits as this reader waits, then drains; returns when the round is over for it. */
    void drainOnce(SampleRing ring, SampleRing.Cursor c, Tally t, SplittableRandom r);
  }

  private static final Lag EAGER = (ring, c, t, r) -> {
    if (c.drain(t, 64) == 0) {
      Thread.onSpinWait();
    }
  };

  private static final Lag PAUSING = (ring, c, t, r) -> {
    c.drain(t, 1 + r.nextInt(24));
    switch (r.nextInt(4)) {
      case 0 -> Thread.yield();
      case 1 -> {
        for (int k = r.nextInt(2000); k > 0; k--) {
          Thread.onSpinWait();
        }
      }
      case 2 -> LockSupport.parkNanos(r.nextInt(200_000));
      default -> { }
    }
  };

  private static Lag atTheEdge(long total) {
    return (ring, c, t, r) -> {
      long behind = CAPACITY - 2 + r.nextInt(4); // 14…17 samples behind the writer
      long target = Math.min(total, c.position() + behind);
      while (ring.written() < target) {
        Thread.onSpinWait();
      }
      c.drain(t, 1 + r.nextInt(4));
    };
  }

  /** A reader thread's cursor, tally and published position (for the writer's pacing). */
  private record Reader(Lag lag, boolean pacesWriter, SampleRing.Cursor cursor, Tally tally,
      AtomicLong position) {}

  @Test
  @Timeout(value = 30, unit = TimeUnit.MINUTES) // a hang guard only; a normal run takes seconds
  void noReaderSeesATornOrMislabelledSampleAndEveryLossIsCounted() throws Exception {
    int rounds = ROUNDS * StressSettings.scale();
    long seed = StressSettings.seed();
    long delivered = 0;
    long torn = 0;
    long mislabelled = 0;
    long outOfOrder = 0;
    for (int round = 0; round < rounds; round++) {
      for (Tally t : round(SAMPLES_PER_ROUND, new SplittableRandom(seed + round))) {
        delivered += t.delivered;
        torn += t.torn;
        mislabelled += t.mislabelled;
        outOfOrder += t.outOfOrder;
      }
    }
    String summary = String.format("%d rounds, %d samples written, %d delivered to three readers,"
        + " %d torn, %d mislabelled, %d out of order (seed %d)", rounds,
        (long) rounds * SAMPLES_PER_ROUND, delivered, torn, mislabelled, outOfOrder, seed);
    System.out.println("SampleRingStressTest: " + summary);
    assertThat(torn).as("torn samples: " + summary).isZero();
    assertThat(mislabelled).as("mislabelled samples: " + summary).isZero();
    assertThat(outOfOrder).as("indices out of order: " + summary).isZero();
  }

  /**
   * One writer, three readers from index 0; returns each reader's tally once all are done. Every
   * 1024 samples the writer waits until the eager and the edge reader are within two rings of it,
   * so they run beside the writer even when the machine is busy, rather than after it; the
   * pausing reader is never waited for.
   */
  private static List<Tally> round(int total, SplittableRandom random) throws Exception {
    SampleRing ring = new SampleRing(CAPACITY);
    List<Reader> readers = new ArrayList<>();
    for (Lag lag : List.of(EAGER, PAUSING, atTheEdge(total))) {
      readers.add(new Reader(lag, lag != PAUSING, ring.cursorAtOldest(), new Tally(),
          new AtomicLong()));
    }
    CyclicBarrier go = new CyclicBarrier(readers.size() + 1);
    List<Thread> threads = new ArrayList<>();
    for (Reader rd : readers) {
      SplittableRandom r = random.split();
      threads.add(new Thread(() -> {
        await(go);
        while (rd.cursor().position() < total) {
          rd.lag().drainOnce(ring, rd.cursor(), rd.tally(), r);
          rd.position().set(rd.cursor().position());
        }
      }, "ring-reader"));
    }
    threads.forEach(Thread::start);
    SplittableRandom w = random.split();
    await(go);
    for (long i = 0; i < total; i++) {
      ring.put(seqOf(i), deviceUsOf(i), timeUsOf(i), countsOf(i), hasPositionOf(i), positionOf(i));
      for (int k = w.nextInt(16); k > 0; k--) {
        Thread.onSpinWait(); // a device's pace varies: the readers sometimes keep up, sometimes not
      }
      if ((i & 1023) == 1023) {
        for (Reader rd : readers) {
          while (rd.pacesWriter() && rd.position().get() < i - 2 * CAPACITY) {
            Thread.yield();
          }
        }
      }
    }
    for (Thread th : threads) {
      th.join();
    }
    for (Reader rd : readers) {
      // every sample was either delivered once or counted lost once (checked every round)
      assertThat(rd.tally().delivered + rd.cursor().lost())
          .as("delivered + lost, reader %s", rd.lag()).isEqualTo(total);
    }
    // the edge reader waited until it was 14 to 17 behind before each drain, half the time a ring
    // or more: it must have lost samples
    assertThat(readers.get(2).cursor().lost()).as("losses of the reader at the edge").isPositive();
    return readers.stream().map(Reader::tally).toList();
  }

  private static void await(CyclicBarrier b) {
    try {
      b.await();
    } catch (Exception e) {
      throw new IllegalStateException(e);
    }
  }
}
