package org.loadstone.cli;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.loadstone.archive.ArchiveIndex;
import org.loadstone.archive.RunMetadata;

/**
 * The JSON views of results that have none in the core, one per type, shared by every command
 * that shows one (the core's own: {@code RunMetrics.toJsonMap}, {@code StudyResult.toJsonView},
 * {@code LeftOut.toJsonView}, {@code CalibrationService.summary}). Field names follow the
 * vocabulary in {@code schema/} beside {@link JsonDocument}.
 */
final class JsonViews {
  private JsonViews() {}

  /** @return a run of the archive as listed: identity, end, start and files */
  static Map<String, Object> run(ArchiveIndex.Entry e) {
    RunMetadata m = e.metadata();
    Map<String, Object> row = new LinkedHashMap<>();
    row.put("run_id", m.runId());
    row.put("specimen", m.specimen());
    row.put("group", m.group());
    row.put("tags", m.tags());
    row.put("cause", m.cause().wireName());
    row.put("started_at", m.startedAt().toString());
    row.put("calibration_id", m.calibrationId());
    row.put("amendment_count", m.amendments().log().size());
    row.put("retired", m.amendments().retired());
    row.put("csv_file", e.csv().toString());
    row.put("sidecar_file", e.json().toString());
    row.put("samples_problem", e.samplesProblem());
    return row;
  }

  /** @return a stored run's id and files */
  static Map<String, Object> stored(String runId, Path csv, Path sidecar) {
    Map<String, Object> m = new LinkedHashMap<>();
    m.put("run_id", runId);
    m.put("csv_file", csv.toString());
    m.put("sidecar_file", sidecar.toString());
    return m;
  }

  /** @return the path as text, or null */
  static String path(Path p) {
    return p == null ? null : p.toString();
  }

  /** @return the lowest and highest value, or null for none */
  static List<Double> range(double[] v) {
    if (v == null || v.length == 0) {
      return null;
    }
    double lo = Double.POSITIVE_INFINITY;
    double hi = Double.NEGATIVE_INFINITY;
    for (double x : v) {
      lo = Math.min(lo, x);
      hi = Math.max(hi, x);
    }
    return List.of(lo, hi);
  }
}
