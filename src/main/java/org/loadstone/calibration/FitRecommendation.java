package org.loadstone.calibration;

/**
 * The lowest-degree fit judged good enough, and why; the rule is {@link FitChoice}'s: a higher
 * degree only when the partial F-test finds its added coefficient significant at α = 0.025 (0.05 shared by the two
 * terms that may be added), with
 * at least two residual degrees of freedom left and a curve monotonic over the range.
 *
 * @param kind the recommended fit
 * @param reason one or two sentences for the operator
 */
public record FitRecommendation(FitKind kind, String reason) {}
