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
 * @param sampleRate_Hz the device's sample rate, samples/s: its stated rate, or measured from its own
 *     timestamps when it stated none ({@code sampleRateSource} says which)
 * @param sampleRateSource where {@code sampleRate_Hz} comes from: {@code identity} (the rate the
 *     device stated) or {@code device-clock} (measured from the device timestamps of the first
 *     samples); null in runs stored before this was kept
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
 * @param returnToZero_N force read once the load came off at the end of the run, relative to the
 *     tare, N; null when the run ended with load still on the cell
 * @param checkWeight the last check-weight verification of the calibration, as stored, or null
 * @param warnings warnings given before or during the run (expired calibration, overload warning…)
 * @param softwareVersion Loadstone's version
 * @param extra other fields kept from the file (forward compatibility), may be empty
 * @param amendments what the run's amendment log changed (never written to the sidecar; set
 *     when the run is read, see {@link Amendments}); {@link RunAmendments#NONE} when none
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
    String sampleRateSource,
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
    Double returnToZero_N,
    Map<String, Object> checkWeight,
    List<String> warnings,
    String softwareVersion,
    Map<String, Object> extra,
    RunAmendments amendments) {

  /**
   * Key in {@link #extra()}: the run time (s) at which the sync light was switched on, written by
   * the recorder when the device accepted {@code LIGHT on}.
   */
  public static final String SYNC_LIGHT_KEY = "sync_light_s";

  /** The extra field holding a crush run's end rule in words, as it was set for the run. */
  public static final String CRUSH_END_KEY = "crush_end";

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
    amendments = amendments == null ? RunAmendments.NONE : amendments;
    if (returnToZero_N != null && !Double.isFinite(returnToZero_N)) {
      throw new IllegalArgumentException("return to zero must be a finite force, was "
          + returnToZero_N);
    }
    if (mass_g != null && !(Double.isFinite(mass_g) && mass_g > 0)) {
      throw new org.loadstone.units.LoadstoneException(
          "specimen mass must be a positive number of grams, was " + mass_g);
    }
  }

  /** @return a copy with these warnings instead */
  public RunMetadata withWarnings(List<String> w) {
    return toBuilder().warnings(w).build();
  }

  /** @return a copy with another run id, specimen and group (e.g. an imported run) */
  public RunMetadata withIdentity(String newRunId, String newSpecimen, String newGroup) {
    return toBuilder().runId(newRunId).specimen(newSpecimen).group(newGroup).build();
  }

  /** @return a copy whose force comes from another scale (another calibration) */
  public RunMetadata withScale(String newCalibrationId, String newSha256, String newScale,
      ScaleSpec newSpec) {
    return toBuilder().calibrationId(newCalibrationId).calibrationSha256(newSha256)
        .scale(newScale).scaleSpec(newSpec).build();
  }

  /** @return a copy with another break sample (null: none) and break time */
  public RunMetadata withBreak(Integer newBreakIndex, Double newBreakTime_s) {
    return toBuilder().breakIndex(newBreakIndex).breakTime_s(newBreakTime_s).build();
  }

  /** @return an empty builder; run id, start time, specimen, scale spec and cause are required */
  public static Builder builder() {
    return new Builder();
  }

  /** @return a builder holding every field of this record, to change some and build a copy */
  public Builder toBuilder() {
    Builder b = new Builder();
    b.runId = runId;
    b.startedAt = startedAt;
    b.specimen = specimen;
    b.group = group;
    b.tags = tags;
    b.operator = operator;
    b.notes = notes;
    b.mass_g = mass_g;
    b.geometry = geometry;
    b.testType = testType;
    b.device = device;
    b.sampleRate_Hz = sampleRate_Hz;
    b.sampleRateSource = sampleRateSource;
    b.calibrationId = calibrationId;
    b.calibrationSha256 = calibrationSha256;
    b.scale = scale;
    b.scaleSpec = scaleSpec;
    b.zeroOffset_counts = zeroOffset_counts;
    b.dropped = dropped;
    b.checksumErrors = checksumErrors;
    b.cause = cause;
    b.breakIndex = breakIndex;
    b.breakTime_s = breakTime_s;
    b.peakBeforeBreak_N = peakBeforeBreak_N;
    b.dropAtBreak_pct = dropAtBreak_pct;
    b.pretrigger_s = pretrigger_s;
    b.startThreshold_N = startThreshold_N;
    b.returnToZero_N = returnToZero_N;
    b.checkWeight = checkWeight;
    b.warnings = warnings;
    b.softwareVersion = softwareVersion;
    b.extra = extra;
    b.amendments = amendments;
    return b;
  }

  /**
   * Builds a {@link RunMetadata} field by field, so that no two fields of one type can be swapped by
   * position. Setters are named after the record's components; {@link #build()} validates.
   */
  public static final class Builder {
    private String runId;
    private Instant startedAt;
    private String specimen;
    private String group;
    private List<String> tags;
    private String operator;
    private String notes;
    private Double mass_g;
    private Geometry geometry;
    private TestType testType;
    private Map<String, String> device;
    private double sampleRate_Hz;
    private String sampleRateSource;
    private String calibrationId;
    private String calibrationSha256;
    private String scale;
    private ScaleSpec scaleSpec;
    private double zeroOffset_counts;
    private long dropped;
    private long checksumErrors;
    private FinishCause cause;
    private Integer breakIndex;
    private Double breakTime_s;
    private Double peakBeforeBreak_N;
    private Double dropAtBreak_pct;
    private double pretrigger_s;
    private Double startThreshold_N;
    private Double returnToZero_N;
    private Map<String, Object> checkWeight;
    private List<String> warnings;
    private String softwareVersion;
    private Map<String, Object> extra;
    private RunAmendments amendments;

    private Builder() {}

    public Builder runId(String v) {
      runId = v;
      return this;
    }

    public Builder startedAt(Instant v) {
      startedAt = v;
      return this;
    }

    public Builder specimen(String v) {
      specimen = v;
      return this;
    }

    public Builder group(String v) {
      group = v;
      return this;
    }

    public Builder tags(List<String> v) {
      tags = v;
      return this;
    }

    public Builder operator(String v) {
      operator = v;
      return this;
    }

    public Builder notes(String v) {
      notes = v;
      return this;
    }

    public Builder mass_g(Double v) {
      mass_g = v;
      return this;
    }

    public Builder geometry(Geometry v) {
      geometry = v;
      return this;
    }

    public Builder testType(TestType v) {
      testType = v;
      return this;
    }

    public Builder device(Map<String, String> v) {
      device = v;
      return this;
    }

    public Builder sampleRate_Hz(double v) {
      sampleRate_Hz = v;
      return this;
    }

    public Builder sampleRateSource(String v) {
      sampleRateSource = v;
      return this;
    }

    public Builder calibrationId(String v) {
      calibrationId = v;
      return this;
    }

    public Builder calibrationSha256(String v) {
      calibrationSha256 = v;
      return this;
    }

    public Builder scale(String v) {
      scale = v;
      return this;
    }

    public Builder scaleSpec(ScaleSpec v) {
      scaleSpec = v;
      return this;
    }

    public Builder zeroOffset_counts(double v) {
      zeroOffset_counts = v;
      return this;
    }

    public Builder dropped(long v) {
      dropped = v;
      return this;
    }

    public Builder checksumErrors(long v) {
      checksumErrors = v;
      return this;
    }

    public Builder cause(FinishCause v) {
      cause = v;
      return this;
    }

    public Builder breakIndex(Integer v) {
      breakIndex = v;
      return this;
    }

    public Builder breakTime_s(Double v) {
      breakTime_s = v;
      return this;
    }

    public Builder peakBeforeBreak_N(Double v) {
      peakBeforeBreak_N = v;
      return this;
    }

    public Builder dropAtBreak_pct(Double v) {
      dropAtBreak_pct = v;
      return this;
    }

    public Builder pretrigger_s(double v) {
      pretrigger_s = v;
      return this;
    }

    public Builder startThreshold_N(Double v) {
      startThreshold_N = v;
      return this;
    }

    public Builder returnToZero_N(Double v) {
      returnToZero_N = v;
      return this;
    }

    public Builder checkWeight(Map<String, Object> v) {
      checkWeight = v;
      return this;
    }

    public Builder warnings(List<String> v) {
      warnings = v;
      return this;
    }

    public Builder softwareVersion(String v) {
      softwareVersion = v;
      return this;
    }

    public Builder extra(Map<String, Object> v) {
      extra = v;
      return this;
    }

    public Builder amendments(RunAmendments v) {
      amendments = v;
      return this;
    }

    /** @return the record; throws as the record's constructor does when a required field is missing */
    public RunMetadata build() {
      return new RunMetadata(runId, startedAt, specimen, group, tags, operator, notes, mass_g, geometry, testType, device, sampleRate_Hz, sampleRateSource, calibrationId, calibrationSha256, scale, scaleSpec, zeroOffset_counts, dropped, checksumErrors, cause, breakIndex, breakTime_s, peakBeforeBreak_N, dropAtBreak_pct, pretrigger_s, startThreshold_N, returnToZero_N, checkWeight, warnings, softwareVersion, extra, amendments);
    }
  }
}
