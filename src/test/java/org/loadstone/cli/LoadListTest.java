package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.units.LoadstoneException;

/** The weights of a live calibration as typed on the command line or listed in a file. */
class LoadListTest {
  @Test
  void sumsUnitsAndOrderAreAccepted() {
    // 1 kg + 500 g = 1.5 kg; 250 g = 0.25 kg; listed out of order, used ascending
    assertThat(LoadList.parse("2 kg, 1 kg + 500 g; 250 g", null)).containsExactly(0.25, 1.5, 2.0);
  }

  @Test
  void aFileMayHoldCommentsAndSeveralWeightsPerLine(@TempDir Path tmp) throws Exception {
    Path f = tmp.resolve("weights.txt");
    Files.writeString(f, "# the workshop's steel set\n5 kg, 10 kg\n\n20 kg  # two 10 kg\n");
    assertThat(LoadList.parse(null, f)).containsExactly(5.0, 10.0, 20.0);
  }

  @Test
  void zeroNeitherOrBothAndAMissingFileAreRefused(@TempDir Path tmp) {
    assertThatThrownBy(() -> LoadList.parse("0 kg, 1 kg", null))
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("zero point is always read");
    assertThatThrownBy(() -> LoadList.parse(null, null))
        .hasMessageContaining("no weights given");
    assertThatThrownBy(() -> LoadList.parse("1 kg", tmp.resolve("w.txt")))
        .hasMessageContaining("both given");
    assertThatThrownBy(() -> LoadList.parse(null, tmp.resolve("w.txt")))
        .hasMessageContaining("w.txt does not exist");
    assertThatThrownBy(() -> LoadList.parse(" , ", null))
        .hasMessageContaining("lists no weights");
  }
}
