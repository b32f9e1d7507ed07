package org.loadstone.archive;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.math.BigDecimal;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import org.loadstone.analysis.PositionSource;
import org.loadstone.files.FileLog;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;
import org.loadstone.units.TextFiles;

/**
 * A run's amendment log: {@code <run-id>.amendments.jsonl} beside its two files, one JSON object
 * a line, appended through {@link FileLog} and never rewritten. The run's CSV and sidecar are
 * never touched; {@link RunReader} (and the archive index) apply the log when the run is read,
 * so every face sees the amended values and a retired run is left out of every study.
 *
 * <p>A line: {@code {"amendment_format":1, "amended_at":"…Z", "operator":"…", "reason":"…",
 * "set":{"mass_g":41.2, "width_mm":50.0}, "retired":true, "software_version":"…"}} ({@code set}
 * and {@code retired} each optional). A last line without its line end (a power cut while
 * appending) is ignored; any other line that cannot be read makes the run unreadable, naming
 * the file and the line, rather than showing values the log may not mean.
 */
public final class Amendments {
  /** The file name ending of an amendment log. */
  public static final String SUFFIX = ".amendments.jsonl";

  private static final int FORMAT = 1;

  private Amendments() {}

  /**
   * @param json a run's sidecar ({@code <dir>/<id>.json})
   * @return its amendment log's path (which may not exist)
   */
  public static Path file(Path json) {
    Precondition.notNull(json, "json");
    String n = json.getFileName().toString().replaceFirst("\\.json$", "");
    return json.resolveSibling(n + SUFFIX);
  }

  /**
   * The stored metadata with its amendment log applied; the metadata itself when there is none.
   *
   * @param json the run's sidecar
   * @param stored the sidecar as read
   * @throws LoadstoneException naming the log and the line when the log cannot be read
   */
  static RunMetadata applyLog(Path json, RunMetadata stored) {
    Path log = file(json);
    if (!Files.exists(log)) {
      return stored;
    }
    return apply(stored, parse(log, TextFiles.read(log, "amendment log")), log);
  }

  /**
   * @param log the log file, for messages
   * @param text its content
   * @return its amendments, oldest first
   * @throws LoadstoneException naming the file and the line of a line that cannot be read
   */
  static List<Amendment> parse(Path log, String text) {
    List<Amendment> out = new ArrayList<>();
    String[] lines = text.split("\n", -1);
    for (int i = 0; i < lines.length - 1; i++) { // the last piece has no line end: torn or empty
      if (!lines[i].isBlank()) {
        out.add(fromLine(lines[i], log + " line " + (i + 1)));
      }
    }
    return out;
  }

  /**
   * Applies amendments, oldest first, to the metadata as stored.
   *
   * @param where the log, for messages
   * @throws LoadstoneException when an amended value is not valid for the run
   */
  static RunMetadata apply(RunMetadata stored, List<Amendment> log, Object where) {
    if (log.isEmpty()) {
      return stored;
    }
    ObjectNode tree = RunJson.toTree(stored);
    Amendment retiredBy = null;
    for (Amendment a : log) {
      a.changes().forEach((k, v) -> {
        ObjectNode target = Amendment.GEOMETRY_FIELDS.contains(k)
            ? (ObjectNode) tree.get("geometry") : tree;
        if (v == null) {
          target.remove(k); // an optional value cleared reads as never given
        } else {
          target.set(k, RunJson.LINE.valueToTree(v));
        }
      });
      if (a.retires()) {
        retiredBy = a;
      } else if (a.reinstates()) {
        retiredBy = null;
      }
    }
    RunMetadata amended = RunJson.fromTree(tree, "amendment log " + where, null);
    checkValues(amended);
    return amended.toBuilder()
        .amendments(new RunAmendments(log, changes(stored, amended), retiredBy)).build();
  }

  /**
   * Appends an amendment to a run's log after checking that it applies: the run's files are not
   * touched.
   *
   * @param json the run's sidecar, not null
   * @param a the amendment, not null
   * @return the run's metadata with the whole log applied, this amendment included
   * @throws LoadstoneException when the run cannot be read, the amendment changes nothing the
   *     run does not already say, retires a retired run or reinstates one that is not retired,
   *     gives an invalid value, or the log cannot be written (naming the file and the fix)
   */
  public static RunMetadata append(Path json, Amendment a) {
    Precondition.notNull(json, "json");
    Precondition.notNull(a, "amendment");
    RunMetadata before = RunReader.readMetadata(json);
    RunAmendments was = before.amendments();
    if (a.retires() && was.retired()) {
      throw new LoadstoneException("run " + before.runId() + " is already retired ("
          + was.retiredReason() + ")");
    }
    if (a.reinstates() && !was.retired()) {
      throw new LoadstoneException("run " + before.runId() + " is not retired: there is "
          + "nothing to reinstate");
    }
    Path log = file(json);
    List<Amendment> all = new ArrayList<>(was.log());
    all.add(a);
    RunMetadata stored = was.any() ? RunReader.readStoredMetadata(json)
        : before.toBuilder().amendments(RunAmendments.NONE).build();
    RunMetadata after = apply(stored, all, log);
    if (a.retired() == null && RunJson.toTree(after).equals(RunJson.toTree(before))) {
      throw new LoadstoneException("run " + before.runId() + " already has these values: "
          + "nothing to amend");
    }
    FileLog.append(log, "amendment log",
        (toLine(a) + "\n").getBytes(StandardCharsets.UTF_8));
    return after;
  }

  /** @return the amendment as one line of JSON */
  static String toLine(Amendment a) {
    ObjectNode o = RunJson.LINE.createObjectNode();
    o.put("amendment_format", FORMAT);
    o.put("amended_at", a.at().toString());
    o.put("operator", a.operator());
    o.put("reason", a.reason());
    if (!a.changes().isEmpty()) {
      ObjectNode set = o.putObject("set");
      a.changes().forEach((k, v) -> set.set(k, RunJson.LINE.valueToTree(v)));
    }
    if (a.retired() != null) {
      o.put("retired", a.retired());
    }
    o.put("software_version", a.softwareVersion());
    try {
      return RunJson.LINE.writeValueAsString(o);
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("cannot serialise an amendment", e);
    }
  }

  private static Amendment fromLine(String line, String where) {
    JsonNode o;
    try {
      o = RunJson.LINE.readTree(line);
    } catch (JsonProcessingException e) {
      throw bad(where, "is not JSON (" + e.getOriginalMessage() + ")");
    }
    if (o == null || !o.isObject()) {
      throw bad(where, "is not a JSON object");
    }
    if (o.path("amendment_format").asInt(0) > FORMAT) {
      throw bad(where, "was written by a newer Loadstone (amendment format "
          + o.get("amendment_format") + "); use that version");
    }
    try {
      Map<String, Object> set = new LinkedHashMap<>();
      JsonNode s = o.get("set");
      if (s != null && s.isObject()) {
        s.fields().forEachRemaining(e -> set.put(e.getKey(), value(e.getValue())));
      }
      JsonNode r = o.get("retired");
      return new Amendment(Instant.parse(o.path("amended_at").asText()),
          o.path("operator").asText(""), o.path("reason").asText(""), set,
          r == null || r.isNull() ? null : r.asBoolean(), o.path("software_version").asText(""));
    } catch (LoadstoneException e) {
      throw bad(where, "is invalid: " + e.getMessage());
    } catch (DateTimeParseException e) {
      throw bad(where, "has no valid 'amended_at' time");
    }
  }

  private static Object value(JsonNode v) {
    if (v.isNull()) {
      return null;
    }
    if (v.isNumber()) {
      return v.asDouble();
    }
    if (v.isArray()) {
      List<Object> l = new ArrayList<>();
      ((ArrayNode) v).forEach(e -> l.add(e.isTextual() ? e.asText() : e.toString()));
      return l;
    }
    return v.isTextual() ? v.asText() : v.toString();
  }

  private static LoadstoneException bad(String where, String what) {
    return new LoadstoneException("amendment log " + where + " " + what + ": correct that line "
        + "(keep a copy of the file) or remove the log to see the run as recorded");
  }

  /** Checks the amended values the sidecar reader leaves to others. */
  private static void checkValues(RunMetadata m) {
    if (m.specimen().isBlank()) {
      throw new LoadstoneException("the amended specimen id of run " + m.runId()
          + " is blank: give the right one");
    }
    Object source = m.extra().get(PositionSource.METADATA_KEY);
    if (source != null) {
      PositionSource.parse(source.toString());
    }
  }

  /** @return the editable fields whose value differs between the two */
  static List<RunAmendments.Change> changes(RunMetadata stored, RunMetadata amended) {
    ObjectNode a = RunJson.toTree(stored);
    ObjectNode b = RunJson.toTree(amended);
    List<RunAmendments.Change> out = new ArrayList<>();
    for (String f : List.of("specimen", "group", "tags", "operator", "notes", "mass_g",
        "test_type", "position_source")) {
      add(out, f, a.get(f), b.get(f));
    }
    for (String f : Amendment.GEOMETRY_FIELDS) {
      add(out, f, a.path("geometry").get(f), b.path("geometry").get(f));
    }
    return out;
  }

  private static void add(List<RunAmendments.Change> out, String f, JsonNode was, JsonNode now) {
    if (!Objects.equals(norm(was), norm(now))) {
      out.add(new RunAmendments.Change(f, text(was), text(now)));
    }
  }

  private static JsonNode norm(JsonNode n) {
    return n == null || n.isNull() ? null : n;
  }

  /** @return a value as people read it: numbers without trailing zeros, {@code none} if empty */
  static String text(JsonNode n) {
    if (n == null || n.isNull() || (n.isTextual() && n.asText().isEmpty())) {
      return "none";
    }
    if (n.isNumber()) {
      return new BigDecimal(n.asText()).stripTrailingZeros().toPlainString();
    }
    if (n.isArray()) {
      List<String> l = new ArrayList<>();
      n.forEach(e -> l.add(e.asText()));
      return l.isEmpty() ? "none" : String.join(", ", l);
    }
    return n.asText();
  }
}
