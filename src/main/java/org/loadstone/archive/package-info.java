/**
 * The run archive: file formats, atomic writes and journal recovery. No JavaFX, no ports.
 *
 * <p>A run is two files in the archive folder, named by its {@link org.loadstone.archive.RunIds
 * run id}: {@code <id>.csv} (samples: {@code time_s,force_N,position_mm,raw_counts,raw_position,
 * seq}) and {@code <id>.json} (the {@link org.loadstone.archive.RunMetadata} sidecar, snake_case
 * names with units). {@link org.loadstone.archive.RunWriter} publishes both atomically and never
 * over an existing run; {@link org.loadstone.archive.RunReader} reads them back strictly.
 *
 * <p>While a run records, its raw samples go to {@code .journal/<id>.journal} ({@link
 * org.loadstone.archive.JournalFormat}, written by {@code acquire.JournalWriter}); at start-up
 * {@link org.loadstone.archive.JournalRecovery} turns leftovers into runs with cause {@code
 * recovered}, and moves unreadable ones to {@code .journal/damaged/}.
 */
package org.loadstone.archive;
