package org.loadstone.study;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.Map;
import org.junit.jupiter.api.Test;
import org.loadstone.analysis.Flexure;
import org.loadstone.analysis.PositionSource;
import org.loadstone.archive.Geometry;
import org.loadstone.archive.RunData;
import org.loadstone.archive.RunMetadata;
import org.loadstone.archive.TestRuns;
import org.loadstone.archive.TestType;
import org.loadstone.units.LoadstoneException;

class FourPointRunTest {
  // a 6 mm deep, 30 mm wide strip on a 150 mm span, loading noses 50 mm apart (span/3)
  static final double E = 3500;
  static final double L = 150;
  static final double LS = 50;
  static final double W = 30;
  static final double DEPTH = 6;
  static final double I = W * DEPTH * DEPTH * DEPTH / 12;

  static RunMetadata fourPoint() {
    return TestRuns.meta("FP-1", "strips", new Geometry(L, LS, W, DEPTH, null, null, null), null)
        .toBuilder().testType(TestType.FOUR_POINT_BEND).build();
  }

  @Test
  void aStoredFourPointRunGetsTheFormulaForWhatItsPositionMeasures() {
    // slopes of a simply supported beam under two symmetric loads (Roark's / Timoshenko, checked
    // by the unit-load method in FourPointBendTest): at the noses and at mid-span
    double atNoses = 100 / Flexure.fourPointLoadPointDeflection_mm(100, L, LS, E, I);
    double atMid = 100 / Flexure.fourPointMidSpanDeflection_mm(100, L, LS, E, I);

    RunData crossheadRun = TestRuns.bend(atNoses, 400);
    RunMetrics byCrosshead = RunMetrics.of(fourPoint(), crossheadRun);
    assertThat(RunMetrics.positionSource(fourPoint())).isEqualTo(PositionSource.CROSSHEAD);
    // the stiffness search recovers the slope to well within 0.5 %, so must the modulus
    assertThat(byCrosshead.flexuralModulus_MPa().getAsDouble()).isCloseTo(E, within(0.005 * E));
    assertThat(byCrosshead.notes()).anyMatch(s -> s.contains("loading noses"));
    assertThat(byCrosshead.toJsonMap().get("flexural_stress_at_peak_large_deflection_MPa"))
        .isNull();

    RunAdjust gauge = RunAdjust.of(fourPoint(), TestRuns.bend(atMid, 400))
        .positionMeasures(PositionSource.MID_SPAN_GAUGE);
    RunMetrics byGauge = RunMetrics.of(gauge.metadata(), gauge.data());
    assertThat(byGauge.flexuralModulus_MPa().getAsDouble()).isCloseTo(E, within(0.005 * E));
    assertThat(gauge.notes()).anyMatch(s -> s.contains("mid-span-gauge"));
    assertThat(byGauge.metadata().extra()).containsEntry("position_source", "mid-span-gauge");
  }

  @Test
  void anUnknownRecordedSourceIsNamed() {
    RunMetadata odd = fourPoint().toBuilder()
        .extra(Map.of(PositionSource.METADATA_KEY, "laser")).build();
    assertThatThrownBy(() -> RunMetrics.positionSource(odd))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("'laser'")
        .hasMessageContaining("mid-span-gauge");
  }
}
