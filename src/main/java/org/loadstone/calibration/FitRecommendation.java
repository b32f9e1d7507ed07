package org.loadstone.calibration;

/**
 * The lowest-degree fit judged good enough, and why.
 *
 * @param kind the recommended fit
 * @param reason one or two sentences for the operator
 */
public record FitRecommendation(FitKind kind, String reason) {}
