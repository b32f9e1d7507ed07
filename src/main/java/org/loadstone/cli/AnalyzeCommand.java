package org.loadstone.cli;

import java.io.PrintWriter;
import java.util.Locale;
import java.util.Map;
import java.nio.file.Path;
import org.loadstone.acquire.ScaleChoice;
import org.loadstone.analysis.position.PositionTable;
import org.loadstone.study.FrameProfile;
import org.loadstone.intake.PositionTableCsv;
import org.loadstone.study.RunAdjust;
import org.loadstone.study.RunEnd;
import org.loadstone.units.DurationUnit;
import org.loadstone.units.LengthUnit;
import java.util.concurrent.Callable;
import org.loadstone.analysis.AnalysisSettings;
import org.loadstone.study.Metric;
import org.loadstone.study.RunMetrics;
import org.loadstone.cli.RunResolver.ResolvedRun;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code loadstone analyze}: peak, break, stiffness, energy and geometry values of one run. */
@Command(
    name = "analyze",
    description = {
      "Analyse one run: peak force, break, stiffness and energy.",
      "Flexural and sandwich values follow when the run's geometry is known. RUN is a CSV "
          + "with columns time_s, force_N and (optionally) position_mm."
    })
public final class AnalyzeCommand implements Callable<Integer> {
  @picocli.CommandLine.Mixin ArchiveOption archive;

  @Parameters(paramLabel = "RUN", description = "A run id (or id prefix) in the archive, a run's CSV, or any CSV with columns time_s, force_N, position_mm.")
  String run;

  @picocli.CommandLine.Mixin StiffnessOptions stiffness;

  @picocli.CommandLine.Mixin CrushOptions crush;

  @Option(names = "--cal", paramLabel = "FILE", description = "Derive force again from the raw counts with this calibration (the stored run is not changed).")
  Path cal;

  @Option(names = "--accept-changed-calibration", description = "Use the --cal calibration even though its content changed since it was saved (refused otherwise).")
  boolean acceptChanged;

  @Option(names = "--crosshead-rate-mm-per-min", paramLabel = "MM-PER-MIN", description = "Position from a constant crosshead rate, for runs without a position channel.")
  Double crossheadRate;

  @Option(names = "--position-table", paramLabel = "FILE", description = "Position from a position-time CSV (video tracking, dial gauge), aligned by the break unless --table-offset-s is given.")
  Path table;

  @Option(names = "--video-table", paramLabel = "FILE", description = "Position from a video table written by 'loadstone track' (its sidecar gives the scale and the sync). Without this or another position source, a table stored beside the run is used.")
  Path videoTable;

  @Option(names = "--no-video", description = "Do not use a video table stored beside the run.")
  boolean noVideo;

  @Option(names = "--table-map", paramLabel = "MAP", defaultValue = "time=1,position=2", description = "Columns of the position table by header or 1-based number (default: ${DEFAULT-VALUE}).")
  String tableMap;

  @Option(names = "--table-time-unit", paramLabel = "UNIT", defaultValue = "s", description = "Time unit of the position table: s, ms or min (default: ${DEFAULT-VALUE}).")
  String tableTimeUnit;

  @Option(names = "--table-length-unit", paramLabel = "UNIT", defaultValue = "mm", description = "Length unit of the position table: mm, um, cm, m or in (default: ${DEFAULT-VALUE}).")
  String tableLengthUnit;

  @Option(names = "--table-decimal", defaultValue = ".", paramLabel = "MARK", description = "Decimal mark of the position table: '.' or ',' (default: ${DEFAULT-VALUE}).")
  String tableDecimal;

  @Option(names = "--table-offset-s", paramLabel = "S", description = "Table time minus run time, s (default: found from the break).")
  Double tableOffset;

  @Option(names = "--position-measures", paramLabel = "WHERE", description = "What the position "
      + "measures: crosshead, mid-span-gauge, video-load-point or video-mid-span (default: as "
      + "recorded, else crosshead); decides the four-point deflection formula.")
  String positionMeasures;

  @Option(names = "--frame", paramLabel = "FILE", description = "Remove the load frame's deflection F/k with this frame profile (see 'loadstone frame').")
  Path frame;

  @Option(names = "--frame-stiffness-n-per-mm", paramLabel = "N-PER-MM", description = "The load frame's stiffness: its deflection, F/K, is taken off the position.")
  Double frameK;

  @Option(names = "--json", description = "Write the results as one JSON document on standard output (schema loadstone-analyze); the text goes to standard error.")
  boolean json;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  private final java.util.List<String> warnings = new java.util.ArrayList<>();
  private String usedVideo;

  private RunAdjust adjust(RunAdjust a, ResolvedRun r) {
    if (cal != null) {
      ScaleChoice c = ScaleChoice.fromCalibration(cal, java.time.LocalDate.now(), acceptChanged);
      warnings.addAll(c.warnings());
      a = a.recalibrated(c.spec(), c.calibrationId(), c.calibrationSha256());
    }
    if (crossheadRate != null && table != null) {
      throw new org.loadstone.units.LoadstoneException("--crosshead-rate-mm-per-min and "
          + "--position-table are two position sources: give one");
    }
    if (crossheadRate != null) {
      a = a.withCrossheadRate(crossheadRate);
    }
    if (table != null) {
      Map<String, String> cols = new java.util.HashMap<>();
      for (String part : tableMap.split(",")) {
        String[] kv = part.split("=", 2);
        if (kv.length != 2 || !(kv[0].trim().equals("time") || kv[0].trim().equals("position"))) {
          throw new org.loadstone.units.LoadstoneException("--table-map '" + tableMap
              + "': use time=COLUMN,position=COLUMN (header names or 1-based numbers)");
        }
        cols.put(kv[0].trim(), kv[1].trim());
      }
      PositionTable t = PositionTableCsv.read(table, cols.getOrDefault("time", "1"),
          cols.getOrDefault("position", "2"), DurationUnit.parse(tableTimeUnit),
          LengthUnit.parse(tableLengthUnit),
          ImportCommand.decimalMark(tableDecimal, "--table-decimal") == ',');
      a = a.withPositionTable(t, tableOffset);
    }
    if (videoTable != null && (table != null || crossheadRate != null)) {
      throw new org.loadstone.units.LoadstoneException("--video-table is a position source of "
          + "its own: give it without --position-table or --crosshead-rate-mm-per-min");
    }
    Path video = videoTable;
    if (video == null && !noVideo && table == null && crossheadRate == null
        && !a.data().hasPosition()) {
      video = storedVideoTable(r);
    }
    if (video != null) {
      org.loadstone.video.VideoTable vt = org.loadstone.video.VideoTableFiles.read(video);
      a = org.loadstone.study.VideoPosition.apply(a, vt);
      usedVideo = String.format(Locale.ROOT, "position from the video table %s (%.6g mm/px "
          + "± %.2f %%, %s)", video, vt.scale().mm_per_px(),
          100 * vt.scale().relativeUncertainty(),
          vt.sync() == null ? "synchronised by the break" : "sync by " + vt.sync().method());
    }
    if (positionMeasures != null) {
      a = a.positionMeasures(org.loadstone.analysis.PositionSource.parse(positionMeasures));
    }
    if (frame != null && frameK != null) {
      throw new org.loadstone.units.LoadstoneException("give --frame or "
          + "--frame-stiffness-n-per-mm, not both");
    }
    if (frame != null) {
      FrameProfile p = FrameProfile.read(frame);
      a = a.complianceCorrected(p.frameStiffness_N_per_mm(), "frame profile " + p.id());
    } else if (frameK != null) {
      a = a.complianceCorrected(frameK, "given");
    }
    return a;
  }

  private static Path storedVideoTable(ResolvedRun r) {
    try {
      Path dir = Path.of(r.source()).toAbsolutePath().getParent();
      return dir == null ? null
          : org.loadstone.video.VideoTableFiles.storedFor(dir, r.metadata().runId());
    } catch (java.nio.file.InvalidPathException e) {
      return null;
    }
  }

  @Override
  public Integer call() throws Exception {
    AnalysisSettings settings = crush.apply(stiffness.apply(AnalysisSettings.DEFAULTS));
    ResolvedRun r = CliWiring.resolve(run, archive.folder());
    RunAdjust adj = adjust(RunAdjust.of(r.metadata(), r.data()), r);
    RunMetrics m = RunMetrics.of(adj.metadata(), adj.data(), settings);
    PrintWriter out = JsonDocument.human(spec, json);
    out.printf(Locale.ROOT, "run %s, specimen %s, %d samples (%s)%n", m.metadata().runId(),
        m.metadata().specimen(), m.analysis().sampleCount(), r.source());
    out.printf(Locale.ROOT, "  %-28s %s%n", "how it ended", RunEnd.words(m.metadata()));
    for (Metric metric : Metric.values()) {
      java.util.OptionalDouble v = metric.of(m);
      out.printf(Locale.ROOT, "  %-28s %14s %s%n", metric.label(), metric.format(v),
          v.isPresent() ? metric.unit() : "");
    }
    m.analysis().stiffness().ifPresent(s -> out.printf(Locale.ROOT, "  %-28s %14s%n",
        "stiffness chosen by", s.method().words()));
    for (String w : warnings) {
      out.println("warning: " + w);
    }
    if (usedVideo != null) {
      out.println("derived: " + usedVideo);
    }
    for (String note : adj.notes()) {
      out.println("derived: " + note);
    }
    if (r.metadata().amendments().any()) {
      out.println(r.metadata().amendments().summary());
    }
    for (String note : m.notes()) {
      out.println("note: " + note);
    }
    if (json) {
      Map<String, Object> j = new java.util.LinkedHashMap<>(m.toJsonMap());
      java.util.List<String> derived = new java.util.ArrayList<>();
      if (usedVideo != null) {
        derived.add(usedVideo);
      }
      derived.addAll(adj.notes());
      j.put("cause", m.metadata().cause().wireName());
      j.put("how_it_ended", RunEnd.words(m.metadata()));
      j.put("derived", derived);
      j.put("calibration_id", adj.metadata().calibrationId());
      j.put("calibration_sha256", adj.metadata().calibrationSha256());
      j.put("source_file", r.source());
      j.put("warnings", warnings);
      j.put("amended", r.metadata().amendments().changes().stream()
          .map(org.loadstone.archive.RunAmendments.Change::line).toList());
      j.put("retired", r.metadata().amendments().retired());
      JsonDocument.write(spec.commandLine().getOut(), JsonDocument.Kind.ANALYZE, j);
    }
    out.flush();
    return 0;
  }
}
