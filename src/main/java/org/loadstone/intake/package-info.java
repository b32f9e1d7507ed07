/**
 * Data from elsewhere: force–time or force–displacement CSV files written by other software
 * ({@link org.loadstone.intake.CsvImport}) and position–time tables ({@link
 * org.loadstone.intake.PositionTableCsv}), read into the archive's run types. No JavaFX, no ports.
 */
package org.loadstone.intake;
