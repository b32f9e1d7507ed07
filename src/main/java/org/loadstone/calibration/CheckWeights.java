package org.loadstone.calibration;

import com.fasterxml.jackson.core.JsonProcessingException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.loadstone.units.InputException;
import org.loadstone.units.JsonInput;
import org.loadstone.files.FileLog;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.TextFiles;
import org.loadstone.units.Precondition;

/**
 * Check-weight verification: a known weight is placed, the reading is compared with its force.
 *
 * <p>The default acceptance, ±1 % of reading, is the usual one for the verification of the force
 * of testing machines (ASTM E4, "permissible variation" of ±1.0 %; from memory). Results are
 * appended as one JSON object per line to {@code <id>.checks.jsonl} beside the calibration file;
 * the log is only ever appended to.
 */
public final class CheckWeights {
  /** Default tolerance, % of reading. */
  public static final double DEFAULT_TOLERANCE_PCT = 1.0;

  private CheckWeights() {}

  /**
   * @param cal the calibration in use
   * @param mass_kg conventional mass of the check weight, > 0
   * @param netCounts reading minus the zero reading taken just before placing the weight
   * @param tolerance_pct accepted |error| in % of reading, > 0
   * @param time when the reading was taken
   * @throws LoadstoneException when the mass is not positive
   */
  public static CheckWeightResult verify(CalibrationDocument cal, double mass_kg,
      double netCounts, double tolerance_pct, Instant time) {
    Precondition.notNull(cal, "cal");
    Precondition.notNull(time, "time");
    Precondition.positive(tolerance_pct, "tolerance_pct");
    if (!(mass_kg > 0 && Double.isFinite(mass_kg))) {
      throw new LoadstoneException("check weight mass " + mass_kg + " kg is invalid: place a"
          + " weight and enter its mass (> 0)");
    }
    double expected = cal.forceModel().force_N(mass_kg);
    double indicated = cal.fit().inverse().force_N(netCounts);
    double err = 100 * (indicated - expected) / expected;
    return new CheckWeightResult(time.toString(), cal.id(), cal.contentSha256(), mass_kg,
        expected, indicated, err, tolerance_pct, Math.abs(err) <= tolerance_pct, false);
  }

  /**
   * @return the last check of the real cell in the log beside {@code calibrationFile}
   *     (rehearsals on the simulated frame are not checks), empty if none
   * @throws LoadstoneException naming the file and line of a bad entry
   */
  public static java.util.Optional<CheckWeightResult> lastCheck(Path calibrationFile) {
    List<CheckWeightResult> real = readLog(calibrationFile).stream()
        .filter(r -> !r.rehearsal()).toList();
    return real.isEmpty() ? java.util.Optional.empty()
        : java.util.Optional.of(real.get(real.size() - 1));
  }

  /** @return the log file beside {@code calibrationFile}: {@code <id>.checks.jsonl} */
  public static Path logFile(Path calibrationFile) {
    String name = calibrationFile.getFileName().toString().replaceFirst("\\.json$", "");
    return calibrationFile.resolveSibling(name + ".checks.jsonl");
  }

  /**
   * Appends {@code result} as one line to the log beside {@code calibrationFile}.
   *
   * @throws LoadstoneException when the log cannot be written
   */
  public static void append(Path calibrationFile, CheckWeightResult result) {
    String line;
    try {
      line = CalibrationFiles.COMPACT_LINE.writeValueAsString(result) + "\n";
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("cannot serialise a check-weight result", e);
    }
    FileLog.append(logFile(calibrationFile), "check-weight log",
        line.getBytes(StandardCharsets.UTF_8));
  }

  /**
   * @return all results in the log beside {@code calibrationFile}, oldest first; empty if none
   * @throws LoadstoneException naming the file and line of a bad entry
   */
  public static List<CheckWeightResult> readLog(Path calibrationFile) {
    Path log = logFile(calibrationFile);
    List<CheckWeightResult> out = new ArrayList<>();
    if (!Files.exists(log)) {
      return out;
    }
    List<String> lines = TextFiles.read(log, "check-weight log").lines().toList();
    for (int i = 0; i < lines.size(); i++) {
      if (lines.get(i).isBlank()) {
        continue;
      }
      try {
        out.add(CalibrationFiles.MAPPER.readValue(lines.get(i), CheckWeightResult.class));
      } catch (JsonProcessingException e) {
        throw JsonInput.translate(e, InputException.in("check-weight log", log).line(i + 1),
            "remove or correct that line (each line is one check)");
      }
    }
    return out;
  }
}
