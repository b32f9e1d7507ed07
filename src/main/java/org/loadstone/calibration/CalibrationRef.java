package org.loadstone.calibration;

import com.fasterxml.jackson.annotation.JsonProperty;
import org.loadstone.units.LoadstoneException;

/**
 * How a run refers to the calibration it used: by id and content hash.
 *
 * @param id the calibration id
 * @param sha256 its content hash, 64 lower-case hex digits
 */
public record CalibrationRef(
    @JsonProperty("calibration_id") String id, @JsonProperty("calibration_sha256") String sha256) {
  /** Validates. */
  public CalibrationRef {
    CalibrationDocument.checkId(id, "calibration_id");
    if (sha256 == null || !sha256.matches("[0-9a-f]{64}")) {
      throw new LoadstoneException("field 'calibration_sha256' is '" + sha256 + "': expected 64"
          + " lower-case hex digits (the content hash of the calibration file)");
    }
  }

  /**
   * @param doc a saved document (with its hash)
   * @throws LoadstoneException when the document has no hash yet
   */
  public static CalibrationRef of(CalibrationDocument doc) {
    return new CalibrationRef(doc.id(), doc.contentSha256());
  }
}
