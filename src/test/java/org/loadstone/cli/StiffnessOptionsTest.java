package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.archive.TestRuns;
import org.loadstone.report.CsvExport;

class StiffnessOptionsTest {
  @TempDir Path dir;
  @Test
  void analyzeTakesABandOfThePeakAndRecordsTheChoice() throws Exception {
    Path csv = dir.resolve("FO-3.csv");
    CsvExport.write(TestRuns.bend(60, 460), csv, ',', '.');
    CliRun band = CliRun.run("", "analyze", csv.toString(), "--stiffness-band-pct", "10,40",
        "--json");
    assertThat(band.exit()).as(band.toString()).isEqualTo(0);
    JsonNode j = band.lastJson();
    // the synthetic run rises at 60 N/mm by construction
    assertThat(j.get("stiffness_N_per_mm").asDouble()).isCloseTo(60.0, within(0.6));
    assertThat(j.get("stiffness_method").asText()).isEqualTo("fraction-of-peak band");
    assertThat(j.get("stiffness_window_from_N").asDouble()).isCloseTo(46, within(3.0));
    assertThat(j.get("analysis_settings").get("stiffness_band").asText())
        .isEqualTo("10 to 40 % of the peak");
    assertThat(band.err()).contains("stiffness chosen by");

    CliRun auto = CliRun.run("", "analyze", csv.toString(), "--json");
    assertThat(auto.exit()).as(auto.toString()).isEqualTo(0);
    j = auto.lastJson();
    assertThat(j.get("stiffness_method").asText()).isEqualTo("automatic");
    assertThat(j.get("stiffness_ci95_low_N_per_mm").asDouble())
        .isLessThan(j.get("stiffness_N_per_mm").asDouble());
    assertThat(j.get("analysis_settings").get("stiffness_precision_95").asDouble())
        .isEqualTo(0.03);
  }

  @Test
  void twoBandsOrABandOutsideTheCurveAreRefused() {
    Path csv = dir.resolve("FO-4.csv");
    CsvExport.write(TestRuns.bend(60, 460), csv, ',', '.');
    CliRun two = CliRun.run("", "analyze", csv.toString(), "--stiffness-band-pct", "10,40",
        "--stiffness-from-mm", "0.1", "--stiffness-to-mm", "0.5");
    assertThat(two.exit()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(two.err()).contains("Give one stiffness band");
    CliRun outside = CliRun.run("", "analyze", csv.toString(), "--stiffness-from-n", "400",
        "--stiffness-to-n", "900");
    assertThat(outside.exit()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(outside.err()).contains("outside the curve").contains("peak force 460");
  }
}
