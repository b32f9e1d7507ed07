package org.loadstone.study;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.Map;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.loadstone.archive.TestRuns;
import org.loadstone.units.LoadstoneException;

/** The metric catalogue: names, keys, digits and accessors. */
class MetricTest {
  private static final RunMetrics PANEL =
      RunMetrics.of(TestRuns.meta("FO-17", "foam", TestRuns.panel(), 52.0), TestRuns.bend(60, 460));

  @Test
  void accessorsGiveTheRunsFigures() {
    // ASTM C393 core shear stress P/((d + c)b) = 460/((26 + 20)·50) = 0.2 MPa
    assertThat(Metric.CORE_SHEAR.of(PANEL).getAsDouble()).isCloseTo(0.2, within(1e-12));
    // per gram: 460 N over 52 g
    assertThat(Metric.SPECIFIC_PEAK.of(PANEL).getAsDouble()).isCloseTo(460 / 52.0, within(1e-12));
    assertThat(Metric.PEAK.of(PANEL).getAsDouble()).isEqualTo(460.0);
    assertThat(Metric.STIFFNESS.of(PANEL).getAsDouble()).isCloseTo(60, within(0.01));
    assertThat(Metric.COMPRESSION_STRESS.of(PANEL)).isEmpty(); // a bend test has no P/A
  }

  @Test
  void everyFigureIsInTheJsonViewUnderItsKey() {
    Map<String, Object> j = PANEL.toJsonMap();
    for (Metric m : Metric.values()) {
      assertThat(j).as(m.key()).containsKey(m.key());
      OptionalDouble v = m.of(PANEL);
      Object inJson = j.get(m.key());
      if (v.isEmpty()) {
        assertThat(inJson).as(m.key()).isNull();
      } else {
        assertThat(((Number) inJson).doubleValue()).as(m.key())
            .isEqualTo(m.digits() == 0 ? Math.round(v.getAsDouble()) : v.getAsDouble());
      }
    }
  }

  @Test
  void wordsAndKeysAreUniqueAndParse() {
    for (Metric m : Metric.comparableOnes()) {
      assertThat(Metric.parse(m.word())).isEqualTo(m);
      assertThat(Metric.parse(" " + m.key().toUpperCase() + " ")).isEqualTo(m);
    }
    assertThat(java.util.Arrays.stream(Metric.values()).map(Metric::word).distinct().count())
        .isEqualTo(Metric.values().length);
    assertThat(java.util.Arrays.stream(Metric.values()).map(Metric::key).distinct().count())
        .isEqualTo(Metric.values().length);
  }

  @Test
  void anUnknownNameListsTheValidOnes() {
    assertThatThrownBy(() -> Metric.parse("strength"))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("unknown metric 'strength'")
        .hasMessageContaining("specific-peak").hasMessageContaining("core-shear")
        .hasMessageContaining("peak, ");
    // a sample index is shown but groups are not compared on it
    assertThatThrownBy(() -> Metric.parse("break-sample"))
        .isInstanceOf(LoadstoneException.class).hasMessageNotContaining("break-sample,");
  }

  @Test
  void valuesAreShownWithTheFiguresSignificantDigits() {
    assertThat(Metric.PEAK.format(331.9698)).isEqualTo("332.0");
    assertThat(Metric.PEAK.format(460.0)).isEqualTo("460.0");
    assertThat(Metric.CORE_SHEAR.format(0.2)).isEqualTo("0.2000");
    assertThat(Metric.SPECIFIC_PEAK.format(31.04)).isEqualTo("31.0");
    assertThat(Metric.SPECIFIC_PEAK.format(0.000123456)).isEqualTo("0.000123");
    assertThat(Metric.PEAK.format(12345.6)).isEqualTo("12346");
    assertThat(Metric.PEAK.format(-2.5)).isEqualTo("-2.500");
    assertThat(Metric.BREAK_SAMPLE.format(2692)).isEqualTo("2692");
    assertThat(Metric.TOE_OFFSET.format(3e-15)).isEqualTo("0");
    assertThat(Metric.ENERGY.format(OptionalDouble.empty())).isEqualTo("-");
    assertThat(Metric.SPECIFIC_PEAK.heading()).isEqualTo("peak force per gram (N/g)");
    assertThat(Metric.STIFFNESS_R2.heading()).isEqualTo("stiffness fit R2");
  }
}
