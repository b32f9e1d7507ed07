package org.loadstone.cli;

import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.loadstone.cli.RunResolver.ResolvedRun;
import org.loadstone.report.CsvExport;
import org.loadstone.units.LoadstoneException;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code loadstone export}: a run's samples as CSV for a spreadsheet. */
@Command(
    name = "export",
    description = {
      "Write a run's samples as CSV for a spreadsheet.",
      "Choose the delimiter and decimal mark, e.g. --delimiter ';' --decimal ',' for "
          + "comma-decimal locales."
    })
public final class ExportCommand implements Callable<Integer> {
  @picocli.CommandLine.Mixin ArchiveOption archive;

  @Parameters(paramLabel = "RUN", description = "A run id (or id prefix) in the archive, a run's CSV, or any CSV with columns time_s, force_N, position_mm.")
  String run;

  @Option(names = "--out", required = true, paramLabel = "FILE", description = "Target file (must not exist).")
  Path out;

  @Option(names = "--delimiter", defaultValue = ",", paramLabel = "MARK", description = "Field delimiter: ',', ';' or tab (default: ${DEFAULT-VALUE}).")
  String delimiter;

  @Option(names = "--decimal", defaultValue = ".", paramLabel = "MARK", description = "Decimal mark: '.' or ',' (default: ${DEFAULT-VALUE}).")
  String decimal;

  @Option(names = "--json", description = "Write what was written as one JSON document on standard output (schema loadstone-export); the text goes to standard error.")
  boolean json;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public Integer call() {
    ResolvedRun r = CliWiring.resolve(run, archive.folder());
    CsvExport.write(r.data(), out, mark(delimiter, "--delimiter"),
        ImportCommand.decimalMark(decimal, "--decimal"));
    java.io.PrintWriter h = JsonDocument.human(spec, json);
    h.println("written " + r.data().size() + " samples to " + out);
    h.flush();
    if (json) {
      java.util.Map<String, Object> m = new java.util.LinkedHashMap<>();
      m.put("run_id", r.metadata().runId());
      m.put("sample_count", r.data().size());
      m.put("out_file", out.toString());
      JsonDocument.write(spec.commandLine().getOut(), JsonDocument.Kind.EXPORT, m);
    }
    return 0;
  }

  /** Reads a one-character mark; {@code tab} or {@code \t} is a tab. */
  static char mark(String text, String option) {
    if (text.equalsIgnoreCase("tab") || text.equals("\\t")) {
      return '\t';
    }
    if (text.length() != 1) {
      throw new LoadstoneException(option + " '" + text + "' is not one character; give e.g. ';', "
          + "',' or tab.");
    }
    return text.charAt(0);
  }
}
