package org.loadstone.acquire;

import org.loadstone.HangGuard;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicReference;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.loadstone.archive.FinishCause;
import org.loadstone.archive.RunMetadata;
import org.loadstone.device.SimSetup;
import org.loadstone.device.SimTransport;

/**
 * A device that restarts during a run (issue 14: the run went on across the restart, its time
 * axis jumped by the device clock's wrap and a false break was declared): the run ends with
 * cause {@code device-reset} at the last sample before the restart, on one even time axis, and a
 * restart while armed starts nothing.
 */
@Tag("fault")
class DeviceResetTest {
  private static final int RATE = 1000;

  @ParameterizedTest(name = "identity {0}, clock restarts {1}")
  @CsvSource({"true, true", "false, true", "false, false"})
  @Timeout(HangGuard.TEST_S)
  void aRestartDuringARunEndsItAtTheLastSampleBefore(boolean identity, boolean clock)
      throws Exception {
    SimSetup setup = new SimSetup("brittle", 3, RATE, false, 4);
    SimTransport t = setup.openTransport();
    DeviceReader reader = new DeviceReader(t, new SampleRing(1 << 20));
    reader.start();
    double zero = Tare.counts(reader, 200, 5000);
    RunSettings s = RunSettings.builder().startThreshold_N(5).pretrigger_s(0.1)
        .ratedCapacity_N(500).build();
    MemoryRunStore store = new MemoryRunStore();
    CountDownLatch started = new CountDownLatch(1);
    Recorder rec = new Recorder(reader, ForceScale.linear(setup.nominalCountsPerN(), "nominal"),
        zero, s, RecorderSimTest.template("reset", RATE), store, new Recorder.Listener() {
          @Override
          public void onStarted(RunControl.Started e) {
            started.countDown();
          }
        });
    rec.startNow();
    started.await();
    long before = reader.samplesAccepted();
    while (reader.samplesAccepted() < before + 300) {
      Thread.sleep(2); // some of the run recorded (a count, not a time)
    }
    t.restartDevice(identity, clock);
    Recorder.Result r = rec.await(HangGuard.S, TimeUnit.SECONDS).orElseThrow();
    long resetAt = reader.firstResetFrom(0);
    reader.close();

    assertThat(resetAt).as("the restart was seen").isLessThan(Long.MAX_VALUE);
    assertThat(reader.resetReason()).hasValueSatisfying(why -> assertThat(why).contains(
        identity ? "sent its identity again"
            : clock ? "device clock jumped" : "sequence started over"));
    assertThat(r.cause()).isEqualTo(FinishCause.DEVICE_RESET);
    RunMetadata m = store.finalMeta;
    assertThat(m.cause()).isEqualTo(FinishCause.DEVICE_RESET);
    assertThat(m.breakIndex()).as("no false break").isNull();
    assertThat(r.dropped()).as("a sequence that started over is no loss").isZero();
    assertThat(m.warnings()).anySatisfy(w -> assertThat(w).contains("restarted")
        .contains("last sample before the restart"));
    // every sample from the run's first to the one before the restart, none after
    assertThat(store.samples.get(store.samples.size() - 1)[0]).isEqualTo(resetAt - 1);
    assertThat(store.samples).hasSize((int) (resetAt - store.firstIndex));
    // one even time axis: the device clock's step of one sample at 1 kS/s (the simulated
    // clock's own jitter aside), every sample
    for (int i = 1; i < store.samples.size(); i++) {
      assertThat(store.samples.get(i)[2] - store.samples.get(i - 1)[2]).isBetween(990L, 1010L);
    }
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  void aRestartWhileArmedEndsTheWaitWithoutARun() throws Exception {
    SimSetup setup = new SimSetup("brittle", 4, RATE, false, 4);
    SimTransport t = setup.openTransport();
    DeviceReader reader = new DeviceReader(t, new SampleRing(1 << 20));
    reader.start();
    double zero = Tare.counts(reader, 100, 5000);
    RunSettings s = RunSettings.builder().startThreshold_N(1e6).ratedCapacity_N(2e6).build();
    MemoryRunStore store = new MemoryRunStore();
    AtomicReference<String> why = new AtomicReference<>();
    Recorder rec = new Recorder(reader, ForceScale.linear(setup.nominalCountsPerN(), "nominal"),
        zero, s, RecorderSimTest.template("armed", RATE), store, new Recorder.Listener() {
          @Override
          public void onDisarmed(String text) {
            why.set(text);
          }
        });
    rec.arm();
    while (Double.isNaN(rec.status().force_N())) {
      Thread.sleep(2); // until the armed recorder has weighed a sample
    }
    t.restartDevice(true, true);
    assertThat(rec.await(HangGuard.S, TimeUnit.SECONDS)).isEmpty();
    assertThat(rec.ended()).isTrue();
    // the live time axis goes on by one sample across the restart, no jump
    long resetAt = reader.firstResetFrom(0);
    while (reader.ring().written() <= resetAt) {
      Thread.sleep(2);
    }
    long step = reader.ring().timeUsAt(resetAt) - reader.ring().timeUsAt(resetAt - 1);
    reader.close();
    assertThat(why.get()).contains("restarted before load came on").contains("no run stored");
    assertThat(store.startMeta).as("nothing started").isNull();
    assertThat(step).isBetween(990L, 1010L);
  }
}
