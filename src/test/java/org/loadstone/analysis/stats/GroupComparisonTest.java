package org.loadstone.analysis.stats;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.apache.commons.math3.stat.inference.OneWayAnova;
import org.apache.commons.math3.stat.inference.TTest;
import org.junit.jupiter.api.Test;
import org.loadstone.units.LoadstoneException;

class GroupComparisonTest {
  // Stiffness (N/mm) of shelf-panel specimens from the simulator scenario.
  static final List<Double> BALSA = List.of(61.2, 63.0, 59.8, 62.4, 60.9, 62.1);
  static final List<Double> FOAM = List.of(49.5, 51.2, 50.3, 48.7, 50.9, 49.8);
  static final List<Double> BOARD = List.of(50.6, 47.9, 52.3, 49.1, 51.0);

  static double[] arr(List<Double> l) {
    return l.stream().mapToDouble(Double::doubleValue).toArray();
  }

  @Test
  void twoGroupsUseWelchAndSayWhichIsHigher() {
    Map<String, List<Double>> in = new LinkedHashMap<>();
    in.put("foam", FOAM);
    in.put("balsa", BALSA);
    ComparisonResult r = GroupComparison.compare("stiffness", in);
    assertThat(r.test()).isEqualTo(ComparisonResult.Test.WELCH_T);
    // p-value from Commons Math TTest.tTest (Welch, two-sided)
    double p = new TTest().tTest(arr(FOAM), arr(BALSA));
    assertThat(r.pValue().orElseThrow()).isCloseTo(p, within(1e-12));
    double balsa = BALSA.stream().mapToDouble(d -> d).average().orElseThrow();
    double foam = FOAM.stream().mapToDouble(d -> d).average().orElseThrow();
    String pct = String.format(java.util.Locale.ROOT, "%.0f %%", 100 * (balsa - foam) / foam);
    assertThat(r.sentence())
        .startsWith("Stiffness: balsa is " + pct + " higher than foam")
        .contains("larger than the scatter")
        .contains("p < 0.001");
    assertThat(r.groups()).extracting(GroupSummary::name).containsExactly("foam", "balsa");
  }

  @Test
  void smallDifferenceIsWithinTheScatter() {
    Map<String, List<Double>> in = new LinkedHashMap<>();
    in.put("foam", FOAM);
    in.put("board", BOARD);
    ComparisonResult r = GroupComparison.compare("peak force", in);
    double p = new TTest().tTest(arr(FOAM), arr(BOARD));
    assertThat(r.pValue().orElseThrow()).isCloseTo(p, within(1e-12));
    assertThat(p).isGreaterThan(0.05);
    assertThat(r.sentence()).contains("within the scatter").contains("p = 0.");
  }

  @Test
  void threeGroupsUseAnova() {
    Map<String, List<Double>> in = new LinkedHashMap<>();
    in.put("balsa", BALSA);
    in.put("foam", FOAM);
    in.put("board", BOARD);
    ComparisonResult r = GroupComparison.compare("stiffness", in);
    assertThat(r.test()).isEqualTo(ComparisonResult.Test.ONE_WAY_ANOVA);
    // Commons Math OneWayAnova as reference
    List<double[]> g = List.of(arr(BALSA), arr(FOAM), arr(BOARD));
    assertThat(r.statistic().orElseThrow())
        .isCloseTo(new OneWayAnova().anovaFValue(g), within(1e-9));
    assertThat(r.pValue().orElseThrow())
        .isCloseTo(new OneWayAnova().anovaPValue(g), within(1e-12));
    assertThat(r.sentence()).contains("balsa is highest").contains("the 3 groups");
  }

  @Test
  void groupWithOneSpecimenGetsNoTestButAClearSentence() {
    Map<String, List<Double>> in = new LinkedHashMap<>();
    in.put("balsa", List.of(61.0));
    in.put("foam", FOAM);
    ComparisonResult r = GroupComparison.compare("stiffness", in);
    assertThat(r.test()).isEqualTo(ComparisonResult.Test.NONE);
    assertThat(r.pValue()).isEmpty();
    assertThat(r.sentence()).contains("'balsa' has a single specimen").contains("at least 2");
    Map<String, Object> json = r.toJsonView();
    assertThat(json.get("p_value")).isNull();
    @SuppressWarnings("unchecked")
    Map<String, Map<String, Object>> groups = (Map<String, Map<String, Object>>) json.get("groups");
    assertThat(groups.get("balsa")).containsEntry("n", 1).containsEntry("sd", null);
    assertThat(groups.get("foam").get("sd")).isInstanceOf(Double.class);
    ComparisonResult.SampleSizeAdvice a = r.advice().orElseThrow();
    assertThat(a.currentN()).isEqualTo(1);
    assertThat(a.resolvableDifferencePct()).isEmpty();
  }

  @Test
  void jsonViewCarriesTheSummaryFields() {
    Map<String, List<Double>> in = new LinkedHashMap<>();
    in.put("balsa", BALSA);
    in.put("foam", FOAM);
    ComparisonResult r = GroupComparison.compare("stiffness", in);
    Map<String, Object> json = r.toJsonView();
    assertThat(json).containsKeys("metric", "test", "p_value", "sentence", "groups");
    @SuppressWarnings("unchecked")
    Map<String, Map<String, Object>> groups = (Map<String, Map<String, Object>>) json.get("groups");
    assertThat(groups.get("balsa"))
        .containsOnlyKeys("n", "mean", "sd", "cv_pct", "ci95_low", "ci95_high");
    GroupSummary b = r.groups().get(0);
    assertThat(groups.get("balsa").get("ci95_low")).isEqualTo(b.ci95Low().orElseThrow());
    assertThat((Double) json.get("p_value")).isEqualTo(r.pValue().orElseThrow());
  }

  @Test
  void outliersAndAdviceAreReported() {
    Map<String, List<Double>> in = new LinkedHashMap<>();
    in.put("balsa", List.of(61.2, 63.0, 59.8, 62.4, 60.9, 62.1, 61.5, 75.0));
    in.put("foam", FOAM);
    ComparisonResult r = GroupComparison.compare("stiffness", in, 0.05);
    assertThat(r.outliers()).hasSize(1);
    assertThat(r.outliers().get(0).group()).isEqualTo("balsa");
    assertThat(r.outliers().get(0).outlier().index()).isEqualTo(7);
    ComparisonResult.SampleSizeAdvice a = r.advice().orElseThrow();
    double cv = r.groups().get(0).cvPct().orElseThrow(); // balsa's CV is the larger
    assertThat(a.cvPct()).isEqualTo(cv);
    assertThat(a.specimensPerGroup()).isEqualTo(SampleSize.perGroup(0.05 / (cv / 100), 0.05, 0.8));
    assertThat(a.resolvableDifferencePct().orElseThrow())
        .isCloseTo(SampleSize.smallestEffect(6, 0.05, 0.8) * cv, within(1e-12));
    assertThat(a.sentence()).contains(a.specimensPerGroup() + " specimens per group");
  }

  @Test
  void badInputIsRefused() {
    assertThatThrownBy(() -> GroupComparison.compare("peak force", Map.of("foam", FOAM)))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("at least 2 groups");
    Map<String, List<Double>> empty = new LinkedHashMap<>();
    empty.put("foam", FOAM);
    empty.put("balsa", List.of());
    assertThatThrownBy(() -> GroupComparison.compare("peak force", empty))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("'balsa' has no values");
    Map<String, List<Double>> nan = new LinkedHashMap<>();
    nan.put("foam", FOAM);
    nan.put("balsa", List.of(1.0, Double.NaN));
    assertThatThrownBy(() -> GroupComparison.compare("peak force", nan))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("'balsa' value 2");
  }
}
