package org.loadstone.calibration;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.loadstone.units.LoadstoneException;

class CalibrationServiceTest {
  static final double ZERO = 81234; // raw counts at no load; every test tares against it

  static CalibrationPoint pt(double f, Direction d, int series, double netCounts) {
    return new CalibrationPoint(f, null, d, series, ZERO + netCounts, 0, 1);
  }

  /**
   * One ascending series, 0…500 N in 100 N steps, 10 counts/N, with deviations
   * e = [0, +1, −1, −1, +1, 0] counts. Σe = 0 and Σ e·i = 1 − 2 − 3 + 4 = 0, so e is orthogonal
   * to both columns of the straight-line design: the least-squares line is exactly 10·F.
   */
  static List<CalibrationPoint> astmSet() {
    double[] e = {0, 1, -1, -1, 1, 0};
    List<CalibrationPoint> pts = new ArrayList<>();
    for (int i = 0; i <= 5; i++) {
      pts.add(pt(100.0 * i, Direction.UP, 1, 10 * 100.0 * i + e[i]));
    }
    return pts;
  }

  @Test
  void astmE74LowerLimitFactorOfAConstructedSet() {
    CalibrationReport r = CalibrationService.fitFromPoints(astmSet(),
        CalibrationSettings.defaults().withChosenFit(FitKind.LINEAR));
    FitResult lin = r.chosenFit();
    assertThat(lin.countsOfForce().coefficient(0)).isCloseTo(0, within(1e-9));
    assertThat(lin.countsOfForce().coefficient(1)).isCloseTo(10, within(1e-12));
    // By hand: residuals in N are e/10 = [0, .1, −.1, −.1, .1, 0]; SSE = 0.04 N²; n − p = 6 − 2 = 4;
    // s = sqrt(0.04/4) = 0.1 N. ASTM E74: LLF = 2.4 s = 0.24 N; Class A lower limit 400 LLF =
    // 96 N; Class AA 2000 LLF = 480 N.
    assertThat(lin.residualSd_N()).isCloseTo(0.1, within(1e-10));
    assertThat(r.astm().llf_N()).isCloseTo(0.24, within(1e-10));
    assertThat(r.astm().classALowerLimit_N()).isCloseTo(96, within(1e-8));
    assertThat(r.astm().classAALowerLimit_N()).isCloseTo(480, within(1e-8));
    assertThat(r.astm().note()).contains("not a substitute for an accredited calibration");
    // one ascending series only: the E74 style figures are those of the adopted line
    assertThat(r.astm().residualSd_N()).isCloseTo(lin.residualSd_N(), within(1e-12));
    // best straight line = 10·F: largest deviation 1 count = 0.1 N = 0.02 % of 500 N
    assertThat(r.linearity().nonlinearity_pct_fs()).isCloseTo(0.02, within(1e-10));
    assertThat(r.linearity().hysteresis_pct_fs()).isNull();
    assertThat(r.linearity().repeatability_pct_fs()).isNull();
    // one series: ISO 7500-1 repeatability cannot be assessed, so no class
    assertThat(r.iso().systemClass()).isEqualTo("none");
    // the deviations are noise about the line: no added term is significant
    assertThat(r.recommendation().kind()).isEqualTo(FitKind.LINEAR);
    assertThat(r.recommendation().reason()).contains("quadratic's added term is not significant");

    Map<String, Object> s = CalibrationService.summary(r);
    assertThat(s).containsKeys("degree", "coefficients", "sensitivity_counts_per_N",
        "residual_sd_N", "nonlinearity_pct_fs", "llf_N", "class_a_lower_limit_N",
        "iso7500_class");
    assertThat((double) s.get("llf_N")).isCloseTo(0.24, within(1e-10));
    assertThat(CalibrationService.summaryJson(r)).contains("\"iso7500_class\" : \"none\"");
  }

  /**
   * Three series up and down, 0…1000 N in 200 N steps, exactly 100 counts/N apart from chosen
   * deviations (counts). The curve is fitted to the ascending readings: their mean deviations
   * per load are [0, 0, 120, 0, 0, 0], so their least-squares line has the slope
   * k = 100 + Σ(x − 500)·dev/Σ(x − 500)² = 100 − 100·120/700000 counts/N and the intercept
   * c = 20 + (100·120/700000)·500 counts (mean deviation 20 less the slope change times 500 N);
   * a reading of n net counts indicates (n − c)/k N.
   *
   * <pre>
   * load   up s1  up s2  up s3   down s1 down s2 down s3
   * 0         0      0      0      +20    −10    −10
   * 200     +20    −20      0      +30    −10    −20
   * 400    +240      0   +120     −120   −120   −120
   * 600…1000  0      0      0        0      0      0
   * </pre>
   */
  static List<CalibrationPoint> isoSet() {
    double[][] up = {{0, 0, 0}, {20, -20, 0}, {240, 0, 120}, {0, 0, 0}, {0, 0, 0}, {0, 0, 0}};
    double[][] down = {{20, -10, -10}, {30, -10, -20}, {-120, -120, -120}, {0, 0, 0}, {0, 0, 0},
        {0, 0, 0}};
    List<CalibrationPoint> pts = new ArrayList<>();
    for (int s = 1; s <= 3; s++) {
      for (int i = 0; i <= 5; i++) {
        pts.add(pt(200.0 * i, Direction.UP, s, 100 * 200.0 * i + up[i][s - 1]));
      }
      for (int i = 5; i >= 0; i--) {
        pts.add(pt(200.0 * i, Direction.DOWN, s, 100 * 200.0 * i + down[i][s - 1]));
      }
    }
    return pts;
  }

  @Test
  void iso7500FiguresAndClassOfAConstructedSet() {
    CalibrationReport r = CalibrationService.fitFromPoints(isoSet(),
        CalibrationSettings.defaults().withChosenFit(FitKind.LINEAR));
    double k = 100 - 12000.0 / 700000;
    double c = 20 + 12000.0 / 700000 * 500;
    assertThat(r.chosenFit().countsOfForce().coefficient(1)).isCloseTo(k, within(1e-9));
    assertThat(r.chosenFit().countsOfForce().coefficient(0)).isCloseTo(c, within(1e-7));
    Iso7500Result iso = r.iso();
    assertThat(iso.points()).hasSize(5);
    Iso7500Result.Point p200 = iso.points().get(0);
    Iso7500Result.Point p400 = iso.points().get(1);
    // By hand, ISO 7500-1 definitions (from memory): q = (F̄i − F)/F, b = (Fi,max − Fi,min)/F̄i,
    // v = (Fi,down − Fi,up)/F (largest magnitude over the series), all × 100; Fi = (n − c)/k.
    // 200 N: up nets 20020, 19980, 20000 → mean (20000 − c)/k; spread 40/k; down − up per
    //        series 10, 10, −20 counts → v = −20/k/200
    double mean200 = (20000 - c) / k;
    assertThat(p200.q_pct()).isCloseTo(100 * (mean200 - 200) / 200, within(1e-9));
    assertThat(p200.b_pct()).isCloseTo(100 * 40 / k / mean200, within(1e-9));
    assertThat(p200.v_pct()).isCloseTo(100 * -20 / k / 200, within(1e-9));
    assertThat(p200.pointClass()).isEqualTo("0.5");
    // 400 N: up nets 40240, 40000, 40120 → mean (40120 − c)/k ≈ 400.98, q ≈ 0.246 %; spread
    //        240/k, b ≈ 0.599 %; down − up −360, −120, −240 → v = −360/k/400 ≈ −0.900 %
    //        → b > 0.5 and |v| > 0.75 (class 0.5 limits) but within class 1 (1.0, 1.5)
    double mean400 = (40120 - c) / k;
    assertThat(p400.q_pct()).isCloseTo(100 * (mean400 - 400) / 400, within(1e-9));
    assertThat(p400.b_pct()).isCloseTo(100 * 240 / k / mean400, within(1e-9));
    assertThat(p400.v_pct()).isCloseTo(100 * -360 / k / 400, within(1e-9));
    assertThat(p400.pointClass()).isEqualTo("1");
    // resolution: SD 0 → one count = 0.01 N; at 200 N a = 0.005 %
    assertThat(p200.a_pct()).isCloseTo(100 * 0.01 / 200 * (100 / r.linearity()
        .sensitivity_counts_per_N()), within(1e-9));
    // zero after unloading, against the zero set at the start: 20/k, −10/k, −10/k N → f0 =
    // 100·(20/k)/1000 ≈ 0.02 % (class 0.5 limit 0.05)
    assertThat(iso.f0_pct()).isCloseTo(100 * 20 / k / 1000, within(1e-9));
    assertThat(iso.systemClass()).isEqualTo("1");

    // Linearity figures use the best straight line through the ascending points only. Mean up
    // deviations per load: [0, 0, 120, 0, 0, 0]. Slope of their least-squares line:
    // Σ(x − 500)·dev / Σ(x − 500)² = (−100·120)/700000 = −0.0171428… counts/N, so the
    // sensitivity is 100 − 0.0171428… ; intercept 20 + 0.0171428…·500 = 28.5714…
    double slope = k;
    double icept = c;
    assertThat(r.linearity().sensitivity_counts_per_N()).isCloseTo(slope, within(1e-9));
    // non-linearity: largest |dev − line| is at 400 N: 120 − (icept + (slope − 100)·400)
    double nl = 120 - (icept - 12000.0 / 700000 * 400);
    assertThat(r.linearity().nonlinearity_pct_fs()).isCloseTo(100 * nl / slope / 1000,
        within(1e-9));
    // hysteresis: largest |down − up| in one series is 360 counts (400 N, series 1)
    assertThat(r.linearity().hysteresis_pct_fs()).isCloseTo(100 * 360 / slope / 1000,
        within(1e-9));
    // repeatability: largest spread is 240 counts (400 N, up)
    assertThat(r.linearity().repeatability_pct_fs()).isCloseTo(100 * 240 / slope / 1000,
        within(1e-9));
  }

  @Test
  void recommendsTheQuadraticForACurvedCellAndExplainsWhy() {
    // counts = 10·F + 0.002·F² with ±1 count alternating noise, 11 loads 0…500 N
    List<CalibrationPoint> pts = new ArrayList<>();
    for (int i = 0; i <= 10; i++) {
      double f = 50.0 * i;
      pts.add(pt(f, Direction.UP, 1, 10 * f + 0.002 * f * f + (i == 0 ? 0 : i % 2 == 0 ? 1 : -1)));
    }
    CalibrationReport r = CalibrationService.fitFromPoints(pts, CalibrationSettings.defaults());
    assertThat(r.recommendation().kind()).isEqualTo(FitKind.QUADRATIC);
    assertThat(r.chosen()).isEqualTo(FitKind.QUADRATIC);
    assertThat(r.recommendation().reason()).contains("quadratic's added term is significant")
        .contains("cubic's added term is not significant");
    assertThat(r.chosenFit().countsOfForce().coefficient(2)).isCloseTo(0.002, within(2e-5));
    // the straight line leaves the bow: 0.002·F² over 0…500 N deviates by 0.002·250²/2 ≈ 62
    // counts at mid-range from the chord, about 1 % FS; the quadratic's errors are ~0.1 N
    assertThat(r.fit(FitKind.LINEAR).maxError_pct_fs()).isGreaterThan(0.5);
    assertThat(r.chosenFit().maxError_pct_fs()).isLessThan(0.05);
    assertThat(FitTable.format(r)).contains("quadratic").contains("<- adopted")
        .doesNotContain("\u001b");
  }

  @Test
  void clearMessagesForPointSetsThatCannotBeFitted() {
    List<CalibrationPoint> two = List.of(pt(0, Direction.UP, 1, 0), pt(100, Direction.UP, 1, 1000));
    assertThatThrownBy(() -> CalibrationService.fitFromPoints(two, CalibrationSettings.defaults()))
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("fewer points than the fit"
            + " needs");
    List<CalibrationPoint> noZero = new ArrayList<>(astmSet());
    noZero.add(pt(100, Direction.UP, 2, 1000));
    assertThatThrownBy(() -> CalibrationService.fitFromPoints(noZero,
        CalibrationSettings.defaults())).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("series 2 has no ascending zero point");
    List<CalibrationPoint> dup = new ArrayList<>(astmSet());
    dup.add(pt(200, Direction.UP, 1, 2000));
    assertThatThrownBy(() -> CalibrationService.fitFromPoints(dup,
        CalibrationSettings.defaults())).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("appears twice in series 1");
  }

  @Test
  void aChosenFitThatTurnsOverIsRefused() {
    // counts rise then fall: 0, 1000, 1500, 1600, 1500 at 0…400 N — a quadratic turns over
    double[] c = {0, 1000, 1500, 1600, 1500};
    List<CalibrationPoint> pts = new ArrayList<>();
    for (int i = 0; i < c.length; i++) {
      pts.add(pt(100.0 * i, Direction.UP, 1, c[i]));
    }
    assertThatThrownBy(() -> CalibrationService.fitFromPoints(pts,
        CalibrationSettings.defaults().withChosenFit(FitKind.QUADRATIC)))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("quadratic could not be made")
        .hasMessageContaining("not monotonic");
  }
}
