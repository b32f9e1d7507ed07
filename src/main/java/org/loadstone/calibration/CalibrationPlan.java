package org.loadstone.calibration;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * The order in which weights are placed for a calibration.
 *
 * <p>Each series starts with the zero point (no load), then the loads in ascending order. With
 * {@code descending}, the loads below the highest follow in descending order, and the series
 * ends with a zero point after unloading (the zero return). The highest load is read once per
 * series: its ascending and descending readings would be the same reading.
 *
 * @param loads_kg the N load points, conventional masses in kg, strictly ascending, all > 0
 * @param descending whether to read on the way down too (hysteresis, zero return)
 * @param series how many series, 1 to 10 (ISO 7500-1 asks for three)
 */
public record CalibrationPlan(List<Double> loads_kg, boolean descending, int series) {

  /**
   * One reading to take.
   *
   * @param number 1-based position in the plan
   * @param series which series
   * @param direction ascending or descending
   * @param mass_kg the weights on the cell, 0 for a zero point
   */
  public record Step(int number, int series, Direction direction, double mass_kg) {
    /** @return an instruction for the operator, e.g. "series 1, up: place 2.5 kg" */
    public String prompt() {
      return mass_kg == 0
          ? String.format(Locale.ROOT, "series %d, %s: remove all weights (zero point)", series,
              direction.label())
          : String.format(Locale.ROOT, "series %d, %s: weights totalling %s kg on the cell",
              series, direction.label(), mass_kg);
    }

    /** @return the calibration point of this step with the captured {@code reading} */
    public CalibrationPoint toPoint(CapturedReading reading, ForceFromMass model) {
      return CalibrationPoint.ofMass(mass_kg, model, direction, series, reading);
    }
  }

  /** Validates: at least two loads, strictly ascending, positive; 1 to 10 series. */
  public CalibrationPlan {
    Precondition.notNull(loads_kg, "loads_kg");
    if (loads_kg.size() < 2) {
      throw new LoadstoneException("a calibration plan needs at least two loads besides zero,"
          + " got " + loads_kg.size() + ": add weights across the range (five or more is usual)");
    }
    double prev = 0;
    for (Double m : loads_kg) {
      if (m == null || !(m > prev) || !Double.isFinite(m)) {
        throw new LoadstoneException("calibration loads must be above zero and strictly"
            + " ascending: " + m + " kg follows " + prev + " kg; sort the loads and drop"
            + " repeats (use more series to repeat)");
      }
      prev = m;
    }
    if (series < 1 || series > 10) {
      throw new LoadstoneException("series " + series + " is out of range: plan 1 to 10 series");
    }
    loads_kg = List.copyOf(loads_kg);
  }

  /** @return every reading to take, in order */
  public List<Step> steps() {
    List<Step> out = new ArrayList<>();
    for (int s = 1; s <= series; s++) {
      out.add(new Step(out.size() + 1, s, Direction.UP, 0));
      for (double m : loads_kg) {
        out.add(new Step(out.size() + 1, s, Direction.UP, m));
      }
      if (descending) {
        for (int i = loads_kg.size() - 2; i >= 0; i--) {
          out.add(new Step(out.size() + 1, s, Direction.DOWN, loads_kg.get(i)));
        }
        out.add(new Step(out.size() + 1, s, Direction.DOWN, 0));
      }
    }
    return out;
  }
}
