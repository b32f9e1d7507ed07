package org.loadstone.acquire;

import java.util.Locale;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Setting;

/**
 * When a run starts and stops by itself. Immutable; build with {@link #builder()} or start from a
 * preset. All forces in N, times in s.
 *
 * @param startThreshold_N recording starts when force reaches this (auto start)
 * @param pretrigger_s history kept before the start so the toe of the curve is not lost
 * @param breakDropPct break when force has fallen by at least this % of the running peak (0…100)
 * @param armingLevel_N the peak must have exceeded this before a break can be declared
 * @param debounce_s the drop must last at least this long
 * @param absoluteStop_N alternatively, break when force falls back below this after arming; 0 = off
 * @param postBreak_s tail recorded after the break
 * @param ratedCapacity_N the load cell's rated capacity
 * @param overloadWarnPct warn at this % of rated capacity
 * @param overloadStopPct stop (cause overload) at this % of rated capacity
 * @param maxSeconds longest run, from the start threshold; 0 = no limit
 * @param crushEnd for a crush run, how it ends instead of at a break (no drop from the peak ends
 *     it); {@code null} for every other run
 */
public record RunSettings(double startThreshold_N, double pretrigger_s, double breakDropPct,
    double armingLevel_N, double debounce_s, double absoluteStop_N, double postBreak_s,
    double ratedCapacity_N, double overloadWarnPct, double overloadStopPct, double maxSeconds,
    CrushEnd crushEnd) {

  /** Defaults for a 500 N cell: start at 5 N, 1 s history, break at a 40 % drop, 0.5 s tail. */
  public static final RunSettings DEFAULTS =
      new RunSettings(5, 1.0, 40, 10, 0.01, 0, 0.5, 500, 80, 100, 0, null);

  /**
   * A crush run's preset: {@link #DEFAULTS} with {@link CrushEnd#DEFAULTS} (no break; force below
   * 5 % of the peak for 1 s ends it). Set its travel limit with {@code
   * CRUSH.toBuilder().crushEnd(CrushEnd.DEFAULTS.withTravelLimit_mm(12))}.
   */
  public static final RunSettings CRUSH = new RunSettings(5, 1.0, 40, 10, 0.01, 0, 0.5, 500, 80,
      100, 0, CrushEnd.DEFAULTS);

  public RunSettings {
    positive(startThreshold_N, Setting.START_THRESHOLD);
    nonNegative(pretrigger_s, Setting.PRETRIGGER);
    if (!(breakDropPct > 0 && breakDropPct < 100)) {
      throw new LoadstoneException(String.format(Locale.ROOT,
          "the break drop must be between 0 and 100 %% of the peak, was %s: give the fall "
              + "below the peak that marks a break, e.g. 40 %%", num(breakDropPct)),
          Setting.BREAK_DROP);
    }
    nonNegative(armingLevel_N, Setting.ARMING_LEVEL);
    nonNegative(debounce_s, Setting.DEBOUNCE);
    nonNegative(absoluteStop_N, Setting.ABSOLUTE_STOP);
    nonNegative(postBreak_s, Setting.TAIL);
    positive(ratedCapacity_N, Setting.RATED_CAPACITY);
    positive(overloadWarnPct, Setting.OVERLOAD_WARNING);
    positive(overloadStopPct, Setting.OVERLOAD_STOP);
    if (overloadWarnPct > overloadStopPct) {
      throw new LoadstoneException("the overload warning (" + num(overloadWarnPct)
          + " %) must not be above the overload stop (" + num(overloadStopPct) + " %): lower the "
          + "warning level or raise the stop level", Setting.OVERLOAD_WARNING,
          Setting.OVERLOAD_STOP);
    }
    if (overloadStopPct > 150) {
      throw new LoadstoneException("an overload stop above 150 % of rated capacity ("
          + num(overloadStopPct) + " %) is refused: cells are damaged beyond their safe overload; "
          + "give a stop level of 150 % or less", Setting.OVERLOAD_STOP);
    }
    nonNegative(maxSeconds, Setting.TIME_LIMIT);
    if (startThreshold_N >= ratedCapacity_N * overloadStopPct / 100) {
      throw new LoadstoneException("the start threshold (" + num(startThreshold_N)
          + " N) is at or above the overload stop (" + num(ratedCapacity_N * overloadStopPct / 100)
          + " N): lower the start threshold or check the cell's rated capacity",
          Setting.START_THRESHOLD, Setting.RATED_CAPACITY);
    }
  }

  private static String num(double v) {
    return String.format(Locale.ROOT, "%.6g", v).replaceAll("\\.?0+($|e)", "$1");
  }

  private static void positive(double v, Setting what) {
    if (!(Double.isFinite(v) && v > 0)) {
      throw new LoadstoneException("the " + what.label() + " must be greater than 0, was "
          + num(v) + ": give a positive value", what);
    }
  }

  private static void nonNegative(double v, Setting what) {
    if (!(Double.isFinite(v) && v >= 0)) {
      throw new LoadstoneException("the " + what.label() + " must be 0 or more, was " + num(v)
          + ": give 0 or a positive value", what);
    }
  }

  /**
   * How this run ends by itself, in words for the operator: the one sentence the console's state
   * band shows while recording and {@code record} prints when it arms, so both say the same.
   * A run with a break ends at its drop from the peak (or below its absolute stop level); a
   * crush run ({@link #crushEnd()}) goes on through the load drops and ends by its own rule
   * ({@link CrushEnd#words()}); either also at the time limit when one is set.
   *
   * @return e.g. "the run stops by itself at a 40 % drop from the peak" or "the crush goes on through
   *     the load drops and ends at 12 mm of travel, or after 60 s"
   */
  public String endWords() {
    String limit = maxSeconds > 0 ? ", or after " + num(maxSeconds) + " s" : "";
    if (crushEnd != null) {
      return "the crush goes on through the load drops and ends " + crushEnd.words() + limit;
    }
    String below = absoluteStop_N > 0
        ? " or when force falls back below " + num(absoluteStop_N) + " N" : "";
    return "the run stops by itself at a " + num(breakDropPct) + " % drop from the peak" + below + limit;
  }

  /** @return force at which an overload warning is given, N */
  public double overloadWarn_N() {
    return ratedCapacity_N * overloadWarnPct / 100;
  }

  /** @return force at which the run stops for overload, N */
  public double overloadStop_N() {
    return ratedCapacity_N * overloadStopPct / 100;
  }

  /** @return a builder starting from {@link #DEFAULTS} */
  public static Builder builder() {
    return new Builder(DEFAULTS);
  }

  /** @return a builder starting from these settings */
  public Builder toBuilder() {
    return new Builder(this);
  }

  /** Builder; {@link #build()} validates. */
  public static final class Builder {
    private double startThreshold_N;
    private double pretrigger_s;
    private double breakDropPct;
    private double armingLevel_N;
    private double debounce_s;
    private double absoluteStop_N;
    private double postBreak_s;
    private double ratedCapacity_N;
    private double overloadWarnPct;
    private double overloadStopPct;
    private double maxSeconds;
    private CrushEnd crushEnd;
    private boolean armingSet;

    private Builder(RunSettings s) {
      startThreshold_N = s.startThreshold_N;
      pretrigger_s = s.pretrigger_s;
      breakDropPct = s.breakDropPct;
      armingLevel_N = s.armingLevel_N;
      debounce_s = s.debounce_s;
      absoluteStop_N = s.absoluteStop_N;
      postBreak_s = s.postBreak_s;
      ratedCapacity_N = s.ratedCapacity_N;
      overloadWarnPct = s.overloadWarnPct;
      overloadStopPct = s.overloadStopPct;
      maxSeconds = s.maxSeconds;
      crushEnd = s.crushEnd;
    }

    public Builder startThreshold_N(double v) {
      startThreshold_N = v;
      return this;
    }

    public Builder pretrigger_s(double v) {
      pretrigger_s = v;
      return this;
    }

    public Builder breakDropPct(double v) {
      breakDropPct = v;
      return this;
    }

    /** Unless set, the arming level is twice the start threshold. */
    public Builder armingLevel_N(double v) {
      armingLevel_N = v;
      armingSet = true;
      return this;
    }

    public Builder debounce_s(double v) {
      debounce_s = v;
      return this;
    }

    public Builder absoluteStop_N(double v) {
      absoluteStop_N = v;
      return this;
    }

    public Builder postBreak_s(double v) {
      postBreak_s = v;
      return this;
    }

    public Builder ratedCapacity_N(double v) {
      ratedCapacity_N = v;
      return this;
    }

    public Builder overloadWarnPct(double v) {
      overloadWarnPct = v;
      return this;
    }

    public Builder overloadStopPct(double v) {
      overloadStopPct = v;
      return this;
    }

    public Builder maxSeconds(double v) {
      maxSeconds = v;
      return this;
    }

    /** A crush run's end rule; {@code null} (the default) ends the run at a break. */
    public Builder crushEnd(CrushEnd v) {
      crushEnd = v;
      return this;
    }

    /** @return the crush end rule set so far, or null */
    public CrushEnd crushEnd() {
      return crushEnd;
    }

    public RunSettings build() {
      double arm = armingSet ? armingLevel_N : 2 * startThreshold_N;
      return new RunSettings(startThreshold_N, pretrigger_s, breakDropPct, arm, debounce_s,
          absoluteStop_N, postBreak_s, ratedCapacity_N, overloadWarnPct, overloadStopPct,
          maxSeconds, crushEnd);
    }
  }
}
