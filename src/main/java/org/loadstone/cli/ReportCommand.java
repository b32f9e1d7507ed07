package org.loadstone.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import org.loadstone.analysis.AnalysisSettings;
import org.loadstone.archive.ArchiveIndex;
import org.loadstone.archive.FinishCause;
import org.loadstone.study.GroupStudy;
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
      "One run: metadata, force curve, results, cautions. With --group: overlays, strip",
      "plots and statistics of archived groups."
    })
public final class ReportCommand implements Callable<Integer> {
  @picocli.CommandLine.Mixin ArchiveOption archive;

  @Parameters(arity = "0..1", paramLabel = "RUN", description = "A run id (or id prefix) in the archive, a run's CSV, or any CSV with columns time_s, force_N, position_mm.")
  String run;

  @Option(names = "--group", split = ",", paramLabel = "G", description = "Groups to compare (comma separated or repeated); one group is compared with all the others.")
  List<String> groups;

  @Option(names = "--out", paramLabel = "FILE.pdf", description = "Target PDF (must not exist).")
  Path out;

  @Option(names = "--png", paramLabel = "FILE.png", description = "Also (or only) write the main chart as a PNG: the force curve of a run, or the overlay of the groups.")
  Path png;

  @Option(names = "--png-size", defaultValue = "1200x800", paramLabel = "WxH", description = "PNG size in pixels (default: ${DEFAULT-VALUE}).")
  String pngSize;

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
    if ((run == null) == (groups == null || groups.isEmpty())) {
      throw new LoadstoneException("give either one RUN or --group G: a run report or a group "
          + "report");
    }
    if (out == null && png == null) {
      throw new LoadstoneException("give --out FILE.pdf, --png FILE.png, or both");
    }
    int[] size = size(pngSize);
    if (run != null) {
      ResolvedRun r = CliWiring.resolve(run, archive.folder());
      RunMetrics m = RunMetrics.of(r.metadata(), r.data());
      if (png != null) {
        PngExport.write(Charts.run(m), png, size[0], size[1]);
        spec.commandLine().getOut().println("chart written to " + png);
      }
      if (out != null) {
        PdfReport.writeRun(m, out);
      }
    } else {
      ArchiveIndex idx = ArchiveIndex.scan(archive.folder());
      List<ArchiveIndex.Entry> broken = idx.entries().stream()
          .filter(e -> e.metadata().cause() == FinishCause.BREAK
              || e.metadata().cause() == FinishCause.IMPORTED)
          .toList();
      Map<String, List<RunMetrics>> all = GroupStudy.load(broken, AnalysisSettings.DEFAULTS);
      Map<String, List<RunMetrics>> chosen = new LinkedHashMap<>();
      for (String g : groups) {
        List<RunMetrics> list = all.entrySet().stream()
            .filter(x -> x.getKey().equalsIgnoreCase(g.trim())).map(Map.Entry::getValue)
            .findFirst().orElseThrow(() -> new LoadstoneException("no runs of group '" + g
                + "' in " + idx.folder() + ": groups there are " + all.keySet()));
        chosen.put(g.trim(), list);
      }
      if (chosen.size() == 1) {
        all.forEach((k, v) -> chosen.putIfAbsent(k, v));
      }
      String title = "Comparison of " + String.join(", ", new ArrayList<>(chosen.keySet()));
      if (png != null) {
        PngExport.write(Charts.overlay(title, chosen), png, size[0], size[1]);
        spec.commandLine().getOut().println("chart written to " + png);
      }
      if (out != null) {
        PdfReport.writeGroups(title, chosen, PdfReport.DEFAULT_METRICS, out);
      }
    }
    if (out != null) {
      spec.commandLine().getOut().println("report written to " + out);
    }
    spec.commandLine().getOut().flush();
    return 0;
  }
}
