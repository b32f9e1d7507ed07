package org.loadstone.archive;

import java.time.Instant;
import java.util.List;
import java.util.Map;
import org.loadstone.units.Precondition;

/**
 * Everything known about a run besides its samples: the JSON sidecar {@code <run-id>.json}.
 * Field names in the file carry units ({@code mass_g}, {@code sample_rate_hz}, …).
 *
 * @param runId unique, time-sortable id; also the file name stem
 * @param startedAt when recording began (first sample of the pre-trigger history)
 * @param specimen specimen id as the user typed it (file names use a sanitised form)
 * @param group group name for comparisons, may be empty
 * @param tags free tags
 * @param operator who ran it, may be empty
 * @param notes free notes, may be empty
 * @param mass_g specimen mass in g, or null
 * @param geometry specimen geometry
 * @param testType the kind of test
 * @param device device identity fields as sent (proto, fw, adc, rate, ch, cpm, motor, name) plus
 *     {@code port}
 * @param sampleRate_Hz measured sample rate
 * @param calibrationId id of the calibration used, or null when a nominal sensitivity was used
 * @param calibrationSha256 content hash of that calibration, or null
 * @param scale how counts became force, in words (e.g. "linear 8590 counts/N (nominal)")
 * @param scaleSpec how counts became force, machine-readable (see {@link ScaleSpec})
 * @param zeroOffset_counts tare: counts subtracted before scaling
 * @param dropped samples missing from the device sequence during the run
 * @param checksumErrors checksum errors during the run
 * @param cause why it ended
 * @param breakIndex index of the break sample in the run, or null
 * @param breakTime_s time of the break, or null
 * @param peakBeforeBreak_N the running peak when the break was declared, or null
 * @param dropAtBreak_pct how far force had fallen below the peak, % of the peak, or null
 * @param pretrigger_s length of the pre-trigger history kept before the start threshold
 * @param startThreshold_N force that started the run (auto start), or null for a manual start
 * @param checkWeight the last check-weight verification of the calibration, as stored, or null
 * @param warnings warnings given before or during the run (expired calibration, overload warning…)
 * @param softwareVersion Loadstone's version
 * @param extra other fields kept from the file (forward compatibility), may be empty
 */
public record RunMetadata(
    String runId,
    Instant startedAt,
    String specimen,
    String group,
    List<String> tags,
    String operator,
    String notes,
    Double mass_g,
    Geometry geometry,
    TestType testType,
    Map<String, String> device,
    double sampleRate_Hz,
    String calibrationId,
    String calibrationSha256,
    String scale,
    ScaleSpec scaleSpec,
    double zeroOffset_counts,
    long dropped,
    long checksumErrors,
    FinishCause cause,
    Integer breakIndex,
    Double breakTime_s,
    Double peakBeforeBreak_N,
    Double dropAtBreak_pct,
    double pretrigger_s,
    Double startThreshold_N,
    Map<String, Object> checkWeight,
    List<String> warnings,
    String softwareVersion,
    Map<String, Object> extra) {

  public RunMetadata {
    Precondition.notNull(runId, "runId");
    Precondition.notNull(startedAt, "startedAt");
    Precondition.notNull(specimen, "specimen");
    group = group == null ? "" : group;
    tags = tags == null ? List.of() : List.copyOf(tags);
    operator = operator == null ? "" : operator;
    notes = notes == null ? "" : notes;
    geometry = geometry == null ? Geometry.NONE : geometry;
    testType = testType == null ? TestType.THREE_POINT_BEND : testType;
    device = device == null ? Map.of() : Map.copyOf(device);
    Precondition.notNull(scaleSpec, "scaleSpec");
    Precondition.notNull(cause, "cause");
    warnings = warnings == null ? List.of() : List.copyOf(warnings);
    extra = extra == null ? Map.of() : Map.copyOf(extra);
    if (mass_g != null && !(Double.isFinite(mass_g) && mass_g > 0)) {
      throw new org.loadstone.units.LoadstoneException(
          "specimen mass must be a positive number of grams, was " + mass_g);
    }
  }

  /** @return a copy with these warnings instead */
  public RunMetadata withWarnings(List<String> w) {
    return new RunMetadata(runId, startedAt, specimen, group, tags, operator, notes, mass_g,
        geometry, testType, device, sampleRate_Hz, calibrationId, calibrationSha256, scale,
        scaleSpec, zeroOffset_counts, dropped, checksumErrors, cause, breakIndex, breakTime_s,
        peakBeforeBreak_N, dropAtBreak_pct, pretrigger_s, startThreshold_N, checkWeight, w,
        softwareVersion, extra);
  }

  /** @return a copy with another run id, specimen and group (e.g. an imported run) */
  public RunMetadata withIdentity(String newRunId, String newSpecimen, String newGroup) {
    return new RunMetadata(newRunId, startedAt, newSpecimen, newGroup, tags, operator, notes,
        mass_g, geometry, testType, device, sampleRate_Hz, calibrationId, calibrationSha256, scale,
        scaleSpec, zeroOffset_counts, dropped, checksumErrors, cause, breakIndex, breakTime_s,
        peakBeforeBreak_N, dropAtBreak_pct, pretrigger_s, startThreshold_N, checkWeight, warnings,
        softwareVersion, extra);
  }

  /** @return a copy whose force comes from another scale (another calibration) */
  public RunMetadata withScale(String newCalibrationId, String newSha256, String newScale,
      ScaleSpec newSpec) {
    return new RunMetadata(runId, startedAt, specimen, group, tags, operator, notes, mass_g,
        geometry, testType, device, sampleRate_Hz, newCalibrationId, newSha256, newScale, newSpec,
        zeroOffset_counts, dropped, checksumErrors, cause, breakIndex, breakTime_s,
        peakBeforeBreak_N, dropAtBreak_pct, pretrigger_s, startThreshold_N, checkWeight, warnings,
        softwareVersion, extra);
  }

  /** @return a copy with another break sample (null: none) and break time */
  public RunMetadata withBreak(Integer newBreakIndex, Double newBreakTime_s) {
    return new RunMetadata(runId, startedAt, specimen, group, tags, operator, notes, mass_g,
        geometry, testType, device, sampleRate_Hz, calibrationId, calibrationSha256, scale,
        scaleSpec, zeroOffset_counts, dropped, checksumErrors, cause, newBreakIndex,
        newBreakTime_s, peakBeforeBreak_N, dropAtBreak_pct, pretrigger_s, startThreshold_N,
        checkWeight, warnings, softwareVersion, extra);
  }
}
