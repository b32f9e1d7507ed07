package org.loadstone.sim;

/**
 * Crosshead motion: true crosshead displacement in mm (positive = towards the specimen) as a
 * function of true time. Queries come in non-decreasing time.
 */
abstract class CrossheadDrive {
  /** @return crosshead displacement at a time, mm */
  abstract double position_mm(double time_s);

  /** Constant rate from time zero. */
  static final class ConstantRate extends CrossheadDrive {
    private final double rate_mm_per_s;

    ConstantRate(double rate_mm_per_s) {
      this.rate_mm_per_s = rate_mm_per_s;
    }

    @Override
    double position_mm(double time_s) {
      return rate_mm_per_s * Math.max(0, time_s);
    }
  }

  /**
   * A person pumping a hand press. After a short start-up pause, each cycle is a stroke (a
   * raised-cosine advance of uneven length and duration), a release in which the crosshead backs
   * off a little (backlash and spring-back of the mechanism), and a pause of uneven length
   * (sometimes a long one). Every cycle's numbers are drawn from the seed when the cycle starts,
   * so nothing is stored per cycle and the motion is the same for the same seed.
   */
  static final class HandPump extends CrossheadDrive {
    private final double meanStroke_mm;
    private final SimRandom random;
    private double cycleStart_s;
    private double base_mm;
    private double stroke_mm;
    private double stroke_s;
    private double back_mm;
    private double back_s;
    private double pause_s;

    /** @param meanStroke_mm mean advance of one stroke, mm, &gt; 0 */
    HandPump(double meanStroke_mm, SimRandom random) {
      this.meanStroke_mm = meanStroke_mm;
      this.random = random;
      // a start-up pause: the first "cycle" moves nothing
      cycleStart_s = 0;
      stroke_mm = 0;
      stroke_s = random.uniform(0.4, 1.2);
      back_mm = 0;
      back_s = 0;
      pause_s = 0;
    }

    private double cycleEnd_s() {
      return cycleStart_s + stroke_s + back_s + pause_s;
    }

    private void nextCycle() {
      double end = cycleEnd_s();
      base_mm += stroke_mm - back_mm;
      cycleStart_s = end;
      stroke_mm = meanStroke_mm * random.uniform(0.55, 1.45);
      stroke_s = random.uniform(0.35, 0.9);
      back_mm = stroke_mm * random.uniform(0.03, 0.10);
      back_s = random.uniform(0.06, 0.15);
      pause_s =
          random.nextDouble() < 0.12 ? random.uniform(1.5, 3.0) : random.uniform(0.15, 0.9);
    }

    @Override
    double position_mm(double time_s) {
      while (time_s >= cycleEnd_s()) {
        nextCycle();
      }
      double s = time_s - cycleStart_s;
      if (s < stroke_s) {
        return base_mm + stroke_mm * 0.5 * (1 - StrictMath.cos(Math.PI * Math.max(0, s) / stroke_s));
      }
      s -= stroke_s;
      if (s < back_s) {
        return base_mm + stroke_mm - back_mm * 0.5 * (1 - StrictMath.cos(Math.PI * s / back_s));
      }
      return base_mm + stroke_mm - back_mm;
    }
  }
}
