package org.loadstone.cli;

import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.loadstone.analysis.stats.GroupComparison;
import org.loadstone.study.ArchiveRuns;
import org.loadstone.study.GroupStudy;
import org.loadstone.study.LeftOut;
import org.loadstone.study.Selection;
import org.loadstone.study.RunMetrics;
import org.loadstone.cli.RunResolver.ResolvedRun;
import org.loadstone.report.Charts;
import org.loadstone.report.PdfReport;
import org.loadstone.report.PngExport;
import org.loadstone.units.LoadstoneException;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code loadstone report}: the PDF of one run, or of a comparison of groups. */
@Command(
    name = "report",
    description = {
      "Write a PDF report of one run, or of a comparison of groups.",
      "",
      "One run: metadata, force curve, results, cautions. With --group: overlays, strip "
          + "plots and statistics of archived groups."
    })
public final class ReportCommand implements Callable<Integer> {
  @picocli.CommandLine.Mixin ArchiveOption archive;

  @Parameters(arity = "0..1", paramLabel = "RUN", description = "A run id (or id prefix) in the archive, a run's CSV, or any CSV with columns time_s, force_N, position_mm.")
  String run;

  @picocli.CommandLine.Mixin SelectionOptions select;

  @Option(names = "--out", paramLabel = "FILE.pdf", description = "Target PDF (must not exist).")
  Path out;

  @Option(names = "--png", paramLabel = "FILE.png", description = "Also (or only) write the main chart as a PNG: the force curve of a run, or the overlay of the groups.")
  Path png;

  @Option(names = "--png-size", defaultValue = "1200x800", paramLabel = "SIZE", description = "PNG size, width x height in pixels (default: ${DEFAULT-VALUE}).")
  String pngSize;

  @Option(names = "--json", description = "Write what was written as one JSON document on standard output (schema loadstone-report); the text goes to standard error.")
  boolean json;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  private static int[] size(String text) {
    java.util.regex.Matcher m = java.util.regex.Pattern.compile("([1-9][0-9]{1,4})x([1-9][0-9]{1,4})")
        .matcher(text.trim());
    if (!m.matches()) {
      throw new LoadstoneException("--png-size '" + text + "': use WIDTHxHEIGHT in pixels, e.g. "
          + "1200x800");
    }
    return new int[] {Integer.parseInt(m.group(1)), Integer.parseInt(m.group(2))};
  }

  @Override
  public Integer call() {
    if ((run == null) == (select.groups == null || select.groups.isEmpty())) {
      throw new LoadstoneException("give either one RUN or --group G: a run report or a group "
          + "report");
    }
    if (out == null && png == null) {
      throw new LoadstoneException("give --out FILE.pdf, --png FILE.png, or both");
    }
    int[] size = size(pngSize);
    java.io.PrintWriter h = JsonDocument.human(spec, json);
    java.util.Map<String, Object> doc = new java.util.LinkedHashMap<>();
    if (run != null) {
      ResolvedRun r = CliWiring.resolve(run, archive.folder());
      RunMetrics m = RunMetrics.of(r.metadata(), r.data());
      doc.put("run_id", r.metadata().runId());
      doc.put("groups", java.util.List.of());
      doc.put("left_out", java.util.List.of());
      if (png != null) {
        PngExport.write(Charts.run(m), png, size[0], size[1]);
        h.println("chart written to " + png);
      }
      if (out != null) {
        PdfReport.writeRun(m, r.source(), out);
      }
    } else {
      ArchiveRuns runs = ArchiveRuns.scan(archive.folder());
      runs.notes().forEach(n -> spec.commandLine().getErr().println("note: " + n));
      Selection sel = runs.select(select.selection(),
          ProgressLine.onStderr(spec.commandLine().getErr(), "analysing runs"));
      GroupStudy.Report study;
      try {
        study = GroupStudy.compareEach(sel, PdfReport.DEFAULT_METRICS,
            GroupComparison.DEFAULT_TARGET_DIFFERENCE);
      } catch (LoadstoneException e) {
        throw new LoadstoneException(e.getMessage()
            + SelectionOptions.includeHint(sel.leftOut()), e,
            e.settings().toArray(new org.loadstone.units.Setting[0]));
      }
      String title = "Comparison of " + String.join(", ", sel.groups().keySet());
      doc.put("run_id", null);
      doc.put("groups", java.util.List.copyOf(sel.groups().keySet()));
      doc.put("left_out", sel.leftOut().stream().map(LeftOut::toJsonView).toList());
      if (png != null) {
        PngExport.write(Charts.overlay(title, sel.groups()), png, size[0], size[1]);
        h.println("chart written to " + png);
      }
      if (out != null) {
        PdfReport.writeGroups(title, study, out);
      }
      for (org.loadstone.study.LeftOut l : sel.leftOut()) {
        h.println("left out: " + l.line());
      }
      if (!sel.leftOut().isEmpty()) {
        h.println(GroupStudy.leftOutSummary(sel.leftOut())
            + (out != null ? ", listed in the report" : "")
            + SelectionOptions.includeHint(sel.leftOut()));
      }
    }
    if (out != null) {
      h.println("report written to " + out);
    }
    h.flush();
    if (json) {
      doc.put("pdf_file", JsonViews.path(out));
      doc.put("png_file", JsonViews.path(png));
      JsonDocument.write(spec.commandLine().getOut(), JsonDocument.Kind.REPORT, doc);
    }
    return 0;
  }
}
