package org.loadstone.acquire;

import org.loadstone.archive.RunMetadata;

/**
 * Where a run's samples go while it records and what it becomes when it ends. The journal store
 * writes every sample to an append-only journal as it arrives and turns the journal into run files
 * at the finish; tests may use a store in memory.
 */
public interface RunStore {
  /**
   * Begins a run.
   *
   * @param start metadata known at the start (cause and break fields are placeholders)
   * @param ring the ring the samples are in
   * @param firstIndex first sample of the run (pre-trigger included), still held by the ring
   * @return the recording
   */
  Recording begin(RunMetadata start, SampleRing ring, long firstIndex);

  /** A run being recorded. */
  interface Recording {
    /** @return samples that have reached durable storage so far */
    long durableSamples();

    /**
     * Ends the run at {@code lastIndex} (inclusive) and writes it.
     *
     * @param finalMetadata the metadata with cause, break and counters filled in
     * @return where the run was written
     * @throws org.loadstone.units.LoadstoneException when the run cannot be written; the journal
     *     then stays on disk and is recovered at the next start
     */
    Stored finish(long lastIndex, RunMetadata finalMetadata);
  }

  /**
   * A written run.
   *
   * @param runId its id
   * @param csv the samples file
   * @param json the metadata sidecar
   * @param samples number of samples written
   */
  record Stored(String runId, java.nio.file.Path csv, java.nio.file.Path json, long samples) {}
}
