package org.loadstone.cli;

import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.loadstone.archive.RunMetrics;
import org.loadstone.cli.RunResolver.ResolvedRun;
import org.loadstone.report.PdfReport;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code loadstone report}: the PDF report of one run. */
@Command(
    name = "report",
    description = {"Write the PDF report of one run: metadata, force curve, results, cautions."})
public final class ReportCommand implements Callable<Integer> {
  @Parameters(paramLabel = "RUN", description = "The run's CSV file.")
  String run;

  @Option(names = "--out", required = true, paramLabel = "FILE.pdf", description = "Target PDF (must not exist).")
  Path out;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public Integer call() {
    ResolvedRun r = CliWiring.resolve(run);
    PdfReport.writeRun(RunMetrics.of(r.metadata(), r.data()), out);
    spec.commandLine().getOut().println("report written to " + out);
    spec.commandLine().getOut().flush();
    return 0;
  }
}
