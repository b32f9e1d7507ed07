package org.loadstone.study;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;
import java.util.Optional;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.loadstone.archive.FinishCause;
import org.loadstone.archive.RunMetadata;
import org.loadstone.archive.ScaleSpec;
import org.loadstone.archive.TestRuns;
import org.loadstone.study.LeftOut.Kind;
import org.loadstone.units.LoadstoneException;

/** The rule of which runs count. */
class RunSelectionTest {
  private static RunMetadata run(FinishCause cause, boolean calibrated) {
    RunMetadata.Builder b = TestRuns.meta("P-1", "foam", TestRuns.panel(), 50.0).toBuilder()
        .cause(cause);
    if (!calibrated) {
      b.calibrationId(null).calibrationSha256(null).scale("nominal 4294.97 counts/N")
          .scaleSpec(ScaleSpec.nominal(4294.97));
    }
    return b.build();
  }

  @Test
  void byDefaultOnlyBrokenCalibratedRunsCount() {
    for (FinishCause c : FinishCause.values()) {
      for (boolean cal : new boolean[] {true, false}) {
        Optional<LeftOut> j = RunSelection.DEFAULT.judge(run(c, cal));
        assertThat(j.isEmpty()).as(c + " calibrated " + cal)
            .isEqualTo(c == FinishCause.BREAK && cal);
      }
    }
  }

  @Test
  void eachEndingHasItsKindAndReason() {
    assertThat(RunSelection.kindsOf(run(FinishCause.MANUAL, true))).containsExactly(Kind.MANUAL);
    assertThat(RunSelection.kindsOf(run(FinishCause.TIME_LIMIT, true)))
        .containsExactly(Kind.TIME_LIMIT);
    assertThat(RunSelection.kindsOf(run(FinishCause.OVERLOAD, true)))
        .containsExactly(Kind.OVERLOAD);
    assertThat(RunSelection.kindsOf(run(FinishCause.RECOVERED, true)))
        .containsExactly(Kind.RECOVERED);
    assertThat(RunSelection.kindsOf(run(FinishCause.DEVICE_LOST, true)))
        .containsExactly(Kind.DEVICE_LOST);
    // an imported run carries no calibration of ours: it is left out as imported only
    assertThat(RunSelection.kindsOf(run(FinishCause.IMPORTED, false)))
        .containsExactly(Kind.IMPORTED);
    LeftOut nominal = RunSelection.DEFAULT.judge(run(FinishCause.BREAK, false)).orElseThrow();
    assertThat(nominal.kinds()).containsExactly(Kind.UNCALIBRATED);
    assertThat(nominal.reason()).contains("nominal scale (nominal 4294.97 counts/N)");
    assertThat(nominal.runId()).isEqualTo("20261202-101500-P-1");
  }

  @Test
  void kindsAreLetInOneByOne() {
    RunMetadata manualNominal = run(FinishCause.MANUAL, false);
    LeftOut both = RunSelection.DEFAULT.judge(manualNominal).orElseThrow();
    assertThat(both.kinds()).containsExactly(Kind.MANUAL, Kind.UNCALIBRATED);
    assertThat(both.reason()).contains("stopped by the operator").contains("nominal scale");
    LeftOut still = RunSelection.DEFAULT.admitting(Kind.MANUAL).judge(manualNominal)
        .orElseThrow();
    assertThat(still.kinds()).containsExactly(Kind.UNCALIBRATED);
    assertThat(RunSelection.DEFAULT.admitting(Kind.MANUAL, Kind.UNCALIBRATED)
        .judge(manualNominal)).isEmpty();
    assertThat(RunSelection.DEFAULT.admitting(Kind.IMPORTED)
        .judge(run(FinishCause.IMPORTED, false))).isEmpty();
  }

  @Test
  void settingsAreChecked() {
    assertThatThrownBy(() -> new RunSelection(Set.of(Kind.NO_VALUE), List.of()))
        .isInstanceOf(IllegalArgumentException.class);
    assertThatThrownBy(() -> Kind.parse("broken"))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("'broken'").hasMessageContaining("uncalibrated, imported, manual")
        .hasMessageNotContaining("no-value");
    assertThat(Kind.parse(" Time-Limit ")).isEqualTo(Kind.TIME_LIMIT);
    RunSelection s = RunSelection.DEFAULT.withGroups(List.of(" foam", "", "FOAM", "balsa "));
    assertThat(s.groups()).containsExactly("foam", "balsa");
    assertThat(s.asks("Foam")).isTrue();
    assertThat(s.asks("board")).isFalse();
  }

  @Test
  void aRetiredRunIsLeftOutWhateverIsLetIn() {
    org.loadstone.archive.Amendment retire = new org.loadstone.archive.Amendment(
        java.time.Instant.parse("2026-12-04T09:00:00Z"), "", "cracked before loading",
        java.util.Map.of(), true, "test");
    RunMetadata retired = run(FinishCause.MANUAL, true).toBuilder()
        .amendments(new org.loadstone.archive.RunAmendments(List.of(retire), List.of(), retire))
        .build();
    RunSelection everything = RunSelection.DEFAULT.admitting(Kind.admissibleOnes());
    LeftOut l = everything.judge(retired).orElseThrow();
    assertThat(l.kinds()).containsExactly(Kind.RETIRED);
    assertThat(l.reason()).isEqualTo("retired: cracked before loading");
    assertThat(RunSelection.DEFAULT.judge(retired).orElseThrow().kinds())
        .containsExactly(Kind.RETIRED, Kind.MANUAL);
    assertThat(Kind.admissibleOnes()).doesNotContain(Kind.RETIRED);
    assertThatThrownBy(() -> Kind.parse("retired")).isInstanceOf(LoadstoneException.class);
  }
}
