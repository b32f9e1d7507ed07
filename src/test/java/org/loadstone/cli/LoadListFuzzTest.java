package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.List;
import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.lifecycle.AfterContainer;
import net.jqwik.api.lifecycle.BeforeContainer;
import org.loadstone.units.Fuzz;

/**
 * Fuzzing of the loads file ({@code calibrate --loads-file}) with damaged copies of a file a lab
 * writes: the loads read are positive, finite and ascending, or the file is refused in words.
 */
class LoadListFuzzTest {
  private static final byte[] LOADS = ("# dead weights for the 1 kN shelf rig\n"
      + "10 kg\n20 kg   # two 10 kg discs\n40 kg\n1 kg + 500 g\n60 kg; 80 kg\n")
      .getBytes(StandardCharsets.UTF_8);
  private static Path dir;

  @BeforeContainer
  static void corpus() {
    dir = Fuzz.tempDir("loads");
  }

  @AfterContainer
  static void clean() {
    Fuzz.delete(dir);
  }

  /** Found by the long run: 400 nines read as an infinite mass and were accepted. */
  @Example
  void aMassPastTheRangeOfNumbersIsRefusedAndNotEchoedWhole() {
    String huge = "9".repeat(400) + " kg";
    assertThatThrownBy(() -> LoadList.parse(huge, null))
        .isInstanceOf(org.loadstone.units.LoadstoneException.class)
        .hasMessageContaining("thousand tonnes")
        .satisfies(e -> assertThat(e.getMessage().length()).isLessThan(300));
    assertThat(LoadList.parse("999 kg, 1000000 kg", null)).containsExactly(999.0, 1e6);
  }

  @Property(tries = 150, seed = "140651")
  void loadsFileGivesAscendingPositiveMassesOrARefusal(@ForAll long seed) {
    Fuzz.eachCopy(LOADS, seed, dir.resolve("loads.txt"), f -> {
      List<Double> kg = Fuzz.readOrRefuse(() -> LoadList.parse(null, f));
      if (kg != null) {
        for (int i = 0; i < kg.size(); i++) {
          assertThat(kg.get(i)).isPositive().isFinite();
          if (i > 0) {
            assertThat(kg.get(i)).isGreaterThan(kg.get(i - 1));
          }
        }
      }
    });
  }
}
