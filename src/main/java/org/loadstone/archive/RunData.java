package org.loadstone.archive;

/**
 * A run's samples, column by column: the CSV {@code <run-id>.csv} with columns {@code time_s,
 * force_N, position_mm, raw_counts, raw_position, seq}. Position arrays are null when the device
 * has no position channel. Arrays are not copied; treat them as read-only.
 *
 * @param time_s seconds since the first sample of the run (pre-trigger included)
 * @param force_N force from the run's scale and zero
 * @param position_mm crosshead position, or null
 * @param rawCounts load counts as the device sent them
 * @param rawPosition position counts as the device sent them, or null
 * @param seq device sequence numbers
 */
public record RunData(double[] time_s, double[] force_N, double[] position_mm, int[] rawCounts,
    int[] rawPosition, int[] seq) {
  public RunData {
    int n = time_s.length;
    if (force_N.length != n || rawCounts.length != n || seq.length != n
        || (position_mm != null && position_mm.length != n)
        || (rawPosition != null && rawPosition.length != n)
        || ((position_mm == null) != (rawPosition == null))) {
      throw new IllegalArgumentException("run columns must all have " + n + " samples");
    }
  }

  /** @return number of samples */
  public int size() {
    return time_s.length;
  }

  /** @return whether there is a position channel */
  public boolean hasPosition() {
    return position_mm != null;
  }
}
