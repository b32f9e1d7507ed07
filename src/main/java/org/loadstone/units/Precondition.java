package org.loadstone.units;

/** One-line argument checks with uniform messages. */
public final class Precondition {
  private Precondition() {}

  /** @throws IllegalArgumentException "Null 'name' argument." when {@code value} is null */
  public static <T> T notNull(T value, String name) {
    if (value == null) {
      throw new IllegalArgumentException("Null '" + name + "' argument.");
    }
    return value;
  }

  /** @throws IllegalArgumentException when {@code value} is NaN or infinite */
  public static double finite(double value, String name) {
    if (!Double.isFinite(value)) {
      throw new IllegalArgumentException("'" + name + "' must be a finite number, was " + value);
    }
    return value;
  }

  /** @throws IllegalArgumentException when {@code value} is not finite and greater than zero */
  public static double positive(double value, String name) {
    if (!(Double.isFinite(value) && value > 0)) {
      throw new IllegalArgumentException("'" + name + "' must be greater than zero, was " + value);
    }
    return value;
  }

  /** @throws IllegalArgumentException when {@code value} is not finite and at least zero */
  public static double nonNegative(double value, String name) {
    if (!(Double.isFinite(value) && value >= 0)) {
      throw new IllegalArgumentException("'" + name + "' must be zero or more, was " + value);
    }
    return value;
  }
}
