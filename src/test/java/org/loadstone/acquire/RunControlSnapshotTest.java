package org.loadstone.acquire;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.atomic.AtomicReference;
import org.junit.jupiter.api.Test;
import org.loadstone.archive.FinishCause;

/**
 * Another thread (the console's, the command line's status loop) reads the run control through
 * one snapshot while the recorder's thread drives it, and always sees one moment of it: a state
 * that only moves forward, a peak that never falls and is never below the force shown beside it,
 * a start index once recording, a break once in the tail.
 */
class RunControlSnapshotTest {
  @Test
  void aStatusReaderSeesStatePeakAndForceOfOneMoment() throws Exception {
    RunSettings s = RunSettings.builder().startThreshold_N(5).breakDropPct(40).debounce_s(0.002)
        .postBreak_s(0.05).ratedCapacity_N(500).build();
    RunControl control = new RunControl(s, 1000);
    control.arm();
    List<String> broken = new ArrayList<>();
    AtomicReference<RunControl.Snapshot> lastSeen = new AtomicReference<>();
    int[] seen = {0};
    Thread status = new Thread(() -> {
      RunControl.Snapshot before = control.snapshot();
      while (true) {
        RunControl.Snapshot now = control.snapshot();
        seen[0]++;
        if (now.state().ordinal() < before.state().ordinal()) {
          broken.add("state went back: " + before + " then " + now);
        }
        if (now.peak_N() < before.peak_N()) {
          broken.add("peak fell: " + before + " then " + now);
        }
        boolean started = now.state().ordinal() >= RunControl.State.RECORDING.ordinal();
        if (started && (now.firstIndex() < 0 || now.peak_N() < now.force_N())) {
          broken.add("recording without a start or below its force: " + now);
        }
        if (now.state() == RunControl.State.TAIL && now.breakDetail() == null) {
          broken.add("tail without a break: " + now);
        }
        before = now;
        if (now.state() == RunControl.State.FINISHED) {
          lastSeen.set(now);
          return;
        }
        Thread.onSpinWait();
      }
    }, "status-line");
    status.start();
    // a brittle curve: 0 → 300 N in 30 000 samples, then 60 N: a break; ms time steps
    int rise = 30_000;
    long i = 0;
    for (; i <= rise; i++) {
      control.offer(i, 0, i / 1000.0, 300.0 * i / rise, e -> { });
      if (i % 500 == 0) {
        Thread.yield(); // give the status line a turn now and then
      }
    }
    for (; control.snapshot().state() != RunControl.State.FINISHED; i++) {
      control.offer(i, 0, i / 1000.0, 60, e -> { });
    }
    status.join();
    assertThat(broken).isEmpty();
    RunControl.Snapshot end = lastSeen.get();
    assertThat(end.finished().cause()).isEqualTo(FinishCause.BREAK);
    assertThat(end.peak_N()).isEqualTo(300.0);
    assertThat(end.breakDetail().peakBefore_N()).isEqualTo(300.0);
    assertThat(seen[0]).as("snapshots read").isPositive();
  }
}
