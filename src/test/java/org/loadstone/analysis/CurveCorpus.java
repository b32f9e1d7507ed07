package org.loadstone.analysis;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.function.DoubleUnaryOperator;

/**
 * Synthetic force–displacement curves whose initial stiffness is known by construction, as a test
 * engineer meets them: seven shapes, force noise from peak/1000 to peak/25, position from an
 * encoder (quantised) or from a 30 frames-per-second video track (quantised to a pixel and
 * interpolated onto the force clock), and uneven time steps with the odd gap. Seeded: the same
 * seed gives the same curve.
 *
 * <p>Every shape is straight with slope k from its toe (if any) to a yield, so the truth is k.
 */
final class CurveCorpus {
  private CurveCorpus() {}

  enum Shape {
    LINEAR_WITH_TOE,
    BRITTLE,
    SOFTENING,
    FOAM_WITH_DENSIFICATION,
    SANDWICH_STICK_SLIP,
    DUCTILE_PLATEAU,
    CRUSH_SAW_TOOTH
  }

  enum PositionKind {
    ENCODER,
    VIDEO_30FPS
  }

  /** One curve with its truth. */
  record Case(Shape shape, int noiseDivisor, PositionKind position, long seed, Curve curve,
      double stiffness_N_per_mm, double peak_N) {
    @Override
    public String toString() {
      return shape + " noise peak/" + noiseDivisor + " " + position + " seed " + seed;
    }
  }

  /** The shape's force at crosshead travel x (mm), its travel span and its travel at the peak. */
  private record Law(DoubleUnaryOperator force, double end_mm, int samples) {}

  static List<Case> all(int[] noiseDivisors, int seeds) {
    List<Case> out = new ArrayList<>();
    for (Shape s : Shape.values()) {
      for (int div : noiseDivisors) {
        for (PositionKind p : PositionKind.values()) {
          for (int k = 0; k < seeds; k++) {
            long seed = 1_000_003L * s.ordinal() + 10_007L * div + 101L * p.ordinal() + k;
            out.add(make(s, div, p, seed));
          }
        }
      }
    }
    return out;
  }

  static Case make(Shape shape, int noiseDivisor, PositionKind kind, long seed) {
    Random rnd = new Random(seed);
    double k = 20 * Math.pow(100, rnd.nextDouble()); // 20 to 2000 N/mm
    Law law = law(shape, k, rnd);
    int n = law.samples();
    double duration_s = 30 + 60 * rnd.nextDouble();
    double speed = law.end_mm() / duration_s; // mm/s
    double[] t = new double[n];
    double dt = duration_s / n;
    for (int i = 1; i < n; i++) {
      double step = dt * (0.6 + 0.8 * rnd.nextDouble());
      if (rnd.nextDouble() < 0.002) {
        step += 5 * dt; // a few samples lost
      }
      t[i] = t[i - 1] + step;
    }
    double scale = law.end_mm() / (speed * t[n - 1]); // stretch so travel ends at end_mm
    double[] trueX = new double[n];
    double[] f = new double[n];
    double peak = 0;
    for (int i = 0; i < n; i++) {
      trueX[i] = speed * t[i] * scale;
      f[i] = law.force().applyAsDouble(trueX[i]);
      peak = Math.max(peak, f[i]);
    }
    double sd = peak / noiseDivisor;
    for (int i = 0; i < n; i++) {
      f[i] += sd * rnd.nextGaussian();
    }
    double[] x = kind == PositionKind.ENCODER
        ? encoder(trueX, 0.0025 + 0.0075 * rnd.nextDouble())
        : video(t, speed * scale, 0.01 + 0.02 * rnd.nextDouble(), rnd);
    double start = 2 + 10 * rnd.nextDouble(); // the channel does not start at zero
    for (int i = 0; i < n; i++) {
      x[i] += start;
    }
    return new Case(shape, noiseDivisor, kind, seed, new Curve(t, f, x), k, peak);
  }

  private static double[] encoder(double[] x, double step_mm) {
    double[] out = new double[x.length];
    for (int i = 0; i < x.length; i++) {
      out[i] = Math.round(x[i] / step_mm) * step_mm;
    }
    return out;
  }

  /** Positions tracked at 30 frames/s to a pixel, then interpolated at the force time stamps. */
  private static double[] video(double[] t, double speed, double pixel_mm, Random rnd) {
    double frame = 1.0 / 30;
    double phase = frame * rnd.nextDouble();
    int frames = (int) Math.ceil((t[t.length - 1] + phase) / frame) + 2;
    double[] ft = new double[frames];
    double[] fx = new double[frames];
    for (int j = 0; j < frames; j++) {
      ft[j] = j * frame - phase;
      double tracked = speed * Math.max(0, ft[j]) + 0.2 * pixel_mm * rnd.nextGaussian();
      fx[j] = Math.round(tracked / pixel_mm) * pixel_mm;
    }
    double[] out = new double[t.length];
    int j = 0;
    for (int i = 0; i < t.length; i++) {
      while (ft[j + 1] < t[i]) {
        j++;
      }
      double w = (t[i] - ft[j]) / (ft[j + 1] - ft[j]);
      out[i] = fx[j] + w * (fx[j + 1] - fx[j]);
    }
    return out;
  }

  private static double between(Random rnd, double lo, double hi) {
    return lo + (hi - lo) * rnd.nextDouble();
  }

  /** A straight line of slope k after a tangent-continuous quadratic toe of length toe. */
  private static double toeLine(double x, double k, double toe) {
    if (toe <= 0) {
      return k * x;
    }
    return x < toe ? k * x * x / (2 * toe) : k * (x - toe / 2);
  }

  /** Continues a line of slope k from (x0, f0) into a tangent-continuous saturation of height h. */
  private static double saturate(double x, double x0, double f0, double k, double h) {
    return f0 + h * Math.tanh(k * (x - x0) / h);
  }

  private static Law law(Shape shape, double k, Random rnd) {
    double yield_mm = between(rnd, 0.8, 3.0); // travel at the end of the straight part
    double toe = between(rnd, 0.0, 0.15) * yield_mm;
    double fy = k * (yield_mm - toe / 2);
    switch (shape) {
      case LINEAR_WITH_TOE -> {
        double toeLen = between(rnd, 0.1, 0.3) * yield_mm;
        double fYield = k * (yield_mm - toeLen / 2);
        double h = 0.15 * fYield;
        double end = yield_mm + 3 * h / k;
        double brk = end - 0.2 * h / k;
        return new Law(x -> x < yield_mm ? toeLine(x, k, toeLen)
            : saturate(x, yield_mm, fYield, k, h) * (x > brk ? 0.1 : 1), end, 5000);
      }
      case BRITTLE -> {
        double end = yield_mm * 1.1;
        // straight to 90 % of the break load, then a slight bend (slope 0.9 k at the break)
        return new Law(x -> {
          double f = x < 0.9 * yield_mm ? toeLine(x, k, toe)
              : toeLine(0.9 * yield_mm, k, toe) + k * (x - 0.9 * yield_mm)
                  - 0.5 * k * (x - 0.9 * yield_mm) * (x - 0.9 * yield_mm) / yield_mm;
          return x > yield_mm ? 0.05 * f : f;
        }, end, 4000);
      }
      case SOFTENING -> {
        double h = 1.5 * fy;
        double end = yield_mm + 4 * h / k;
        return new Law(x -> {
          if (x < yield_mm) {
            return toeLine(x, k, toe);
          }
          double f = saturate(x, yield_mm, fy, k, h);
          double neck = yield_mm + 3 * h / k;
          return x > neck ? f * (1 - 0.3 * (x - neck) / (end - neck)) : f;
        }, end, 6000);
      }
      case FOAM_WITH_DENSIFICATION -> {
        double plateau = fy / 0.8;
        double plateauEnd = yield_mm * 7;
        double lambda = yield_mm * 0.6;
        double end = plateauEnd + lambda * Math.log(1 + 1.5 * plateau / (0.2 * plateau));
        return new Law(x -> {
          if (x < yield_mm) {
            return toeLine(x, k, toe);
          }
          double f = saturate(x, yield_mm, fy, k, plateau - fy) + 0.01 * k * (x - yield_mm);
          return x > plateauEnd ? f + 0.2 * plateau * (Math.exp((x - plateauEnd) / lambda) - 1)
              : f;
        }, end, 16000);
      }
      case SANDWICH_STICK_SLIP -> {
        double h = 1.2 * fy;
        double end = yield_mm + 2.5 * h / k;
        int slips = 4 + rnd.nextInt(6);
        double[] at = new double[slips];
        double[] size = new double[slips];
        for (int j = 0; j < slips; j++) {
          at[j] = yield_mm + between(rnd, 0, 1) * (end - yield_mm) * 0.9;
          size[j] = between(rnd, 0.02, 0.06) * fy / k;
        }
        DoubleUnaryOperator envelope = x -> x < yield_mm ? toeLine(x, k, toe)
            : saturate(x, yield_mm, fy, k, h);
        return new Law(x -> {
          double shift = 0;
          for (int j = 0; j < slips; j++) {
            if (x > at[j]) {
              shift += size[j];
            }
          }
          double f = envelope.applyAsDouble(Math.max(0, x - shift));
          return x > end * 0.98 ? 0.2 * f : f;
        }, end, 6000);
      }
      case DUCTILE_PLATEAU -> {
        double h = fy / 3;
        double end = yield_mm + 12 * h / k;
        return new Law(x -> x < yield_mm ? toeLine(x, k, toe)
            : saturate(x, yield_mm, fy, k, h) + 0.002 * k * (x - yield_mm)
                - (x > end * 0.97 ? 0.6 * fy : 0), end, 6000);
      }
      case CRUSH_SAW_TOOTH -> {
        double first = fy;
        double tooth = 0.4 * yield_mm;
        double end = yield_mm * 6;
        double tallest = between(rnd, 0.85, 1.1);
        return new Law(x -> {
          if (x < yield_mm) {
            return toeLine(x, k, toe);
          }
          double u = (x - yield_mm) / tooth;
          int index = (int) u;
          double frac = u - index;
          double top = index == 3 ? tallest : 0.8 + 0.05 * Math.sin(index);
          // each tooth drops to half the first peak at once, then climbs back at 0.6 k
          double climb = Math.min(top * first, 0.5 * first + 0.6 * k * frac * tooth);
          return climb;
        }, end, 8000);
      }
      default -> throw new IllegalStateException(shape.toString());
    }
  }
}
