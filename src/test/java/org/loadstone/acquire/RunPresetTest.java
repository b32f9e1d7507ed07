package org.loadstone.acquire;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.loadstone.archive.Geometry;
import org.loadstone.archive.TestType;

/** The run presets per test type: one for each, each arms, and each says what it is. */
class RunPresetTest {

  private static RunSettings armed(TestType t, double capacity_N) {
    ScaleChoice scale = ScaleChoice.nominal(100, "test", null);
    RunSetup.Request r = new RunSetup.Request(new RunTemplate("P-01", "foam", List.of(), "", "",
        null, Geometry.NONE, t), scale, capacity_N,
        RunPreset.of(t).applyTo(RunSettings.builder()), null, null, false, "test");
    return RunSetup.check(r, "sim"); // the arming rules, as the console and record apply them
  }

  @Test
  void everyTestTypeHasAPresetThatArmsOnA500NCell() {
    for (TestType t : TestType.values()) {
      RunPreset p = RunPreset.of(t);
      assertThat(p.test()).isEqualTo(t);
      RunSettings s = armed(t, 500);
      assertThat(s.startThreshold_N()).isEqualTo(p.startThreshold_N());
      assertThat(s.breakDropPct()).isEqualTo(p.breakDropPct());
      assertThat(s.postBreak_s()).isEqualTo(p.postBreak_s());
      assertThat(s.maxSeconds()).isEqualTo(p.maxSeconds());
      // only a crush goes on through its load drops (a crush end rule on another test is refused
      // at arming, RunSetup.check)
      assertThat(s.crushEnd() != null).as(t.name()).isEqualTo(t == TestType.CRUSH);
    }
  }

  @Test
  void timeLimitsLeaveRoomForAStandardsPacedTest() {
    // sandwich flexure (ASTM C393 / D7249) paces a test to fail in about 3 to 6 min (from
    // memory): a bending preset's limit must not cut such a run short
    for (TestType t : TestType.values()) {
      double limit = RunPreset.of(t).maxSeconds();
      assertThat(limit == 0 || limit >= 6 * 60 || t == TestType.COMPRESSION).as(t.name())
          .isTrue();
    }
    assertThat(RunPreset.of(TestType.THREE_POINT_BEND).maxSeconds()).isGreaterThan(6 * 60);
  }

  @Test
  void aCrushPresetEndsByItsRuleNotAtADrop() {
    RunPreset crush = RunPreset.of(TestType.CRUSH);
    assertThat(crush.crushEnd()).isEqualTo(CrushEnd.DEFAULTS);
    assertThat(crush.words()).contains("crush").contains("below 5 % of the peak for 1 s")
        .doesNotContain("drop");
    assertThat(RunPreset.of(TestType.TENSION).words())
        .isEqualTo("tension: start at 5 N, break at a 50 % drop, 0.5 s tail, time limit 600 s");
  }

  @Test
  void aPresetOnASmallCellIsRefusedWithTheFieldsToChange() {
    // a 5 N start on a 4 N cell: refused at arming, naming the start threshold and the capacity
    org.loadstone.units.LoadstoneException e = org.junit.jupiter.api.Assertions.assertThrows(
        org.loadstone.units.LoadstoneException.class,
        () -> armed(TestType.THREE_POINT_BEND, 4));
    assertThat(e.settings()).contains(org.loadstone.units.Setting.START_THRESHOLD);
    assertThat(e.getMessage()).contains("start threshold (5 N)");
  }
}
