package org.loadstone.calibration;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.apache.commons.math3.analysis.polynomials.PolynomialFunction;
import org.apache.commons.math3.analysis.solvers.BrentSolver;
import org.junit.jupiter.api.Test;
import org.loadstone.units.LoadstoneException;

class CountsToForceTest {

  @Test
  void newtonInverseMatchesBrentSolverOfCommonsMath() {
    Polynomial p = new Polynomial(3.5, 8590.0, -0.9, 4e-4);
    CountsToForce inv = new CountsToForce(p, 0, 500);
    BrentSolver brent = new BrentSolver(1e-12, 1e-12);
    for (double f = 0; f <= 500; f += 12.5) {
      double c = p.value(f);
      double ref = brent.solve(100, new PolynomialFunction(new double[] {3.5 - c, 8590.0, -0.9,
          4e-4}), 0, 500);
      assertThat(inv.force_N(c)).isCloseTo(ref, within(1e-9));
      assertThat(inv.force_N(c)).isCloseTo(f, within(1e-9));
    }
  }

  @Test
  void extrapolatesAlongTheEndTangentOutsideTheRange() {
    Polynomial p = new Polynomial(0, 100, 0.05);
    CountsToForce inv = new CountsToForce(p, 0, 100);
    // at 100 N: counts = 10000 + 500 = 10500, slope = 100 + 2·0.05·100 = 110 counts/N;
    // 1100 counts beyond → 10 N beyond
    assertThat(inv.force_N(11600)).isCloseTo(110, within(1e-9));
    assertThat(inv.force_N(-200)).isCloseTo(-2, within(1e-12));
  }

  @Test
  void refusesACurveThatTurnsOverInsideTheRange() {
    // counts = 100F − 0.6F²: slope 100 − 1.2F is zero at F = 83.3 N, inside 0..100
    assertThatThrownBy(() -> new CountsToForce(new Polynomial(0, 100, -0.6), 0, 100))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("not monotonic over the calibrated range")
        .hasMessageContaining("use a lower degree");
    // a cubic whose slope dips below zero only in a sliver narrower than the scan step is caught
    // by the exact check at the vertex of the (quadratic) slope
    Polynomial cubic = new Polynomial(0, 7500.0 + 1e-9, -150, 1);
    // slope = 3F² − 300F + 7500 + 1e-9 = 3(F − 50)² + 1e-9 > 0 : monotonic, accepted
    assertThat(new CountsToForce(cubic, 0, 100).force_N(cubic.value(50))).isCloseTo(50,
        within(1e-3));
    Polynomial dip = new Polynomial(0, 7500.0 - 1e-6, -150, 1);
    // slope = 3(F − 50)² − 1e-6 < 0 within |F − 50| < 5.8e-4: refused
    assertThatThrownBy(() -> new CountsToForce(dip, 0, 100))
        .isInstanceOf(LoadstoneException.class);
  }
}
