package org.loadstone.intake;

import org.loadstone.archive.RunData;
import org.loadstone.archive.RunMetadata;

import java.util.List;
import org.loadstone.units.Precondition;

/**
 * A run read from a foreign or plain CSV by {@link CsvImport}.
 *
 * <p>The metadata is partial: specimen = file name stem, cause {@link FinishCause#IMPORTED},
 * no geometry or mass, a provisional run id {@code import-<stem>} that the archive replaces with
 * a fresh one when it stores the run. Raw counts are 0 (there is no raw data) and
 * {@code seq} is the data row index from 0.
 *
 * @param metadata partial metadata, not null
 * @param data the samples in SI-style units (s, N, mm), not null
 * @param delimiter the field delimiter used (given or detected)
 * @param columns one plain line per column read, e.g. "time: 'Time [ms]' (column 1) in ms"
 * @param notes what the import assumed or changed (time shifted to start at 0, units guessed…)
 */
public record ImportedRun(
    RunMetadata metadata, RunData data, char delimiter, List<String> columns, List<String> notes) {
  /** Checks and copies. */
  public ImportedRun {
    Precondition.notNull(metadata, "metadata");
    Precondition.notNull(data, "data");
    columns = List.copyOf(columns);
    notes = List.copyOf(notes);
  }
}
