/**
 * Run analysis and specimen formulas: pure maths on arrays, no files, no JavaFX.
 *
 * <ul>
 *   <li>{@link org.loadstone.analysis.Curve} — validated, read-only force record of one run;
 *   <li>{@link org.loadstone.analysis.RunAnalyzer} with {@link org.loadstone.analysis.AnalysisSettings}
 *       → {@link org.loadstone.analysis.RunResult}: peak, break, stiffness window and line, toe
 *       offset, energy, crush;
 *   <li>{@link org.loadstone.analysis.Flexure}, {@link org.loadstone.analysis.Sandwich},
 *       {@link org.loadstone.analysis.Specific} — beam, sandwich and per-gram formulas.
 * </ul>
 *
 * <p>Sub-packages: {@code position} (encoder, crosshead rate, imported tables, alignment,
 * compliance) and {@code stats} (distributions, group summaries, tests, sample-size advice,
 * group comparison).
 */
package org.loadstone.analysis;
