package org.loadstone.acquire;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.loadstone.archive.ScaleSpec;
import org.loadstone.calibration.CalibrationDocument;
import org.loadstone.calibration.CalibrationFiles;
import org.loadstone.calibration.CalibrationStatus;
import org.loadstone.calibration.CellMatch;
import org.loadstone.calibration.CheckWeightResult;
import org.loadstone.calibration.CheckWeights;
import org.loadstone.calibration.LoadCellProfile;
import org.loadstone.protocol.DeviceMessage;
import org.loadstone.units.LoadstoneException;

/**
 * How counts become force for a run, and what must be said about it before the run starts: a
 * calibration file (checked for expiry and integrity, with its last check-weight result) or a
 * nominal data-sheet sensitivity (always with a warning).
 *
 * @param scale counts above zero → N
 * @param spec the same, stored with the run so force can be derived again
 * @param description in words
 * @param calibrationId the calibration's id, or null
 * @param calibrationSha256 its content hash, or null
 * @param warnings to show before the run and store with it
 * @param checkWeight the last check-weight result of the calibration, or null
 * @param ratedCapacity_N the cell's rated capacity from its profile, or null when unknown
 * @param calibratedCell what the calibration says about its cell, or null without a calibration
 */
public record ScaleChoice(ForceScale scale, ScaleSpec spec, String description,
    String calibrationId, String calibrationSha256, List<String> warnings,
    Map<String, Object> checkWeight, Double ratedCapacity_N,
    CellMatch.CalibratedCell calibratedCell) {

  /**
   * This choice checked against the connected device's load cell ({@link CellMatch}): the
   * mismatches come first among the warnings, so they are shown before the run and stored with
   * it.
   *
   * @param identity what the device said about itself, if anything
   * @return this choice when nothing disagrees, else a copy with the mismatches added
   */
  public ScaleChoice forDevice(Optional<DeviceMessage.Identity> identity) {
    if (calibratedCell == null || identity.isEmpty()) {
      return this;
    }
    DeviceMessage.Identity id = identity.get();
    List<String> found = CellMatch.check(calibratedCell, new CellMatch.ConnectedCell(
        id.cellId(), id.cellCapacity_N(), id.cellCountsPerN()));
    if (found.isEmpty()) {
      return this;
    }
    List<String> all = new ArrayList<>(found);
    for (String w : warnings) {
      if (!all.contains(w)) {
        all.add(w);
      }
    }
    return new ScaleChoice(scale, spec, description, calibrationId, calibrationSha256,
        List.copyOf(all), checkWeight, ratedCapacity_N, calibratedCell);
  }

  /** A data-sheet sensitivity, with the warning that the run is not calibrated. */
  public static ScaleChoice nominal(double countsPerN, String source, Double capacity_N) {
    String d = String.format(Locale.ROOT, "nominal %.6g counts/N (%s)", countsPerN, source);
    ScaleSpec spec = ScaleSpec.nominal(countsPerN);
    return new ScaleChoice(ForceScale.of(spec, d), spec, d,
        null, null, List.of("no calibration: force uses the " + source + " sensitivity "
            + String.format(Locale.ROOT, "%.6g", countsPerN) + " counts/N, so forces are rough "
            + "estimates; calibrate the cell with known weights and use that calibration"), null,
        capacity_N, null);
  }

  /**
   * Loads a calibration for a run, refusing one changed since it was saved (the one rule of
   * {@link CalibrationStatus#refuseChanged}, for {@code record}, {@code analyze} and the
   * console alike).
   *
   * @param file the calibration JSON
   * @param today for the expiry check
   * @throws LoadstoneException when the file is missing, unreadable, damaged or changed since it
   *     was saved (naming the file and the fix)
   */
  public static ScaleChoice fromCalibration(Path file, LocalDate today) {
    return fromCalibration(file, today, false);
  }

  /**
   * Loads a calibration, refusing one changed since it was saved unless accepted
   * ({@link CalibrationStatus#refuseChanged}); accepted, its warning is among the warnings.
   *
   * @param file the calibration JSON
   * @param today for the expiry check
   * @param acceptChanged whether a calibration whose content no longer matches its hash may be
   *     used
   * @throws LoadstoneException when the file is missing, unreadable or damaged, or changed and
   *     not accepted
   */
  public static ScaleChoice fromCalibration(Path file, LocalDate today, boolean acceptChanged) {
    CalibrationStatus st = CalibrationStatus.check(file, null, today);
    st.refuseChanged(acceptChanged);
    if (st.document() == null) {
      throw new LoadstoneException(st.warning());
    }
    List<String> warnings = new ArrayList<>();
    if (!st.ok()) {
      warnings.add(st.warning());
    }
    CalibrationDocument doc = st.document();
    ScaleSpec spec = new ScaleSpec("calibration", doc.fit().coefficients(),
        doc.fit().minForce_N(), doc.fit().maxForce_N());
    ForceScale scale = ForceScale.of(spec,
        "calibration " + doc.id() + " (" + doc.fit().kind().label() + ")");
    Map<String, Object> check = null;
    java.util.Optional<CheckWeightResult> lastCheck = CheckWeights.lastCheck(file);
    if (lastCheck.isEmpty()) {
      warnings.add("calibration " + doc.id() + " has no check-weight verification yet: "
          + "verify it with a known check weight before a day of testing");
    } else {
      CheckWeightResult last = lastCheck.get();
      @SuppressWarnings("unchecked")
      Map<String, Object> m = new ObjectMapper().convertValue(last, Map.class);
      check = m;
      if (!last.pass()) {
        warnings.add("the last check-weight verification of " + doc.id() + " (" + last.time()
            + ") FAILED: " + String.format(Locale.ROOT, "%.2f %%", last.error_pct())
            + " error; recalibrate before trusting forces");
      }
    }
    Double capacity = null;
    LoadCellProfile p = null;
    Path profile = file.toAbsolutePath().getParent().resolve("cells")
        .resolve(doc.cellId() + ".json");
    if (Files.exists(profile)) {
      p = CalibrationFiles.readProfile(profile);
      capacity = p.ratedCapacity_N();
    }
    return new ScaleChoice(scale, spec, scale.describe(), doc.id(), doc.contentSha256(),
        List.copyOf(warnings), check, capacity, CellMatch.CalibratedCell.of(doc, p));
  }
}
