package org.loadstone.cli;

import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.util.Optional;
import org.loadstone.intake.CsvImport;
import org.loadstone.intake.ImportedRun;
import org.loadstone.archive.RunData;
import org.loadstone.archive.RunMetadata;
import org.loadstone.units.Precondition;

/**
 * Finds a run from what the user typed on the command line: a CSV path now, a run id once the
 * archive lookup is plugged in with {@link CliWiring#useResolver}.
 */
@FunctionalInterface
public interface RunResolver {

  /**
   * @param reference what the user typed, not null
   * @return the run, or empty when this resolver does not know the reference
   * @throws org.loadstone.units.LoadstoneException when the reference names a run that cannot be
   *     read
   */
  Optional<ResolvedRun> resolve(String reference);

  /**
   * A run found by a resolver.
   *
   * @param metadata its metadata (partial for a bare CSV), not null
   * @param data its samples, not null
   * @param source where it came from, for messages, e.g. the file path
   */
  record ResolvedRun(RunMetadata metadata, RunData data, String source) {
    /** Checks the fields. */
    public ResolvedRun {
      Precondition.notNull(metadata, "metadata");
      Precondition.notNull(data, "data");
      Precondition.notNull(source, "source");
    }
  }

  /** @return a resolver for existing files read by {@link CsvImport#plain} */
  static RunResolver csvFiles() {
    return ref -> {
      Path p;
      try {
        p = Path.of(ref);
      } catch (InvalidPathException e) {
        return Optional.empty();
      }
      if (!Files.isRegularFile(p)) {
        return Optional.empty();
      }
      ImportedRun r = CsvImport.plain(p);
      return Optional.of(new ResolvedRun(r.metadata(), r.data(), p.toString()));
    };
  }


}
