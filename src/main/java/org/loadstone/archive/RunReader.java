package org.loadstone.archive;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.io.Reader;
import java.nio.file.Files;
import java.nio.file.Path;
import org.loadstone.units.InputException;
import org.loadstone.units.JsonInput;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.TextFiles;
import org.loadstone.units.Precondition;

/** Reads a stored run back, checking it strictly. */
public final class RunReader {
  private RunReader() {}

  /**
   * @param csvOrJsonOrStem {@code <dir>/<id>.csv}, {@code <dir>/<id>.json} or {@code <dir>/<id>}
   * @return the run, its metadata amended by its amendment log when it has one ({@link
   *     Amendments}); unknown CSV columns are ignored, unknown JSON fields kept in {@code extra}
   * @throws LoadstoneException when a file is missing or invalid: the message names the file,
   *     and for the CSV the line and column (missing cells, non-numbers, NaN, time out of order)
   */
  public static Run read(Path csvOrJsonOrStem) {
    org.loadstone.units.SlowWork.check("reading a run");
    Precondition.notNull(csvOrJsonOrStem, "csvOrJsonOrStem");
    Path stem = stem(csvOrJsonOrStem);
    String name = stem.getFileName().toString();
    Path csv = stem.resolveSibling(name + ".csv");
    Path json = stem.resolveSibling(name + ".json");
    RunMetadata meta = readMetadata(json);
    if (!Files.exists(csv)) {
      throw missing(csv, json);
    }
    return new Run(meta, samplesOf(meta, csv, json), csv, json);
  }

  /** The samples of a run whose metadata is read, checked against it (its break index). */
  private static RunData samplesOf(RunMetadata meta, Path csv, Path json) {
    RunData data;
    try {
      data = readSamples(csv);
    } catch (IOException e) {
      throw TextFiles.unreadable(csv, "run file", e);
    }
    if (meta.breakIndex() != null && meta.breakIndex() >= data.size()) {
      throw new LoadstoneException("run file " + json + ": field 'break_index' is "
          + meta.breakIndex() + " but " + csv.getFileName() + " has only " + data.size()
          + " samples: the two files do not belong together; restore them from a backup");
    }
    return data;
  }

  /**
   * Whether a run's samples can be read as {@link #read} reads them (every cell checked, the
   * break index within the samples); the archive index keeps the answer while the files stay
   * as they were, so a listing finds a damaged run without reading it again.
   *
   * @param meta the run's metadata, already read from {@code json}
   * @param json the run's sidecar
   * @return null when the samples read; else what is wrong with them (naming the file, and the
   *     line and column where there is one) and the fix
   */
  public static String samplesProblem(RunMetadata meta, Path json) {
    Path csv = stem(json).resolveSibling(stem(json).getFileName() + ".csv");
    if (!Files.exists(csv)) {
      return "its samples file " + csv.getFileName() + " is missing beside "
          + json.getFileName() + ": restore it from a backup";
    }
    try {
      samplesOf(meta, csv, json);
      return null;
    } catch (LoadstoneException e) {
      return e.getMessage();
    }
  }

  /**
   * The samples: the fast reader for the writer's own format, the strict reader for anything
   * else (and for every fault, so that the message names the line and column).
   */
  static RunData readSamples(Path csv) throws IOException {
    RunData fast = RunCsvFast.read(csv);
    return fast != null ? fast : readStrict(csv);
  }

  /** The reference path: Commons CSV and a check of every cell. */
  static RunData readStrict(Path csv) throws IOException {
    try (Reader r = TextFiles.open(csv, "run file")) {
      return RunCsv.read(r, csv);
    }
  }

  /**
   * @param json a sidecar file
   * @return its metadata, amended by the run's amendment log when it has one ({@link
   *     Amendments})
   * @throws LoadstoneException naming the file and the field (or the log and the line) when
   *     missing or invalid
   */
  public static RunMetadata readMetadata(Path json) {
    return Amendments.applyLog(json, readStoredMetadata(json));
  }

  /**
   * The sidecar exactly as stored, without its amendments (see {@link Amendments}).
   *
   * @param json a sidecar file
   * @throws LoadstoneException naming the file and the field when missing or invalid
   */
  public static RunMetadata readStoredMetadata(Path json) {
    if (!Files.exists(json)) {
      throw missing(json, json);
    }
    return metadataFromText(json, TextFiles.read(json, "run file"));
  }

  /**
   * The sidecar from text already read from {@code json} (the archive index keeps it), checked
   * exactly as {@link #readMetadata} checks the file.
   *
   * @throws LoadstoneException naming the file and the field when invalid
   */
  static RunMetadata metadataFromText(Path json, String text) {
    JsonNode root = JsonInput.parseObject(text, InputException.in("run file", json),
        "correct the file (keep a copy) or restore it from a backup");
    return RunJson.fromTree(root, "run file " + json, null);
  }

  /**
   * @param csvOrJson a stored run's CSV or sidecar
   * @return the run's JSON sidecar beside it (whether or not it exists)
   */
  public static Path sidecarOf(Path csvOrJson) {
    Path stem = stem(csvOrJson);
    return stem.resolveSibling(stem.getFileName() + ".json");
  }

  private static Path stem(Path p) {
    String n = p.getFileName() == null ? "" : p.getFileName().toString();
    if (n.endsWith(".csv")) {
      return p.resolveSibling(n.substring(0, n.length() - 4));
    }
    if (n.endsWith(".json")) {
      return p.resolveSibling(n.substring(0, n.length() - 5));
    }
    if (n.isEmpty()) {
      throw new LoadstoneException("'" + p + "' names no run: give <id>.csv, <id>.json or <id>");
    }
    return p;
  }

  private static LoadstoneException missing(Path which, Path json) {
    return new LoadstoneException("run file " + which + " does not exist: check the path (a run"
        + " is stored as <id>.csv with <id>.json beside it)");
  }
}
