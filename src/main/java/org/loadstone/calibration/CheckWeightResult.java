package org.loadstone.calibration;

import com.fasterxml.jackson.annotation.JsonProperty;

/**
 * One check-weight verification of a calibration.
 *
 * @param time ISO-8601 instant
 * @param calibrationId the calibration checked
 * @param calibrationSha256 its content hash
 * @param mass_kg the check weight's conventional mass
 * @param expected_N force of the weight through the calibration's force model
 * @param indicated_N force the calibration gives for the reading
 * @param error_pct (indicated − expected) / expected × 100
 * @param tolerance_pct accepted |error_pct|
 * @param pass whether |error_pct| ≤ tolerance_pct
 * @param rehearsal true when it was a rehearsal on the simulated frame: logged so, and never
 *     taken as a check of the real cell (absent in older logs: false)
 */
public record CheckWeightResult(
    @JsonProperty("time") String time,
    @JsonProperty("calibration_id") String calibrationId,
    @JsonProperty("calibration_sha256") String calibrationSha256,
    @JsonProperty("mass_kg") double mass_kg,
    @JsonProperty("expected_N") double expected_N,
    @JsonProperty("indicated_N") double indicated_N,
    @JsonProperty("error_pct") double error_pct,
    @JsonProperty("tolerance_pct") double tolerance_pct,
    @JsonProperty("pass") boolean pass,
    @JsonProperty("rehearsal") boolean rehearsal) {

  /** @return the same result marked as a rehearsal on the simulated frame */
  public CheckWeightResult asRehearsal() {
    return new CheckWeightResult(time, calibrationId, calibrationSha256, mass_kg, expected_N,
        indicated_N, error_pct, tolerance_pct, pass, true);
  }
}
