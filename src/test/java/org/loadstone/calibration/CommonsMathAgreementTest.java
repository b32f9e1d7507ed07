package org.loadstone.calibration;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;
import org.apache.commons.math3.fitting.PolynomialCurveFitter;
import org.apache.commons.math3.fitting.WeightedObservedPoints;
import org.apache.commons.math3.stat.regression.OLSMultipleLinearRegression;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** Our QR polynomial fit against Apache Commons Math 3.6.1 on random well-conditioned data. */
class CommonsMathAgreementTest {

  @ParameterizedTest(name = "degree {0}")
  @ValueSource(ints = {1, 2, 3})
  void agreesWithOlsAndPolynomialCurveFitter(int degree) {
    Random rnd = new Random(20261202L + degree);
    int n = 40;
    double[] x = new double[n];
    double[] y = new double[n];
    double[][] design = new double[n][degree];
    WeightedObservedPoints obs = new WeightedObservedPoints();
    for (int i = 0; i < n; i++) {
      x[i] = 500.0 * rnd.nextDouble();
      y[i] = 120 + 8590 * x[i] - 0.4 * x[i] * x[i] + 2e-4 * x[i] * x[i] * x[i]
          + 30 * rnd.nextGaussian();
      for (int k = 0; k < degree; k++) {
        design[i][k] = Math.pow(x[i], k + 1);
      }
      obs.add(x[i], y[i]);
    }
    LeastSquares.Result ours = LeastSquares.polynomial(x, y, degree, true);

    OLSMultipleLinearRegression ols = new OLSMultipleLinearRegression();
    ols.newSampleData(y, design);
    double[] ref = ols.estimateRegressionParameters();
    for (int k = 0; k <= degree; k++) {
      assertThat(ours.polynomial().coefficient(k)).as("b%d vs OLS", k)
          .isCloseTo(ref[k], within(1e-7 * Math.abs(ref[k]) + 1e-12));
    }
    assertThat(ours.residualSd()).isCloseTo(ols.estimateRegressionStandardError(),
        within(1e-9 * ols.estimateRegressionStandardError()));

    double[] lm = PolynomialCurveFitter.create(degree).fit(obs.toList());
    for (int k = 0; k <= degree; k++) {
      // the curve fitter iterates (Levenberg–Marquardt) to a looser tolerance than QR
      assertThat(ours.polynomial().coefficient(k)).as("b%d vs PolynomialCurveFitter", k)
          .isCloseTo(lm[k], within(1e-5 * Math.abs(lm[k]) + 1e-9));
    }
  }

  @ParameterizedTest(name = "through zero, seed {0}")
  @ValueSource(ints = {7, 8})
  void throughZeroAgreesWithOlsWithoutIntercept(int seed) {
    Random rnd = new Random(seed);
    int n = 25;
    double[] x = new double[n];
    double[] y = new double[n];
    double[][] design = new double[n][1];
    for (int i = 0; i < n; i++) {
      x[i] = 490 * rnd.nextDouble();
      y[i] = 8590 * x[i] + 25 * rnd.nextGaussian();
      design[i][0] = x[i];
    }
    OLSMultipleLinearRegression ols = new OLSMultipleLinearRegression();
    ols.setNoIntercept(true);
    ols.newSampleData(y, design);
    LeastSquares.Result ours = LeastSquares.polynomial(x, y, 1, false);
    assertThat(ours.polynomial().coefficient(1))
        .isCloseTo(ols.estimateRegressionParameters()[0], within(1e-9 * 8590));
    assertThat(ours.residualSd()).isCloseTo(ols.estimateRegressionStandardError(),
        within(1e-9 * ols.estimateRegressionStandardError()));
  }
}
