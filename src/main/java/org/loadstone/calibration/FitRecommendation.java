package org.loadstone.calibration;

/**
 * The lowest-degree fit judged good enough, and why.
 *
 * <p>The rule: start from the straight line with offset; step up to quadratic, then cubic, only
 * while all of these hold: (1) the higher degree has at least degree + 2 distinct loads, one more
 * than it has coefficients; (2) its fit exists and is monotonic over the calibrated range; (3) the
 * current fit's residual SD in N is above one count expressed in N (below that a higher degree
 * fits noise); (4) the higher degree cuts the residual SD, computed with n − p degrees of
 * freedom, to at most 0.7 of the current one. With about ten degrees of freedom, (4) is stricter
 * than an F-test at 95 % for one added coefficient (which accepts a cut to about 0.8). The fit
 * through zero is offered for comparison but never recommended: the offset term also absorbs a
 * small zero shift between the zero reading and the loaded readings.
 *
 * @param kind the recommended fit
 * @param reason one or two sentences for the operator
 */
public record FitRecommendation(FitKind kind, String reason) {}
