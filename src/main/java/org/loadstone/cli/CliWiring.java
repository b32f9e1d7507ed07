package org.loadstone.cli;

import java.util.Optional;
import org.loadstone.cli.RunResolver.ResolvedRun;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * The services the run commands use, replaceable at start-up (before the command line runs):
 * how a run reference is resolved and where an imported run is stored.
 */
public final class CliWiring {
  private CliWiring() {}

  private static volatile RunResolver resolver = RunResolver.csvFiles();
  private static volatile RunSink sink;

  /** Uses another resolver, e.g. {@code archiveLookup.orElse(RunResolver.csvFiles())}. */
  public static void useResolver(RunResolver r) {
    resolver = Precondition.notNull(r, "resolver");
  }

  /** Uses a sink for {@code loadstone import}; {@code null} for none. */
  public static void useSink(RunSink s) {
    sink = s;
  }

  static Optional<RunSink> sink() {
    return Optional.ofNullable(sink);
  }

  /** @throws LoadstoneException when no resolver knows the reference */
  static ResolvedRun resolve(String reference) {
    return resolver.resolve(reference).orElseThrow(() -> new LoadstoneException(
        "No run '" + reference + "': it is not a readable file. Give the path of a CSV with "
            + "columns time_s, force_N and (optionally) position_mm."));
  }
}
