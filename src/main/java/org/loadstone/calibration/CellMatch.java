package org.loadstone.calibration;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.loadstone.units.Precondition;

/**
 * Whether a calibration belongs to the load cell a device reports, checked before a run: the
 * cell's id, its sensitivity and its rated capacity. A calibration for another cell gives forces
 * off by the ratio of the two sensitivities without anything looking wrong on the screen, so each
 * mismatch is a warning the run shows and stores.
 *
 * <p>Sensitivity: the calibration's slope at zero force against the data-sheet sensitivity the
 * device reports. Rated output of inexpensive strain-gauge cells is specified to about ±10 % of
 * nominal (common practice; precision cells ±0.1–1 %), so only a difference beyond {@value
 * #SENSITIVITY_TOLERANCE_PCT} % means another cell (or another amplifier gain). Capacity: the
 * profile's rated capacity (or the calibration's full scale) against the device's, beyond
 * {@value #CAPACITY_TOLERANCE_PCT} %.
 */
public final class CellMatch {
  /** Largest accepted difference between calibrated and data-sheet sensitivity, %. */
  public static final double SENSITIVITY_TOLERANCE_PCT = 10;
  /** Largest accepted difference between the rated capacities, %. */
  public static final double CAPACITY_TOLERANCE_PCT = 1;

  private CellMatch() {}

  /**
   * What a device says about its load cell; any part may be unknown.
   *
   * @param id the cell's id, or null
   * @param capacity_N rated capacity, N, or NaN
   * @param countsPerN data-sheet sensitivity, counts per N, or NaN
   */
  public record ConnectedCell(String id, double capacity_N, double countsPerN) {
    /** @return whether the device says anything about its cell */
    public boolean known() {
      return id != null || Double.isFinite(capacity_N) || Double.isFinite(countsPerN);
    }
  }

  /**
   * What a calibration says about the cell it was made on.
   *
   * @param calibrationId the calibration's id
   * @param cellId the cell's id
   * @param serialNumber the cell's serial number from its profile, or null
   * @param countsPerN the adopted fit's sensitivity at zero force, counts per N
   * @param capacity_N the profile's rated capacity, else the calibration's full scale, N
   */
  public record CalibratedCell(String calibrationId, String cellId, String serialNumber,
      double countsPerN, double capacity_N) {

    /**
     * @param doc the calibration
     * @param profile its cell's profile, or null when not at hand
     */
    public static CalibratedCell of(CalibrationDocument doc, LoadCellProfile profile) {
      Precondition.notNull(doc, "doc");
      List<Double> c = doc.fit().coefficients();
      return new CalibratedCell(doc.id(), doc.cellId(),
          profile == null ? null : profile.serialNumber(), c.size() > 1 ? c.get(1) : Double.NaN,
          profile != null ? profile.ratedCapacity_N() : doc.fullScale_N());
    }
  }

  /**
   * @param cal the calibration's cell, not null
   * @param device what the device reports, not null
   * @return one sentence per mismatch; empty when everything the device reports agrees (or it
   *     reports nothing)
   */
  public static List<String> check(CalibratedCell cal, ConnectedCell device) {
    Precondition.notNull(cal, "cal");
    Precondition.notNull(device, "device");
    List<String> out = new ArrayList<>();
    String id = device.id();
    if (id != null && !id.equals(cal.cellId()) && !id.equals(cal.serialNumber())) {
      out.add("calibration " + cal.calibrationId() + " was made for load cell " + cal.cellId()
          + " but the device reports cell " + id + ": forces would be wrong; calibrate this"
          + " cell or choose its calibration");
    }
    if (Double.isFinite(device.countsPerN()) && Double.isFinite(cal.countsPerN())) {
      double pct = 100 * (cal.countsPerN() / device.countsPerN() - 1);
      if (Math.abs(pct) > SENSITIVITY_TOLERANCE_PCT) {
        out.add(String.format(Locale.ROOT, "calibration %s has a sensitivity of %s counts/N,"
            + " %+.0f %% from the %s counts/N of the connected cell: forces would be off by"
            + " that ratio; calibrate this cell or choose its calibration", cal.calibrationId(),
            number(cal.countsPerN()), pct, number(device.countsPerN())));
      }
    }
    if (Double.isFinite(device.capacity_N()) && Double.isFinite(cal.capacity_N())
        && Math.abs(cal.capacity_N() / device.capacity_N() - 1)
            > CAPACITY_TOLERANCE_PCT / 100) {
      out.add("calibration " + cal.calibrationId() + " is for a cell rated "
          + number(cal.capacity_N()) + " N but the connected cell is rated "
          + number(device.capacity_N()) + " N: it belongs to another cell, and the overload"
          + " limits would be wrong");
    }
    return out;
  }

  /** Six significant digits without trailing zeros: 500, 4294.97. */
  private static String number(double v) {
    return new java.math.BigDecimal(v).round(new java.math.MathContext(6)).stripTrailingZeros()
        .toPlainString();
  }
}
