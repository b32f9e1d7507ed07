package org.loadstone.calibration;

import java.util.Locale;

/** Plain-text tables of a {@link CalibrationReport}, for a terminal (no colour codes). */
public final class FitTable {
  private FitTable() {}

  /**
   * @param report not null
   * @return several lines: the fits compared, the residuals of the adopted fit, the
   *     standards-style figures and the recommendation; ends with a newline
   */
  public static String format(CalibrationReport report) {
    StringBuilder sb = new StringBuilder();
    LinearityMetrics lin = report.linearity();
    sb.append(String.format(Locale.ROOT, "Full scale %.6g N, largest load %.6g N, %d points%n",
        report.fullScale_N(), report.maxForce_N(), report.points().size()));
    sb.append(String.format(Locale.ROOT,
        "Sensitivity %.6g counts/N   non-linearity %.4f %%FS   hysteresis %s   repeatability %s%n",
        lin.sensitivity_counts_per_N(), lin.nonlinearity_pct_fs(), pct(lin.hysteresis_pct_fs()),
        pct(lin.repeatability_pct_fs())));
    ForceFromMass fm = report.settings().forceModel();
    double heaviest = report.points().stream().filter(p -> p.mass_kg() != null)
        .mapToDouble(CalibrationPoint::mass_kg).max().orElse(0);
    sb.append(String.format(Locale.ROOT, "g %.7f m/s² (%s), air %.3g kg/m³, weights %.0f kg/m³%n",
        fm.g_m_per_s2(), fm.gSource(), fm.airDensity_kg_per_m3(), fm.weightDensity_kg_per_m3()));
    if (heaviest > 0) {
      ForceFromMass.Corrections c = fm.corrections(heaviest);
      sb.append(String.format(Locale.ROOT, "Corrections at %.6g kg: gravity %+.5g N (%+.4f %%),"
          + " buoyancy %+.5g N (%+.4f %%)%n", heaviest, c.gravityCorrection_N(),
          100 * c.gravityRelative(), c.buoyancyCorrection_N(), 100 * c.buoyancyRelative()));
    }
    sb.append(System.lineSeparator());
    sb.append(String.format(Locale.ROOT, "%-20s %4s %12s %14s %12s  %s%n",
        "fit", "dof", "resid SD N", "resid SD cnt", "max err %FS", "coefficients (counts, N)"));
    for (FitResult f : report.fits()) {
      StringBuilder c = new StringBuilder();
      for (double v : f.countsOfForce().coefficients()) {
        c.append(c.length() == 0 ? "" : ", ").append(String.format(Locale.ROOT, "%.9g", v));
      }
      sb.append(String.format(Locale.ROOT, "%-20s %4d %12.4g %14.4g %12.4f  [%s]%s%n",
          f.kind().label(), f.degreesOfFreedom(), f.residualSd_N(), f.residualSd_counts(),
          f.maxError_pct_fs(), c, f.kind() == report.chosen() ? "  <- adopted" : ""));
    }
    for (String n : report.notes()) {
      sb.append("  note: ").append(n).append(System.lineSeparator());
    }
    sb.append(System.lineSeparator()).append(report.recommendation().reason())
        .append(System.lineSeparator()).append(System.lineSeparator());
    sb.append(String.format(Locale.ROOT, "Residuals of %s:%n", report.chosen().label()));
    sb.append(String.format(Locale.ROOT, "%6s %4s %12s %14s %12s %10s %10s%n",
        "series", "dir", "load N", "net counts", "error N", "% reading", "% FS"));
    for (PointResidual r : report.chosenFit().residuals()) {
      sb.append(String.format(Locale.ROOT, "%6d %4s %12.6g %14.2f %12.4g %10s %10.4f%n",
          r.point().series(), r.point().direction().label(), r.point().force_N(), r.netCounts(),
          r.error_N(), r.error_pct_reading() == null ? "-"
              : String.format(Locale.ROOT, "%.4f", r.error_pct_reading()), r.error_pct_fs()));
    }
    AstmE74Result a = report.astm();
    if (a == null) {
      sb.append(String.format(Locale.ROOT, "%nASTM E74 style: not assessed (see the notes)%n"));
    } else {
      sb.append(String.format(Locale.ROOT, "%nASTM E74 style, ascending readings: SD %.4g N,"
          + " LLF %.4g N, Class A lower limit %.4g N, Class AA lower limit %.4g N%n",
          a.residualSd_N(), a.llf_N(), a.classALowerLimit_N(), a.classAALowerLimit_N()));
      sb.append("  ").append(a.note()).append(System.lineSeparator());
    }
    Iso7500Result iso = report.iso();
    sb.append(String.format(Locale.ROOT, "ISO 7500-1 style: class %s, f0 %s%n",
        iso.systemClass(), pct(iso.f0_pct())));
    sb.append(String.format(Locale.ROOT, "%12s %9s %9s %9s %9s %6s%n",
        "load N", "q %", "b %", "v %", "a %", "class"));
    for (Iso7500Result.Point p : iso.points()) {
      sb.append(String.format(Locale.ROOT, "%12.6g %9.4f %9s %9s %9.4f %6s%n", p.force_N(),
          p.q_pct(), num(p.b_pct()), num(p.v_pct()), p.a_pct(), p.pointClass()));
    }
    for (String n : iso.notes()) {
      sb.append("  ").append(n).append(System.lineSeparator());
    }
    return sb.toString();
  }

  private static String pct(Double v) {
    return v == null ? "not assessed" : String.format(Locale.ROOT, "%.4f %%FS", v);
  }

  private static String num(Double v) {
    return v == null ? "-" : String.format(Locale.ROOT, "%.4f", v);
  }
}
