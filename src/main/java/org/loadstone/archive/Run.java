package org.loadstone.archive;

import java.nio.file.Path;
import org.loadstone.units.Precondition;

/**
 * A run read back from the archive.
 *
 * @param metadata the sidecar
 * @param data the samples
 * @param csv file the samples came from
 * @param json file the sidecar came from
 */
public record Run(RunMetadata metadata, RunData data, Path csv, Path json) {
  public Run {
    Precondition.notNull(metadata, "metadata");
    Precondition.notNull(data, "data");
    Precondition.notNull(csv, "csv");
    Precondition.notNull(json, "json");
  }
}
