package org.loadstone.sim;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.analysis.ParametricUnivariateFunction;
import org.apache.commons.math3.distribution.ExponentialDistribution;
import org.apache.commons.math3.distribution.PoissonDistribution;
import org.apache.commons.math3.fitting.SimpleCurveFitter;
import org.apache.commons.math3.fitting.WeightedObservedPoints;
import org.apache.commons.math3.stat.descriptive.DescriptiveStatistics;
import org.apache.commons.math3.stat.inference.KolmogorovSmirnovTest;
import org.junit.jupiter.api.Test;
import org.loadstone.units.LoadstoneException;

/** Noise, warm-up, drift, creep and spikes of the simulated cell, each as set. */
class ImperfectionsTest {
  private static final double G = 9.80665;

  private static SimulatedFrame deadWeight(double rateHz, SimImperfections imp, long seed) {
    return SimulatedFrame.builder().scenario(Scenario.DEAD_WEIGHT).rateHz(rateHz)
        .nonLinearity_pctFS(0).imperfections(imp).seed(seed).build();
  }

  // --- converter noise -------------------------------------------------------------------------

  /** HX711 input noise at gain 128 in counts: nV RMS × 2²³ / (0.5 × 5 V / 128). */
  private static double hx711Counts(double nV) {
    return nV * 1e-9 * 8_388_608 / (0.5 * 5.0 / 128);
  }

  @Test
  void noiseAtTheBridgeAmplifierRatesIsTheDataSheetFigure() {
    // HX711 data sheet (Avia Semiconductor), input noise at gain 128: 50 nV RMS at 10 samples/s,
    // 90 nV RMS at 80 samples/s (from memory) → 21.5 and 38.7 counts at 5 V excitation
    for (double[] rateAndNv : new double[][] {{10, 50}, {80, 90}}) {
      SimulatedFrame f = deadWeight(rateAndNv[0], SimImperfections.NONE, 31);
      DescriptiveStatistics s = new DescriptiveStatistics();
      for (int i = 0; i < 20_000; i++) {
        s.addValue(f.next().loadCounts());
      }
      double expected = hx711Counts(rateAndNv[1]);
      // relative standard error of an SD from 20 000 samples: 1/√(2·19 999) = 0.5 %; 3 % is six
      // of them. Rounding to whole counts adds 1/12 count² (negligible).
      assertThat(s.getStandardDeviation()).isCloseTo(expected, within(0.03 * expected));
    }
  }

  @Test
  void aFastConverterIsNoisierAndTheNoiseCanBeSet() {
    // a fast converter: white noise scales as √(rate) from the 80/s figure (illustrative,
    // common practice for a delta-sigma converter whose filter bandwidth follows its rate)
    SimulatedFrame fast = deadWeight(1000, SimImperfections.NONE, 32);
    double expected = hx711Counts(90) * Math.sqrt(1000 / 80.0);
    assertThat(sd(fast, 20_000)).isCloseTo(expected, within(0.03 * expected));
    // a figure of one's own, e.g. a quieter amplifier, under every other typical imperfection;
    // measured from successive differences (SD/√2), blind to the slow zero drift
    SimulatedFrame set = deadWeight(80, SimImperfections.TYPICAL.withNoiseRms_counts(12), 33);
    assertThat(set.truth().loadCell().noiseRms_counts()).isEqualTo(12.0);
    DescriptiveStatistics d = new DescriptiveStatistics();
    int previous = set.next().loadCounts();
    for (int i = 0; i < 20_000; i++) {
      int c = set.next().loadCounts();
      d.addValue(c - previous);
      previous = c;
    }
    assertThat(d.getStandardDeviation() / Math.sqrt(2)).isCloseTo(12, within(0.03 * 12 + 0.1));
  }

  private static double sd(SimulatedFrame f, int n) {
    DescriptiveStatistics s = new DescriptiveStatistics();
    for (int i = 0; i < n; i++) {
      s.addValue(f.next().loadCounts());
    }
    return s.getStandardDeviation();
  }

  // --- creep -----------------------------------------------------------------------------------

  /** a + b·(1 − exp(−t/τ)), parameters {a, b, τ}. */
  private static final ParametricUnivariateFunction FIRST_ORDER =
      new ParametricUnivariateFunction() {
        @Override
        public double value(double t, double... p) {
          return p[0] + p[1] * (1 - Math.exp(-t / p[2]));
        }

        @Override
        public double[] gradient(double t, double... p) {
          double e = Math.exp(-t / p[2]);
          return new double[] {1, 1 - e, -p[1] * e * t / (p[2] * p[2])};
        }
      };

  @Test
  void aDeadWeightHeldHalfAnHourShowsTheSetCreep() {
    double creepPct = 0.025;
    double creep_s = 600;
    SimulatedFrame f = deadWeight(10, SimImperfections.NONE.withCreep(creepPct, creep_s), 41);
    double countsPerN = f.truth().loadCell().countsPerN();
    for (int i = 0; i < 50; i++) {
      f.next();
    }
    f.placeMass(80); // 784.5 N on the 1 kN cell
    double placed_s = f.lastTime_s();
    WeightedObservedPoints held = new WeightedObservedPoints();
    List<double[]> samples = new ArrayList<>();
    while (f.lastTime_s() < placed_s + 2400) {
      SimSample s = f.next();
      double t = s.time_s() - placed_s;
      if (t >= 5) { // the hanger has settled (25 time constants of 0.2 s)
        held.add(t, s.loadCounts());
        samples.add(new double[] {t, s.loadCounts()});
      }
    }
    double force_N = 80 * G;
    double expectedB = creepPct / 100 * force_N * countsPerN; // 843 counts
    // least-squares fit of the first-order creep by Commons Math (Levenberg–Marquardt)
    double[] p = SimpleCurveFitter.create(FIRST_ORDER, new double[] {samples.get(0)[1], 500, 300})
        .fit(held.toList());
    // noise 21 counts over 24 000 samples: the fitted size and time constant are known to well
    // under 1 %; 3 % allows for the fit's correlation of a and b
    assertThat(p[1]).isCloseTo(expectedB, within(0.03 * expectedB));
    assertThat(p[2]).isCloseTo(creep_s, within(0.05 * creep_s));
    // as OIML R 60's creep test reads it (from memory): the change from the first reading to
    // the one 30 min later, each here the mean of 20 s; first order: κF·(e^(−t1/τ) − e^(−t2/τ))
    double early = mean(samples, 5, 25);
    double late = mean(samples, 1790, 1810);
    double expectedChange = expectedB * (Math.exp(-15 / creep_s) - Math.exp(-1800 / creep_s));
    // mean of 200 samples: SE 1.5 counts each; within 8 counts
    assertThat(late - early).isCloseTo(expectedChange, within(8.0));
    // the model's own truth agrees with what the counts show
    assertThat(f.lastCreep_N()).isCloseTo(creepPct / 100 * force_N
        * (1 - Math.exp(-2400 / creep_s)), within(1e-3));
  }

  private static double mean(List<double[]> samples, double from_s, double to_s) {
    return samples.stream().filter(s -> s[0] >= from_s && s[0] < to_s).mapToDouble(s -> s[1])
        .average().orElseThrow();
  }

  // --- warm-up and drift -----------------------------------------------------------------------

  @Test
  void theZeroSettlesAfterPowerOnAsSet() {
    SimImperfections imp = SimImperfections.NONE.withWarmup(0.05, 300);
    SimulatedFrame f = deadWeight(10, imp, 51);
    double fs = f.truth().loadCell().fullScaleOutput_counts();
    double offset = f.truth().loadCell().zeroOffset_counts();
    for (double at : new double[] {30, 300, 900}) {
      DescriptiveStatistics s = new DescriptiveStatistics();
      while (f.lastTime_s() < at - 5) {
        f.next();
      }
      while (f.lastTime_s() < at + 5) {
        s.addValue(f.next().loadCounts());
      }
      // W·exp(−t/τ), W = 0.05 % FS; the mean over ±5 s of an exponential is its middle value
      // within 0.03 %; 100 samples of 21 counts: SE 2.1 counts
      double expected = offset + 0.0005 * fs * Math.exp(-at / 300);
      assertThat(s.getMean()).isCloseTo(expected, within(10.0));
    }
  }

  @Test
  void theSlowDriftWandersWithTheSetSpreadAndIsSeeded() {
    SimImperfections imp = SimImperfections.NONE.withDrift(0.01, 60);
    // one hour at 10/s is 60 correlation times; the spread of the zero over it, sampled every
    // minute (nearly independent values), is the set 0.01 % FS within the scatter of an SD
    // estimated from 60 values (relative SE 9 %); 30 % is over three of them
    SimulatedFrame f = deadWeight(10, imp, 52);
    double fs = f.truth().loadCell().fullScaleOutput_counts();
    DescriptiveStatistics shifts = new DescriptiveStatistics();
    for (int i = 1; i <= 36_000; i++) {
      f.next();
      if (i % 600 == 0) {
        shifts.addValue(f.lastZeroShift_counts());
      }
    }
    assertThat(shifts.getStandardDeviation()).isCloseTo(0.0001 * fs, within(0.3 * 0.0001 * fs));
    // seeded: the same seed gives the same counts, another seed others
    assertThat(counts(imp, 52, 2000)).isEqualTo(counts(imp, 52, 2000));
    assertThat(counts(imp, 53, 2000)).isNotEqualTo(counts(imp, 52, 2000));
  }

  private static int[] counts(SimImperfections imp, long seed, int n) {
    SimulatedFrame f = deadWeight(10, imp, seed);
    int[] out = new int[n];
    for (int i = 0; i < n; i++) {
      out[i] = f.next().loadCounts();
    }
    return out;
  }

  // --- spikes ----------------------------------------------------------------------------------

  @Test
  void spikesComeAtTheSetRateFromTheSeed() {
    double perMin = 30;
    SimImperfections imp = SimImperfections.NONE.withSpikes(perMin, 5);
    List<Long> seen = spikes(imp, 61);
    // 20 min at 1 kS/s: a Poisson count with mean 600 (Commons Math); the seed fixes it, the
    // check is that it lies in the central 99.9 % of that distribution
    PoissonDistribution poisson = new PoissonDistribution(perMin * 20);
    assertThat(seen.size()).isBetween(poisson.inverseCumulativeProbability(0.0005),
        poisson.inverseCumulativeProbability(0.9995));
    // the times between spikes are exponential with mean 60/30 s: Kolmogorov–Smirnov test
    // against Commons Math's exponential distribution
    double[] gaps = new double[seen.size() - 1];
    for (int i = 1; i < seen.size(); i++) {
      gaps[i - 1] = (seen.get(i) - seen.get(i - 1)) / 1000.0;
    }
    double p = new KolmogorovSmirnovTest()
        .kolmogorovSmirnovTest(new ExponentialDistribution(60 / perMin), gaps);
    assertThat(p).isGreaterThan(0.001);
    // seeded: the same seed gives the same spikes, another seed others
    assertThat(spikes(imp, 61)).isEqualTo(seen);
    assertThat(spikes(imp, 62)).isNotEqualTo(seen);
  }

  /** @return sample indices of the spikes found in the counts, checked against the truth */
  private static List<Long> spikes(SimImperfections imp, long seed) {
    SimulatedFrame f = deadWeight(1000, imp, seed);
    double fs = f.truth().loadCell().fullScaleOutput_counts();
    double offset = f.truth().loadCell().zeroOffset_counts();
    List<Long> found = new ArrayList<>();
    for (long i = 0; i < 1_200_000; i++) {
      SimSample s = f.next();
      // a spike is at least 0.5 × 5 % FS = 107 000 counts; the noise is 137 counts RMS
      boolean spike = Math.abs(s.loadCounts() - offset) > 0.01 * fs;
      assertThat(spike).isEqualTo(f.lastSpike());
      if (spike) {
        double size = Math.abs(s.loadCounts() - offset) / (0.05 * fs);
        assertThat(size).isBetween(0.49, 1.51);
        found.add(i);
      }
    }
    assertThat(f.spikeCount()).isEqualTo(found.size());
    return found;
  }

  // --- settings --------------------------------------------------------------------------------

  @Test
  void figuresOutOfRangeAreRefusedNamingTheFigure() {
    assertThatThrownBy(() -> SimImperfections.NONE.withCreep(5, 600))
        .isInstanceOf(LoadstoneException.class)
        .hasMessage("the simulated cell's creep must be -1 to 1 % of the load, was 5.0");
    assertThatThrownBy(() -> SimImperfections.NONE.withSpikes(-1, 5))
        .hasMessageStartingWith("the simulated cell's spike rate must be 0 to 600 per minute");
    assertThatThrownBy(() -> SimImperfections.NONE.withWarmup(0.02, 0))
        .hasMessageStartingWith("the simulated cell's warm-up time constant must be more than 0 s");
    assertThatThrownBy(() -> SimImperfections.NONE.withDrift(Double.NaN, 60))
        .hasMessageContaining("zero drift");
  }

  @Test
  void switchingOneImperfectionOffLeavesTheNoiseOfTheOthers() {
    // each part draws from its own stream: with the drift and spikes off, the converter noise is
    // the same sample for sample as with them on, less their own contribution
    SimulatedFrame plain = deadWeight(80, SimImperfections.NONE, 71);
    SimulatedFrame typical = deadWeight(80, SimImperfections.TYPICAL, 71);
    for (int i = 0; i < 2000; i++) {
      int a = plain.next().loadCounts();
      int b = typical.next().loadCounts();
      assertThat((double) b - a).isCloseTo(typical.lastZeroShift_counts(), within(1.0)); // two roundings;
    }
  }
}
