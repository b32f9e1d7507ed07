package org.loadstone.analysis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;

class FourPointBendTest {
  static final double E = 4000; // MPa
  static final double B = 25;
  static final double D = 5;
  static final double I = B * D * D * D / 12;

  /**
   * Deflection at point c of a simply supported beam (span L) under two loads P/2 at a from each
   * support, by the unit-load method of virtual work (any structural-analysis text, e.g. Hibbeler):
   * δ_c = ∫ M(x)·m_c(x) dx / (EI), M the bending moment of the loads, m_c that of a unit load at
   * c; integrated numerically (Simpson, 20 000 intervals), independent of the closed forms.
   */
  static double unitLoad(double p, double l, double a, double c) {
    int n = 20_000;
    double h = l / n;
    double sum = 0;
    for (int i = 0; i <= n; i++) {
      double x = i * h;
      double moment = p / 2 * (Math.min(x, a) - Math.max(0, x - (l - a)));
      double unit = x <= c ? (l - c) * x / l : c * (l - x) / l;
      double w = i == 0 || i == n ? 1 : (i % 2 == 1 ? 4 : 2);
      sum += w * moment * unit;
    }
    return sum * h / 3 / (E * I);
  }

  @Test
  void closedFormDeflectionsMatchTheUnitLoadMethod() {
    double l = 120;
    double p = 200;
    for (double loadSpan : new double[] {l / 3, l / 2, 0.2 * l}) {
      double a = (l - loadSpan) / 2;
      assertThat(Flexure.fourPointMidSpanDeflection_mm(p, l, loadSpan, E, I))
          .isCloseTo(unitLoad(p, l, a, l / 2), within(1e-9));
      assertThat(Flexure.fourPointLoadPointDeflection_mm(p, l, loadSpan, E, I))
          .isCloseTo(unitLoad(p, l, a, a), within(1e-9));
    }
  }

  @Test
  void theMidSpanFormOnCrossheadTravelOverstatesTheModulusAsMeasured() {
    // (3L² − 4a²)/(4a(3L − 4a)): 23/20 = 1.15 at a load span of L/3 (a = L/3), 11/8 = 1.375 at
    // L/2 (a = L/4); the same overstatements were measured on the analysis before this fix.
    assertThat(Flexure.fourPointMidSpanPerLoadPoint(90, 30)).isCloseTo(1.15, within(1e-12));
    assertThat(Flexure.fourPointMidSpanPerLoadPoint(90, 45)).isCloseTo(1.375, within(1e-12));
  }

  @Test
  void eachPositionSourceGetsItsFormulaBackToTheModulus() {
    double l = 120;
    double ls = 40;
    double p = 100;
    double loadPointSlope = p / Flexure.fourPointLoadPointDeflection_mm(p, l, ls, E, I);
    double midSpanSlope = p / Flexure.fourPointMidSpanDeflection_mm(p, l, ls, E, I);
    BendFigures crosshead = BendFigures.of(l, ls, B, D, 300, OptionalDouble.of(loadPointSlope),
        OptionalDouble.empty(), PositionSource.CROSSHEAD);
    assertThat(crosshead.modulus_MPa().getAsDouble()).isCloseTo(E, within(1e-9));
    assertThat(crosshead.notes()).anyMatch(s -> s.contains("loading noses"));
    BendFigures gauge = BendFigures.of(l, ls, B, D, 300, OptionalDouble.of(midSpanSlope),
        OptionalDouble.empty(), PositionSource.MID_SPAN_GAUGE);
    assertThat(gauge.modulus_MPa().getAsDouble()).isCloseTo(E, within(1e-9));
    // ASTM D6272 stress at load span L/3: σ = PL/(bd²)
    assertThat(gauge.stressAtPeak_MPa()).isCloseTo(300 * l / (B * D * D), within(1e-9));
    // three-point: the crosshead is the mid-span, k = 48EI/L³ (strength-of-materials text)
    BendFigures three = BendFigures.of(l, null, B, D, 300,
        OptionalDouble.of(48 * E * I / (l * l * l)), OptionalDouble.empty(),
        PositionSource.CROSSHEAD);
    assertThat(three.modulus_MPa().getAsDouble()).isCloseTo(E, within(1e-9));
  }

  @Test
  void largeDeflectionIsCorrectedInThreePointAndFlaggedInFourPoint() {
    // ASTM D790 (from memory): σ = 3PL/(2bd²)·[1 + 6(D/L)² − 4(d/L)(D/L)];
    // P = 100, L = 80, b = 25, d = 2, D = 12: 3·100·80/(2·25·4) = 120 MPa;
    // factor 1 + 6·0.0225 − 4·0.025·0.15 = 1.12, so 134.4 MPa (hand-computed).
    BendFigures big = BendFigures.of(80, null, 25, 2, 100, OptionalDouble.empty(),
        OptionalDouble.of(12), PositionSource.CROSSHEAD);
    assertThat(big.stressAtPeak_MPa()).isCloseTo(120, within(1e-9));
    assertThat(big.stressAtPeakLargeDeflection_MPa().getAsDouble()).isCloseTo(134.4, within(1e-9));
    assertThat(big.notes()).anyMatch(s -> s.contains("ASTM D790") && s.contains("from memory"));
    BendFigures small = BendFigures.of(80, null, 25, 2, 100, OptionalDouble.empty(),
        OptionalDouble.of(7.9), PositionSource.CROSSHEAD);
    assertThat(small.stressAtPeakLargeDeflection_MPa()).isEmpty();
    // four-point on the crosshead: 7.5 mm at the noses is 8.6 mm at mid-span (× 1.15), > L/10
    BendFigures four = BendFigures.of(80, 80.0 / 3, 25, 2, 100, OptionalDouble.empty(),
        OptionalDouble.of(7.5), PositionSource.CROSSHEAD);
    assertThat(four.stressAtPeakLargeDeflection_MPa()).isEmpty();
    assertThat(four.notes()).anyMatch(s -> s.contains("10.8 %") && s.contains("D6272"));
  }
}
