/**
 * Position sources for a run: encoder counts ({@link org.loadstone.analysis.position.EncoderScale}),
 * a constant crosshead rate ({@link org.loadstone.analysis.position.CrossheadRate}), an imported
 * table ({@link org.loadstone.analysis.position.PositionTable}) aligned by the break
 * ({@link org.loadstone.analysis.position.BreakAlignment}), and machine compliance correction
 * ({@link org.loadstone.analysis.position.Compliance}).
 */
package org.loadstone.analysis.position;
