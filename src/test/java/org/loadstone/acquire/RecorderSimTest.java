package org.loadstone.acquire;

import org.loadstone.HangGuard;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Instant;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.loadstone.archive.FinishCause;
import org.loadstone.archive.RunMetadata;
import org.loadstone.archive.ScaleSpec;
import org.loadstone.device.SimSetup;
import org.loadstone.device.SimTransport;
import org.loadstone.sim.SimTruth;
import org.loadstone.sim.SimulatedFrame;

/** Hands-free runs end to end on the simulated frame: bytes, decoder, ring, run control. */
class RecorderSimTest {

  static RunMetadata template(String specimen, double rate) {
    return RunMetadata.builder()
        .runId("test-" + specimen)
        .startedAt(Instant.now())
        .specimen(specimen)
        .group("g")
        .tags(List.of())
        .operator("")
        .notes("")
        .device(Map.of())
        .sampleRate_Hz(rate)
        .scale("nominal")
        .scaleSpec(ScaleSpec.nominal(1))
        .zeroOffset_counts(0)
        .dropped(0)
        .checksumErrors(0)
        .cause(FinishCause.MANUAL)
        .pretrigger_s(1.0)
        .warnings(List.of())
        .softwareVersion("test")
        .extra(Map.of())
        .build();
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  void stoppedBeforeLoadComesOnItSaysSoAndStoresNothing() throws Exception {
    SimSetup setup = new SimSetup("brittle", 5, 1000, false, 1);
    DeviceReader reader = new DeviceReader(setup.openTransport(), new SampleRing(1 << 20));
    reader.start();
    double zero = Tare.counts(reader, 100, HangGuard.MS);
    // a start level the specimen never reaches
    RunSettings s = RunSettings.builder().startThreshold_N(1e6).ratedCapacity_N(2e6).build();
    MemoryRunStore store = new MemoryRunStore();
    java.util.concurrent.atomic.AtomicReference<String> why =
        new java.util.concurrent.atomic.AtomicReference<>();
    Recorder rec = new Recorder(reader, ForceScale.linear(setup.nominalCountsPerN(), "nominal"),
        zero, s, template("never", 1000), store, new Recorder.Listener() {
          @Override
          public void onDisarmed(String text) {
            why.set(text);
          }
        });
    rec.arm();
    while (Double.isNaN(rec.status().force_N())) {
      Thread.sleep(5); // until the armed recorder has weighed a sample
    }
    rec.stop();
    assertThat(rec.await(HangGuard.S, TimeUnit.SECONDS)).isEmpty();
    assertThat(rec.ended()).as("the recorder ended, not only the wait").isTrue();
    reader.close();
    assertThat(why.get()).isEqualTo("disarmed before load came on: no run stored");
    assertThat(store.startMeta).as("no run begun").isNull();
    assertThat(store.finalMeta).isNull();
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  void brittleRunStopsAtTheBreakWithTheTruePeakAndKeepsThePretrigger() throws Exception {
    int rate = 1000;
    SimSetup setup = new SimSetup("brittle", 5, rate, false, 8);
    SimulatedFrame truthFrame = setup.buildFrame();
    SimTransport t = setup.openTransport();
    DeviceReader reader = new DeviceReader(t, new SampleRing(1 << 20));
    reader.start();
    double countsPerN = setup.nominalCountsPerN();
    double zero = Tare.counts(reader, 200, HangGuard.MS);
    // the simulated press starts 1 s after the arming and touches the specimen 0.6 s later: 0.3 s
    // of history fits
    RunSettings s = RunSettings.builder().startThreshold_N(5).pretrigger_s(0.3)
        .ratedCapacity_N(500).build();
    MemoryRunStore store = new MemoryRunStore();
    Recorder rec = new Recorder(reader, ForceScale.linear(countsPerN, "nominal"), zero, s,
        template("b1", rate).toBuilder().device(Map.of("cpm", "400")).build(), store, null);
    rec.arm();
    Recorder.Result r = rec.await(HangGuard.S, TimeUnit.SECONDS).orElseThrow();
    reader.close();
    // the status line's travel: position counts since arming over the stated 400 counts/mm; the
    // press stands still until 1 s after arming, so the oldest sample in the ring (read for the
    // tare) is where it stood when armed
    long[] atRest = new long[1];
    reader.ring().cursorAtOldest().drain((i, seq, dev, tUs, counts, hp, pos) -> atRest[0] = pos,
        1);
    long[] last = store.samples.get(store.samples.size() - 1);
    assertThat(rec.status().travel_mm()).isEqualTo((last[4] - atRest[0]) / 400.0);
    assertThat(rec.status().travel_mm()).isPositive();

    assertThat(r.cause()).isEqualTo(FinishCause.BREAK);
    assertThat(r.dropped()).isZero();
    // ground truth: run the same model to the end and read its peak (its press started at once:
    // the same specimen at the same rate reaches the same peak whenever it starts)
    truthFrame.operatorStarts();
    for (int i = 0; i < 200_000 && !truthFrame.truth().broken(); i++) {
      truthFrame.next((a, b, c, d) -> { });
    }
    for (int i = 0; i < 2000; i++) {
      truthFrame.next((a, b, c, d) -> { });
    }
    SimTruth truth = truthFrame.truth();
    double noiseStep_N = truth.loadCell().noiseRms_counts() / countsPerN;
    double zeroError_N = Math.abs(zero - truth.loadCell().zeroOffset_counts()) / countsPerN;
    // the recorded peak is the true peak within one noise step (plus the tare's own error, which
    // is the mean of 200 samples: noise/sqrt(200)), and the cell's non-linearity at that load
    double nonLin_N = truth.loadCell().nonLinearity_pctFS() / 100 * truth.loadCell().capacity_N();
    assertThat(Math.abs(r.peak_N() - truth.peakForce_N()))
        .isLessThanOrEqualTo(noiseStep_N + zeroError_N + nonLin_N + 1e-9);
    // pre-trigger history: exactly 0.3 s (300 samples) before the first sample at 5 N or more
    RunMetadata m = store.finalMeta;
    assertThat(m.cause()).isEqualTo(FinishCause.BREAK);
    assertThat(m.breakIndex()).isNotNull();
    double firstT = store.samples.get(0)[2] / 1e6;
    double breakT = store.samples.get(m.breakIndex())[2] / 1e6;
    int trigger = -1;
    for (int i = 0; i < store.samples.size() && trigger < 0; i++) {
      if ((store.samples.get(i)[3] - zero) / countsPerN >= 5.0) {
        trigger = i;
      }
    }
    assertThat(trigger).isEqualTo(300);
    assertThat(m.pretrigger_s()).isEqualTo(0.3);
    // the tail: 0.5 s after the break
    double lastT = store.samples.get(store.samples.size() - 1)[2] / 1e6;
    assertThat(lastT - breakT).isBetween(0.5, 0.52);
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  void overRangeSpecimenStopsForOverload() throws Exception {
    SimSetup setup = new SimSetup("over-range", 2, 1000, false, 8);
    DeviceReader reader = new DeviceReader(setup.openTransport(), new SampleRing(1 << 20));
    reader.start();
    double k = setup.nominalCountsPerN();
    double zero = Tare.counts(reader, 100, HangGuard.MS);
    double capacity = setup.buildFrame().truth().loadCell().capacity_N();
    RunSettings s = RunSettings.builder().ratedCapacity_N(capacity).build();
    MemoryRunStore store = new MemoryRunStore();
    List<String> warnings = new java.util.concurrent.CopyOnWriteArrayList<>();
    Recorder rec = new Recorder(reader, ForceScale.linear(k, "nominal"), zero, s,
        template("o1", 1000), store, new Recorder.Listener() {
          @Override
          public void onWarning(String text) {
            warnings.add(text);
          }
        });
    rec.arm();
    Recorder.Result r = rec.await(HangGuard.S, TimeUnit.SECONDS).orElseThrow();
    reader.close();
    assertThat(r.cause()).isEqualTo(FinishCause.OVERLOAD);
    assertThat(warnings).anySatisfy(w -> assertThat(w).contains("overload warning"));
    assertThat(r.peak_N()).isGreaterThanOrEqualTo(capacity);
    assertThat(store.finalMeta.warnings()).anySatisfy(w -> assertThat(w).contains("80 %"));
    // stopped with the load on the cell: there is no return to zero to read
    assertThat(store.finalMeta.returnToZero_N()).isNull();
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  void aRunThatEndsUnloadedStoresItsReturnToZero() throws Exception {
    int rate = 1000;
    // an ideal cell: with the typical creep the return to zero would also show the creep's
    // recovery (about 0.2 N after this run), which ZeroOnTheSimulatorTest's kind of check owns
    SimSetup setup = new SimSetup("ductile", 3, rate, false, 8, 1.0,
        org.loadstone.sim.SimImperfections.NONE);
    DeviceReader reader = new DeviceReader(setup.openTransport(), new SampleRing(1 << 20));
    reader.start();
    double countsPerN = setup.nominalCountsPerN();
    double zero = Tare.counts(reader, 200, HangGuard.MS);
    MemoryRunStore store = new MemoryRunStore();
    // the break at rupture, not at the necking's fall to about half the peak
    RunSettings s = RunSettings.builder().ratedCapacity_N(500).breakDropPct(90).build();
    Recorder rec = new Recorder(reader, ForceScale.linear(countsPerN, "nominal"), zero, s,
        template("rz", rate), store, null);
    rec.arm();
    Recorder.Result r = rec.await(HangGuard.S, TimeUnit.SECONDS).orElseThrow();
    reader.close();
    assertThat(r.cause()).isEqualTo(FinishCause.BREAK);
    // the ductile specimen ruptures and carries no load after it (simulator: SuddenDrop to 0),
    // so the cell reads its own zero again: the return to zero is the tare's error, within the
    // noise of a 100-sample mean (0.1 s at 1 kS/s)
    var cell = setup.buildFrame().truth().loadCell();
    double tareError_N = (cell.zeroOffset_counts() - zero) / countsPerN;
    double noiseOfMean_N = cell.noiseRms_counts() / countsPerN / Math.sqrt(100);
    Double rtz = store.finalMeta.returnToZero_N();
    assertThat(rtz).isNotNull();
    assertThat(Math.abs(rtz - tareError_N)).isLessThanOrEqualTo(5 * noiseOfMean_N);
    // the mean of the run's last 100 stored samples, relative to the tare
    double sum = 0;
    for (int i = store.samples.size() - 100; i < store.samples.size(); i++) {
      sum += (store.samples.get(i)[3] - zero) / countsPerN;
    }
    assertThat(rtz).isCloseTo(sum / 100, org.assertj.core.data.Offset.offset(1e-9));
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  void cablePulledFinishesAsDeviceLostWithTheData() throws Exception {
    SimSetup setup = new SimSetup("ductile", 3, 1000, false, 4);
    SimTransport t = setup.openTransport();
    DeviceReader reader = new DeviceReader(t, new SampleRing(1 << 20));
    reader.start();
    double zero = Tare.counts(reader, 100, HangGuard.MS);
    MemoryRunStore store = new MemoryRunStore();
    java.util.concurrent.atomic.AtomicReference<RunControl.Started> started =
        new java.util.concurrent.atomic.AtomicReference<>();
    Recorder rec = new Recorder(reader, ForceScale.linear(setup.nominalCountsPerN(), "n"), zero,
        RunSettings.DEFAULTS, template("d1", 1000), store, new Recorder.Listener() {
          @Override
          public void onStarted(RunControl.Started s) {
            started.set(s);
          }
        });
    rec.startNow();
    while (reader.samplesAccepted() < 3000) {
      Thread.sleep(5);
    }
    t.pullCable();
    Recorder.Result r = rec.await(HangGuard.S, TimeUnit.SECONDS).orElseThrow();
    assertThat(r.cause()).isEqualTo(FinishCause.DEVICE_LOST);
    // every sample from the start to the last one before the cable was pulled
    assertThat(r.samples()).isEqualTo(reader.samplesAccepted() - started.get().firstIndex());
    assertThat(store.samples.get(store.samples.size() - 1)[0] + 1)
        .isEqualTo(reader.samplesAccepted());
    reader.close();
  }
}
