package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.apache.commons.math3.stat.regression.SimpleRegression;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.calibration.CalibrationReport;
import org.loadstone.calibration.CalibrationService;
import org.loadstone.calibration.CalibrationSettings;
import org.loadstone.calibration.ForceFromMass;

/** {@code loadstone calibrate --from}: the offline fit of a points file, and its bad inputs. */
class CalibrateOfflineCommandTest {
  static final Path DIR = Path.of(System.getProperty("loadstone.projectDir", "."), "calibration");
  static final Path POINTS = DIR.resolve("shelf-rig-500N-2026-12-02.points.csv");
  static final Path EXAMPLE_CAL = DIR.resolve("shelf-rig-500N-2026-12-02.json");
  static final String[] SITE = {"--latitude-deg", "48", "--elevation-m", "300", "--full-scale-n",
      "500"};

  private static String[] args(String... extra) {
    String[] base = {"calibrate", "--points", POINTS.toString(), "--cell", "shelf-rig-500N"};
    String[] all = new String[base.length + SITE.length + extra.length];
    System.arraycopy(base, 0, all, 0, base.length);
    System.arraycopy(SITE, 0, all, base.length, SITE.length);
    System.arraycopy(extra, 0, all, base.length + SITE.length, extra.length);
    return all;
  }

  @Test
  void exampleFitPrintsTheTableAndEndsWithTheServiceSummaryAsJson() throws Exception {
    CliRun r = CliRun.run("", args("--json"));
    assertThat(r.exit()).as(r.toString()).isZero();
    assertThat(r.err()).contains("Residuals of quadratic", "ASTM E74 style", "ISO 7500-1 style",
        "Corrections at 50.0000 kg: gravity", "buoyancy",
        "not a substitute for an accredited calibration");
    JsonNode j = r.lastJson();
    for (String key : List.of("degree", "coefficients", "sensitivity_counts_per_N",
        "residual_sd_N", "nonlinearity_pct_fs", "llf_N", "class_a_lower_limit_N",
        "iso7500_class")) {
      assertThat(j.has(key)).as(key).isTrue();
    }
    // the same numbers as the service gives for the same points and settings
    CalibrationReport rep = CalibrationService.fitFromCsv(POINTS,
        new CalibrationSettings(ForceFromMass.atSite(48, 300), 500.0, null));
    JsonNode expected = new ObjectMapper().valueToTree(CalibrationService.summary(rep));
    // (the summary's one remark is the command's notes array: notes are always an array)
    expected.fieldNames().forEachRemaining(k -> assertThat(k.equals("note")
        ? j.get("notes").get(0) : j.get(k)).as(k).isEqualTo(expected.get(k)));
    // and as the calibration shipped with the example (made from these points at 48°, 300 m)
    JsonNode shipped = new ObjectMapper().readTree(EXAMPLE_CAL.toFile()).get("summary");
    assertThat(j.get("degree").asInt()).isEqualTo(shipped.get("degree").asInt());
    assertThat(j.get("iso7500_class").asText()).isEqualTo(shipped.get("iso7500_class").asText());
    assertThat(j.get("sensitivity_counts_per_N").asDouble()).isCloseTo(
        shipped.get("sensitivity_counts_per_N").asDouble(), within(1e-9));
    assertThat(j.get("llf_N").asDouble()).isCloseTo(shipped.get("llf_N").asDouble(),
        within(1e-12));
  }

  @Test
  void sensitivityIsTheLeastSquaresSlopeOfTheAscendingPoints() throws Exception {
    JsonNode j = CliRun.run("", args("--json")).lastJson();
    double g = new ObjectMapper().readTree(EXAMPLE_CAL.toFile()).get("force_model")
        .get("g_m_per_s2").asDouble();
    // force of a dead weight F = m·g·(1 − ρ_air/ρ_weight), conventional densities 1.2 and
    // 8000 kg/m³ (OIML R 111-1); reference slope from Commons Math SimpleRegression
    SimpleRegression reg = new SimpleRegression(true);
    Map<Integer, Double> zero = new HashMap<>();
    for (String line : Files.readAllLines(POINTS, StandardCharsets.UTF_8)) {
      String[] f = line.split(",");
      if (line.startsWith("#") || f[0].equals("mass_g") || !f[2].equals("up")) {
        continue;
      }
      int series = Integer.parseInt(f[3]);
      double counts = Double.parseDouble(f[1]);
      zero.putIfAbsent(series, counts);
      reg.addData(Double.parseDouble(f[0]) / 1000 * g * (1 - 1.2 / 8000),
          counts - zero.get(series));
    }
    assertThat(j.get("sensitivity_counts_per_N").asDouble())
        .isCloseTo(reg.getSlope(), within(1e-9 * reg.getSlope()));
    // (g − 9.80665)/9.80665, the standard gravity of the CGPM (1901)
    assertThat(j.get("gravity_correction_relative").asDouble())
        .isCloseTo((g - 9.80665) / 9.80665, within(1e-15));
    assertThat(j.get("buoyancy_correction_relative").asDouble())
        .isCloseTo(-1.2 / 8000, within(1e-15));
  }

  @Test
  void chosenFitIsAdoptedAndLinearZeroIsAccepted() throws Exception {
    JsonNode q = CliRun.run("", args("--fit", "quadratic", "--json")).lastJson();
    assertThat(q.get("degree").asInt()).isEqualTo(2);
    assertThat(q.get("coefficients").size()).isEqualTo(3);
    JsonNode z = CliRun.run("", args("--fit", "linear-zero", "--json")).lastJson();
    assertThat(z.get("fit").asText()).isEqualTo("linear-through-zero");
    assertThat(z.get("coefficients").get(0).asDouble()).isZero();
  }

  @Test
  void savesOnceAndNeverOverwrites(@TempDir Path tmp) throws Exception {
    CliRun first = CliRun.run("", args("--out", tmp.toString(), "--id", "cal-a",
        "--operator", "tester", "--json"));
    assertThat(first.exit()).as(first.toString()).isZero();
    Path saved = tmp.resolve("cal-a.json");
    assertThat(first.lastJson().get("calibration_file").asText()).isEqualTo(saved.toString());
    byte[] before = Files.readAllBytes(saved);
    assertThat(new String(before, StandardCharsets.UTF_8)).contains("\"operator\" : \"tester\"",
        "\"cell_id\" : \"shelf-rig-500N\"");

    CliRun again = CliRun.run("", args("--out", tmp.toString(), "--id", "cal-a",
        "--operator", "someone else", "--fit", "cubic"));
    assertThat(again.exit()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(again.err()).contains(saved.toString(), "never overwritten", "'cal-a-2'");
    assertThat(Files.readAllBytes(saved)).isEqualTo(before);
  }

  @Test
  void badPointsFilesExitWithTwoAndNameFileLineAndColumn(@TempDir Path tmp) throws Exception {
    expectBad(tmp, "mass_g,counts\n0,100\nfive,200\n2000,300\n", "line 3", "column 'mass_g'",
        "'five' is not a number");
    expectBad(tmp, "mass_g,counts\n0,100\n-500,200\n2000,300\n", "line 3", "is negative");
    expectBad(tmp, "mass_g,counts\n0,100\n1000,200\n1000,201\n2000,300\n", "line 4",
        "appears twice");
    expectBad(tmp, "mass_g,counts\n0,100\n1000,8700\n", "fewer points than the fit needs",
        "at least 3");
  }

  @Test
  void aFitNeedingMorePointsThanGivenIsRefused(@TempDir Path tmp) throws Exception {
    Path csv = tmp.resolve("three.csv");
    Files.writeString(csv, "mass_g,counts\n0,100\n1000,8700\n2000,17300\n");
    CliRun r = CliRun.run("", "calibrate", "--points", csv.toString(), "--cell", "c1", "--fit",
        "cubic", "--out", tmp.toString());
    assertThat(r.exit()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    // four coefficients and one degree of freedom left for the residual SD
    assertThat(r.err()).contains("cubic", "needs at least 5 distinct ascending loads, there are 3");
    assertThat(tmp.resolve("c1-" + java.time.LocalDate.now() + ".json")).doesNotExist();
  }

  @Test
  void conflictingOptionsAreRefused() {
    CliRun both = CliRun.run("", args("--gravity-m-per-s2", "9.81"));
    assertThat(both.exit()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(both.err()).contains("--gravity-m-per-s2 and --latitude-deg/--elevation-m both given");
    CliRun live = CliRun.run("", args("--loads", "1 kg, 2 kg"));
    assertThat(live.exit()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(live.err()).contains("--loads", "cannot be used with it");
    CliRun fit = CliRun.run("", args("--fit", "spline"));
    assertThat(fit.err()).contains("--fit 'spline' is not known");
  }

  private static void expectBad(Path tmp, String csvText, String... message) throws Exception {
    Path csv = Files.createTempFile(tmp, "points", ".csv");
    Files.writeString(csv, csvText);
    Path save = tmp.resolve("out");
    CliRun r = CliRun.run("", "calibrate", "--points", csv.toString(), "--cell", "c1",
        "--out", save.toString(), "--id", "x");
    assertThat(r.exit()).as(r.toString()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(r.err()).contains(message);
    if (!message[0].startsWith("fewer")) {
      assertThat(r.err()).contains(csv.toString());
    }
    assertThat(save.resolve("x.json")).doesNotExist();
  }
}
