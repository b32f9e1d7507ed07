package org.loadstone.calibration;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.Size;
import net.jqwik.api.lifecycle.AfterContainer;
import net.jqwik.api.lifecycle.BeforeContainer;
import org.loadstone.units.Fuzz;

/**
 * Fuzzing of the calibration readers with damaged copies of the calibration folder's own files
 * (a calibration, its cell profile, its points, a check-weight log) and random bytes: each gives
 * a usable result or the project's own exception with a plain message. A calibration that is
 * read is then used (status check, force of a reading, a fit of the points read), since a file
 * that reads but breaks its user is no better.
 */
class CalibrationReadersFuzzTest {
  private static final Path CAL = Path.of("calibration/shelf-rig-1kN-2026-12-03.json");

  private static Path dir;
  private static byte[] calibration;
  private static byte[] profile;
  private static byte[] points;
  private static byte[] checkLog;

  @BeforeContainer
  static void corpus() throws Exception {
    dir = Fuzz.tempDir("calibration");
    calibration = Files.readAllBytes(CAL);
    profile = Files.readAllBytes(Path.of("calibration/cells/shelf-rig-1kN.json"));
    points = Files.readAllBytes(Path.of("calibration/shelf-rig-1kN-2026-12-03.points.csv"));
    Path cal = Files.write(dir.resolve("log-source.json"), calibration);
    CalibrationDocument doc = CalibrationFiles.readCalibration(cal);
    for (int i = 1; i <= 3; i++) {
      CheckWeights.append(cal, CheckWeights.verify(doc, 20.0 * i, 86_000.0 * i, 1.0,
          Instant.parse("2026-12-03T10:00:00Z").plusSeconds(3600L * i)));
    }
    checkLog = Files.readAllBytes(CheckWeights.logFile(cal));
  }

  @AfterContainer
  static void clean() {
    Fuzz.delete(dir);
  }

  @Property(tries = 200, seed = "140611")
  void calibrationFileReadsIntoAUsableCalibrationOrIsRefused(@ForAll long seed) {
    Fuzz.eachCopy(calibration, seed, dir.resolve("cal.json"), f -> {
      CalibrationDocument d = Fuzz.readOrRefuse(() -> CalibrationFiles.readCalibration(f));
      if (d != null) {
        CalibrationStatus st = CalibrationStatus.check(f, null, LocalDate.of(2026, 12, 4));
        assertThat(st.state()).isNotEqualTo(CalibrationStatus.State.UNREADABLE);
        Fuzz.readOrRefuse(() -> CalibrationFiles.contentSha256(d));
        Fuzz.readOrRefuse(() -> d.fit().inverse().force_N(400_000));
      }
    });
  }

  @Property(tries = 150, seed = "140612")
  void cellProfileReadsOrIsRefused(@ForAll long seed) {
    Fuzz.eachCopy(profile, seed, dir.resolve("cell.json"), f -> {
      LoadCellProfile p = Fuzz.readOrRefuse(() -> CalibrationFiles.readProfile(f));
      if (p != null) {
        assertThat(p.ratedCapacity_N()).isPositive().isFinite();
      }
    });
  }

  @Property(tries = 200, seed = "140613")
  void pointsReadIntoPointsThatFitOrAreRefused(@ForAll long seed) {
    Fuzz.eachCopy(points, seed, dir.resolve("points.csv"), f -> {
      List<CalibrationPoint> read = Fuzz.readOrRefuse(() -> PointsCsv.read(f,
          ForceFromMass.standard()));
      if (read != null) {
        // the points read are used as calibrate --from uses them: fitted, or refused in words
        Fuzz.readOrRefuse(() -> CalibrationService.fitFromPoints(read,
            CalibrationSettings.defaults()));
      }
    });
  }

  @Property(tries = 150, seed = "140614")
  void checkWeightLogReadsOrIsRefused(@ForAll long seed) {
    for (int k = 0; k < Fuzz.SCALE; k++) {
      Path cal = dir.resolve("checked.json");
      Fuzz.write(CheckWeights.logFile(cal), Fuzz.mutate(checkLog, seed + k));
      List<CheckWeightResult> log = Fuzz.readOrRefuse(() -> CheckWeights.readLog(cal));
      if (log != null) {
        assertThat(log).doesNotContainNull();
      }
    }
  }

  @Property(tries = 60, seed = "140615")
  void randomBytesAreRefusedByEveryCalibrationReader(@ForAll @Size(max = 600) byte[] noise) {
    Path f = Fuzz.write(dir.resolve("noise.json"), noise);
    Path csv = Fuzz.write(dir.resolve("noise.csv"), noise);
    Fuzz.write(CheckWeights.logFile(f), noise);
    Fuzz.readOrRefuse(() -> CalibrationFiles.readCalibration(f));
    Fuzz.readOrRefuse(() -> CalibrationFiles.readProfile(f));
    Fuzz.readOrRefuse(() -> PointsCsv.read(csv, ForceFromMass.standard()));
    Fuzz.readOrRefuse(() -> CheckWeights.readLog(f));
  }
}
