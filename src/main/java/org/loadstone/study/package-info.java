/**
 * What is learnt from stored runs: the figures of one run with its geometry and mass ({@link
 * org.loadstone.study.RunMetrics}), groups of runs compared on one figure ({@link
 * org.loadstone.study.GroupStudy}), re-analysis with another calibration, position source or frame
 * compliance ({@link org.loadstone.study.RunAdjust}), and the load frame's own stiffness ({@link
 * org.loadstone.study.FrameProfile}). Reads the archive, never writes a run. No JavaFX, no ports.
 */
package org.loadstone.study;
