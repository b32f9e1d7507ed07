package org.loadstone.calibration;

import java.util.List;
import java.util.Locale;

/**
 * Figures computed in the style of ASTM E74 (verification of force-measuring instruments) — not
 * a substitute for an accredited calibration.
 *
 * <p>From the ascending readings only, every series together: the adopted curve is fitted to
 * them, the standard deviation s of their residuals is taken in force units with
 * n − m − 1 degrees of freedom (m the degree), the lower limit factor is LLF = 2.4·s, and the
 * lower limit of the verified range is 400·LLF for Class A and 2000·LLF for Class AA. Descending
 * readings do not enter s: hysteresis is reported on its own (and the reversibility in the ISO
 * 7500-1 style figures). The factors 2.4, 400 and 2000 and the use of ascending readings are
 * quoted from memory of ASTM E74-18 (sections 8.5, 8.6 and the loading procedure); check them
 * against your copy.
 *
 * @param residualSd_N s, the standard deviation of the ascending readings about their curve, N
 * @param llf_N lower limit factor, 2.4 × residualSd_N
 * @param classALowerLimit_N 400 × LLF
 * @param classAALowerLimit_N 2000 × LLF
 * @param points how many ascending readings s is based on
 * @param series from how many series
 * @param note label and caveats, e.g. when a lower limit lies above the largest applied load
 */
public record AstmE74Result(
    double residualSd_N,
    double llf_N,
    double classALowerLimit_N,
    double classAALowerLimit_N,
    int points,
    int series,
    String note) {

  /** Multiplier from the residual SD to the LLF (ASTM E74, from memory). */
  public static final double LLF_FACTOR = 2.4;
  /** Class A lower limit in LLFs (ASTM E74, from memory). */
  public static final double CLASS_A_FACTOR = 400;
  /** Class AA lower limit in LLFs (ASTM E74, from memory). */
  public static final double CLASS_AA_FACTOR = 2000;

  /**
   * @param ascendingFit the adopted curve, fitted to the ascending readings alone
   * @param maxForce_N largest applied load, for the caveat
   */
  public static AstmE74Result of(FitResult ascendingFit, double maxForce_N) {
    double sd = ascendingFit.residualSd_N();
    double llf = LLF_FACTOR * sd;
    double a = CLASS_A_FACTOR * llf;
    double aa = CLASS_AA_FACTOR * llf;
    List<CalibrationPoint> up = ascendingFit.residuals().stream().map(PointResidual::point)
        .filter(p -> p.direction() == Direction.UP).toList();
    int n = up.size();
    int series = (int) up.stream().mapToInt(CalibrationPoint::series).distinct().count();
    String note = String.format(Locale.ROOT, "computed in the style of ASTM E74 — not a"
        + " substitute for an accredited calibration; from the %d ascending readings of %d"
        + " series (descending readings excluded: hysteresis is reported on its own)", n, series);
    if (a > maxForce_N) {
      note += "; the Class A lower limit lies above the largest load: no verified range";
    } else if (aa > maxForce_N) {
      note += "; the Class AA lower limit lies above the largest load";
    }
    return new AstmE74Result(sd, llf, a, aa, n, series, note);
  }
}
