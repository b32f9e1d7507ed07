package org.loadstone.acquire;

import org.loadstone.HangGuard;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.loadstone.archive.FinishCause;
import org.loadstone.device.Transport;

/**
 * The start is decided on every sample from the arming on, however many samples arrive before
 * the recorder's thread looks at them (as on a fast device or a simulator run faster than real
 * time). Here the test itself is the ring's only writer, so nothing depends on timing: the whole
 * loading ramp is in the ring before the recorder reads a sample.
 */
class TriggerFromArmTest {
  private static final double RATE_HZ = 100;
  private static final double START_N = 5;

  /** A device that never sends anything: the test writes the ring itself. */
  private static final class Silent implements Transport {
    @Override
    public String name() {
      return "silent";
    }

    @Override
    public int read(byte[] buf, int off, int len) {
      return 0;
    }

    @Override
    public void write(byte[] data) {}

    @Override
    public boolean isOpen() {
      return true;
    }

    @Override
    public void close() {}
  }

  /** Force of sample i: 3 s at zero, then a ramp of 10 N/s to 100 N, then a sudden drop. */
  private static double force_N(int i) {
    double t = i / RATE_HZ;
    if (t < 3) {
      return 0;
    }
    double f = 10 * (t - 3);
    return f <= 100 ? f : 1;
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  void loadThatArrivesBeforeTheThreadLooksStillStartsTheRunAtTheCrossing() throws Exception {
    SampleRing ring = new SampleRing(1 << 14);
    DeviceReader reader = new DeviceReader(new Silent(), ring);
    int i = 0;
    for (; i < 50; i++) { // the zero: half a second unloaded
      ring.put(i, i * 10_000L, i * 10_000L, 0, false, 0);
    }
    long afterZero = ring.written();
    // set-up takes a while on the host; meanwhile the whole ramp, the break and a tail arrive
    for (; i < 1600; i++) {
      ring.put(i, i * 10_000L, i * 10_000L, (int) Math.round(force_N(i) * 1000), false, 0);
    }
    MemoryRunStore store = new MemoryRunStore();
    RunSettings s = RunSettings.builder().startThreshold_N(START_N).pretrigger_s(1.0)
        .ratedCapacity_N(1000).build();
    Recorder rec = new Recorder(reader, ForceScale.linear(1000, "test"), 0, s,
        RecorderSimTest.template("ramp", RATE_HZ), store, null);
    rec.arm(afterZero);
    Recorder.Result r = rec.await(HangGuard.S, TimeUnit.SECONDS).orElseThrow();

    assertThat(r.cause()).isEqualTo(FinishCause.BREAK);
    // the ramp reaches 5 N at t = 3.5 s, sample 350; a full second (100 samples) of history
    // before it, which starts at sample 250, below the threshold
    long trigger = 350;
    assertThat(store.firstIndex).isEqualTo(trigger - 100);
    assertThat(store.samples.get(0)[3] / 1000.0).isLessThan(START_N);
    assertThat(store.samples.get(100)[0]).isEqualTo(trigger);
    assertThat(store.samples.get(99)[3] / 1000.0).isLessThan(START_N);
    assertThat(store.samples.get(100)[3] / 1000.0).isGreaterThanOrEqualTo(START_N);
    // every sample from the first to the last, none skipped
    for (int k = 1; k < store.samples.size(); k++) {
      assertThat(store.samples.get(k)[0]).isEqualTo(store.samples.get(k - 1)[0] + 1);
    }
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  void armWithoutAnIndexDecidesFromTheNextSampleWritten() throws Exception {
    SampleRing ring = new SampleRing(1 << 14);
    DeviceReader reader = new DeviceReader(new Silent(), ring);
    // load already on before the arming: those samples are history, not a start
    for (int i = 0; i < 100; i++) {
      ring.put(i, i * 10_000L, i * 10_000L, 50_000, false, 0);
    }
    MemoryRunStore store = new MemoryRunStore();
    RunSettings s = RunSettings.builder().startThreshold_N(START_N).pretrigger_s(0.2)
        .ratedCapacity_N(1000).build();
    Recorder rec = new Recorder(reader, ForceScale.linear(1000, "test"), 0, s,
        RecorderSimTest.template("late", RATE_HZ), store, null);
    rec.arm();
    for (int i = 100; i < 400; i++) {
      int counts = i < 300 ? 60_000 : 0; // 60 N, then the break
      ring.put(i, i * 10_000L, i * 10_000L, counts, false, 0);
    }
    Recorder.Result r = rec.await(HangGuard.S, TimeUnit.SECONDS).orElseThrow();
    assertThat(r.cause()).isEqualTo(FinishCause.BREAK);
    // the first sample decided on is the first written after arm(): index 100, 20 back
    assertThat(store.firstIndex).isEqualTo(80);
  }
}
