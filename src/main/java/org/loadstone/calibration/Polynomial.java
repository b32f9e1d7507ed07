package org.loadstone.calibration;

import java.util.Arrays;
import java.util.List;
import org.loadstone.units.Precondition;

/**
 * A polynomial with real coefficients, lowest order first: {@code c0 + c1·x + c2·x² + …}.
 * Immutable.
 */
public final class Polynomial {
  private final double[] c;

  /**
   * @param coefficients lowest order first, at least one, all finite; copied
   * @throws IllegalArgumentException when empty or a coefficient is not finite
   */
  public Polynomial(double... coefficients) {
    Precondition.notNull(coefficients, "coefficients");
    if (coefficients.length == 0) {
      throw new IllegalArgumentException("a polynomial needs at least one coefficient");
    }
    for (int i = 0; i < coefficients.length; i++) {
      Precondition.finite(coefficients[i], "coefficients[" + i + "]");
    }
    this.c = coefficients.clone();
  }

  /** @param coefficients lowest order first, as for {@link #Polynomial(double...)} */
  public static Polynomial of(List<Double> coefficients) {
    Precondition.notNull(coefficients, "coefficients");
    return new Polynomial(coefficients.stream().mapToDouble(Double::doubleValue).toArray());
  }

  /** @return the highest power (the number of coefficients minus one) */
  public int degree() {
    return c.length - 1;
  }

  /** @return a copy of the coefficients, lowest order first */
  public double[] coefficients() {
    return c.clone();
  }

  /** @return the coefficients as an unmodifiable list, lowest order first */
  public List<Double> coefficientList() {
    return Arrays.stream(c).boxed().toList();
  }

  /** @return coefficient of {@code x^power}, zero above the degree */
  public double coefficient(int power) {
    return power < c.length ? c[power] : 0.0;
  }

  /** Evaluates by Horner's rule. */
  public double value(double x) {
    double v = 0;
    for (int i = c.length - 1; i >= 0; i--) {
      v = v * x + c[i];
    }
    return v;
  }

  /** Evaluates the first derivative. */
  public double slope(double x) {
    double v = 0;
    for (int i = c.length - 1; i >= 1; i--) {
      v = v * x + i * c[i];
    }
    return v;
  }

  /** @return the first derivative as a polynomial (the zero polynomial for a constant) */
  public Polynomial derivative() {
    if (c.length == 1) {
      return new Polynomial(0.0);
    }
    double[] d = new double[c.length - 1];
    for (int i = 1; i < c.length; i++) {
      d[i - 1] = i * c[i];
    }
    return new Polynomial(d);
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof Polynomial p && Arrays.equals(c, p.c);
  }

  @Override
  public int hashCode() {
    return Arrays.hashCode(c);
  }

  @Override
  public String toString() {
    return "Polynomial" + Arrays.toString(c);
  }
}
