package org.loadstone.cli;

import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.time.Instant;
import java.util.Optional;
import org.loadstone.archive.ArchiveIndex;
import org.loadstone.intake.ImportedRun;
import org.loadstone.archive.Run;
import org.loadstone.archive.RunIdClaim;
import org.loadstone.archive.RunIds;
import org.loadstone.archive.RunMetadata;
import org.loadstone.archive.RunReader;
import org.loadstone.archive.RunWriter;
import org.loadstone.archive.StoredRun;
import org.loadstone.cli.RunResolver.ResolvedRun;
import org.loadstone.units.LoadstoneException;

/**
 * How the run commands find a run and where an imported run goes: a file path (a run's CSV with
 * its JSON sidecar keeps all metadata; any other CSV with {@code time_s, force_N, position_mm} is
 * read as plain columns), else a run id or id prefix in the archive.
 */
final class CliWiring {
  private CliWiring() {}

  /** @throws LoadstoneException when neither a file nor an archived run matches */
  static ResolvedRun resolve(String reference, Path archiveDir) {
    Optional<Path> file = asFile(reference);
    if (file.isPresent()) {
      Path p = file.get();
      if (p.toString().endsWith(".json") || (p.toString().endsWith(".csv")
          && Files.isRegularFile(RunReader.sidecarOf(p)))) {
        Run r = RunReader.read(p);
        return new ResolvedRun(r.metadata(), r.data(), r.csv().toString());
      }
      return RunResolver.csvFiles().resolve(reference).orElseThrow();
    }
    if (!Files.isDirectory(archiveDir)) {
      throw new LoadstoneException("no run '" + reference + "': it is not a file, and the "
          + "archive " + archiveDir + " does not exist; give a CSV path or --archive DIR");
    }
    ArchiveIndex.Entry e = ArchiveIndex.load(archiveDir).find(reference);
    Run r = RunReader.read(e.json());
    return new ResolvedRun(r.metadata(), r.data(), r.csv().toString());
  }

  /**
   * The sidecar of a stored run: a run's CSV or JSON path, else a run id, id prefix or specimen
   * id in the archive.
   *
   * @throws LoadstoneException when no stored run matches, or several do
   */
  static Path sidecar(String reference, Path archiveDir) {
    Optional<Path> file = asFile(reference);
    if (file.isPresent()) {
      Path p = file.get();
      Path json = RunReader.sidecarOf(p);
      if (Files.isRegularFile(json)) {
        return json;
      }
      throw new LoadstoneException(p + " is not a stored run (no " + json.getFileName()
          + " beside it): only runs in an archive keep a record to amend; import it first");
    }
    if (!Files.isDirectory(archiveDir)) {
      throw new LoadstoneException("no run '" + reference + "': the archive " + archiveDir
          + " does not exist; give --archive DIR");
    }
    return ArchiveIndex.scan(archiveDir).find(reference).json();
  }

  private static Optional<Path> asFile(String reference) {
    try {
      Path p = Path.of(reference);
      return Files.isRegularFile(p) ? Optional.of(p) : Optional.empty();
    } catch (InvalidPathException e) {
      return Optional.empty();
    }
  }

  /**
   * Stores an imported run in the archive under a fresh id.
   *
   * @return the new run id
   */
  static StoredRun store(ImportedRun run, Path archiveDir) {
    RunMetadata h = run.metadata();
    Instant now = Instant.now();
    try (RunIdClaim id = RunIdClaim.claim(archiveDir, RunIds.base(now, h.specimen()))) {
      RunMetadata m = h.withIdentity(id.id(), h.specimen(), h.group());
      return RunWriter.write(archiveDir, m, run.data());
    }
  }
}
