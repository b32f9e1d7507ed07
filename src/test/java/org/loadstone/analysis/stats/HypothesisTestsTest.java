package org.loadstone.analysis.stats;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.apache.commons.math3.distribution.TDistribution;
import org.apache.commons.math3.stat.inference.OneWayAnova;
import org.apache.commons.math3.stat.inference.TTest;
import org.junit.jupiter.api.Test;
import org.loadstone.units.LoadstoneException;

/** Reference values from Apache Commons Math 3.6.1 on fixed-seed data. */
class HypothesisTestsTest {

  static double[] sample(Random r, int n, double mean, double sd) {
    double[] v = new double[n];
    for (int i = 0; i < n; i++) {
      v[i] = mean + sd * r.nextGaussian();
    }
    return v;
  }

  @Test
  void welchMatchesCommonsMath() {
    Random r = new Random(20261202L);
    TTest ref = new TTest();
    for (int trial = 0; trial < 40; trial++) {
      double[] a = sample(r, 2 + r.nextInt(12), 300, 5 + 20 * r.nextDouble());
      double[] b = sample(r, 2 + r.nextInt(12), 300 + 40 * r.nextGaussian(), 5 + 20 * r.nextDouble());
      HypothesisTests.Welch w = HypothesisTests.welch("a", a, "b", b);
      assertThat(w.t()).isCloseTo(ref.t(a, b), within(1e-10 * Math.max(1, Math.abs(w.t()))));
      assertThat(w.pValue()).isCloseTo(ref.tTest(a, b), within(1e-10));
    }
  }

  @Test
  void anovaMatchesCommonsMath() {
    Random r = new Random(77L);
    OneWayAnova ref = new OneWayAnova();
    for (int trial = 0; trial < 30; trial++) {
      int k = 3 + r.nextInt(3);
      List<double[]> groups = new ArrayList<>();
      List<String> names = new ArrayList<>();
      for (int g = 0; g < k; g++) {
        groups.add(sample(r, 2 + r.nextInt(8), 50 + 4 * r.nextGaussian(), 1 + 3 * r.nextDouble()));
        names.add("g" + g);
      }
      HypothesisTests.Anova a = HypothesisTests.oneWayAnova(names, groups);
      assertThat(a.f()).isCloseTo(ref.anovaFValue(groups), within(1e-9 * Math.max(1, a.f())));
      assertThat(a.pValue()).isCloseTo(ref.anovaPValue(groups), within(1e-10));
    }
  }

  @Test
  void confidenceIntervalUsesStudentT() {
    double[] v = {10.2, 9.8, 10.5, 10.1, 9.9};
    GroupSummary s = GroupSummary.of("foam", v);
    double sd = Math.sqrt(new org.apache.commons.math3.stat.descriptive.moment.Variance().evaluate(v));
    double half = new TDistribution(4).inverseCumulativeProbability(0.975) * sd / Math.sqrt(5);
    assertThat(s.sd().orElseThrow()).isCloseTo(sd, within(1e-14));
    assertThat(s.ci95Low().orElseThrow()).isCloseTo(10.1 - half, within(1e-9));
    assertThat(s.ci95High().orElseThrow()).isCloseTo(10.1 + half, within(1e-9));
    assertThat(s.cvPct().orElseThrow()).isCloseTo(100 * sd / 10.1, within(1e-12));
  }

  @Test
  void singleSpecimenHasNoSpreadAndTestsRefuseIt() {
    GroupSummary one = GroupSummary.of("balsa", new double[] {412.0});
    assertThat(one.n()).isEqualTo(1);
    assertThat(one.mean()).isEqualTo(412.0);
    assertThat(one.sd()).isEmpty();
    assertThat(one.ci95Low()).isEmpty();
    assertThatThrownBy(one::requireSpread)
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("'balsa' has 1 specimen");
    assertThatThrownBy(
            () -> HypothesisTests.welch("balsa", new double[] {1}, "foam", new double[] {1, 2}))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("'balsa'")
        .hasMessageContaining("at least 2");
    assertThatThrownBy(() -> GroupSummary.of("foam", new double[] {1, Double.NaN}))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("value 2");
  }

  @Test
  void grubbsCriticalValuesMatchPublishedTable() {
    // Two-sided Grubbs critical values at α = 0.05 (ASTM E178 table, upper 2.5 % column;
    // from memory): n = 3: 1.155, n = 10: 2.290, n = 20: 2.709.
    assertThat(Grubbs.critical(3, 0.05)).isCloseTo(1.155, within(0.001));
    assertThat(Grubbs.critical(10, 0.05)).isCloseTo(2.290, within(0.001));
    assertThat(Grubbs.critical(20, 0.05)).isCloseTo(2.709, within(0.001));
    // Same formula with Commons Math's t quantile (NIST e-Handbook §1.3.5.17 form).
    for (int n = 3; n <= 40; n++) {
      double t = new TDistribution(n - 2).inverseCumulativeProbability(1 - 0.05 / (2 * n));
      double g = (n - 1) / Math.sqrt(n) * Math.sqrt(t * t / (n - 2 + t * t));
      assertThat(Grubbs.critical(n, 0.05)).isCloseTo(g, within(1e-7));
    }
  }

  @Test
  void grubbsFlagsAPlantedOutlierOnly() {
    double[] clean = {101.2, 99.8, 100.5, 100.1, 99.6, 100.9, 99.9, 100.3};
    assertThat(Grubbs.test(clean, 0.05)).isEmpty();
    double[] dirty = clean.clone();
    dirty[5] = 112.0;
    Grubbs.Outlier o = Grubbs.test(dirty, 0.05).orElseThrow();
    assertThat(o.index()).isEqualTo(5);
    assertThat(o.g()).isGreaterThan(o.critical());
    assertThat(Grubbs.test(new double[] {1, 2}, 0.05)).isEmpty();
  }

  @Test
  void sampleSizeMatchesCohensTable() {
    // Cohen, "Statistical Power Analysis for the Behavioral Sciences" (2nd ed., 1988),
    // Table 2.4.1, two-sided α = 0.05, power 0.80 (values from memory):
    // d = 0.5 → 64, d = 0.8 → 26, d = 1.0 → 17 per group.
    assertThat(SampleSize.perGroup(0.5, 0.05, 0.80)).isEqualTo(64);
    assertThat(SampleSize.perGroup(0.8, 0.05, 0.80)).isEqualTo(26);
    assertThat(SampleSize.perGroup(1.0, 0.05, 0.80)).isEqualTo(17);
    // Lehr's rule (Lehr, Statistics in Medicine 11, 1992): n ≈ 16/d² per group.
    for (double d : new double[] {0.3, 0.4, 0.6}) {
      assertThat((double) SampleSize.perGroup(d, 0.05, 0.80))
          .isCloseTo(16 / (d * d), within(0.06 * 16 / (d * d)));
    }
  }

  @Test
  void smallestEffectIsTheInverseOfTheGroupSize() {
    for (double d : new double[] {0.4, 0.7, 1.0, 1.5, 2.5}) {
      int n = SampleSize.perGroup(d, 0.05, 0.80);
      assertThat(SampleSize.smallestEffect(n, 0.05, 0.80)).isLessThanOrEqualTo(d + 1e-12);
      if (n > 2) {
        assertThat(SampleSize.smallestEffect(n - 1, 0.05, 0.80)).isGreaterThan(d);
      }
    }
    assertThatThrownBy(() -> SampleSize.smallestEffect(1, 0.05, 0.8))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("at least 2");
  }
}
