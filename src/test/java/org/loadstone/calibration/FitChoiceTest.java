package org.loadstone.calibration;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.apache.commons.math3.distribution.FDistribution;
import org.apache.commons.math3.stat.regression.OLSMultipleLinearRegression;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** The fit recommendation: a partial F-test on each added coefficient (see {@link FitChoice}). */
class FitChoiceTest {
  /** Nominal sensitivity of the example 500 N cell (see {@link ExampleCellModel}), counts/N. */
  static final double COUNTS_PER_N = 8589.934592;
  /**
   * Noise of one reading, counts: the mean of 50 samples of 25-count RMS converter noise (a
   * typical HX711 at 10 samples/s; common practice), 25/√50 ≈ 3.5 counts.
   */
  static final double READING_SD_COUNTS = 25 / Math.sqrt(50);

  /** One ascending series: zero and {@code loads} loads evenly up to 500 N. */
  static List<CalibrationPoint> series(int points, double curvature_counts_per_N2, Random rnd) {
    List<CalibrationPoint> pts = new ArrayList<>();
    for (int i = 0; i < points; i++) {
      double f = 500.0 * i / (points - 1);
      double counts = 84210 + COUNTS_PER_N * f + curvature_counts_per_N2 * f * f
          + READING_SD_COUNTS * rnd.nextGaussian();
      pts.add(new CalibrationPoint(f, null, Direction.UP, 1, counts, 25, 50));
    }
    return pts;
  }

  @ParameterizedTest(name = "{0} points")
  @ValueSource(ints = {5, 7, 12})
  void aStraightLineWithRealisticNoiseIsFittedWithALineInAtLeast95PercentOfSeeds(int points) {
    int seeds = 1000;
    int linear = 0;
    for (int seed = 0; seed < seeds; seed++) {
      CalibrationReport r = CalibrationService.fitFromPoints(
          series(points, 0, new Random(1000L * points + seed)), CalibrationSettings.defaults());
      if (r.recommendation().kind() == FitKind.LINEAR) {
        linear++;
      }
    }
    // the F-test at α = 0.025 adopts a needless quadratic in 2.5 % of calibrations when the
    // errors are normal (the test's definition; the cubic is only reached through the
    // quadratic): about 975 of 1000, SD about 5, so 950 is far in the tail
    assertThat(linear).as("linear picks of %d", seeds).isGreaterThanOrEqualTo(950);
  }

  @Test
  void aTrulyQuadraticCellIsFittedWithAQuadraticAndACubicNeedsTwoDegreesOfFreedomLeft() {
    // bow of −0.03 % FS at mid-range (as the example cell): counts = c·F − k·F² with
    // k·250² = 0.0003·c·500 → k = 0.0206 counts/N²; about 1290 counts, 370 times the noise
    double k = -0.0003 * COUNTS_PER_N * 500 / (250.0 * 250.0);
    for (int points : new int[] {5, 7, 12}) {
      CalibrationReport r = CalibrationService.fitFromPoints(
          series(points, k, new Random(7)), CalibrationSettings.defaults());
      assertThat(r.recommendation().kind()).as("%d points", points).isEqualTo(FitKind.QUADRATIC);
      assertThat(r.recommendation().reason()).contains("quadratic's added term is significant");
      if (points == 5) {
        // cubic on 5 points leaves one residual degree of freedom: never considered
        assertThat(r.recommendation().reason()).contains("cubic not considered")
            .contains("1 residual degree(s) of freedom");
      }
    }
  }

  @Test
  void thePValueOfTheAddedTermAgreesWithCommonsMath() {
    // Reference: Commons Math 3.6.1 OLS sums of squares and its FDistribution (1, ν).
    Random rnd = new Random(11);
    for (int points : new int[] {5, 7, 12, 30}) {
      List<CalibrationPoint> pts = series(points, -0.004, rnd);
      CalibrationReport r = CalibrationService.fitFromPoints(pts, CalibrationSettings.defaults());
      double[] y = new double[points];
      double[][] x1 = new double[points][1];
      double[][] x2 = new double[points][2];
      for (int i = 0; i < points; i++) {
        double f = pts.get(i).force_N();
        y[i] = pts.get(i).counts_mean() - pts.get(0).counts_mean();
        x1[i][0] = f;
        x2[i][0] = f;
        x2[i][1] = f * f;
      }
      OLSMultipleLinearRegression lin = new OLSMultipleLinearRegression();
      lin.newSampleData(y, x1);
      OLSMultipleLinearRegression quad = new OLSMultipleLinearRegression();
      quad.newSampleData(y, x2);
      double sse1 = lin.calculateResidualSumOfSquares();
      double sse2 = quad.calculateResidualSumOfSquares();
      int dof = points - 3;
      double f = (sse1 - sse2) / (sse2 / dof);
      double expected = 1 - new FDistribution(1, dof).cumulativeProbability(f);
      double ours = FitChoice.addedTermP(r.fit(FitKind.LINEAR), r.fit(FitKind.QUADRATIC));
      assertThat(ours).as("%d points", points).isCloseTo(expected, within(1e-6 + 1e-6 * expected));
    }
  }

  @Test
  void theCriticalValueOfCommonsMathIsWhereOurTestTurns() {
    // F at the 95 % point of F(1, ν) from Commons Math gives p = 0.05 in our distribution
    for (int dof : new int[] {2, 3, 4, 9, 30}) {
      double crit = new FDistribution(1, dof).inverseCumulativeProbability(1 - FitChoice.ALPHA);
      assertThat(org.loadstone.analysis.stats.Distributions.fUpperTail(crit, 1, dof))
          .as("ν = %d", dof).isCloseTo(FitChoice.ALPHA, within(1e-8));
    }
  }
}
