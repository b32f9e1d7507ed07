package org.loadstone.cli;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.Collection;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import picocli.CommandLine;

/**
 * The one way a command writes JSON. With {@code --json} a command writes exactly one document on
 * standard output (a stream, {@code monitor}, writes JSON Lines: one document a line) and
 * everything meant for a person on standard error. Every document starts with {@code schema}
 * ({@code name}, {@code version}) and the software {@code version}; its fields are described by
 * {@code schema/NAME.schema.json} beside this class (JSON Schema 2020-12), the one place the
 * vocabulary is written down. Numbers that are not finite are written as null.
 */
final class JsonDocument {
  /** The documents, one per command that has {@code --json}. */
  enum Kind {
    PORTS, MONITOR, SIMULATE, RECORD, CALIBRATE, VERIFY, RUNS, COMPARE, ANALYZE, IMPORT, EXPORT,
    REPORT, FRAME, AMEND, RETIRE, CONFIG, TRACK;

    /** Version of every document's field list; raised when a field is renamed or removed. */
    static final int VERSION = 1;

    /** @return the schema's name, e.g. {@code loadstone-analyze} */
    String schemaName() {
      return "loadstone-" + name().toLowerCase(Locale.ROOT);
    }

    /** @return the schema file's resource path, relative to this class */
    String resource() {
      return "schema/" + name().toLowerCase(Locale.ROOT) + ".schema.json";
    }
  }

  private static final ObjectMapper MAPPER = new ObjectMapper();

  private JsonDocument() {}

  /**
   * @param spec the command
   * @param json whether {@code --json} was given
   * @return where text for a person goes: standard error with {@code --json}, else standard
   *     output
   */
  static PrintWriter human(CommandLine.Model.CommandSpec spec, boolean json) {
    return json ? spec.commandLine().getErr() : spec.commandLine().getOut();
  }

  /**
   * Writes one document on one line.
   *
   * @param out standard output
   * @param kind which document
   * @param body its fields, in order; values are maps, lists, strings, numbers, booleans or null
   */
  static void write(PrintWriter out, Kind kind, Map<String, ?> body) {
    Map<String, Object> doc = new LinkedHashMap<>();
    Map<String, Object> schema = new LinkedHashMap<>();
    schema.put("name", kind.schemaName());
    schema.put("version", Kind.VERSION);
    doc.put("schema", schema);
    doc.put("version", LoadstoneCommand.softwareVersion());
    body.forEach((k, v) -> doc.put(k, finite(v)));
    try {
      out.println(MAPPER.writeValueAsString(doc));
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("a " + kind.schemaName() + " document cannot be written as"
          + " JSON", e);
    }
    out.flush();
  }

  /**
   * @return the start of a document of this kind, up to and including the comma after {@code
   *     version}, for streams that write many small documents without building maps
   */
  static String opening(Kind kind) {
    return "{\"schema\":{\"name\":\"" + kind.schemaName() + "\",\"version\":" + Kind.VERSION
        + "},\"version\":" + quoted(LoadstoneCommand.softwareVersion()) + ",";
  }

  private static String quoted(String text) {
    try {
      return MAPPER.writeValueAsString(text);
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("text cannot be written as JSON", e);
    }
  }

  /** @return the value with every NaN or infinite number replaced by null, recursively */
  private static Object finite(Object v) {
    if (v instanceof Double d) {
      return Double.isFinite(d) ? d : null;
    }
    if (v instanceof Float f) {
      return Float.isFinite(f) ? f : null;
    }
    if (v instanceof Map<?, ?> m) {
      Map<Object, Object> copy = new LinkedHashMap<>();
      m.forEach((k, x) -> copy.put(k, finite(x)));
      return copy;
    }
    if (v instanceof Collection<?> c) {
      List<Object> copy = new ArrayList<>(c.size());
      c.forEach(x -> copy.add(finite(x)));
      return copy;
    }
    if (v instanceof double[] a) {
      List<Object> copy = new ArrayList<>(a.length);
      for (double x : a) {
        copy.add(finite(x));
      }
      return copy;
    }
    return v;
  }
}
