package org.loadstone.report;

import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.loadstone.archive.RunMetadata;
import org.loadstone.study.RunConcerns;

/**
 * Blocks every report carries: the warning banner on the first page, the cautions, the
 * traceability tables and, last, the approval block.
 */
final class ReportParts {
  private ReportParts() {}

  /** Most run ids named on one line of a group report's banner; the tables name the rest. */
  static final int IDS_PER_LINE = 6;

  /** The banner of one run: every concern, gravest first; nothing when there is none. */
  static void banner(PdfLayout p, RunMetadata md) {
    List<String[]> lines = new ArrayList<>();
    for (RunConcerns.Concern c : RunConcerns.of(md)) {
      lines.add(new String[] {c.kind().words(), c.text()});
    }
    if (!lines.isEmpty()) {
      p.box("Read before using these figures", lines, PdfLayout.ALERT_TONE, 8.5f);
    }
  }

  /**
   * The banner of a group report: per kind of concern, how many counted runs have it and which
   * (the first few by run id); nothing when no counted run has any.
   */
  static void banner(PdfLayout p, List<RunMetadata> counted) {
    List<String[]> lines = new ArrayList<>();
    RunConcerns.byKind(counted).forEach((kind, list) -> {
      Map<String, String> runs = new LinkedHashMap<>();
      list.forEach(c -> runs.putIfAbsent(c.runId(), c.text()));
      List<String> ids = new ArrayList<>(runs.keySet());
      String named = String.join(", ", ids.subList(0, Math.min(IDS_PER_LINE, ids.size())))
          + (ids.size() > IDS_PER_LINE ? " and " + (ids.size() - IDS_PER_LINE) + " more" : "");
      String first = runs.values().iterator().next();
      lines.add(new String[] {kind.words(), ids.size() + (ids.size() == 1 ? " run" : " runs")
          + " counted (" + named + ")" + (ids.size() == 1 || kind == RunConcerns.Kind.WARNING
              ? ": " + first : ": " + first + ", and alike")});
    });
    if (!lines.isEmpty()) {
      p.box("Read before using these figures", lines, PdfLayout.ALERT_TONE, 8.5f);
    }
  }

  /**
   * Traceability: what made the report and when, where the runs came from, and the calibration
   * of every run by id and content hash.
   *
   * @param source where the runs were read from (an archive folder or a file)
   * @param runs the runs reported
   * @param made when the report was made
   */
  static void traceability(PdfLayout p, String source, List<RunMetadata> runs, Instant made) {
    p.heading("Traceability", 90);
    List<String[]> rows = new ArrayList<>();
    rows.add(new String[] {"report made", RunFacts.when(made) + " by " + PdfReport.producer()});
    rows.add(new String[] {"runs read from", source});
    List<String> versions = runs.stream().map(RunMetadata::softwareVersion)
        .map(v -> v == null || v.isBlank() ? "unknown" : v).distinct().toList();
    rows.add(new String[] {"runs recorded with", "Loadstone " + String.join(", ", versions)});
    p.table(new String[] {"item", "value"}, rows, new float[] {0.25f, 0.75f}, 8);
    Map<String, String> hashes = new LinkedHashMap<>();
    Map<String, Integer> uses = new LinkedHashMap<>();
    for (RunMetadata md : runs) {
      String id = calibration(md);
      hashes.putIfAbsent(id, md.calibrationSha256() == null ? "-" : md.calibrationSha256());
      uses.merge(id, 1, Integer::sum);
    }
    List<String[]> cal = new ArrayList<>();
    hashes.forEach((id, h) -> cal.add(new String[] {id, h, Integer.toString(uses.get(id))}));
    p.table(new String[] {"calibration", "content SHA-256", "runs"}, cal,
        new float[] {0.26f, 0.64f, 0.1f}, 7.5f);
  }

  /** @return the run's calibration id, or "none (nominal scale)" */
  static String calibration(RunMetadata md) {
    return md.calibrationId() == null || md.calibrationId().isBlank() ? "none (nominal scale)"
        : md.calibrationId();
  }

  /** @return the first 12 hex digits of the run's calibration hash, or "-" */
  static String shortHash(RunMetadata md) {
    String h = md.calibrationSha256();
    return h == null || h.isBlank() ? "-" : h.substring(0, Math.min(12, h.length()));
  }

  /** Approval: tested by (the operators named in the runs), checked by, date. */
  static void approval(PdfLayout p, List<RunMetadata> runs) {
    String operators = String.join(", ", runs.stream().map(RunMetadata::operator)
        .filter(o -> !o.isBlank()).distinct().toList());
    p.heading("Approval", 70);
    p.signatures(List.of(new String[] {"Tested by", operators.isEmpty() ? ""
        : "runs recorded by " + operators, "name, signature"},
        new String[] {"Checked by", "", "name, signature"},
        new String[] {"Date", "", "date of approval"}), 9);
  }

  /** The note on missing glyphs (when needed) and the cautions box, before traceability. */
  static void close(PdfLayout p) {
    p.glyphNote();
    p.cautionBox("Cautions", PdfReport.CAUTIONS, 8.5f);
  }
}
