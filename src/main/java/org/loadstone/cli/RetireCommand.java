package org.loadstone.cli;

import java.time.Instant;
import java.util.Map;
import java.util.concurrent.Callable;
import org.loadstone.archive.Amendment;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code loadstone retire}: takes a bad run out of every study, keeping its files. */
@Command(
    name = "retire",
    description = {
      "Retire a run: it stays in the archive but no study, comparison or report counts it.",
      "",
      "Nothing is deleted: the retirement and its reason are appended to the run's amendment "
          + "log; --undo reinstates the run the same way."
    })
public final class RetireCommand implements Callable<Integer> {
  @Mixin ArchiveOption archive;

  @Parameters(paramLabel = "RUN", description = "A run id, the start of one, or a specimen id in the archive.")
  String run;

  @Option(names = "--reason", paramLabel = "TEXT", required = true, description = "Why (kept with the run, shown where it is left out).")
  String reason;

  @Option(names = "--undo", description = "Reinstate a retired run instead.")
  boolean undo;

  @Option(names = "--by", paramLabel = "NAME", defaultValue = "", description = "Who retires it.")
  String by;

  @Option(names = "--json", description = "Write the run's record as one JSON document on standard output (schema loadstone-retire); the text goes to standard error.")
  boolean json;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public Integer call() throws Exception {
    return AmendCommand.amend(spec, archive, run, new Amendment(Instant.now(), by, reason,
        Map.of(), !undo, LoadstoneCommand.softwareVersion()), json);
  }
}
