package org.loadstone.sim;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;
import org.loadstone.units.LoadstoneException;

class ScenarioTest {

  @Test
  void parsesCommandLineNames() {
    for (Scenario s : Scenario.values()) {
      assertThat(Scenario.parse(s.cliName())).isEqualTo(s);
      assertThat(Scenario.parse(" " + s.cliName().toUpperCase().replace('-', '_') + " "))
          .isEqualTo(s);
    }
  }

  @Test
  void unknownNameListsTheAcceptedOnes() {
    assertThatThrownBy(() -> Scenario.parse("panel-cork"))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("'panel-cork'")
        .hasMessageContaining("brittle, four-point, ductile, crush, over-range, rigid-block, panel-foam,"
            + " panel-balsa, panel-board, dead-weight");
    assertThatThrownBy(() -> Scenario.parse(null)).isInstanceOf(LoadstoneException.class);
  }

  @Test
  void builderRefusesBadSettingsWithTheSettingNamed() {
    assertThatThrownBy(() -> SimulatedFrame.builder().rateHz(60_000).build())
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("rate 60000");
    assertThatThrownBy(() -> SimulatedFrame.builder().frameStiffness_N_per_mm(0).build())
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("frame stiffness");
    assertThatThrownBy(() -> SimulatedFrame.builder().firstSequence(70_000).build())
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("first sequence");
    assertThatThrownBy(
            () -> SimulatedFrame.builder().scenario(Scenario.DEAD_WEIGHT).handPumped(0.2).build())
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("dead-weight");
    assertThatThrownBy(() -> SimulatedFrame.builder().build().placeMass(1))
        .isInstanceOf(IllegalStateException.class).hasMessageContaining("dead-weight");
  }
}
