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

  /**
   * Called when a run is armed, before the operator loads the specimen: a store on a disk may
   * keep room there for the run's start, so that a disk that fills between the arming and the
   * load still takes the run's journal ({@link #begin} uses the room). Nothing by default.
   *
   * @throws org.loadstone.units.LoadstoneException when no room can be kept and the run would
   *     have nowhere to go (the message names the disk and the fix)
   */
  default void keepRoom() {}

  /** Gives back the room kept by {@link #keepRoom} when no run began. Nothing by default. */
  default void releaseRoom() {}

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

    /**
     * As {@link #finish(long, RunMetadata)}, for a store that may have to wait (a full disk):
     * it tells {@code waiting} what it waits for and gives up when asked to.
     */
    default Stored finish(long lastIndex, RunMetadata finalMetadata, Waiting waiting) {
      return finish(lastIndex, finalMetadata);
    }

    /**
     * @return the first failure to write the run's samples (a full disk), or empty while every
     *     sample is written; the run then ends with cause {@code disk-full}
     */
    default java.util.Optional<String> diskFault() {
      return java.util.Optional.empty();
    }

    /** @return a warning once the disk lacks the room to store the run so far, else null */
    default String spaceWarning() {
      return null;
    }
  }

  /** What a store that waits (for space) tells, and asks. */
  interface Waiting {
    /** Never told, never cancelled. */
    Waiting NONE = new Waiting() {
      @Override
      public void say(String text) {}

      @Override
      public boolean cancelled() {
        return false;
      }
    };

    /** @param text what the store is waiting for and what is kept meanwhile */
    void say(String text);

    /** @return whether to give up waiting (the samples then stay where the message said) */
    boolean cancelled();
  }

  /**
   * A written run.
   *
   * @param runId its id
   * @param csv the samples file
   * @param json the metadata sidecar
   * @param samples number of samples written
   * @param cause the cause stored when the store changed it (a disk that filled during the run:
   *     {@code disk-full}), else null (the cause it was given)
   */
  record Stored(String runId, java.nio.file.Path csv, java.nio.file.Path json, long samples,
      org.loadstone.archive.FinishCause cause) {
    /** A run stored with the cause it was finished with. */
    public Stored(String runId, java.nio.file.Path csv, java.nio.file.Path json, long samples) {
      this(runId, csv, json, samples, null);
    }
  }
}
