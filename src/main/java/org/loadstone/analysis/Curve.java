package org.loadstone.analysis;

import java.lang.ref.SoftReference;
import java.util.Arrays;
import java.util.function.Supplier;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * A read-only force record of one run, the input to {@link RunAnalyzer}.
 *
 * <p>Force is positive in the loading direction (a bend or compression load presses with a
 * positive force). Position is the crosshead or specimen position in millimetres, increasing in
 * the loading direction; it may be absent ({@code null}), in which case stiffness, energy and
 * displacements are absent from the analysis instead of being guessed.
 *
 * <p>The arrays are copied on construction and on every accessor call, so a curve never changes
 * (except {@link #over}, which takes arrays that their owner no longer changes).
 *
 * <p>A {@linkplain #deferred deferred} curve knows its size and whether it has position, and
 * reads its samples only when they are asked for (a chart of a run whose figures came from the
 * archive index); it keeps them only as long as memory allows, so a study of thousands of runs
 * does not hold their samples.
 *
 * @param time_s sample times in seconds, strictly increasing, finite
 * @param force_N force in newtons, finite, same length as {@code time_s}
 * @param position_mm position in millimetres, finite, same length, or {@code null} when unknown
 * @throws LoadstoneException when the arrays differ in length, hold fewer than 2 samples, hold a
 *     non-finite value (the message names the column and sample index) or time does not increase
 * @throws IllegalArgumentException when {@code time_s} or {@code force_N} is null
 */
public final class Curve {
  private final double[] time_s;
  private final double[] force_N;
  private final double[] position_mm;
  private final int size;
  private final boolean hasPosition;
  private final Supplier<Curve> source;
  private volatile SoftReference<Curve> read = new SoftReference<>(null);

  /** Validates and copies the arrays. */
  public Curve(double[] time_s, double[] force_N, double[] position_mm) {
    this(Precondition.notNull(time_s, "time_s").clone(),
        Precondition.notNull(force_N, "force_N").clone(),
        position_mm == null ? null : position_mm.clone(), true);
  }

  private Curve(double[] time_s, double[] force_N, double[] position_mm, boolean owned) {
    Precondition.notNull(time_s, "time_s");
    Precondition.notNull(force_N, "force_N");
    this.time_s = time_s;
    this.force_N = force_N;
    this.position_mm = position_mm;
    this.size = time_s.length;
    this.hasPosition = position_mm != null;
    this.source = null;
    if (time_s.length < 2) {
      throw new LoadstoneException(
          "Run curve has " + time_s.length + " sample(s); analysis needs at least 2. "
              + "Record a longer run.");
    }
    if (force_N.length != time_s.length) {
      throw new LoadstoneException(
          "Run curve columns differ in length: time_s has " + time_s.length + " samples, force_N "
              + force_N.length + ". Supply one force value per time stamp.");
    }
    if (position_mm != null && position_mm.length != time_s.length) {
      throw new LoadstoneException(
          "Run curve columns differ in length: time_s has " + time_s.length
              + " samples, position_mm " + position_mm.length
              + ". Supply one position per time stamp, or none.");
    }
    requireFinite(time_s, "time_s");
    requireFinite(force_N, "force_N");
    if (position_mm != null) {
      requireFinite(position_mm, "position_mm");
    }
    for (int i = 1; i < time_s.length; i++) {
      if (!(time_s[i] > time_s[i - 1])) {
        throw new LoadstoneException(
            "Run curve time_s does not increase at sample " + i + " (" + time_s[i - 1] + " s then "
                + time_s[i] + " s). Time stamps must strictly increase; remove repeated or "
                + "out-of-order samples.");
      }
    }
  }

  /**
   * A curve over the given arrays without copying them, for columns that no one changes after
   * reading (a stored run's samples); saves two copies of a long run.
   *
   * @throws LoadstoneException as the constructor
   */
  public static Curve over(double[] time_s, double[] force_N, double[] position_mm) {
    return new Curve(time_s, force_N, position_mm, true);
  }

  private Curve(int size, boolean hasPosition, Supplier<Curve> source) {
    this.time_s = null;
    this.force_N = null;
    this.position_mm = null;
    this.size = size;
    this.hasPosition = hasPosition;
    this.source = source;
  }

  /**
   * A curve whose samples are read when first asked for, and read again if memory ran short
   * meanwhile.
   *
   * @param size its number of samples, at least 2
   * @param hasPosition whether it has a position channel
   * @param source reads the curve; must give one of {@code size} samples with position as
   *     stated, and throws {@link LoadstoneException} when it cannot (the run's file gone or
   *     changed), which then reaches the caller of the accessor
   */
  public static Curve deferred(int size, boolean hasPosition, Supplier<Curve> source) {
    Precondition.notNull(source, "source");
    if (size < 2) {
      throw new IllegalArgumentException("a curve has at least 2 samples, not " + size);
    }
    return new Curve(size, hasPosition, source);
  }

  /**
   * @return a curve that holds its samples: this one, or a deferred curve's samples, read now
   * @throws LoadstoneException when a deferred curve's samples cannot be read
   */
  public Curve read() {
    return samples();
  }

  /** @return the curve holding the samples: this one, or a deferred curve's samples */
  private Curve samples() {
    if (source == null) {
      return this;
    }
    Curve c = read.get();
    if (c == null) {
      c = source.get();
      if (c.size() != size || c.hasPosition() != hasPosition) {
        throw new LoadstoneException("the run's samples changed since its figures were "
            + "computed (" + c.size() + " samples where " + size + " were analysed): list the "
            + "archive again to analyse the run anew");
      }
      read = new SoftReference<>(c.samples());
      c = c.samples();
    }
    return c;
  }

  /** The arrays themselves, for the analysis in this package, which only reads them. */
  double[] timeColumn() {
    return samples().time_s;
  }

  double[] forceColumn() {
    return samples().force_N;
  }

  double[] positionColumn() {
    return samples().position_mm;
  }

  /** A curve without a position channel. */
  public static Curve withoutPosition(double[] time_s, double[] force_N) {
    return new Curve(time_s, force_N, null);
  }

  static void requireFinite(double[] values, String column) {
    for (int i = 0; i < values.length; i++) {
      if (!Double.isFinite(values[i])) {
        throw new LoadstoneException(
            "Run curve column " + column + " holds " + values[i] + " at sample " + i
                + ". Every value must be a finite number; remove or repair that sample.");
      }
    }
  }

  /** @return a copy of the sample times, seconds */
  public double[] time_s() {
    return samples().time_s.clone();
  }

  /** @return a copy of the forces, newtons */
  public double[] force_N() {
    return samples().force_N.clone();
  }

  /** @return a copy of the positions in millimetres, or {@code null} when there is no position */
  public double[] position_mm() {
    double[] p = samples().position_mm;
    return p == null ? null : p.clone();
  }

  /** @return the time of sample {@code i}, seconds, without copying anything */
  public double time_s(int i) {
    return source == null ? time_s[i] : samples().time_s[i];
  }

  /** @return the force of sample {@code i}, newtons */
  public double force_N(int i) {
    return source == null ? force_N[i] : samples().force_N[i];
  }

  /**
   * @return the position of sample {@code i}, millimetres
   * @throws IllegalStateException when the curve has no position
   */
  public double position_mm(int i) {
    if (!hasPosition) {
      throw new IllegalStateException("the curve has no position channel");
    }
    return source == null ? position_mm[i] : samples().position_mm[i];
  }

  /** @return the number of samples, at least 2 */
  public int size() {
    return size;
  }

  /** @return whether the curve has a position channel */
  public boolean hasPosition() {
    return hasPosition;
  }

  @Override
  public boolean equals(Object o) {
    if (!(o instanceof Curve c)) {
      return false;
    }
    Curve a = samples();
    Curve b = c.samples();
    return Arrays.equals(a.time_s, b.time_s)
        && Arrays.equals(a.force_N, b.force_N)
        && Arrays.equals(a.position_mm, b.position_mm);
  }

  @Override
  public int hashCode() {
    Curve a = samples();
    return 31 * (31 * Arrays.hashCode(a.time_s) + Arrays.hashCode(a.force_N))
        + Arrays.hashCode(a.position_mm);
  }

  @Override
  public String toString() {
    return "Curve[" + size() + " samples, " + (hasPosition() ? "with" : "without") + " position]";
  }
}
