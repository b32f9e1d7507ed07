package org.loadstone.acquire;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.loadstone.archive.FinishCause;
import org.loadstone.units.LoadstoneException;

/**
 * The break criterion on synthetic curves whose answers follow from their construction. The rule
 * itself (a drop of a set fraction from the running peak, held for a debounce time, after the peak
 * passed an arming level) is common practice for automatic end-of-test detection.
 */
class BreakDetectorTest {
  static final double RATE = 1000; // samples/s
  static final double FS = 500; // N, full scale of the cell

  private static RunSettings settings(double dropPct) {
    return RunSettings.builder().breakDropPct(dropPct).startThreshold_N(5).debounce_s(0.005)
        .ratedCapacity_N(FS).build();
  }

  /** Runs a curve through the detector; returns the break index or -1. */
  private static long detect(double[] f, RunSettings s) {
    BreakDetector d = new BreakDetector(s);
    for (int i = 0; i < f.length; i++) {
      BreakDetector.Break b = d.offer(i, i / RATE, f[i]);
      if (b != null) {
        return b.index();
      }
    }
    return -1;
  }

  @Test
  void brittleBreakAtTheFirstSampleThatMeetsTheCriterion() {
    // linear rise to 300 N over 2 s, then fracture: 300 → 20 N over 3 samples (1.5 ms), then 20 N.
    // 40 % of 300 N leaves 180 N: the first sample at or below 180 N is the break.
    List<Double> f = new ArrayList<>();
    for (int i = 0; i <= 2000; i++) {
      f.add(300.0 * i / 2000);
    }
    f.add(210.0); // 30 % drop: not yet
    f.add(120.0); // 60 % drop: this is the first sample meeting the criterion (index 2002)
    f.add(20.0);
    for (int i = 0; i < 100; i++) {
      f.add(20.0);
    }
    double[] a = f.stream().mapToDouble(Double::doubleValue).toArray();
    assertThat(detect(a, settings(40))).isEqualTo(2002);
  }

  @Test
  void ductilePlateauDoesNotStop() {
    // rise to 250 N, plateau with a slow decline to 180 N (28 % below the peak) over 5 s
    double[] a = new double[8000];
    for (int i = 0; i < a.length; i++) {
      double t = i / RATE;
      a[i] = t < 1 ? 250 * t : 250 - 70 * Math.min(1, (t - 1) / 5);
    }
    assertThat(detect(a, settings(40))).isEqualTo(-1);
  }

  @Test
  void noiseOfHalfAPercentOfFullScaleDoesNotStop() {
    // a held 100 N load with Gaussian noise of 0.5 % FS (2.5 N rms): even 6-sigma excursions
    // (15 N) stay far from a 40 % drop (40 N)
    Random r = new Random(11);
    double[] a = new double[20_000];
    for (int i = 0; i < a.length; i++) {
      double ramp = Math.min(1, i / 500.0);
      a[i] = 100 * ramp + 0.005 * FS * r.nextGaussian();
    }
    assertThat(detect(a, settings(40))).isEqualTo(-1);
  }

  @Test
  void sawToothCrushingWithTwentyPercentDropsDoesNotStopAtForty() {
    // progressive crushing: each tooth rises to 200 N and drops by 20 % to 160 N, twenty times
    List<Double> f = new ArrayList<>();
    for (int i = 0; i < 1000; i++) {
      f.add(200.0 * i / 1000);
    }
    for (int tooth = 0; tooth < 20; tooth++) {
      for (int k = 0; k < 5; k++) {
        f.add(200 - 8.0 * (k + 1)); // fast drop to 160 N
      }
      for (int k = 0; k < 200; k++) {
        f.add(160 + 40.0 * (k + 1) / 200); // rise back to 200 N
      }
    }
    double[] a = f.stream().mapToDouble(Double::doubleValue).toArray();
    assertThat(detect(a, settings(40))).isEqualTo(-1);
    // ... and with a 15 % criterion the first tooth's drop is a break: 200 → 170 N is the 4th
    // sample of the drop (200 − 8·4 = 168 ≤ 170), index 1000 + 3
    assertThat(detect(a, settings(15))).isEqualTo(1003);
  }

  @Test
  void aGlitchShorterThanTheDebounceIsNotABreak() {
    double[] a = new double[3000];
    for (int i = 0; i < a.length; i++) {
      a[i] = Math.min(200, i * 0.2);
    }
    a[1500] = 10; // one-sample dropout (1 ms < 5 ms debounce)
    assertThat(detect(a, settings(40))).isEqualTo(-1);
  }

  @Test
  void noBreakBeforeTheArmingLevel() {
    // a wobble at 6 N (peak below the 10 N arming level) falling to 1 N is not a break
    double[] a = {0, 2, 4, 6, 5, 3, 1, 1, 1, 1, 1, 1, 1, 1, 1};
    RunSettings s = RunSettings.builder().startThreshold_N(5).debounce_s(0).build();
    assertThat(detect(a, s)).isEqualTo(-1);
  }

  @Test
  void absoluteLevelStopsToo() {
    // falls from 100 N to 55 N (45 % drop) but the criterion is 60 %; the absolute level 60 N does
    double[] a = new double[400];
    for (int i = 0; i < 400; i++) {
      a[i] = i < 200 ? i * 0.5 : 55;
    }
    RunSettings s = RunSettings.builder().breakDropPct(60).absoluteStop_N(60).debounce_s(0.002)
        .build();
    assertThat(detect(a, s)).isEqualTo(200);
  }

  @Test
  void badThresholdsAreRefusedNamingTheSettingToFix() {
    // core messages speak of the setting; the command line and the console add how to change it
    assertThatThrownBy(() -> RunSettings.builder().breakDropPct(100).build())
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("break drop")
        .hasMessageNotContaining("--")
        .satisfies(e -> assertThat(((LoadstoneException) e).settings())
            .containsExactly(org.loadstone.units.Setting.BREAK_DROP));
    assertThatThrownBy(() -> RunSettings.builder().breakDropPct(0).build())
        .isInstanceOf(LoadstoneException.class);
    assertThatThrownBy(() -> RunSettings.builder().startThreshold_N(-1).build())
        .isInstanceOf(LoadstoneException.class)
        .hasMessage("the start threshold must be greater than 0, was -1: give a positive value")
        .satisfies(e -> assertThat(((LoadstoneException) e).settings())
            .containsExactly(org.loadstone.units.Setting.START_THRESHOLD));
    assertThatThrownBy(() -> RunSettings.builder().startThreshold_N(600).build())
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("overload stop");
    assertThatThrownBy(() -> RunSettings.builder().overloadWarnPct(90).overloadStopPct(85).build())
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("warning");
  }

  @Test
  void runControlKeepsPretriggerAndRecordsTheTail() {
    RunSettings s = RunSettings.builder().startThreshold_N(5).pretrigger_s(0.1).postBreak_s(0.05)
        .debounce_s(0).ratedCapacity_N(FS).build();
    RunControl rc = new RunControl(s, RATE);
    rc.arm();
    List<RunControl.Event> ev = new ArrayList<>();
    // 0.5 s at zero, rise 1 N per ms to 100 N, fracture to 0
    int i = 0;
    for (; i < 500; i++) {
      rc.offer(i, 0, i / RATE, 0.0, ev::add);
    }
    for (int k = 1; k <= 100; k++, i++) {
      rc.offer(i, 0, i / RATE, k, ev::add);
    }
    int breakAt = i;
    for (int k = 0; k < 200 && rc.state() != RunControl.State.FINISHED; k++, i++) {
      rc.offer(i, 0, i / RATE, 0.0, ev::add);
    }
    RunControl.Started st = (RunControl.Started) ev.get(0);
    assertThat(st.triggerIndex()).isEqualTo(504); // first sample ≥ 5 N: 500 + 5 − 1
    assertThat(st.firstIndex()).isEqualTo(504 - 100); // 0.1 s of history at 1000 samples/s
    RunControl.BreakDeclared b = (RunControl.BreakDeclared) ev.get(1);
    assertThat(b.detail().index()).isEqualTo(breakAt);
    RunControl.Finished fin = (RunControl.Finished) ev.get(2);
    assertThat(fin.cause()).isEqualTo(FinishCause.BREAK);
    assertThat(fin.lastIndex()).isEqualTo(breakAt + 50); // 0.05 s tail
  }

  @Test
  void overloadStopsAtOnceAfterAWarning() {
    RunSettings s = RunSettings.builder().ratedCapacity_N(100).build();
    RunControl rc = new RunControl(s, RATE);
    rc.arm();
    List<RunControl.Event> ev = new ArrayList<>();
    for (int i = 0; i < 200 && rc.state() != RunControl.State.FINISHED; i++) {
      rc.offer(i, 0, i / RATE, i * 1.0, ev::add);
    }
    assertThat(ev).hasSize(3);
    assertThat(ev.get(1)).isInstanceOf(RunControl.OverloadWarning.class);
    assertThat(((RunControl.OverloadWarning) ev.get(1)).index()).isEqualTo(80);
    RunControl.Finished fin = (RunControl.Finished) ev.get(2);
    assertThat(fin.cause()).isEqualTo(FinishCause.OVERLOAD);
    assertThat(fin.lastIndex()).isEqualTo(100);
  }

  @Test
  void timeLimitAndManualStop() {
    RunSettings s = RunSettings.builder().maxSeconds(0.2).build();
    RunControl rc = new RunControl(s, RATE);
    rc.arm();
    List<RunControl.Event> ev = new ArrayList<>();
    for (int i = 0; i < 1000 && rc.state() != RunControl.State.FINISHED; i++) {
      rc.offer(i, 0, i / RATE, 50, ev::add);
    }
    assertThat(((RunControl.Finished) ev.get(ev.size() - 1)).cause())
        .isEqualTo(FinishCause.TIME_LIMIT);

    RunControl m = new RunControl(RunSettings.DEFAULTS, RATE);
    List<RunControl.Event> ev2 = new ArrayList<>();
    m.startNow();
    m.offer(0, 0, 0, 0, ev2::add);
    m.offer(1, 0, 0.001, 0, ev2::add);
    m.stopNow();
    m.offer(2, 0, 0.002, 0, ev2::add);
    assertThat(((RunControl.Started) ev2.get(0)).manual()).isTrue();
    assertThat(((RunControl.Finished) ev2.get(1)).cause()).isEqualTo(FinishCause.MANUAL);
  }
}
