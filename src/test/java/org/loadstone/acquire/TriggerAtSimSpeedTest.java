package org.loadstone.acquire;

import org.loadstone.HangGuard;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.loadstone.device.SimSetup;

/**
 * The start trigger on the simulated frame run at 1, 20 and 100 times real time: the press waits
 * for the arming, the start is decided on every sample, so the run's first stored sample is
 * below the start threshold and the pre-trigger history is whole, whatever the speed. Nothing
 * here waits on a clock: latches and the recorder's own result.
 */
class TriggerAtSimSpeedTest {
  private static final double START_N = 5;

  @ParameterizedTest
  @ValueSource(doubles = {1, 20, 100})
  @Timeout(HangGuard.TEST_S)
  void firstStoredSampleIsBelowTheThresholdAndTheHistoryIsWhole(double speed) throws Exception {
    SimSetup setup = new SimSetup("panel-board", 6, 80, false, speed, 0.5);
    double countsPerN = setup.nominalCountsPerN();
    DeviceReader reader = new DeviceReader(setup.openTransport(), new SampleRing(1 << 20));
    reader.start();
    try {
      Tare zero = Tare.take(reader, 40, HangGuard.MS);
      RunSettings s = RunSettings.builder().startThreshold_N(START_N).pretrigger_s(1.0)
          .ratedCapacity_N(1000).build();
      MemoryRunStore store = new MemoryRunStore();
      CountDownLatch started = new CountDownLatch(1);
      Recorder rec = new Recorder(reader, ForceScale.linear(countsPerN, "nominal"),
          zero.counts(), s, RecorderSimTest.template("speed-" + speed, 80), store,
          new Recorder.Listener() {
            @Override
            public void onStarted(RunControl.Started e) {
              started.countDown();
            }
          });
      rec.arm(zero.nextIndex());
      assertThat(started.await(HangGuard.S, TimeUnit.SECONDS)).isTrue();
      rec.stop();
      assertThat(rec.await(HangGuard.S, TimeUnit.SECONDS)).isPresent();

      // 80 samples of history (1 s at 80 samples/s), then the first sample at the threshold
      assertThat(store.samples.size()).isGreaterThanOrEqualTo(81);
      double first_N = (store.samples.get(0)[3] - zero.counts()) / countsPerN;
      assertThat(first_N).as("first stored sample, N").isLessThan(START_N);
      for (int i = 0; i < 80; i++) {
        assertThat((store.samples.get(i)[3] - zero.counts()) / countsPerN)
            .as("history sample %d", i).isLessThan(START_N);
      }
      assertThat((store.samples.get(80)[3] - zero.counts()) / countsPerN)
          .as("trigger sample").isGreaterThanOrEqualTo(START_N);
      for (int i = 1; i < store.samples.size(); i++) {
        assertThat(store.samples.get(i)[0]).isEqualTo(store.samples.get(i - 1)[0] + 1);
        assertThat(store.samples.get(i)[1]).isEqualTo((store.samples.get(i - 1)[1] + 1) & 0xFFFF);
      }
    } finally {
      reader.close();
    }
  }
}
