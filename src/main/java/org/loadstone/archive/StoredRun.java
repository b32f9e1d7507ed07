package org.loadstone.archive;

import java.nio.file.Path;
import org.loadstone.units.Precondition;

/**
 * Where a run was stored.
 *
 * @param csv the samples, {@code <archive>/<run-id>.csv}
 * @param json the metadata sidecar, {@code <archive>/<run-id>.json}
 */
public record StoredRun(Path csv, Path json) {
  public StoredRun {
    Precondition.notNull(csv, "csv");
    Precondition.notNull(json, "json");
  }
}
