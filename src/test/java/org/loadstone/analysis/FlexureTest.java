package org.loadstone.analysis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.loadstone.units.LoadstoneException;

class FlexureTest {

  @Test
  void threePointFormulasOfD790() {
    // ASTM D790 / ISO 178: σ = 3PL/(2bd²), ε = 6Dd/L², E = L³m/(4bd³).
    // P = 100 N, L = 64, b = 25, d = 4: σ = 19200/800 = 24 MPa.
    assertThat(Flexure.threePointStress_MPa(100, 64, 25, 4)).isCloseTo(24.0, within(1e-12));
    // D = 2 mm: ε = 48/4096 = 0.01171875
    assertThat(Flexure.threePointStrain(2, 64, 4)).isCloseTo(0.01171875, within(1e-15));
    // m = 73.2421875 N/mm: E = 262144·73.2421875/6400 = 3000 MPa
    assertThat(Flexure.threePointModulus_MPa(73.2421875, 64, 25, 4)).isCloseTo(3000, within(1e-9));
  }

  @Test
  void threePointModulusInvertsTheBeamStiffness() {
    // Simply supported beam, centre load: k = 48EI/L³, I = bd³/12 (strength-of-materials text).
    double e = 7000;
    double k = 48 * e * (30 * Math.pow(5, 3) / 12) / Math.pow(80, 3);
    assertThat(Flexure.threePointModulus_MPa(k, 80, 30, 5)).isCloseTo(e, within(1e-9));
    // stress over strain at a load on the line equals E
    double p = 50;
    double sigma = Flexure.threePointStress_MPa(p, 80, 30, 5);
    double eps = Flexure.threePointStrain(p / k, 80, 5);
    assertThat(sigma / eps).isCloseTo(e, within(1e-9));
  }

  @Test
  void fourPointThirdSpanReducesToTheD6272Coefficients() {
    // ASTM D6272, load span L/3: σ = PL/(bd²), ε = 4.70Dd/L², E = 0.21L³m/(bd³).
    double l = 90;
    assertThat(Flexure.fourPointStress_MPa(100, l, l / 3, 20, 3))
        .isCloseTo(100 * l / (20 * 9.0), within(1e-12));
    double eps = Flexure.fourPointStrain(1.0, l, l / 3, 3);
    assertThat(eps * l * l / 3.0).isCloseTo(4.70, within(0.005)); // 108/23 = 4.6957
    double e = Flexure.fourPointModulus_MPa(10, l, l / 3, 20, 3);
    assertThat(e * 20 * 27 / (10 * l * l * l)).isCloseTo(0.21, within(0.005)); // 23/108 = 0.2130, printed as 0.21
    // load span L/2: σ = 3PL/(4bd²) (ASTM D6272)
    assertThat(Flexure.fourPointStress_MPa(100, l, l / 2, 20, 3))
        .isCloseTo(3 * 100 * l / (4 * 20 * 9.0), within(1e-12));
  }

  @Test
  void fourPointModulusInvertsTheBeamDeflection() {
    // Two loads P/2 at a from each support: midspan deflection P·a·(3L² − 4a²)/(48EI)
    // (standard beam table, e.g. Roark's Formulas for Stress and Strain).
    double e = 5000;
    double l = 100;
    double ls = 40;
    double a = (l - ls) / 2;
    double inertia = 20 * Math.pow(4, 3) / 12;
    double m = 48 * e * inertia / (a * (3 * l * l - 4 * a * a));
    assertThat(Flexure.fourPointModulus_MPa(m, l, ls, 20, 4)).isCloseTo(e, within(1e-9));
    double p = 80;
    double sigma = Flexure.fourPointStress_MPa(p, l, ls, 20, 4);
    double eps = Flexure.fourPointStrain(p / m, l, ls, 4);
    assertThat(sigma / eps).isCloseTo(e, within(1e-9));
  }

  @Test
  void sandwichDeflectionMatchesAllenOnAWorkedCase() {
    // Allen, "Analysis and Design of Structural Sandwich Panels": Δ = PL³/(48D) + PL/(4U).
    // Worked by hand: hardboard facings t = 3 mm, E_f = 4000 MPa; foam core c = 20 mm,
    // G_c = 20 MPa, E_c neglected; b = 50 mm; d = 26 mm; h = (26 + 20)/2 = 23 mm.
    //   D = 4000·50·3³/6 + 4000·50·3·23²/2 = 900 000 + 158 700 000 = 159 600 000 N·mm²
    //   U = 20·50·23²/20 = 26 450 N
    //   P = 200 N, L = 400 mm: bending 200·400³/(48·159.6e6) = 1.670844 mm,
    //   shear 200·400/(4·26450) = 0.756144 mm, total 2.426987 mm.
    SandwichGeometry g = new SandwichGeometry(26, 20, 3, 50);
    double d = Sandwich.bendingRigidity_Nmm2(g, 4000, 0);
    double u = Sandwich.shearRigidity_N(g, 20);
    assertThat(d).isCloseTo(159_600_000, within(1e-3));
    assertThat(u).isCloseTo(26_450, within(1e-9));
    assertThat(Sandwich.threePointDeflection_mm(200, 400, d, u)).isCloseTo(2.426987, within(1e-6));
    // ASTM C393: τ = P/((d + c)b) = 200/(46·50) = 0.0869565 MPa;
    // σ = PL/(2t(d + c)b) = 80000/(2·3·46·50) = 5.797101 MPa
    assertThat(Sandwich.coreShearStress_MPa(200, g)).isCloseTo(0.0869565, within(1e-7));
    assertThat(Sandwich.facingStress_MPa(200, 400, g)).isCloseTo(5.797101, within(1e-6));
  }

  @Test
  void inconsistentSandwichGeometryIsRefused() {
    assertThatThrownBy(() -> new SandwichGeometry(30, 20, 3, 50))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("inconsistent")
        .hasMessageContaining("c + 2t");
    assertThat(new SandwichGeometry(26.3, 20, 3, 50).facingCentroidDistance_mm())
        .isCloseTo(23.15, within(1e-12));
    assertThatThrownBy(() -> new SandwichGeometry(26, 20, 0, 50))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("facing thickness");
  }

  @Test
  void badDimensionsAndSpecificValues() {
    assertThatThrownBy(() -> Flexure.threePointStress_MPa(100, 0, 25, 4))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("support span");
    assertThatThrownBy(() -> Flexure.fourPointStress_MPa(100, 60, 60, 25, 4))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("load span");
    assertThat(Flexure.compressionStress_MPa(1000, 400)).isEqualTo(2.5);
    assertThat(Specific.force_N_per_g(300, 12)).isEqualTo(25);
    assertThat(Specific.energy_J_per_g(0.6, 12)).isCloseTo(0.05, within(1e-15));
    assertThat(Specific.stiffness_N_per_mm_per_g(48, 12)).isEqualTo(4);
    assertThatThrownBy(() -> Specific.force_N_per_g(300, 0))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("specimen mass");
  }
}
