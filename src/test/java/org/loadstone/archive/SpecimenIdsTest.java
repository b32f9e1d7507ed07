package org.loadstone.archive;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.units.LoadstoneException;

class SpecimenIdsTest {
  @Test
  void theNextIdCountsOnTheTrailingNumberKeepingItsWidth() {
    assertThat(SpecimenIds.next("P-07")).isEqualTo("P-08");
    assertThat(SpecimenIds.next("P-09")).isEqualTo("P-10");
    assertThat(SpecimenIds.next("P-99")).isEqualTo("P-100");
    assertThat(SpecimenIds.next("foam 9")).isEqualTo("foam 10");
    assertThat(SpecimenIds.next("balsa-001")).isEqualTo("balsa-002");
    assertThat(SpecimenIds.next("12")).isEqualTo("13");
    assertThat(SpecimenIds.next("B7x2")).isEqualTo("B7x3");
    assertThat(SpecimenIds.next("board")).isEqualTo("board-2");
    assertThat(SpecimenIds.next("P-99999999999999999999")).isEqualTo("P-100000000000000000000");
    assertThatThrownBy(() -> SpecimenIds.next("  ")).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("specimen id");
  }

  @Test
  void runsOfASpecimenAreFoundByTheirSidecarNotByALookAlikeName(@TempDir Path dir) {
    RunMetadata m = RunFixtures.fullMetadata("20261204T100000.000Z-P-07");
    RunWriter.write(dir, m.withIdentity("20261204T100000.000Z-P-07", "P-07", "foam"),
        RunFixtures.randomData(1, 20, false));
    // the same specimen again, disambiguated by the archive with -2
    RunWriter.write(dir, m.withIdentity("20261204T110000.000Z-P-07-2", "P-07", "foam"),
        RunFixtures.randomData(2, 20, false));
    // a specimen whose own id ends like a disambiguation
    RunWriter.write(dir, m.withIdentity("20261204T120000.000Z-P-07-3", "P-07-3", "foam"),
        RunFixtures.randomData(3, 20, false));
    assertThat(SpecimenIds.runsOf(dir, "P-07")).containsExactly(
        "20261204T100000.000Z-P-07", "20261204T110000.000Z-P-07-2");
    assertThat(SpecimenIds.runsOf(dir, "P-07-3")).containsExactly("20261204T120000.000Z-P-07-3");
    assertThat(SpecimenIds.runsOf(dir, "P-08")).isEmpty();
    assertThat(SpecimenIds.runsOf(dir.resolve("none"), "P-07")).isEmpty();
  }
}
