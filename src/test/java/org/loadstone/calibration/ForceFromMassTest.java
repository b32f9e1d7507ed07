package org.loadstone.calibration;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.loadstone.units.LoadstoneException;

class ForceFromMassTest {

  @Test
  void normalGravityAtEquatorAndPolesIsTheWgs84Value() {
    // NIMA TR8350.2 (WGS 84), Table 3.4: γe = 9.7803253359, γp = 9.8321849378 m/s². The pole
    // value checks that k and e² in Somigliana's formula agree with γe and γp.
    assertThat(NormalGravity.onEllipsoid_m_per_s2(0)).isCloseTo(9.7803253359, within(1e-10));
    assertThat(NormalGravity.onEllipsoid_m_per_s2(90)).isCloseTo(9.8321849378, within(1e-10));
    assertThat(NormalGravity.onEllipsoid_m_per_s2(-90)).isCloseTo(9.8321849378, within(1e-10));
  }

  @Test
  void elevationLowersGravityByTheFreeAirGradient() {
    // free-air gradient 0.3086 mGal/m (standard geodesy value): 1000 m lowers g by 3.086e-3 m/s²
    double sea = NormalGravity.at_m_per_s2(47.0, 0);
    double up = NormalGravity.at_m_per_s2(47.0, 1000);
    assertThat(sea - up).isCloseTo(3.086e-3, within(1e-12));
    assertThatThrownBy(() -> NormalGravity.at_m_per_s2(91, 0))
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("latitude");
  }

  @Test
  void buoyancyWorkedExample() {
    // Worked by hand: m = 500 g + 2 kg = 2.5 kg, g = 9.80665 m/s², ρ_air = 1.2, ρ_weight = 8000
    // (OIML R 111-1 conventional values). m·g = 24.516625 N; ρ_air/ρ_weight = 1.5e-4;
    // buoyancy = −24.516625 × 1.5e-4 = −0.00367749375 N; F = 24.51294750625 N.
    double m = MassText.parse_kg("500 g + 2 kg");
    assertThat(m).isCloseTo(2.5, within(1e-15));
    ForceFromMass model = ForceFromMass.standard();
    assertThat(model.force_N(m)).isCloseTo(24.51294750625, within(1e-11));
    ForceFromMass.Corrections c = model.corrections(m);
    assertThat(c.buoyancyCorrection_N()).isCloseTo(-0.00367749375, within(1e-13));
    assertThat(c.buoyancyRelative()).isCloseTo(-1.5e-4, within(1e-15));
    assertThat(c.gravityCorrection_N()).isZero();
  }

  @Test
  void massesAreConventionalMassesWhateverTheWeightsAreMadeOf() {
    // OIML R 111-1 convention (from memory): a weight of conventional mass m_c balances, in air
    // of 1.2 kg/m³, a reference of 8000 kg/m³ and mass m_c, so its true mass m satisfies
    // m·(1 − 1.2/ρ) = m_c·(1 − 1.2/8000), and its force in air of density ρ_air is
    // m·g·(1 − ρ_air/ρ).
    double g = 9.80665;
    // In conventional air an aluminium (2700 kg/m³) 10 kg weight gives what a steel one gives:
    // 10 × 9.80665 × (1 − 1.5e-4) N; the old true-mass reading was 294 ppm (1.2/2700 −
    // 1.2/8000 = 2.944e-4) lower.
    ForceFromMass alu = new ForceFromMass(g, "standard", 1.2, 2700);
    assertThat(alu.force_N(10)).isCloseTo(10 * g * (1 - 1.2 / 8000), within(1e-12));
    assertThat(alu.force_N(10) / (10 * g * (1 - 1.2 / 2700)) - 1)
        .isCloseTo((1 - 1.2 / 8000) / (1 - 1.2 / 2700) - 1, within(1e-12))
        .isCloseTo(2.94e-4, within(2e-6));
    // steel weights in thinner air: m_c·g·(1 − ρ_air/8000)
    assertThat(new ForceFromMass(g, "standard", 1.0, 8000).force_N(10))
        .isCloseTo(10 * g * (1 - 1.0 / 8000), within(1e-12));
    // both differ: from the definition, by hand
    double trueMass = 10 * (1 - 1.2 / 8000) / (1 - 1.2 / 2700);
    ForceFromMass thinAlu = new ForceFromMass(g, "standard", 1.1, 2700);
    assertThat(thinAlu.force_N(10)).isCloseTo(trueMass * g * (1 - 1.1 / 2700), within(1e-12));
    assertThat(thinAlu.corrections(10).buoyancyRelative())
        .isCloseTo(thinAlu.force_N(10) / (10 * g) - 1, within(1e-15));
  }

  @Test
  void gravityCorrectionIsReportedAgainstStandardGravity() {
    // By hand: g = 9.81 entered, m = 10 kg: m·(g − 9.80665) = 10 × 0.00335 = 0.0335 N;
    // relative 0.00335 / 9.80665 = 3.41605e-4.
    ForceFromMass.Corrections c = ForceFromMass.withGravity(9.81).corrections(10);
    assertThat(c.gravityCorrection_N()).isCloseTo(0.0335, within(1e-12));
    assertThat(c.gravityRelative()).isCloseTo(0.00335 / 9.80665, within(1e-15));
  }

  @Test
  void badInputsAreRefusedWithTheFix() {
    assertThatThrownBy(() -> ForceFromMass.withGravity(98.1))
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("9.7 to 9.9");
    assertThatThrownBy(() -> MassText.parse_kg("500"))
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("unit");
    assertThatThrownBy(() -> MassText.parse_kg("2 kg + -5 g"))
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("-5 g");
    assertThatThrownBy(() -> MassText.parse_kg("1,5 kg"))
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("decimal point");
    assertThat(MassText.parse_kg("250 mg + .5 G")).isCloseTo(0.00075, within(1e-15));
  }
}
