package org.loadstone.cli;

import org.loadstone.archive.ImportedRun;

/** Stores an imported run; the archive writer is plugged in with {@link CliWiring#useSink}. */
@FunctionalInterface
public interface RunSink {
  /**
   * Stores the run.
   *
   * @param run the imported run, not null
   * @return a short description of where it went, e.g. the new run id
   * @throws org.loadstone.units.LoadstoneException when it cannot be stored
   */
  String store(ImportedRun run);
}
