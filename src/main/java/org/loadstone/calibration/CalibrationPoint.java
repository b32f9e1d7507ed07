package org.loadstone.calibration;

import com.fasterxml.jackson.annotation.JsonIgnore;
import com.fasterxml.jackson.annotation.JsonProperty;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * One calibration point: a known load and the raw counts read under it.
 *
 * @param force_N applied force, ≥ 0; 0 for the zero (no-load) point
 * @param mass_kg the conventional mass the force was computed from, or null when the force was
 *     entered directly
 * @param direction ascending or descending
 * @param series which series (1, 2, …) for repeatability
 * @param counts_mean mean raw counts (not tared)
 * @param counts_sd sample standard deviation of the counts averaged, ≥ 0 (0 when unknown)
 * @param samples number of samples averaged, ≥ 1
 */
public record CalibrationPoint(
    @JsonProperty("force_N") double force_N,
    @JsonProperty("mass_kg") Double mass_kg,
    @JsonProperty("direction") Direction direction,
    @JsonProperty("series") int series,
    @JsonProperty("counts_mean") double counts_mean,
    @JsonProperty("counts_sd") double counts_sd,
    @JsonProperty("samples") int samples) {

  /** Validates ranges. */
  public CalibrationPoint {
    if (!(force_N >= 0 && Double.isFinite(force_N))) {
      throw new LoadstoneException(
          "calibration point force " + force_N + " N is invalid: loads are zero or more");
    }
    if (mass_kg != null && !(mass_kg >= 0 && Double.isFinite(mass_kg))) {
      throw new LoadstoneException(
          "calibration point mass " + mass_kg + " kg is invalid: masses are zero or more");
    }
    Precondition.notNull(direction, "direction");
    if (series < 1) {
      throw new LoadstoneException(
          "calibration point series " + series + " is invalid: number series from 1");
    }
    Precondition.finite(counts_mean, "counts_mean");
    Precondition.nonNegative(counts_sd, "counts_sd");
    if (samples < 1) {
      throw new LoadstoneException(
          "calibration point samples " + samples + " is invalid: at least one sample");
    }
  }

  /** A point whose force comes from a mass through {@code model}. */
  public static CalibrationPoint ofMass(
      double mass_kg, ForceFromMass model, Direction direction, int series, CapturedReading r) {
    Precondition.notNull(model, "model");
    Precondition.notNull(r, "r");
    return new CalibrationPoint(
        model.force_N(mass_kg), mass_kg, direction, series, r.mean_counts(), r.sd_counts(),
        r.samples());
  }

  /** A point with the force entered directly (e.g. from a reference force transducer). */
  public static CalibrationPoint ofForce(
      double force_N, Direction direction, int series, CapturedReading r) {
    Precondition.notNull(r, "r");
    return new CalibrationPoint(
        force_N, null, direction, series, r.mean_counts(), r.sd_counts(), r.samples());
  }

  /** @return whether this is a no-load point */
  @JsonIgnore
  public boolean isZero() {
    return force_N == 0;
  }
}
