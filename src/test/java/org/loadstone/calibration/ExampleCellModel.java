package org.loadstone.calibration;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.Locale;
import java.util.Random;

/**
 * A simple deterministic model of the demo workshop's 500 N S-beam cell on an HX711, used to make
 * the example files in {@code calibration/} (run {@link #main} from the project folder; it refuses
 * to overwrite). Not a simulator of the device: just a few lines of physics with seeded noise.
 *
 * <p>Sensitivity: a 2 mV/V bridge excited at 5 V gives 10 mV at its rated 500 N. The HX711 at
 * gain 128, with the bridge excited from its own analog supply AVDD = 5 V, spans ±0.5·AVDD/128 =
 * ±19.53 mV over ±2²³ counts (HX711 data sheet, "input differential range"; from memory). So
 * counts = (2 mV/V × F/500 N) × 256 × 2²³, i.e. 0.002 × 256 × 8388608 / 500 = 8589.934592 counts
 * per N nominal. The modelled cell reads 0.12 % above nominal, bows by −0.03 % FS at mid-range,
 * shows 0.02 % FS hysteresis on the way down, and its zero creeps 35 counts per series. Each
 * reading is the mean of 50 samples of 25-count RMS noise (a typical HX711 at 10 samples/s).
 */
final class ExampleCellModel {
  static final double RATED_N = 500;
  static final double NOMINAL_COUNTS_PER_N = 0.002 * 256 * 8388608 / RATED_N;
  static final double[] MASSES_G = {0, 5000, 10000, 20000, 30000, 40000, 50000};
  /** The demo workshop's site: 48.0° N, 300 m above sea level. */
  static final ForceFromMass SITE = ForceFromMass.atSite(48.0, 300);
  static final String CELL_ID = "shelf-rig-500N";
  static final String CAL_ID = "shelf-rig-500N-2026-12-02";

  private ExampleCellModel() {}

  static String pointsCsv() {
    Random rnd = new Random(500);
    double fsCounts = RATED_N * NOMINAL_COUNTS_PER_N * 1.0012;
    StringBuilder sb = new StringBuilder();
    sb.append("# Example calibration points of the 500 N S-beam cell of the shelf-panel rig.\n");
    sb.append("# Made with a simple model of the cell (ExampleCellModel), not measured.\n");
    sb.append("mass_g,counts,direction,series,counts_sd,samples\n");
    for (int s = 1; s <= 3; s++) {
      double zero = 84210 + 35 * (s - 1);
      for (int dir = 0; dir < 2; dir++) {
        for (int k = 0; k < MASSES_G.length; k++) {
          int i = dir == 0 ? k : MASSES_G.length - 1 - k;
          double f = SITE.force_N(MASSES_G[i] / 1000.0);
          double u = f / RATED_N;
          double c = zero + fsCounts * u - 0.0003 * fsCounts * 4 * u * (1 - u);
          if (dir == 1) {
            c += 0.0002 * fsCounts * (i == 0 ? 0.25 : 4 * u * (1 - u) + 0.25);
          }
          double sd = 25 * (1 + 0.1 * rnd.nextGaussian());
          c += sd / Math.sqrt(50) * rnd.nextGaussian();
          sb.append(String.format(Locale.ROOT, "%.0f,%.1f,%s,%d,%.1f,50%n", MASSES_G[i], c,
              dir == 0 ? "up" : "down", s, sd));
        }
      }
    }
    return sb.toString();
  }

  static CalibrationSettings settings() {
    return new CalibrationSettings(SITE, RATED_N, null);
  }

  static LoadCellProfile profile() {
    return new LoadCellProfile(CELL_ID, "Invented 500 N S-beam cell, 2 mV/V, on an HX711 at gain"
        + " 128 and 5 V excitation, for the shelf-panel three-point bending rig of the demo"
        + " workshop", RATED_N, "DEMO-0001", NOMINAL_COUNTS_PER_N);
  }

  static String description() {
    return "Example made with a simple model of the cell (ExampleCellModel), not a real"
        + " calibration: weights 5 to 50 kg, three series up and down, site 48.0° N, 300 m";
  }

  public static void main(String[] args) throws IOException {
    Path dir = Path.of(args.length > 0 ? args[0] : "calibration");
    Files.createDirectories(dir.resolve("cells"));
    CalibrationFiles.saveProfile(dir.resolve("cells"), profile());
    Path csv = dir.resolve(CAL_ID + ".points.csv");
    if (Files.exists(csv)) {
      throw new IOException(csv + " exists; not overwritten");
    }
    Files.writeString(csv, pointsCsv(), StandardCharsets.UTF_8);
    CalibrationReport r = CalibrationService.fitFromCsv(csv, settings());
    CalibrationDocument d = CalibrationDocument.of(r, CAL_ID, LocalDate.of(2026, 12, 2),
        "demo operator", CELL_ID, LocalDate.of(2027, 12, 1), description());
    CalibrationFiles.saveCalibration(dir, d);
    System.out.print(FitTable.format(r));
  }
}
