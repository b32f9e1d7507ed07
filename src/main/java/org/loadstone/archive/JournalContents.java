package org.loadstone.archive;

import org.loadstone.units.Precondition;

/**
 * What a journal holds: its header and every intact record, as a run.
 *
 * @param startInfo the header's sidecar fields; cause {@code recovered}, no break fields
 * @param data the intact records as columns; time from the first record, force derived again
 *     from the raw counts with the header's scale spec and zero offset
 * @param firstIndex ring index of the first record, or -1 when there is none
 * @param missedByJournal samples absent between records (the journal fell behind the ring)
 * @param seqGaps samples missing from the device sequence between records
 * @param outOfOrder intact records left out because their time was not after the previous one
 * @param tornBytes bytes after the last intact record (a torn last write), 0 when none
 * @param positionDropped whether some records had position and some had not, so position was
 *     left out
 */
public record JournalContents(RunMetadata startInfo, RunData data, long firstIndex,
    long missedByJournal, long seqGaps, long outOfOrder, long tornBytes,
    boolean positionDropped) {
  public JournalContents {
    Precondition.notNull(startInfo, "startInfo");
    Precondition.notNull(data, "data");
  }

  /** @return whether every record that reached the disk is in {@link #data()} */
  public boolean complete() {
    return outOfOrder == 0 && !positionDropped;
  }
}
