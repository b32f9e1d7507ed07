package org.loadstone.acquire;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.archive.Geometry;
import org.loadstone.device.SimSetup;
import org.loadstone.sim.SimImperfections;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Setting;

/**
 * The zero and the zero check against the simulator's own drift: the shift comes from the
 * simulated warm-up, not from a number written into the test. Waits are counted samples.
 */
class ZeroOnTheSimulatorTest {
  @TempDir Path archive;

  private static final Clock CLOCK =
      Clock.fixed(Instant.parse("2026-12-03T09:00:00Z"), ZoneOffset.UTC);

  private static void awaitSamples(DeviceReader reader, long written) throws InterruptedException {
    while (reader.ring().written() < written) {
      assertThat(reader.lostReason()).isEmpty();
      Thread.sleep(5); // a poll for a counted event, not a timed check
    }
  }

  @Test
  @Timeout(120)
  void theZeroCheckWarnsWhenTheSimulatedWarmUpMovesTheZeroPastTheLimit() throws Exception {
    // warm-up 0.05 % of the 1 kN cell (0.5 N) settling with a 120 s time constant; no other drift
    SimImperfections warm = SimImperfections.TYPICAL.withWarmup(0.05, 120).withDrift(0, 1800);
    SimSetup sim = new SimSetup("panel-foam", 1, 80, false, 200, 1.0, warm);
    DeviceReader reader = new DeviceReader(sim.openTransport(), new SampleRing(1 << 20));
    reader.start();
    try {
      ScaleChoice scale = ScalePolicy.choose(null, null, sim, LocalDate.now());
      RunSetup setup = new RunSetup(reader, archive, sim, Map.of(), CLOCK);
      // the first zero near power-on (within the first few simulated seconds)
      RunSetup.Prepared early = setup.prepare(
          RunSetupTest.request(scale, null, 0.2, null, Geometry.NONE, null), s -> { });
      double first = setup.lastTare().zero_counts();
      // four time constants later (80 samples/s × 480 s), the warm-up has taken away
      // 0.5 N × (e^(−t1/120) − e^(−480/120)) ≈ 0.47 N at t1 of a few seconds
      awaitSamples(reader, 80 * 480);
      RunSetup.Prepared later = setup.prepare(
          RunSetupTest.request(scale, null, 0.2, null, Geometry.NONE, null), s -> { });
      double shift_N = (later.zero_counts() - first) / sim.nominalCountsPerN();
      // the simulator's warm-up at the middle of each zero's 40 samples (ring index i is the
      // sample at (i + 1)/80 s: no jitter by default)
      double t1 = (early.decideFrom() - 20) / 80.0;
      double t2 = (later.decideFrom() - 20) / 80.0;
      double expected_N = 0.5 * (Math.exp(-t2 / 120) - Math.exp(-t1 / 120));
      // noise of a 40-sample mean: 39 counts / √40 / 4295 counts/N = 1.4 mN each
      assertThat(shift_N).isCloseTo(expected_N, org.assertj.core.data.Offset.offset(0.01));
      assertThat(expected_N).isLessThan(-0.2);
      assertThat(later.warnings()).anySatisfy(w -> assertThat(w)
          .startsWith("zero check: the zero moved by -0.").contains("(limit 0.200 N)"));
      assertThat(later.metadata().warnings()).isEqualTo(later.warnings());
      // the same shift within the default limit (0.1 % of 1 kN = 1 N) is no warning; by now the
      // warm-up is nearly over, so the next zero hardly moves
      RunSetup.Prepared settled = setup.prepare(
          RunSetupTest.request(scale, null, null, null, Geometry.NONE, null), s -> { });
      assertThat(settled.warnings()).noneSatisfy(w -> assertThat(w).startsWith("zero check"));
    } finally {
      reader.close();
    }
  }

  @Test
  @Timeout(120)
  void aZeroThatNeverSettlesIsRefusedAfterItsTriesNamingTheFix() {
    // a cell switched on with its zero 1 % of full scale (10 N) off and settling with a 20 s time
    // constant: in the first seconds the zero runs at 0.4–0.5 N/s, so the halves of each zero
    // of half a second differ by about 0.1 N, past a limit of 0.05 N, in every one of the tries
    // (the noise allowance, six standard errors of 39 counts over 20 + 20 samples, is 0.017 N)
    SimImperfections restless = SimImperfections.TYPICAL.withWarmup(-1.0, 20);
    SimSetup sim = new SimSetup("panel-foam", 3, 80, false, 4, 1.0, restless);
    DeviceReader reader = new DeviceReader(sim.openTransport(), new SampleRing(1 << 20));
    reader.start();
    try {
      ScaleChoice scale = ScalePolicy.choose(null, null, sim, LocalDate.now());
      RunSetup setup = new RunSetup(reader, archive, sim, Map.of(), CLOCK);
      List<String> said = new ArrayList<>();
      assertThatThrownBy(() -> setup.prepare(
          RunSetupTest.request(scale, null, 0.05, null, Geometry.NONE, null), said::add))
          .isInstanceOf(LoadstoneException.class)
          .hasMessageStartingWith("the zero did not settle: in 10 tries of 40 samples")
          .hasMessageContaining("(accepted: 0.0500 N)")
          .hasMessageContaining("unload the cell, stop the press")
          .hasMessageNotContaining("--")
          .satisfies(e -> assertThat(((LoadstoneException) e).settings())
              .containsExactly(Setting.ZERO_DRIFT_LIMIT));
      assertThat(said).hasSize(Zeroing.MAX_TRIES);
      assertThat(said.get(1)).startsWith("the zero is still moving").endsWith("(2 of 10)");
      // nothing was kept as a tare from a zero that never came to rest
      assertThat(setup.lastTare()).isNull();
    } finally {
      reader.close();
    }
  }

  @Test
  void noiseAloneIsAtRestAndASpikeOrARampIsNot() {
    double[] quiet = new double[40];
    java.util.Random r = new java.util.Random(5);
    for (int i = 0; i < quiet.length; i++) {
      quiet[i] = 1000 + 39 * r.nextGaussian();
    }
    Zeroing.Zero z = Zeroing.of(quiet, 40);
    assertThat(z.atRest(1e-9)).isTrue(); // even with a tiny limit: noise is allowed for
    assertThat(z.noise_counts()).isBetween(25.0, 55.0);
    double[] ramp = quiet.clone();
    for (int i = 0; i < ramp.length; i++) {
      ramp[i] += 100 * i; // a press loading the specimen
    }
    assertThat(Zeroing.of(ramp, 40).atRest(430)).isFalse();
    double[] spike = quiet.clone();
    spike[30] += 200_000; // 0.5 × 10 % of a 1 kN cell's full scale
    assertThat(Zeroing.of(spike, 40).atRest(4295)).isFalse();
  }
}
