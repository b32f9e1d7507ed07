package org.loadstone.analysis.stats;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.apache.commons.math3.distribution.ChiSquaredDistribution;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.distribution.TDistribution;
import org.junit.jupiter.api.Test;

/**
 * The sample-size advice against an independent exact power: the noncentral t written as
 * T = (Z + δ)/√(V/ν) and integrated numerically over the χ² density of V (Simpson's rule in
 * √V), with Commons Math 3.6.1's normal, χ² and t distributions. Nothing of {@link Distributions} is used
 * for the reference.
 */
class SampleSizeExactTest {
  private static final NormalDistribution Z = new NormalDistribution(0, 1);

  /**
   * P(T ≤ t) for the noncentral t(ν, δ): ∫ Φ(t·√(v/ν) − δ)·f_χ²(v) dv, taken over s = √v
   * (dv = 2s ds) so that the integrand is smooth at zero for every ν.
   */
  static double integratedCdf(double t, double nu, double delta) {
    ChiSquaredDistribution v = new ChiSquaredDistribution(nu);
    double top = Math.sqrt(nu + 40 * Math.sqrt(2 * nu) + 80);
    int steps = 8000;
    double h = top / steps;
    double sum = 0;
    for (int i = 0; i <= steps; i++) {
      double s = i * h;
      double w = i == 0 || i == steps ? 1 : i % 2 == 1 ? 4 : 2;
      sum += w * 2 * s * v.density(s * s) * Z.cumulativeProbability(t * s / Math.sqrt(nu) - delta);
    }
    return sum * h / 3;
  }

  /** Exact power of the two-sided two-sample t-test, n per group, by the integral above. */
  static double integratedPower(int n, double d, double alpha) {
    double nu = 2.0 * n - 2;
    double crit = new TDistribution(nu).inverseCumulativeProbability(1 - alpha / 2);
    double delta = d * Math.sqrt(n / 2.0);
    return 1 - integratedCdf(crit, nu, delta) + integratedCdf(-crit, nu, delta);
  }

  /**
   * Groups of identical specimens have a scatter of rounding size, so the effect size asked
   * about is of order 1e14: the advice answers at once (it used to sum δ²/2 series terms, for
   * ever) with the power the integral gives, on both sides of the shortcut.
   */
  @Test
  void hugeEffectsAnswerAtOnceWithTheIntegralsPower() {
    for (int n : new int[] {2, 3, 10}) {
      double crit = new TDistribution(2.0 * n - 2).inverseCumulativeProbability(1 - 0.05 / 2);
      for (double delta : new double[] {10 * crit + 39, 10 * crit + 41, 1e6, 1e14}) {
        double d = delta / Math.sqrt(n / 2.0);
        double p = SampleSize.power(n, d, 0.05);
        assertThat(p).as("n %d δ %s", n, delta).isLessThanOrEqualTo(1)
            .isCloseTo(integratedPower(n, d, 0.05), within(1e-12));
      }
    }
    assertThat(SampleSize.perGroup(1e14, 0.05, 0.80)).isEqualTo(2);
    // three identical peaks whose SD is rounding only: the comparison ends, with advice
    ComparisonResult r = GroupComparison.compare("peak", java.util.Map.of(
        "a", java.util.List.of(0.1 + 0.2, 0.3, 0.30000000000000004),
        "b", java.util.List.of(0.6, 0.6000000000000001, 0.6)));
    assertThat(r).isNotNull();
  }

  @Test
  void noncentralTAgreesWithTheIntegralOnBothSidesOfZero() {
    for (double nu : new double[] {2, 5, 17, 58}) {
      for (double delta : new double[] {-3, -0.4, 0.7, 2.5, 6}) {
        for (double t : new double[] {-4, -1.1, 0, 0.3, 2.2, 7}) {
          assertThat(Distributions.noncentralTCdf(t, nu, delta))
              .as("ν %s δ %s t %s", nu, delta, t)
              .isCloseTo(integratedCdf(t, nu, delta), within(2e-7));
        }
      }
    }
  }

  @Test
  void powerAndGroupSizeAreExactAtEveryGroupSizeFrom2To30() {
    for (int n = 2; n <= 30; n++) {
      for (double d : new double[] {0.5, 1.0, 2.0, 4.0}) {
        assertThat(SampleSize.power(n, d, 0.05)).as("n %d, d %s", n, d)
            .isCloseTo(integratedPower(n, d, 0.05), within(1e-6));
      }
      // the smallest effect n specimens resolve has exactly the wanted power, and the advice
      // turns from n + 1 to n right there
      double dStar = SampleSize.smallestEffect(n, 0.05, 0.80);
      assertThat(integratedPower(n, dStar, 0.05)).as("n %d", n).isCloseTo(0.80, within(1e-6));
      assertThat(SampleSize.perGroup(dStar * (1 + 1e-6), 0.05, 0.80)).as("n %d", n).isEqualTo(n);
      assertThat(SampleSize.perGroup(dStar * (1 - 1e-6), 0.05, 0.80)).as("n %d", n)
          .isEqualTo(n + 1);
    }
  }

  @Test
  void theNormalFormulaWithTQuantilesWasOneSpecimenShortAtSmallGroups() {
    // d = 3.04: √(2/n)·(t_{0.975,2n−2} + t_{0.80,2n−2}) is 3.035 at n = 3, so that formula
    // advised 3 specimens; their exact power is 0.79 (by the integral), so 4 are needed
    assertThat(integratedPower(3, 3.04, 0.05)).isLessThan(0.80);
    assertThat(integratedPower(4, 3.04, 0.05)).isGreaterThan(0.80);
    assertThat(SampleSize.perGroup(3.04, 0.05, 0.80)).isEqualTo(4);
  }
}
