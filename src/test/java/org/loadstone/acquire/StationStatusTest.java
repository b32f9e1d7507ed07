package org.loadstone.acquire;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.HashSet;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.loadstone.archive.FinishCause;

/** The state band's rules: staleness on an injected clock, words per state, capacity levels. */
class StationStatusTest {
  private static final long S = 1_000_000_000L;

  private static StationStatus.View at(long now, StationStatus.Run run) {
    return StationStatus.of(new StationStatus.Stream(StationStatus.Link.LIVE, null, 100, 10 * S,
        now, 80), run);
  }

  @Test
  void aStreamThatStopsIsShownAsNoDataWithinOneSecond() {
    // 80 samples/s: five periods are 62.5 ms, held up to the 0.25 s floor
    assertThat(SampleFreshness.staleAfter_ns(80)).isEqualTo(250_000_000L);
    assertThat(SampleFreshness.staleAfter_ns(1)).isEqualTo(S); // never later than 1 s
    assertThat(SampleFreshness.staleAfter_ns(0)).isEqualTo(S);
    StationStatus.View fresh = at(10 * S + S / 5, StationStatus.Run.NONE);
    assertThat(fresh.noData()).isFalse();
    assertThat(fresh.shownRate_Hz()).isEqualTo(80);
    StationStatus.View old = at(11 * S, StationStatus.Run.NONE);
    assertThat(old.noData()).isTrue();
    assertThat(old.words()).isEqualTo("NO DATA");
    assertThat(old.shownRate_Hz()).isZero();
    assertThat(old.detail()).startsWith("no sample for 1.0 s");
    assertThat(old.tone()).isEqualTo(StationStatus.Tone.FAULT);
  }

  @Test
  void everyStateHasItsOwnWordsAndEveryToneItsOwnMark() {
    Set<String> words = new HashSet<>();
    int shown = 0;
    for (StationStatus.Phase p : StationStatus.Phase.values()) {
      for (FinishCause c : p == StationStatus.Phase.STORED ? new FinishCause[] {FinishCause.BREAK,
          FinishCause.MANUAL, FinishCause.TIME_LIMIT, FinishCause.OVERLOAD}
          : new FinishCause[] {null}) {
        StationStatus.View v = at(10 * S, new StationStatus.Run(p, c, null, 5));
        words.add(v.words());
        shown++;
      }
    }
    // NONE and DISARMED both read NOT ARMED (their detail differs); all others differ
    assertThat(words).hasSize(shown - 1);
    assertThat(at(10 * S, new StationStatus.Run(StationStatus.Phase.STORED, FinishCause.OVERLOAD,
        null, 5)).tone()).isEqualTo(StationStatus.Tone.FAULT);
    Set<String> marks = new HashSet<>();
    for (StationStatus.Tone t : StationStatus.Tone.values()) {
      marks.add(switch (t) {
        case QUIET -> at(10 * S, StationStatus.Run.NONE).mark();
        case WAITING -> at(10 * S, new StationStatus.Run(StationStatus.Phase.ARMED, null, null,
            5)).mark();
        case RUNNING -> at(10 * S, new StationStatus.Run(StationStatus.Phase.RECORDING, null,
            null, 5)).mark();
        case DONE -> at(10 * S, new StationStatus.Run(StationStatus.Phase.STORED,
            FinishCause.BREAK, null, 5)).mark();
        case FAULT -> at(20 * S, StationStatus.Run.NONE).mark();
      });
    }
    assertThat(marks).hasSize(StationStatus.Tone.values().length);
    StationStatus.View lost = StationStatus.of(new StationStatus.Stream(
        StationStatus.Link.LOST, "cable pulled", 100, 10 * S, 10 * S, 80),
        new StationStatus.Run(StationStatus.Phase.RECORDING, null, null, 5));
    assertThat(lost.words()).isEqualTo("DEVICE LOST");
    assertThat(lost.detail()).contains("cable pulled").contains("stored up to the loss");
  }

  @Test
  void aRecordingRunSaysHowItEndsInTheWordsOfItsOwnSettings() {
    // one sentence from the run's settings for the band and for record's arming line: a crush run
    // goes on through its load drops (its rule, not the break's drop from the peak)
    RunSettings crush = RunSettings.CRUSH.toBuilder()
        .crushEnd(CrushEnd.DEFAULTS.withTravelLimit_mm(12)).maxSeconds(60).build();
    StationStatus.View v = at(10 * S, new StationStatus.Run(StationStatus.Phase.RECORDING, null,
        null, 5, crush.endWords()));
    assertThat(v.detail()).isEqualTo("the crush goes on through the load drops and ends at 12 mm "
        + "of travel, or when force stays below 5 % of the peak for 1 s, or after 60 s")
        .doesNotContain("break");
    StationStatus.View armed = at(10 * S, new StationStatus.Run(StationStatus.Phase.ARMED, null,
        null, 5, crush.endWords()));
    assertThat(armed.detail()).isEqualTo("waiting for load: the run starts at 5 N; "
        + crush.endWords());
    RunSettings bend = RunSettings.builder().breakDropPct(30).absoluteStop_N(2).build();
    assertThat(at(10 * S, new StationStatus.Run(StationStatus.Phase.RECORDING, null, null, 5,
        bend.endWords())).detail()).isEqualTo("the run stops by itself at a 30 % drop from the "
            + "peak or when force falls back below 2 N");
  }

  @Test
  void theCapacityGaugeWarnsAndFlagsOverRangeAndSaturation() {
    RunSettings s = RunSettings.DEFAULTS; // warn 80 %, stop 100 %
    assertThat(CapacityGauge.of(500, 0, 1000, s).level()).isEqualTo(CapacityGauge.Level.NORMAL);
    assertThat(CapacityGauge.of(-850, 0, 1000, s).level())
        .isEqualTo(CapacityGauge.Level.WARNING);
    assertThat(CapacityGauge.of(1000, 0, 1000, s).overRange()).isTrue();
    assertThat(CapacityGauge.of(500, 0, 1000, s).words()).isEqualTo("50 % of 1000 N");
    // protocol v1: a 24-bit converter reports −8 388 608…8 388 607 after sign extension
    CapacityGauge pegged = CapacityGauge.of(924.6, 8_388_607, 1000, s);
    assertThat(pegged.saturated()).isTrue();
    assertThat(pegged.overRange()).isTrue();
    assertThat(CapacityGauge.of(10, 0, Double.NaN, s).level())
        .isEqualTo(CapacityGauge.Level.UNKNOWN);
    assertThat(CapacityGauge.of(1500, 0, 1000, s).barFraction()).isEqualTo(1.0);
  }
}
