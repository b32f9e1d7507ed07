package org.loadstone.acquire;

import java.util.EnumMap;
import java.util.Locale;
import java.util.Map;
import org.loadstone.archive.TestType;
import org.loadstone.units.Precondition;

/**
 * The run settings a kind of test usually starts from: when recording starts, what drop ends it,
 * how long the tail is, the time limit and, for a crush, how it ends. One preset per test type,
 * here only, for every face that arms a run (the console's run settings start from it). A preset
 * fills a {@link RunSettings.Builder}; the builder's {@link RunSettings.Builder#build()} still
 * checks the values. Forces in N, times in s.
 *
 * @param test the kind of test
 * @param startThreshold_N recording starts at this force
 * @param breakDropPct a break is this fall below the peak, per cent (not used by a crush run)
 * @param postBreak_s the tail recorded after the break
 * @param maxSeconds the longest run; 0 = no limit
 * @param crushEnd how a crush run ends; null for every other test
 */
public record RunPreset(TestType test, double startThreshold_N, double breakDropPct,
    double postBreak_s, double maxSeconds, CrushEnd crushEnd) {

  /**
   * The presets. Where the values come from:
   *
   * <ul>
   *   <li>Bending (three- and four-point) starts from {@link RunSettings#DEFAULTS} (5 N start,
   *       40 % drop, 0.5 s tail), as {@code record} does. Time limit 10 min: flexure standards for
   *       sandwich panels ask for a rate that fails the specimen in about 3 to 6 min (ASTM C393 /
   *       D7249, from memory), so a run still going at 10 min has missed its break.
   *   <li>Compression of a core or foam block often has no sharp break, only a plateau and
   *       densification: a 30 % drop and a 5 min limit (common practice); the operator may stop
   *       by hand once densification is reached.
   *   <li>Tension: a tensile break drops to near zero at once, so 50 % is safe from the noise of
   *       a yielding specimen (common practice); 10 min limit.
   *   <li>Crush: no drop ends it ({@link CrushEnd#DEFAULTS}: force below 5 % of the peak for 1 s);
   *       10 min limit.
   * </ul>
   */
  private static final Map<TestType, RunPreset> PRESETS = new EnumMap<>(TestType.class);

  static {
    RunSettings d = RunSettings.DEFAULTS;
    for (TestType bend : new TestType[] {TestType.THREE_POINT_BEND, TestType.FOUR_POINT_BEND}) {
      PRESETS.put(bend, new RunPreset(bend, d.startThreshold_N(), d.breakDropPct(),
          d.postBreak_s(), 600, null));
    }
    PRESETS.put(TestType.COMPRESSION,
        new RunPreset(TestType.COMPRESSION, 5, 30, 0.5, 300, null));
    PRESETS.put(TestType.TENSION, new RunPreset(TestType.TENSION, 5, 50, 0.5, 600, null));
    PRESETS.put(TestType.CRUSH,
        new RunPreset(TestType.CRUSH, 5, d.breakDropPct(), 0.5, 600, CrushEnd.DEFAULTS));
  }

  /** Checks the values the way a run's settings will, so a preset can never refuse to arm. */
  public RunPreset {
    Precondition.notNull(test, "test");
    if ((crushEnd != null) != (test == TestType.CRUSH)) {
      throw new IllegalArgumentException("a crush end rule belongs to a crush preset only");
    }
    RunSettings.builder().startThreshold_N(startThreshold_N).breakDropPct(breakDropPct)
        .postBreak_s(postBreak_s).maxSeconds(maxSeconds).ratedCapacity_N(Double.MAX_VALUE)
        .crushEnd(crushEnd).build();
  }

  /**
   * @param test a kind of test, not null
   * @return its preset
   */
  public static RunPreset of(TestType test) {
    return PRESETS.get(Precondition.notNull(test, "test"));
  }

  /**
   * Sets this preset's values on a builder (the others, such as the rated capacity, are left).
   *
   * @return {@code b}
   */
  public RunSettings.Builder applyTo(RunSettings.Builder b) {
    return b.startThreshold_N(startThreshold_N).breakDropPct(breakDropPct)
        .postBreak_s(postBreak_s).maxSeconds(maxSeconds).crushEnd(crushEnd);
  }

  /** @return the preset in words, e.g. "three-point: start at 5 N, break at a 40 % drop, …" */
  public String words() {
    String end = crushEnd != null ? "ends " + crushEnd.words()
        : String.format(Locale.ROOT, "break at a %s %% drop, %s s tail", num(breakDropPct),
            num(postBreak_s));
    return String.format(Locale.ROOT, "%s: start at %s N, %s, %s", test.wireName(),
        num(startThreshold_N), end, maxSeconds > 0 ? "time limit " + num(maxSeconds) + " s"
            : "no time limit");
  }

  private static String num(double v) {
    return String.format(Locale.ROOT, "%.6g", v).replaceAll("\\.?0+($|e)", "$1");
  }
}
