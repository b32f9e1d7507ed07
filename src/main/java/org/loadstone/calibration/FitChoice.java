package org.loadstone.calibration;

import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.loadstone.analysis.stats.Distributions;

/**
 * The one rule that recommends a calibration curve, for the console and the command line alike.
 *
 * <p>Start from the straight line with offset. Step up one degree (to quadratic, then cubic) only
 * while the added coefficient is significant by the partial F-test of nested least-squares fits:
 *
 * <pre>
 * F = (SSE_lower − SSE_higher) / (SSE_higher / ν),  ν = n − p_higher residual degrees of freedom
 * </pre>
 *
 * <p>compared with the F distribution on 1 and ν degrees of freedom (textbook regression, e.g.
 * Draper &amp; Smith, "Applied Regression Analysis", extra sum of squares principle). Up to two
 * terms are tested (quadratic, cubic), so the family's level of {@value #FAMILY_ALPHA} is split
 * between them (Bonferroni): each added term needs p &lt; {@value #ALPHA}. A single test at 0.05
 * would adopt a needless quadratic in 5 % of straight-line calibrations on average, as many as
 * the 95 % promise allows, and so more than that in about half of any set of calibrations.
 *
 * <p>The higher degree is considered only when it leaves at least {@value #MIN_RESIDUAL_DOF}
 * residual degrees of freedom (with one, the test rests on a single residual) and its curve is
 * monotonic over the calibrated range. Sums of squares are in counts, the quantity the curves are
 * fitted in, over the ascending readings the curves are fitted to. When the straight line is the
 * truth the rule adopts a higher degree in at most {@value #ALPHA} of calibrations, whatever the
 * number of points. The fit through zero is offered for comparison but never recommended: the
 * offset term also absorbs a small zero shift between the zero reading and the loaded readings.
 */
final class FitChoice {
  /** Significance level of the whole choice. */
  static final double FAMILY_ALPHA = 0.05;
  /** Significance level of the test on each added coefficient: the family's, split over two. */
  static final double ALPHA = FAMILY_ALPHA / 2;
  /** Residual degrees of freedom the higher degree must leave. */
  static final int MIN_RESIDUAL_DOF = 2;

  private FitChoice() {}

  /**
   * @param fits every fit that could be made, by kind; must hold {@link FitKind#LINEAR}
   * @return the recommended fit and the reasons, step by step
   */
  static FitRecommendation recommend(Map<FitKind, FitResult> fits) {
    FitResult best = fits.get(FitKind.LINEAR);
    StringBuilder why = new StringBuilder("linear with offset is the starting point");
    for (FitKind next : List.of(FitKind.QUADRATIC, FitKind.CUBIC)) {
      FitResult cand = fits.get(next);
      if (cand == null) {
        why.append("; ").append(next.label()).append(" not available (too few distinct loads,"
            + " not monotonic over the range, or rank deficient)");
        break;
      }
      if (cand.degreesOfFreedom() < MIN_RESIDUAL_DOF) {
        why.append(String.format(Locale.ROOT, "; %s not considered: it would leave %d residual"
            + " degree(s) of freedom, the test of its added term needs at least %d",
            next.label(), cand.degreesOfFreedom(), MIN_RESIDUAL_DOF));
        break;
      }
      double p = addedTermP(best, cand);
      if (!(p < ALPHA)) {
        why.append(String.format(Locale.ROOT, "; %s's added term is not significant (F-test"
            + " p = %.3g on 1 and %d degrees of freedom, needs < %.3g)", next.label(), p,
            cand.degreesOfFreedom(), ALPHA));
        break;
      }
      why.append(String.format(Locale.ROOT, "; %s's added term is significant (F-test p = %.3g"
          + " on 1 and %d degrees of freedom)", next.label(), p, cand.degreesOfFreedom()));
      best = cand;
    }
    return new FitRecommendation(best.kind(), "recommended " + best.kind().label() + ": " + why);
  }

  /**
   * @return the p-value of the partial F-test of {@code higher}'s one added coefficient over
   *     {@code lower}; 1 when the higher degree removes nothing
   */
  static double addedTermP(FitResult lower, FitResult higher) {
    double sseLow = sse(lower);
    double sseHigh = sse(higher);
    int dof = higher.degreesOfFreedom();
    if (!(sseLow - sseHigh > 0)) {
      return 1;
    }
    if (sseHigh == 0) {
      return 0;
    }
    double f = (sseLow - sseHigh) / (sseHigh / dof);
    return Distributions.fUpperTail(f, 1, dof);
  }

  private static double sse(FitResult fit) {
    double sd = fit.residualSd_counts();
    return sd * sd * fit.degreesOfFreedom();
  }
}
