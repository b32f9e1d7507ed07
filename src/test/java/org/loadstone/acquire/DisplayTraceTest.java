package org.loadstone.acquire;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The decimated live trace: a window's points hold the signal's extremes, and a trace carried
 * over to a shorter window keeps exactly the part the shorter window reaches.
 */
class DisplayTraceTest {

  @Test
  void aShorterWindowKeepsTheRecentExtremesOfTheSignal() {
    // 20 s of a noisy ramp at 1 kHz, seed logged: 17
    SplittableRandom rnd = new SplittableRandom(17);
    int n = 20_000;
    double[] t = new double[n];
    double[] v = new double[n];
    DisplayTrace trace = new DisplayTrace(30, 600);
    for (int i = 0; i < n; i++) {
      t[i] = i / 1000.0;
      v[i] = 5 * t[i] + rnd.nextGaussian();
      trace.add(t[i], v[i]);
    }
    DisplayTrace shorter = trace.resized(5);
    assertThat(shorter.window_s()).isEqualTo(5.0);
    double[] pt = new double[shorter.size()];
    double[] pv = new double[shorter.size()];
    int m = shorter.copyTo(pt, pv);
    // every point is a real sample, none older than the window reaches (five seconds before
    // the newest bucket began, less one bucket of the old trace, whose points it carries)
    double oldBucket_s = 30.0 / 600;
    for (int k = 0; k < m; k++) {
      assertThat(pt[k]).isGreaterThanOrEqualTo(t[n - 1] - 5 - 2 * oldBucket_s);
      int i = (int) Math.round(pt[k] * 1000);
      assertThat(pv[k]).isEqualTo(v[i]);
    }
    // the largest of the last 4 s is kept: the signal's own, found directly
    double max = Double.NEGATIVE_INFINITY;
    for (int i = n - 4000; i < n; i++) {
      max = Math.max(max, v[i]);
    }
    double shownMax = Double.NEGATIVE_INFINITY;
    for (int k = 0; k < m; k++) {
      if (pt[k] >= t[n - 4000]) {
        shownMax = Math.max(shownMax, pv[k]);
      }
    }
    assertThat(shownMax).isEqualTo(max);
  }
}
