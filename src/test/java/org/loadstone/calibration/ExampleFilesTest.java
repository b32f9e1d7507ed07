package org.loadstone.calibration;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The example files in calibration/ are loadable and agree with the code that reads them. */
class ExampleFilesTest {
  static final Path DIR = Path.of(System.getProperty("loadstone.projectDir", "."), "calibration");

  @Test
  void profileLoadsAndItsNominalSensitivityIsTheHx711Arithmetic() {
    LoadCellProfile p = CalibrationFiles.readProfile(DIR.resolve("cells/shelf-rig-500N.json"));
    assertThat(p).isEqualTo(ExampleCellModel.profile());
    // 2 mV/V at rated 500 N; HX711 gain 128 spans ±AVDD/256 over ±2^23 counts (data sheet,
    // from memory): 0.002 × 256 × 8388608 / 500 N = 8589.934592 counts/N
    assertThat(p.nominalCounts_per_N()).isCloseTo(8589.934592, within(1e-6));
  }

  @Test
  void pointsFileIsWhatTheModelMakesAndRefitsToTheStoredCalibration() throws Exception {
    Path csv = DIR.resolve(ExampleCellModel.CAL_ID + ".points.csv");
    assertThat(Files.readString(csv, StandardCharsets.UTF_8)).isEqualTo(ExampleCellModel.pointsCsv());
    Path calFile = CalibrationFiles.fileFor(DIR, ExampleCellModel.CAL_ID);
    CalibrationStatus st = CalibrationStatus.check(calFile, null, LocalDate.of(2027, 6, 1));
    assertThat(st.warning()).isEmpty();
    CalibrationDocument cal = st.document();
    CalibrationReport r = CalibrationService.fitFromCsv(csv,
        new CalibrationSettings(cal.forceModel(), cal.fullScale_N(), null));
    assertThat(r.chosen()).isEqualTo(cal.fit().kind());
    List<Double> c = r.chosenFit().countsOfForce().coefficientList();
    for (int k = 0; k < c.size(); k++) {
      assertThat(c.get(k)).isCloseTo(cal.fit().coefficients().get(k),
          within(1e-9 * Math.abs(cal.fit().coefficients().get(k))));
    }
    assertThat(CalibrationService.summary(r).get("iso7500_class"))
        .isEqualTo(cal.summary().get("iso7500_class"));
    // the modelled sensitivity is 0.12 % above nominal and the site's g is above standard
    assertThat(r.linearity().sensitivity_counts_per_N() / ExampleCellModel.NOMINAL_COUNTS_PER_N)
        .isCloseTo(1.0012, within(0.001));
  }
}
