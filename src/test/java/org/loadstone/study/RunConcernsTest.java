package org.loadstone.study;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.loadstone.archive.FinishCause;
import org.loadstone.archive.RunMetadata;
import org.loadstone.archive.ScaleSpec;
import org.loadstone.archive.TestRuns;
import org.loadstone.study.RunConcerns.Kind;

class RunConcernsTest {
  private static RunMetadata.Builder run(String id) {
    return TestRuns.meta(id, "foam", TestRuns.panel(), 50.0).toBuilder().warnings(List.of());
  }

  private static List<Kind> kinds(RunMetadata md) {
    return RunConcerns.of(md).stream().map(RunConcerns.Concern::kind).toList();
  }

  @Test
  void aBrokenCalibratedRunWithAPassedCheckRaisesNone() {
    assertThat(RunConcerns.of(run("A").checkWeight(TestRuns.checkWeight(true, 0.1)).build())).isEmpty();
  }

  @Test
  void eachDoubtIsNamedOnceGravestFirst() {
    // a failed check (common practice: |error| beyond the tolerance fails), an expired
    // calibration, both also stored as the text warnings a run keeps, and a manual stop
    RunMetadata md = run("B").checkWeight(TestRuns.checkWeight(false, 1.5)).cause(FinishCause.MANUAL)
        .warnings(List.of("Calibration cal-2026-11-20-500N of cell LC expired on 2026-11-30. Forces will be "
            + "computed with it, but recalibrate or verify with a check weight before testing.",
            "the last check-weight verification of cal-2026-11-20-500N (2026-12-01T07:45:12.345Z) FAILED: 1.50 % "
                + "error; recalibrate before trusting forces",
            "zero shifted 0.3 % of capacity since the last tare"))
        .build();
    assertThat(kinds(md)).containsExactly(Kind.CHECK_FAILED, Kind.CALIBRATION_EXPIRED,
        Kind.NOT_A_BREAK, Kind.WARNING);
    assertThat(RunConcerns.of(md).get(0).text()).contains("cal-2026-11-20-500N (2026-12-01 07:45 UTC) read "
        + "+1.50 % against a tolerance of 0.50 %");
    assertThat(RunConcerns.of(md).get(3).text()).startsWith("zero shifted");
  }

  @Test
  void nominalAndImportedRunsSaySo() {
    RunMetadata nominal = run("C").calibrationId(null).calibrationSha256(null)
        .scaleSpec(ScaleSpec.nominal(8590)).scale("nominal 8590 counts/N (data sheet)")
        .warnings(List.of("no calibration: force uses the data sheet sensitivity 8590 counts/N"))
        .build();
    assertThat(kinds(nominal)).containsExactly(Kind.UNCALIBRATED);
    RunMetadata imported = run("D").calibrationId(null).cause(FinishCause.IMPORTED).build();
    assertThat(kinds(imported)).containsExactly(Kind.IMPORTED);
  }

  @Test
  void anAmendedRunSaysWhatChanged() {
    org.loadstone.archive.Amendment a = new org.loadstone.archive.Amendment(
        java.time.Instant.parse("2026-12-03T09:00:00Z"), "R. Okafor", "weighed again",
        Map.of("mass_g", 41.2), null, "0.1.0-test");
    RunMetadata md = run("F").mass_g(41.2).amendments(new org.loadstone.archive.RunAmendments(
        List.of(a), List.of(new org.loadstone.archive.RunAmendments.Change("mass_g", "50",
            "41.2")), null)).build();
    assertThat(RunConcerns.of(md)).singleElement().satisfies(c -> {
      assertThat(c.kind()).isEqualTo(Kind.AMENDED);
      assertThat(c.text()).startsWith("amended: mass_g 41.2 (was 50)");
    });
  }

  @Test
  void aCheckRecordWithoutAVerdictIsNotReadAsAFailure() {
    Map<String, Object> c = TestRuns.checkWeight(true, 0.1);
    c.remove("pass");
    assertThat(RunConcerns.lastCheck(run("E").checkWeight(c).build())).isEmpty();
    assertThat(RunConcerns.of(run("E").checkWeight(c).build())).isEmpty();
  }
}
