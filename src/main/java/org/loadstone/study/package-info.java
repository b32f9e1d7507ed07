/**
 * What is learnt from stored runs: the figures of one run with its geometry and mass ({@link
 * org.loadstone.study.RunMetrics}) named by one typed catalogue ({@link
 * org.loadstone.study.Metric}); which runs count and why the others are left out ({@link
 * org.loadstone.study.RunSelection}, {@link org.loadstone.study.LeftOut}); an archive's runs
 * analysed and grouped ({@link org.loadstone.study.ArchiveRuns}, {@link
 * org.loadstone.study.Selection}); groups compared on one figure ({@link
 * org.loadstone.study.GroupStudy}, {@link org.loadstone.study.StudyResult}); re-analysis with
 * another calibration, position source or frame compliance ({@link org.loadstone.study.RunAdjust});
 * and the load frame's own stiffness ({@link org.loadstone.study.FrameProfile}). Reads the
 * archive, never writes a run. No JavaFX, no ports.
 */
package org.loadstone.study;
