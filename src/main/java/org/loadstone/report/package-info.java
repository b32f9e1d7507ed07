/**
 * Output for people and other programs: JFreeChart charts of runs and groups ({@link
 * org.loadstone.report.Charts}), PNG images ({@link org.loadstone.report.PngExport}), spreadsheet
 * CSV ({@link org.loadstone.report.CsvExport}) and PDF reports of a run or a group comparison
 * ({@link org.loadstone.report.PdfReport}).
 *
 * <p>Every file is written to a temporary sibling and then linked into place, so a reader never
 * sees half a file and an existing file is never overwritten.
 */
package org.loadstone.report;
