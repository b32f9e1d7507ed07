package org.loadstone.video;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.Map;
import org.junit.jupiter.api.Test;
import org.loadstone.units.LoadstoneException;

/** Frames on the run's clock, with the force recorded at each frame's instant. */
class ReplayTimelineTest {
  static VideoTable table(double[] clip) {
    int n = clip.length;
    double[] pos = new double[n];
    boolean[] lost = new boolean[n];
    int[] frame = new int[n];
    for (int i = 0; i < n; i++) {
      pos[i] = 0.01 * i;
      frame[i] = i;
    }
    pos[3] = Double.NaN;
    lost[3] = true;
    return new VideoTable(clip, pos, new double[n], new double[n], frame, lost,
        new ImageScale(0.1, "test", 0), LoadingDirection.DOWN, null, Map.of());
  }

  @Test
  void eachFrameGetsTheForceOfTheSampleAtItsRunTime() {
    // a run sampled at 1 kHz whose force rises as 100 N/s × t: at run time t the force is 100·t
    int n = 1001;
    double[] t = new double[n];
    double[] f = new double[n];
    for (int i = 0; i < n; i++) {
      t[i] = i / 1000.0;
      f[i] = 100 * t[i];
    }
    double[] clip = {0.5, 0.6, 0.7, 0.8, 1.2, 1.5, 1.6};
    // clip time = run time + 0.5 s
    ReplayTimeline r = ReplayTimeline.of(table(clip).withSync(VideoSync.offset(0.5)), t, f);
    assertThat(r.runTime_s()[1]).isCloseTo(0.1, within(1e-12));
    assertThat(r.force_N()[1]).isCloseTo(10, within(1e-9));
    assertThat(r.force_N()[4]).isCloseTo(70, within(1e-9));
    assertThat(r.force_N()[5]).isCloseTo(100, within(1e-9)); // the last sample, at 1.000 s
    assertThat(r.force_N()[6]).as("after the run's last sample").isNaN();
    assertThat(r.position_mm()[3]).as("a lost frame").isNaN();
    assertThat(r.position_mm()[2]).isCloseTo(0.02, within(1e-12));
    assertThat(r.rowAt(0.65)).isEqualTo(1);
    assertThat(r.rowAt(0.1)).isZero();
    assertThat(r.rowAt(9)).isEqualTo(6);
    // a clip starting before the run: its first frames have no force
    ReplayTimeline early = ReplayTimeline.of(table(clip).withSync(VideoSync.offset(0.6)), t, f);
    assertThat(early.force_N()[0]).isNaN();
    assertThat(early.force_N()[1]).isCloseTo(0, within(1e-9));
  }

  @Test
  void aTableWithoutSyncIsRefused() {
    assertThatThrownBy(() -> ReplayTimeline.of(table(new double[] {0, 1, 2, 3, 4}),
        new double[] {0, 1}, new double[] {0, 1}))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("not synchronised");
  }
}
