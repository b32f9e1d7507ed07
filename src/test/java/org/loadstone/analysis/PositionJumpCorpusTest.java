package org.loadstone.analysis;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * Jumps in a run's own position column (encoder, gauge, imported) on a seeded corpus of curves
 * with known answers: the jump is a break or slip in the record and adds no travel and no energy.
 *
 * <p>Each curve is a force–displacement law F(x) sampled along a true path x(t) of a crosshead
 * at constant speed, with uneven time steps, force noise from peak/1000 to peak/100 and the
 * position quantised like an encoder (0.0025 to 0.01 mm) or read with a gauge's noise. Three
 * shapes: linear with a soft toe, polymer-like softening, and a sandwich panel's stiffening
 * rise; each breaks after its peak. The position record then jumps by 0.5 to 3 mm either at
 * the break, up to three samples before the force's peak sample (a position read ahead of a
 * converter's filter delay), or mid-rise (a slip of the gauge; force goes on). The truth is
 * the integral of F over the true path to the peak sample's true position, by Simpson's rule on
 * the law itself (any numerical-analysis text), and that true position.
 */
class PositionJumpCorpusTest {
  static final int CURVES = 240;
  static final long SEED = 0x12C0FFEEL;

  /** One curve of the corpus: its samples, the law and the true path. */
  record Case(String name, double[] t, double[] f, double[] pos, double[] trueX, Law law,
      boolean jumped, int jumpAt) {}

  interface Law {
    double force(double x);
  }

  @Test
  void energyAndDisplacementAtPeakLeaveTheJumpOut() {
    Random rnd = new Random(SEED);
    int jumped = 0;
    int naiveWrong = 0;
    int before = 0;
    double worstEnergy = 0;
    double worstDisplacement = 0;
    List<String> failures = new ArrayList<>();
    for (int c = 0; c < CURVES; c++) {
      Case k = make(rnd, c);
      RunResult r = RunAnalyzer.analyze(new Curve(k.t(), k.f(), k.pos()));
      int p = r.peakIndex();
      double xTrue = k.trueX()[p] - k.trueX()[0];
      double eTrue = simpson(k.law(), k.trueX()[0], k.trueX()[p]) / 1000;
      double dErr = Math.abs(r.displacementAtPeak_mm().orElseThrow() - xTrue) / xTrue;
      double eErr = Math.abs(r.energyToPeak_J().orElseThrow() - eTrue) / eTrue;
      worstEnergy = Math.max(worstEnergy, eErr);
      worstDisplacement = Math.max(worstDisplacement, dErr);
      // issue 12: displacement at peak and energy to peak within 2 % of the truth
      if (dErr > 0.02 || eErr > 0.02) {
        failures.add(String.format("%s: displacement %.2f %%, energy %.2f %% off", k.name(),
            100 * dErr, 100 * eErr));
      }
      boolean noted = r.notes().stream().anyMatch(s -> s.startsWith("The position jumps by"));
      if (k.jumped()) {
        jumped++;
        if (!noted && p > 0) {
          // a jump after the peak and the break needs no mending; any before must be named
          failures.add(k.name() + ": the jump was not named in the notes");
        }
        // the same curve integrated straight across the jump, as before: outside the tolerance
        // whenever the jump comes before the peak sample
        double naive = RunAnalyzer.area_Nmm(minusFirst(k.pos()), k.f(), p) / 1000;
        boolean beforePeak = k.jumpAt() <= p;
        if (beforePeak && Math.abs(naive - eTrue) / eTrue > 0.02) {
          naiveWrong++;
        }
        before += beforePeak ? 1 : 0;
      } else if (noted) {
        failures.add(k.name() + ": a jump was found in a record without one");
      }
    }
    assertThat(failures).as("worst energy error %.3f %%, displacement %.3f %%",
        100 * worstEnergy, 100 * worstDisplacement).isEmpty();
    assertThat(jumped).isGreaterThan(CURVES * 2 / 3);
    // the corpus does test the rule: integrated across, the jumps before the peak put nearly
    // every such curve outside the tolerance
    assertThat(before).isGreaterThan(CURVES / 4);
    assertThat(naiveWrong).as("of %d", before).isGreaterThan(before * 9 / 10);
  }

  /** Curve c: shape c % 3, every fourth without a jump, the jump's place by c. */
  static Case make(Random rnd, int c) {
    int shape = c % 3;
    double k = 50 + 150 * rnd.nextDouble(); // N/mm
    double toe = 0.05 + 0.25 * rnd.nextDouble(); // mm
    double xPeak = 2 + 3 * rnd.nextDouble(); // mm of travel to the break
    Law law = switch (shape) {
      case 0 -> x -> k * (Math.sqrt(x * x + toe * toe) - toe); // soft toe, then linear
      case 1 -> x -> k * xPeak * 0.6 * Math.tanh(x / (0.6 * xPeak)); // softening
      default -> x -> k * x * (1 + 0.3 * x / xPeak); // stiffening (sandwich rise)
    };
    double speed = (1 + 4 * rnd.nextDouble()) / 60; // 1 to 5 mm/min, in mm/s
    double rate = 50 + 150 * rnd.nextDouble(); // samples/s
    double peakF = law.force(xPeak);
    double noise = peakF / (100 + 900 * rnd.nextDouble());
    boolean encoder = rnd.nextBoolean();
    double quantum = 0.0025 + 0.0075 * rnd.nextDouble();
    double gaugeNoise = 0.0005 + 0.002 * rnd.nextDouble();
    int rise = (int) Math.ceil(xPeak / speed * rate);
    int n = (int) (1.2 * rise) + (int) (0.3 * rate); // past the break whatever the steps
    double[] t = new double[n];
    double[] trueX = new double[n];
    double[] f = new double[n];
    double[] pos = new double[n];
    double now = 0;
    int breakAt = -1;
    for (int i = 0; i < n; i++) {
      now += i == 0 ? 0 : (0.6 + 0.8 * rnd.nextDouble()) / rate; // uneven time steps
      t[i] = now;
      trueX[i] = speed * now;
      if (breakAt < 0 && trueX[i] > xPeak) {
        breakAt = i;
      }
      double law_N = law.force(trueX[i]);
      f[i] = (breakAt < 0 ? law_N : 0.1 * law_N) + noise * rnd.nextGaussian();
      pos[i] = encoder ? quantum * Math.floor(trueX[i] / quantum)
          : trueX[i] + gaugeNoise * rnd.nextGaussian();
    }
    boolean jumped = c % 4 != 3;
    String where = "none";
    int jumpAt = Integer.MAX_VALUE;
    if (jumped) {
      double size = (0.5 + 2.5 * rnd.nextDouble()) * (rnd.nextBoolean() ? 1 : -1);
      int from = switch (c % 4) {
        case 0 -> breakAt; // with the force drop
        case 1 -> Math.max(1, breakAt - 1 - rnd.nextInt(3)); // read up to 3 samples ahead
        default -> breakAt / 3 + rnd.nextInt(breakAt / 3); // a slip mid-rise
      };
      where = (c % 4 == 2 ? "slip at " : "at ") + from + " of break " + breakAt;
      jumpAt = from;
      for (int i = from; i < n; i++) {
        pos[i] += size;
      }
    }
    String name = String.format("curve %d (shape %d, %s, %s, %.0f S/s)", c, shape,
        encoder ? "encoder" : "gauge", where, rate);
    return new Case(name, t, f, pos, trueX, law, jumped, jumpAt);
  }

  static double[] minusFirst(double[] pos) {
    double[] x = new double[pos.length];
    for (int i = 0; i < pos.length; i++) {
      x[i] = pos[i] - pos[0];
    }
    return x;
  }

  /** Composite Simpson's rule with 2000 intervals. */
  static double simpson(Law law, double a, double b) {
    int m = 2000;
    double h = (b - a) / m;
    double s = law.force(a) + law.force(b);
    for (int i = 1; i < m; i++) {
      s += (i % 2 == 1 ? 4 : 2) * law.force(a + i * h);
    }
    return s * h / 3;
  }
}
