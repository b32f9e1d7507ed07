package org.loadstone.acquire;

import org.loadstone.HangGuard;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.archive.Geometry;
import org.loadstone.archive.TestType;
import org.loadstone.device.SimSetup;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Setting;

/** The run set-up's rules, one by one: rate, zero, zero check, scale and capacity, specimen. */
class RunSetupTest {
  @TempDir Path archive;

  private static final Clock CLOCK =
      Clock.fixed(Instant.parse("2026-12-03T09:00:00Z"), ZoneOffset.UTC);

  static RunSetup.Request request(ScaleChoice scale, Double capacity, Double driftLimit,
      Integer zeroSamples, Geometry geometry, Double mass_g) {
    return new RunSetup.Request(new RunTemplate("s1", "g", List.of(), "", "", mass_g, geometry,
        TestType.THREE_POINT_BEND), scale, capacity,
        RunSettings.builder(), driftLimit, zeroSamples, false, "test");
  }

  // --- the sample rate -------------------------------------------------------------------------

  @Test
  void deviceClockRateCountsLostSamplesBySequenceNotByArrival() {
    // a 1 kS/s device that lost every third sample on the way (29-33 % lost): the sequence
    // numbers still advance by one per conversion, 1000 µs apart
    int[] seq = new int[20];
    long[] t = new long[20];
    int k = 0;
    for (int s = 0; k < 20; s++) {
      if (s % 3 == 2) {
        continue;
      }
      seq[k] = (65530 + s) & 0xFFFF; // wraps through 65535 → 0
      t[k] = 5_000_000L + 1000L * s;
      k++;
    }
    SampleRate r = SampleRate.fromDeviceClock(seq, t, 20).orElseThrow();
    assertThat(r.rate_Hz()).isEqualTo(1000.0);
    assertThat(r.source()).isEqualTo(SampleRate.Source.DEVICE_CLOCK);
    assertThat(r.describe()).startsWith("1000 samples/s").contains("device's clock");
  }

  @Test
  void deviceClockThatDoesNotAdvanceGivesNoRate() {
    assertThat(SampleRate.fromDeviceClock(new int[] {1, 2, 3}, new long[] {7, 7, 7}, 3)).isEmpty();
    assertThat(SampleRate.fromDeviceClock(new int[] {1}, new long[] {7}, 1)).isEmpty();
  }

  @Test
  void samplesInAStretchComeFromTheRate() {
    assertThat(new SampleRate(1000, SampleRate.Source.IDENTITY).samplesIn(0.5, 5)).isEqualTo(500);
    assertThat(new SampleRate(10, SampleRate.Source.IDENTITY).samplesIn(0.5, 5)).isEqualTo(5);
    assertThat(new SampleRate(80, SampleRate.Source.IDENTITY).describe())
        .isEqualTo("80 samples/s (stated by the device)");
    assertThat(new SampleRate(50_000, SampleRate.Source.IDENTITY).describe())
        .startsWith("50000 samples/s");
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  void withAnIdentityTheRateIsTheStatedOneAndTheZeroHalfASecondOfIt() {
    SimSetup sim = new SimSetup("brittle", 5, 1000, false, 1);
    DeviceReader reader = new DeviceReader(sim.openTransport(), new SampleRing(1 << 20));
    reader.start();
    try {
      RunSetup setup = new RunSetup(reader, archive, sim, Map.of(), CLOCK);
      List<String> said = new java.util.ArrayList<>();
      RunSetup.Prepared p = setup.prepare(request(ScalePolicy.choose(null, null, sim,
          LocalDate.now()), null, null, null, Geometry.NONE, null), said::add);
      assertThat(p.rate()).isEqualTo(new SampleRate(1000, SampleRate.Source.IDENTITY));
      assertThat(said).containsExactly("zeroing on 500 samples: keep the specimen unloaded");
      assertThat(p.metadata().sampleRate_Hz()).isEqualTo(1000.0);
      assertThat(p.metadata().sampleRateSource()).isEqualTo("identity");
      assertThat(p.metadata().pretrigger_s()).isEqualTo(1.0);
      // the simulated cell's data sheet: capacity and a stored warning that force is nominal
      assertThat(p.settings().ratedCapacity_N()).isEqualTo(sim.cell().capacity_N());
      assertThat(p.metadata().warnings()).anySatisfy(w -> assertThat(w)
          .startsWith("no calibration: force uses the simulated cell's nominal sensitivity"));
      // a fresh zero, and no earlier tare to compare with
      assertThat(p.warnings()).noneSatisfy(w -> assertThat(w).startsWith("zero check"));
      assertThat(setup.lastTare()).isEqualTo(new ZeroCheck.Tare(p.zero_counts(), CLOCK.instant()));
    } finally {
      reader.close();
    }
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  void withoutAnIdentityTheRateComesFromTheDeviceClockDespiteLostSamplesAndIsStated() {
    // a 1 kS/s device whose identity never arrives and that loses every third sample line
    SimSetup sim = new SimSetup("brittle", 5, 1000, false, 1);
    DeviceReader reader = new DeviceReader(new FilteredTransport(sim.openTransport(), 3),
        new SampleRing(1 << 20));
    reader.start();
    try {
      RunSetup setup = new RunSetup(reader, archive, sim, Map.of(), CLOCK);
      RunSetup.Prepared p = setup.prepare(request(ScalePolicy.choose(null, null, sim,
          LocalDate.now()), null, null, null, Geometry.NONE, null), s -> { });
      assertThat(reader.identity()).isEmpty();
      // the simulator's defaults have no conversion jitter and no rate error
      // (SimulatedFrameBuilder), so the device clock shows the true 1000 samples/s
      assertThat(p.rate().rate_Hz()).isCloseTo(1000.0, org.assertj.core.data.Offset.offset(0.1));
      assertThat(p.rate().source()).isEqualTo(SampleRate.Source.DEVICE_CLOCK);
      assertThat(p.metadata().sampleRateSource()).isEqualTo("device-clock");
      assertThat(p.metadata().sampleRate_Hz()).isEqualTo(p.rate().rate_Hz());
      assertThat(p.metadata().warnings()).anySatisfy(w -> assertThat(w)
          .startsWith("the device did not state its sample rate: 1000"));
      // the history before the start is sized from that rate: a full second of samples
      RunControl control = new RunControl(p.settings(), p.metadata().sampleRate_Hz());
      long[] first = {-1};
      control.arm();
      for (long i = 0; i < 5000; i++) {
        control.offer(i, 0, i / 1000.0, i == 4000 ? 10 : 0, e -> {
          if (e instanceof RunControl.Started s) {
            first[0] = s.firstIndex();
          }
        });
      }
      assertThat(first[0]).isEqualTo(3000);
    } finally {
      reader.close();
    }
  }

  // --- the zero and the zero check -------------------------------------------------------------

  @Test
  void aZeroDriftLimitOfZeroOrLessIsRefusedNamingTheSetting() {
    for (double bad : new double[] {0, -0.5, Double.NaN}) {
      assertThatThrownBy(() -> new ZeroCheck(bad)).isInstanceOf(LoadstoneException.class)
          .hasMessageStartingWith("the zero-drift limit must be a force greater than 0 N")
          .hasMessageNotContaining("--")
          .satisfies(e -> assertThat(((LoadstoneException) e).settings())
              .containsExactly(Setting.ZERO_DRIFT_LIMIT));
    }
    ScaleChoice nominal = ScaleChoice.nominal(100, "given", 500.0);
    assertThatThrownBy(() -> RunSetup.check(request(nominal, null, -1.0, null, Geometry.NONE,
        null), "port")).hasMessageContaining("zero-drift limit");
  }

  @Test
  void theZeroCheckWarnsOnlyPastItsLimit() {
    ForceScale scale = ForceScale.linear(100, "nominal"); // 100 counts per N
    ZeroCheck check = new ZeroCheck(0.5);
    ZeroCheck.Tare last = new ZeroCheck.Tare(1000, Instant.parse("2026-12-03T08:50:00Z"));
    Instant now = Instant.parse("2026-12-03T09:00:00Z");
    assertThat(check.check(last, new ZeroCheck.Tare(1049, now), scale)).isEmpty(); // 0.49 N
    assertThat(check.check(last, new ZeroCheck.Tare(951, now), scale)).isEmpty(); // -0.49 N
    assertThat(check.check(null, new ZeroCheck.Tare(5000, now), scale)).isEmpty();
    String w = check.check(last, new ZeroCheck.Tare(1080, now), scale).orElseThrow();
    assertThat(w).startsWith("zero check: the zero moved by +0.800 N since the last tare 10 min "
        + "ago (limit 0.500 N)");
    assertThat(check.check(last, new ZeroCheck.Tare(900, now), scale).orElseThrow())
        .contains("by -1.00 N");
    // the default: 0.1 % of the rated capacity
    assertThat(ZeroCheck.of(null, 500).limit_N()).isEqualTo(0.5);
    assertThat(ZeroCheck.of(2.0, 500).limit_N()).isEqualTo(2.0);
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  void aZeroThatMovedSinceTheLastTareIsWarnedAboutAndStoredWithTheRun() {
    SimSetup sim = new SimSetup("brittle", 5, 1000, false, 1);
    DeviceReader reader = new DeviceReader(sim.openTransport(), new SampleRing(1 << 20));
    reader.start();
    try {
      RunSetup setup = new RunSetup(reader, archive, sim, Map.of(), CLOCK);
      double countsPerN = sim.cell().countsPerN();
      // the last tare read 3 N more than the cell's true zero
      setup.noteTare(sim.cell().zeroOffset_counts() + 3 * countsPerN);
      RunSetup.Prepared p = setup.prepare(request(ScalePolicy.choose(null, null, sim,
          LocalDate.now()), null, 1.0, 200, Geometry.NONE, null), s -> { });
      assertThat(p.warnings()).anySatisfy(w -> assertThat(w)
          .startsWith("zero check: the zero moved by -3.0").contains("(limit 1.00 N)"));
      assertThat(p.metadata().warnings()).isEqualTo(p.warnings());
      // the fresh zero is the one used, and the next check compares with it
      assertThat(p.metadata().zeroOffset_counts()).isEqualTo(p.zero_counts());
      assertThat(setup.lastTare().zero_counts()).isEqualTo(p.zero_counts());
    } finally {
      reader.close();
    }
  }

  @Test
  void aZeroOfNoSamplesIsRefused() {
    ScaleChoice nominal = ScaleChoice.nominal(100, "given", 500.0);
    assertThatThrownBy(() -> RunSetup.check(request(nominal, null, null, 0, Geometry.NONE,
        null), "port")).isInstanceOf(LoadstoneException.class)
        .hasMessageStartingWith("the zero must average at least 1 sample, was 0")
        .satisfies(e -> assertThat(((LoadstoneException) e).settings())
            .containsExactly(Setting.ZERO_SAMPLES));
  }

  // --- scale and capacity ----------------------------------------------------------------------

  @Test
  void withoutACalibrationOrANominalSensitivityARunIsRefused() {
    assertThat(ScalePolicy.choose(null, null, null, LocalDate.now())).isNull();
    assertThatThrownBy(() -> RunSetup.check(request(null, 500.0, null, null, Geometry.NONE,
        null), "/dev/ttyACM0")).isInstanceOf(LoadstoneException.class)
        .hasMessageStartingWith("no calibration is chosen for /dev/ttyACM0")
        .hasMessageNotContaining("--")
        .satisfies(e -> assertThat(((LoadstoneException) e).settings())
            .containsExactly(Setting.CALIBRATION, Setting.NOMINAL_SENSITIVITY));
  }

  @Test
  void aNominalSensitivityIsUsedOnlyWhenGivenAndAlwaysCarriesAWarning() {
    ScaleChoice c = ScalePolicy.choose(null, 4295.0, null, LocalDate.now());
    assertThat(c.calibrationId()).isNull();
    assertThat(c.warnings()).singleElement().asString()
        .startsWith("no calibration: force uses the given sensitivity 4295.00 counts/N")
        .doesNotContain("--");
    assertThatThrownBy(() -> ScalePolicy.choose(null, 0.0, null, LocalDate.now()))
        .hasMessageContaining("nominal sensitivity must be a non-zero number");
  }

  @Test
  void theCapacityIsTheOneGivenElseTheCellProfileElseARunIsRefused() {
    ScaleChoice fromFile = ScalePolicy.choose(
        Path.of("calibration", "shelf-rig-500N-2026-12-02.json"), null, null, LocalDate.now());
    // calibration/cells/shelf-rig-500N.json says 500 N
    assertThat(ScalePolicy.capacity_N(null, fromFile)).isEqualTo(500.0);
    assertThat(ScalePolicy.capacity_N(250.0, fromFile)).isEqualTo(250.0);
    ScaleChoice nominal = ScalePolicy.choose(null, 4295.0, null, LocalDate.now());
    assertThatThrownBy(() -> ScalePolicy.capacity_N(null, nominal))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageStartingWith("the load cell's rated capacity is unknown")
        .hasMessageNotContaining("--")
        .satisfies(e -> assertThat(((LoadstoneException) e).settings())
            .containsExactly(Setting.RATED_CAPACITY));
    assertThatThrownBy(() -> ScalePolicy.capacity_N(-5.0, nominal))
        .hasMessageContaining("must be a positive force");
  }

  // --- the simulated specimen ------------------------------------------------------------------

  @Test
  void theSimulatedSpecimenFillsWhatWasNotGivenAndKeepsWhatWas() {
    SimSetup sim = new SimSetup("panel-foam", 1, 80, false, 1);
    var panel = sim.buildFrame().truth().specimen().panel();
    SimulatedSpecimen.Described d = SimulatedSpecimen.fill(sim, Geometry.NONE, null);
    assertThat(d.filled()).isTrue();
    assertThat(d.geometry().span_mm()).isEqualTo(panel.span_mm());
    assertThat(d.geometry().width_mm()).isEqualTo(panel.width_mm());
    assertThat(d.geometry().depth_mm()).isEqualTo(panel.core_mm() + 2 * panel.facing_mm());
    assertThat(d.mass_g()).isPositive();
    Geometry given = new Geometry(150.0, null, 40.0, 10.0, null, null, null);
    SimulatedSpecimen.Described kept = SimulatedSpecimen.fill(sim, given, 12.5);
    assertThat(kept.geometry().span_mm()).isEqualTo(150.0);
    assertThat(kept.geometry().width_mm()).isEqualTo(40.0);
    assertThat(kept.geometry().depth_mm()).isEqualTo(10.0);
    assertThat(kept.geometry().facing_mm()).isNull();
    assertThat(kept.mass_g()).isEqualTo(12.5);
    assertThat(kept.filled()).isFalse();
  }
}
