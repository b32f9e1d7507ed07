/**
 * Statistics for comparing groups of specimens, implemented here (no statistics library in the
 * main code): special functions, t/F/normal distributions, group summaries, Welch's t-test,
 * one-way ANOVA, Grubbs' outlier test, sample-size advice and the
 * {@link org.loadstone.analysis.stats.GroupComparison} service.
 */
package org.loadstone.analysis.stats;
