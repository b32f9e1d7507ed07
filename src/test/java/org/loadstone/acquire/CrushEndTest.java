package org.loadstone.acquire;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.loadstone.archive.FinishCause;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Setting;

/** A crush run's own ends: through the load drops to its travel limit or its low-force rule. */
class CrushEndTest {
  private static final double RATE_HZ = 1000;

  /** A saw-tooth: rise to 300 N over 0.3 mm, then teeth falling 50 % and rising again. */
  private static double sawTooth_N(double x_mm) {
    if (x_mm < 0.3) {
      return 1000 * x_mm;
    }
    double phase = ((x_mm - 0.3) % 0.4) / 0.4; // a tooth every 0.4 mm
    return phase < 0.1 ? 300 - 1500 * phase : 150 + 150 * (phase - 0.1) / 0.9;
  }

  private record Ended(RunControl.Finished finished, int breaks, long samples) {}

  /** Feeds the curve at 1 mm/s from 0.0 mm until the run ends or {@code seconds} pass. */
  private static Ended run(RunSettings s, double seconds,
      java.util.function.DoubleUnaryOperator forceAt) {
    RunControl rc = new RunControl(s, RATE_HZ);
    rc.arm();
    List<RunControl.Event> events = new ArrayList<>();
    long i = 0;
    for (; i < seconds * RATE_HZ && rc.state() != RunControl.State.FINISHED; i++) {
      double t = i / RATE_HZ;
      double x = t; // 1 mm/s
      rc.offer(i, 0, t, forceAt.applyAsDouble(x), 10 + x, events::add);
    }
    long breaks = events.stream().filter(e -> e instanceof RunControl.BreakDeclared).count();
    return new Ended(rc.finished(), (int) breaks, i);
  }

  private static RunSettings crush(CrushEnd end) {
    return RunSettings.builder().startThreshold_N(5).crushEnd(end).build();
  }

  @Test
  void aBreakRunStopsAtTheFirstToothButACrushRunGoesOnToItsTravelLimit() {
    // the same saw-tooth: the 40 % drop rule ends a break run at the first tooth (0.3 mm)
    Ended brk = run(RunSettings.builder().startThreshold_N(5).build(), 20, CrushEndTest::sawTooth_N);
    assertThat(brk.finished().cause()).isEqualTo(FinishCause.BREAK);
    assertThat(brk.samples()).isLessThan(1000);
    // a crush run with a 6 mm travel limit takes ~15 teeth and ends at 6 mm of travel from the
    // start of recording (the start threshold, 5 N, is reached at 0.005 mm)
    Ended c = run(crush(new CrushEnd(6, 0.05, 1)), 20, CrushEndTest::sawTooth_N);
    assertThat(c.finished().cause()).isEqualTo(FinishCause.TRAVEL_LIMIT);
    assertThat(c.breaks()).isZero();
    assertThat(c.finished().lastIndex()).isBetween(6004L, 6007L);
  }

  @Test
  void forceHeldBelowItsShareOfThePeakEndsACrushRun() {
    // crushed through at 3 mm: force falls to 2 % of the 300 N peak; 5 % for 0.5 s ends the run
    // 0.5 s (500 samples at 1 mm/s) after the fall, not at the fall itself
    Ended c = run(crush(new CrushEnd(0, 0.05, 0.5)), 20,
        x -> x < 3 ? sawTooth_N(x) : 6);
    assertThat(c.finished().cause()).isEqualTo(FinishCause.LOW_FORCE);
    assertThat(c.finished().lastIndex()).isEqualTo(3000L + 500);
    // a short dip below the level (0.2 s) does not end it; the time limit does
    RunSettings timed = crush(new CrushEnd(0, 0.05, 0.5)).toBuilder().maxSeconds(8).build();
    Ended dip = run(timed, 20, x -> x > 3 && x < 3.2 ? 6 : sawTooth_N(x));
    assertThat(dip.finished().cause()).isEqualTo(FinishCause.TIME_LIMIT);
  }

  @Test
  void outOfRangeEndsAreRefusedNamingTheSetting() {
    assertThatThrownBy(() -> new CrushEnd(-1, 0.05, 1)).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("travel limit")
        .satisfies(e -> assertThat(((LoadstoneException) e).settings())
            .contains(Setting.TRAVEL_LIMIT));
    assertThatThrownBy(() -> new CrushEnd(0, 1.2, 1)).hasMessageContaining("low-force level")
        .hasMessageContaining("120 %");
    assertThatThrownBy(() -> new CrushEnd(0, 0.05, Double.NaN))
        .hasMessageContaining("low-force time");
    assertThat(new CrushEnd(12, 0.05, 1).words())
        .isEqualTo("at 12 mm of travel, or when force stays below 5 % of the peak for 1 s");
  }
}
