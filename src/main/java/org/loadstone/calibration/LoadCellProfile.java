package org.loadstone.calibration;

import com.fasterxml.jackson.annotation.JsonProperty;
import org.loadstone.units.LoadstoneException;

/**
 * What is known about a load cell before it is calibrated.
 *
 * @param id short name, letters, digits, '.', '_' and '-' (used as file name)
 * @param description free text, not null
 * @param ratedCapacity_N rated capacity, > 0
 * @param serialNumber maker's serial number, not null (may be empty)
 * @param nominalCounts_per_N expected sensitivity from the data sheet and amplifier gain, > 0
 */
public record LoadCellProfile(
    @JsonProperty("id") String id,
    @JsonProperty("description") String description,
    @JsonProperty("rated_capacity_N") double ratedCapacity_N,
    @JsonProperty("serial_number") String serialNumber,
    @JsonProperty("nominal_counts_per_N") double nominalCounts_per_N) {

  /** Validates; messages name the field. */
  public LoadCellProfile {
    CalibrationDocument.checkId(id, "id");
    if (description == null) {
      throw new LoadstoneException("field 'description' is missing: give a short description");
    }
    if (!(ratedCapacity_N > 0 && Double.isFinite(ratedCapacity_N))) {
      throw new LoadstoneException("field 'rated_capacity_N' is " + ratedCapacity_N
          + ": give the cell's rated capacity in N (> 0)");
    }
    if (serialNumber == null) {
      throw new LoadstoneException("field 'serial_number' is missing: give it, or \"\" if"
          + " unknown");
    }
    if (!(nominalCounts_per_N > 0 && Double.isFinite(nominalCounts_per_N))) {
      throw new LoadstoneException("field 'nominal_counts_per_N' is " + nominalCounts_per_N
          + ": give the expected sensitivity in counts per N (> 0)");
    }
  }
}
