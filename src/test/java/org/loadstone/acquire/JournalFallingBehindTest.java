package org.loadstone.acquire;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayOutputStream;
import java.nio.ByteBuffer;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicLong;
import java.util.concurrent.locks.LockSupport;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.loadstone.archive.JournalFormat;

/**
 * A journal writer that falls a ring or more behind stores no torn sample and reports exactly how
 * many it lost; and it forces the file within {@value JournalWriter#FORCE_INTERVAL_MS} ms of every
 * sample, measured on an injected clock, without forcing more often than that.
 */
class JournalFallingBehindTest {
  private static final Path FILE = Path.of("memory.journal");

  /** A disk in memory that counts forces and can be slow. */
  static final class MemorySink implements JournalSink {
    final ByteArrayOutputStream bytes = new ByteArrayOutputStream();
    long forces;
    private final SplittableRandom slow;

    MemorySink(SplittableRandom slow) {
      this.slow = slow;
    }

    @Override
    public void write(ByteBuffer records) {
      if (slow != null && slow.nextInt(4) == 0) {
        LockSupport.parkNanos(slow.nextInt(300_000)); // a disk that stalls now and then
      }
      synchronized (bytes) {
        bytes.write(records.array(), records.position(), records.remaining());
      }
      records.position(records.limit());
    }

    @Override
    public void force() {
      forces++;
    }

    @Override
    public void close() {}

    /** @return the ring indices of the records, after checking each against its index */
    List<Long> checkedIndices() {
      ByteBuffer b;
      synchronized (bytes) {
        b = ByteBuffer.wrap(bytes.toByteArray());
      }
      assertThat(b.remaining() % JournalFormat.RECORD_BYTES).isZero();
      List<Long> indices = new ArrayList<>();
      while (b.hasRemaining()) {
        long i = b.getLong();
        // layout from JournalFormat: index, time_us, device_us, counts, position, seq, flags, crc
        String what = "record for sample " + i;
        assertThat(b.getLong()).as(what).isEqualTo(JournalSamples.timeUs(i));
        assertThat(b.getLong()).as(what).isEqualTo(JournalSamples.deviceUs(i));
        assertThat(b.getInt()).as(what).isEqualTo(JournalSamples.counts(i));
        assertThat(b.getInt()).as(what).isEqualTo(JournalSamples.position(i));
        assertThat(b.getInt()).as(what).isEqualTo(JournalSamples.seq(i));
        assertThat(b.getInt()).as(what).isEqualTo(1);
        b.getInt();
        if (!indices.isEmpty()) {
          assertThat(i).as("index after %d", indices.get(indices.size() - 1))
              .isGreaterThan(indices.get(indices.size() - 1));
        }
        indices.add(i);
      }
      return indices;
    }
  }

  @Test
  void exactlyOneRingBehindTheOldestSlotIsCountedLostNotStored() throws Exception {
    SampleRing ring = new SampleRing(16);
    MemorySink disk = new MemorySink(null);
    JournalWriter w = new JournalWriter(FILE, disk, ring.cursorAtEnd(), () -> 0);
    for (long i = 0; i < 16; i++) {
      JournalSamples.put(ring, i);
    }
    // 16 behind a 16-slot ring: sample 0's slot is the one the device side rewrites next
    assertThat(w.pass()).isEqualTo(15);
    assertThat(w.samplesLost()).isEqualTo(1);
    assertThat(disk.checkedIndices()).first().isEqualTo(1L);

    for (long i = 16; i < 56; i++) {
      JournalSamples.put(ring, i);
    }
    // 40 behind: samples 16…40 are gone, 41…55 are kept
    assertThat(w.pass()).isEqualTo(15);
    assertThat(w.samplesLost()).isEqualTo(1 + 25);
    List<Long> kept = disk.checkedIndices();
    assertThat(kept).hasSize(30).contains(15L, 41L).doesNotContain(16L, 40L);
    assertThat(w.samplesWritten() + w.samplesLost()).isEqualTo(56);
  }

  @Test
  @Timeout(value = 30, unit = TimeUnit.MINUTES) // a hang guard only; a normal run takes seconds
  void aJournalFallingBehindAStreamingDeviceStoresNoTornSampleAndCountsEveryLoss()
      throws Exception {
    long seed = StressSettings.seed();
    int rounds = 3 * StressSettings.scale();
    long totalLost = 0;
    for (int round = 0; round < rounds; round++) {
      SplittableRandom random = new SplittableRandom(seed + round);
      SampleRing ring = new SampleRing(16);
      MemorySink disk = new MemorySink(random.split());
      JournalWriter w = new JournalWriter(FILE, disk, ring.cursorAtEnd(), System::nanoTime)
          .begin();
      SplittableRandom device = random.split();
      int total = 30_000;
      for (long i = 0; i < total; i++) {
        JournalSamples.put(ring, i);
        for (int k = device.nextInt(16); k > 0; k--) {
          Thread.onSpinWait(); // a device's pace varies
        }
        while ((i & 511) == 511 && w.samplesWritten() + w.samplesLost() < i - 32) {
          Thread.yield(); // every 512 samples, let the journal come within two rings
        }
      }
      w.finish();
      List<Long> kept = disk.checkedIndices(); // no torn or mislabelled record
      String who = "round " + round + " (seed " + seed + ")";
      assertThat((long) kept.size()).as(who).isEqualTo(w.samplesWritten());
      assertThat(w.samplesWritten() + w.samplesLost()).as("written + lost, " + who)
          .isEqualTo(total);
      assertThat(kept).as("the last sample is always kept, " + who).last()
          .isEqualTo(total - 1L);
      totalLost += w.samplesLost();
    }
    System.out.printf("JournalFallingBehindTest: %d rounds of 30000 samples, %d lost and"
        + " counted, none torn (seed %d)%n", rounds, totalLost, seed);
  }

  @Test
  void theJournalIsForcedWithinTheIntervalOfEverySampleAndNoMoreOften() throws Exception {
    // DESIGN.md "Nothing lost": fsync at most 100 ms after a sample arrives
    SampleRing ring = new SampleRing(1 << 12);
    MemorySink disk = new MemorySink(null);
    AtomicLong now_ms = new AtomicLong();
    JournalWriter w = new JournalWriter(FILE, disk, ring.cursorAtEnd(),
        () -> TimeUnit.MILLISECONDS.toNanos(now_ms.get()));
    SplittableRandom gaps = new SplittableRandom(StressSettings.seed());
    long[] putAt_ms = new long[20_000];
    long put = 0;
    long durable = 0;
    long worstLag_ms = 0;
    int longestGap_ms = 0;
    while (now_ms.get() < 10_000) {
      // 1 000 samples/s; the writer's passes come 1 to 8 ms apart (polls, a busy machine)
      int gap = 1 + gaps.nextInt(8);
      longestGap_ms = Math.max(longestGap_ms, gap);
      for (int k = 0; k < gap; k++) {
        putAt_ms[(int) put] = now_ms.get();
        JournalSamples.put(ring, put++);
        now_ms.incrementAndGet();
      }
      w.pass();
      for (; durable < w.samplesDurable(); durable++) {
        worstLag_ms = Math.max(worstLag_ms, now_ms.get() - putAt_ms[(int) durable]);
      }
    }
    assertThat(w.samplesLost()).isZero();
    assertThat(durable).isGreaterThan(put - JournalWriter.FORCE_INTERVAL_MS - longestGap_ms);
    // a sample waits for the next pass, then at most one force interval (and one pass late)
    assertThat(worstLag_ms).isLessThanOrEqualTo(JournalWriter.FORCE_INTERVAL_MS
        + 2L * longestGap_ms).isLessThanOrEqualTo(100);
    // and the disk is forced once per interval (one pass late at most), never more often
    assertThat(disk.forces).isBetween(10_000 / (JournalWriter.FORCE_INTERVAL_MS + longestGap_ms),
        10_000 / JournalWriter.FORCE_INTERVAL_MS);
  }
}
