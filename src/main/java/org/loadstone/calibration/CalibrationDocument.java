package org.loadstone.calibration;

import com.fasterxml.jackson.annotation.JsonIgnore;
import com.fasterxml.jackson.annotation.JsonProperty;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * One calibration as stored in a file: who, when, which cell, the raw points, the adopted curve,
 * the metrics of every fit, and the gravity and buoyancy inputs. Referenced by runs through
 * {@link #id} and {@link #contentSha256}.
 *
 * @param format always {@value #FORMAT}
 * @param id file name stem; letters, digits, '.', '_', '-'
 * @param date calibration date, ISO yyyy-mm-dd
 * @param operator who calibrated, not blank
 * @param cellId the {@link LoadCellProfile#id} of the cell
 * @param validUntil last day the calibration may be used, ISO yyyy-mm-dd, not before date
 * @param description free text (where, with which weights, remarks); not null, may be empty
 * @param forceModel g and densities used to turn masses into forces
 * @param fullScale_N reference of the % FS figures
 * @param zeroCounts zero reading of each series
 * @param points the raw points
 * @param fit the adopted curve
 * @param fits the metrics of every fit made
 * @param summary the summary of {@link CalibrationService#summary}
 * @param contentSha256 SHA-256 (hex) of the canonical JSON of everything else; null before saving
 */
public record CalibrationDocument(
    @JsonProperty("format") String format,
    @JsonProperty("id") String id,
    @JsonProperty("date") String date,
    @JsonProperty("operator") String operator,
    @JsonProperty("cell_id") String cellId,
    @JsonProperty("valid_until") String validUntil,
    @JsonProperty("description") String description,
    @JsonProperty("force_model") ForceFromMass forceModel,
    @JsonProperty("full_scale_N") double fullScale_N,
    @JsonProperty("zero_counts") List<SeriesZero> zeroCounts,
    @JsonProperty("points") List<CalibrationPoint> points,
    @JsonProperty("fit") AdoptedFit fit,
    @JsonProperty("fits") List<FitSummary> fits,
    @JsonProperty("summary") Map<String, Object> summary,
    @JsonProperty("content_sha256") String contentSha256) {

  /** Format tag of version 1. */
  public static final String FORMAT = "loadstone-calibration/1";

  /**
   * @param series series number
   * @param counts its ascending zero reading
   */
  public record SeriesZero(
      @JsonProperty("series") int series, @JsonProperty("counts") double counts) {}

  /**
   * The adopted curve: net counts = polynomial(force).
   *
   * @param kind fit kind
   * @param coefficients lowest order first, counts per N^k
   * @param minForce_N lower end of the calibrated range
   * @param maxForce_N upper end of the calibrated range
   */
  public record AdoptedFit(
      @JsonProperty("kind") FitKind kind,
      @JsonProperty("coefficients") List<Double> coefficients,
      @JsonProperty("min_force_N") double minForce_N,
      @JsonProperty("max_force_N") double maxForce_N) {
    /** Validates. */
    public AdoptedFit {
      if (kind == null) {
        throw new LoadstoneException("field 'fit.kind' is missing: give the fit kind");
      }
      if (coefficients == null || coefficients.size() != kind.degree() + 1
          || coefficients.stream().anyMatch(c -> c == null || !Double.isFinite(c))) {
        throw new LoadstoneException("field 'fit.coefficients' must hold " + (kind.degree() + 1)
            + " finite numbers for a " + kind.label() + " fit, lowest order first");
      }
      coefficients = List.copyOf(coefficients);
      if (!(maxForce_N > minForce_N)) {
        throw new LoadstoneException("fields 'fit.min_force_N' and 'fit.max_force_N' give an"
            + " empty range: " + minForce_N + " to " + maxForce_N + " N");
      }
    }

    /** @return the counts → force inverse; throws LoadstoneException when not monotonic */
    public CountsToForce inverse() {
      return new CountsToForce(Polynomial.of(coefficients), minForce_N, maxForce_N);
    }
  }

  /**
   * Metrics of one fit.
   *
   * @param kind fit kind
   * @param coefficients lowest order first
   * @param degreesOfFreedom points minus coefficients
   * @param residualSd_N residual SD in N
   * @param residualSd_counts residual SD in counts
   * @param maxError_pct_fs largest |error| in % FS
   */
  public record FitSummary(
      @JsonProperty("kind") FitKind kind,
      @JsonProperty("coefficients") List<Double> coefficients,
      @JsonProperty("degrees_of_freedom") int degreesOfFreedom,
      @JsonProperty("residual_sd_N") double residualSd_N,
      @JsonProperty("residual_sd_counts") double residualSd_counts,
      @JsonProperty("max_error_pct_fs") double maxError_pct_fs) {
    /** Copies. */
    public FitSummary {
      Precondition.notNull(kind, "kind");
      coefficients = List.copyOf(coefficients);
    }
  }

  /** Validates; messages name the field. */
  public CalibrationDocument {
    if (!FORMAT.equals(format)) {
      throw new LoadstoneException("field 'format' is '" + format + "': expected '" + FORMAT
          + "' (a calibration file written by this program)");
    }
    checkId(id, "id");
    LocalDate d = parseDate(date, "date");
    if (operator == null || operator.isBlank()) {
      throw new LoadstoneException("field 'operator' is empty: give who calibrated");
    }
    checkId(cellId, "cell_id");
    if (parseDate(validUntil, "valid_until").isBefore(d)) {
      throw new LoadstoneException("field 'valid_until' (" + validUntil + ") is before 'date' ("
          + date + "): give a later expiry date");
    }
    if (description == null) {
      throw new LoadstoneException("field 'description' is missing: give a remark, or \"\"");
    }
    if (forceModel == null) {
      throw new LoadstoneException("field 'force_model' is missing: give g and the densities");
    }
    if (!(fullScale_N > 0 && Double.isFinite(fullScale_N))) {
      throw new LoadstoneException("field 'full_scale_N' is " + fullScale_N + ": must be > 0");
    }
    if (zeroCounts == null || zeroCounts.isEmpty()) {
      throw new LoadstoneException("field 'zero_counts' is empty: one entry per series needed");
    }
    if (points == null || points.isEmpty()) {
      throw new LoadstoneException("field 'points' is empty: a calibration needs its points");
    }
    if (fit == null) {
      throw new LoadstoneException("field 'fit' is missing: the adopted curve is needed");
    }
    zeroCounts = List.copyOf(zeroCounts);
    points = List.copyOf(points);
    fits = fits == null ? List.of() : List.copyOf(fits);
    summary = summary == null ? Map.of() : java.util.Collections.unmodifiableMap(
        new LinkedHashMap<>(summary));
    if (contentSha256 != null && !contentSha256.matches("[0-9a-f]{64}")) {
      throw new LoadstoneException("field 'content_sha256' is not 64 lower-case hex digits");
    }
  }

  /**
   * Builds the document of a report; {@link #contentSha256} is filled in.
   *
   * @param description free text, e.g. the site and the weights used; not null
   *
   * @throws LoadstoneException on an invalid id, date, operator or cell id
   */
  public static CalibrationDocument of(CalibrationReport report, String id, LocalDate date,
      String operator, String cellId, LocalDate validUntil, String description) {
    Precondition.notNull(report, "report");
    Precondition.notNull(date, "date");
    Precondition.notNull(validUntil, "validUntil");
    List<SeriesZero> zeros = new ArrayList<>();
    report.zeroCounts().entrySet().stream().sorted(Map.Entry.comparingByKey())
        .forEach(e -> zeros.add(new SeriesZero(e.getKey(), e.getValue())));
    FitResult c = report.chosenFit();
    AdoptedFit fit = new AdoptedFit(c.kind(), c.countsOfForce().coefficientList(),
        c.inverse().minForce_N(), c.inverse().maxForce_N());
    List<FitSummary> fits = report.fits().stream().map(f -> new FitSummary(f.kind(),
        f.countsOfForce().coefficientList(), f.degreesOfFreedom(), f.residualSd_N(),
        f.residualSd_counts(), f.maxError_pct_fs())).toList();
    CalibrationDocument d = new CalibrationDocument(FORMAT, id, date.toString(), operator, cellId,
        validUntil.toString(), description, report.settings().forceModel(), report.fullScale_N(),
        zeros, report.points(), fit, fits, CalibrationService.summary(report), null);
    return d.withHash();
  }

  /** @return a copy whose {@link #contentSha256} is the hash of its content */
  public CalibrationDocument withHash() {
    return withContentSha256(CalibrationFiles.contentSha256(this));
  }

  /** @return a copy with {@code hash} as content hash (for tests and tools) */
  public CalibrationDocument withContentSha256(String hash) {
    return new CalibrationDocument(format, id, date, operator, cellId, validUntil, description,
        forceModel, fullScale_N, zeroCounts, points, fit, fits, summary, hash);
  }

  /** @return a copy with another adopted fit (e.g. a corrected coefficient); hash not updated */
  public CalibrationDocument withFit(AdoptedFit newFit) {
    return new CalibrationDocument(format, id, date, operator, cellId, validUntil, description,
        forceModel, fullScale_N, zeroCounts, points, newFit, fits, summary, contentSha256);
  }

  /** @return a copy with another id, for saving a recalculation beside the original */
  public CalibrationDocument withId(String newId) {
    return new CalibrationDocument(format, newId, date, operator, cellId, validUntil, description,
        forceModel, fullScale_N, zeroCounts, points, fit, fits, summary, null).withHash();
  }

  /** @return the calibration date */
  @JsonIgnore
  public LocalDate calibrationDate() {
    return LocalDate.parse(date);
  }

  /** @return the last valid day */
  @JsonIgnore
  public LocalDate validUntilDate() {
    return LocalDate.parse(validUntil);
  }

  static void checkId(String id, String field) {
    if (id == null || !id.matches("[A-Za-z0-9][A-Za-z0-9._-]{0,79}")) {
      throw new LoadstoneException("field '" + field + "' is '" + id + "': use 1 to 80 letters,"
          + " digits, '.', '_' or '-', starting with a letter or digit");
    }
  }

  private static LocalDate parseDate(String text, String field) {
    try {
      return LocalDate.parse(Precondition.notNull(text, field));
    } catch (DateTimeParseException | IllegalArgumentException e) {
      throw new LoadstoneException("field '" + field + "' is '" + text + "': write the date as"
          + " yyyy-mm-dd, e.g. 2026-12-02");
    }
  }
}
