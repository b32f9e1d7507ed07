package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.archive.RunData;
import org.loadstone.archive.TestRuns;
import org.loadstone.report.CsvExport;

class CrushOptionsTest {
  @TempDir Path dir;

  @Test
  void analyzeTakesTheCrushFiguresOverTheChosenStroke() throws Exception {
    RunData d = TestRuns.bend(60, 460);
    Path csv = dir.resolve("CR-1.csv");
    CsvExport.write(d, csv, ',', '.');
    // by hand over the same samples: the trapezoid area of force over forward displacement
    // between 1 and 5 mm, over the 4 mm stroke (mean crush force, common practice)
    double[] x = d.position_mm();
    double[] f = d.force_N();
    double area = 0;
    for (int i = 1; i < x.length; i++) {
      double lo = Math.max(x[i - 1] - x[0], 1);
      double hi = Math.min(x[i] - x[0], 5);
      if (x[i] > x[i - 1] && hi > lo) {
        double slope = (f[i] - f[i - 1]) / (x[i] - x[i - 1]);
        double flo = f[i - 1] + slope * (lo - (x[i - 1] - x[0]));
        double fhi = f[i - 1] + slope * (hi - (x[i - 1] - x[0]));
        area += 0.5 * (flo + fhi) * (hi - lo);
      }
    }
    CliRun r = CliRun.run("", "analyze", csv.toString(), "--crush-from-mm", "1",
        "--crush-to-mm", "5", "--json");
    assertThat(r.exit()).as(r.toString()).isZero();
    JsonNode j = r.lastJson();
    assertThat(j.get("mean_crush_force_N").asDouble()).isCloseTo(area / 4, within(1e-6));
    assertThat(j.get("crush_energy_J").asDouble()).isCloseTo(area / 1000, within(1e-9));
    assertThat(j.get("crush_force_efficiency").asDouble())
        .isCloseTo(area / 4 / 460, within(1e-6));
    assertThat(j.get("analysis_settings").get("crush_stroke").asText())
        .isEqualTo("1.000 to 5.000 mm");
    assertThat(r.err()).contains("mean crush force").contains("crush-force efficiency");
  }

  @Test
  void aStrokeLongerThanTheRunIsRefusedNamingTheFigureAndTheFix() {
    Path csv = dir.resolve("CR-2.csv");
    RunData d = TestRuns.bend(60, 460);
    CsvExport.write(d, csv, ',', '.');
    CliRun r = CliRun.run("", "analyze", csv.toString(), "--crush-to-mm", "500");
    assertThat(r.exit()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(r.err()).contains("crush stroke 0.000 to 500.0 mm for the mean crush force")
        .contains("run is shorter than the stroke").contains("ends at or before");
    CliRun backwards = CliRun.run("", "analyze", csv.toString(), "--crush-from-mm", "3",
        "--crush-to-mm", "2");
    assertThat(backwards.exit()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(backwards.err()).contains("Crush stroke").contains("0 ≤ from < to");
  }
}
