package org.loadstone.calibration;

/**
 * Figures computed in the style of ASTM E74 (verification of force-measuring instruments) — not
 * a substitute for an accredited calibration.
 *
 * <p>ASTM E74 takes the standard deviation of the residuals of the calibration curve, in force
 * units, with n − m − 1 degrees of freedom (m the degree), multiplies it by 2.4 to get the
 * lower limit factor LLF, and sets the lower limit of the verified range to 400 × LLF for
 * Class A and 2000 × LLF for Class AA (ASTM E74-18, sections 8.5 and 8.6; quoted from memory).
 *
 * @param residualSd_N the residual standard deviation in N that the LLF is based on
 * @param llf_N lower limit factor, 2.4 × residualSd_N
 * @param classALowerLimit_N 400 × LLF
 * @param classAALowerLimit_N 2000 × LLF
 * @param note label and caveats, e.g. when a lower limit lies above the largest applied load
 */
public record AstmE74Result(
    double residualSd_N,
    double llf_N,
    double classALowerLimit_N,
    double classAALowerLimit_N,
    String note) {

  /** Multiplier from the residual SD to the LLF. */
  public static final double LLF_FACTOR = 2.4;
  /** Class A lower limit in LLFs. */
  public static final double CLASS_A_FACTOR = 400;
  /** Class AA lower limit in LLFs. */
  public static final double CLASS_AA_FACTOR = 2000;

  /**
   * @param residualSd_N residual SD of the adopted fit in N
   * @param maxForce_N largest applied load, for the caveat
   */
  public static AstmE74Result of(double residualSd_N, double maxForce_N) {
    double llf = LLF_FACTOR * residualSd_N;
    double a = CLASS_A_FACTOR * llf;
    double aa = CLASS_AA_FACTOR * llf;
    String note = "computed in the style of ASTM E74 — not a substitute for an accredited"
        + " calibration";
    if (a > maxForce_N) {
      note += "; the Class A lower limit lies above the largest load: no verified range";
    } else if (aa > maxForce_N) {
      note += "; the Class AA lower limit lies above the largest load";
    }
    return new AstmE74Result(residualSd_N, llf, a, aa, note);
  }
}
