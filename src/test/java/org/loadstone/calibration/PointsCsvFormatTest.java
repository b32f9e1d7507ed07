package org.loadstone.calibration;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.StringReader;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;

/** {@link PointsCsv#format} writes what {@link PointsCsv#read} takes back unchanged. */
class PointsCsvFormatTest {
  static final Path POINTS = Path.of(System.getProperty("loadstone.projectDir", "."),
      "calibration", "shelf-rig-500N-2026-12-02.points.csv");

  @Test
  void theShippedExamplePointsSurviveAWriteAndReadBack() throws Exception {
    ForceFromMass model = ForceFromMass.atSite(48, 300);
    List<CalibrationPoint> original = PointsCsv.read(POINTS, model);
    String text = PointsCsv.format(original, "round trip\nsecond line");
    assertThat(text).startsWith("# round trip\n# second line\nmass_g,counts,direction,series,");
    List<CalibrationPoint> back = PointsCsv.read(new StringReader(text), "memory", model);
    assertThat(back).isEqualTo(original);
  }

  @Test
  void pointsWithoutAMassAreWrittenAsForces() throws Exception {
    List<CalibrationPoint> pts = List.of(
        CalibrationPoint.ofForce(0, Direction.UP, 1, new CapturedReading(100.5, 2, 40)),
        CalibrationPoint.ofForce(12.5, Direction.UP, 1, new CapturedReading(1100.25, 3, 40)));
    String text = PointsCsv.format(pts, null);
    assertThat(text).startsWith("force_N,counts,");
    assertThat(PointsCsv.read(new StringReader(text), "memory", ForceFromMass.standard()))
        .isEqualTo(pts);
  }
}
