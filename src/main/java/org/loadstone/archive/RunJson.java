package org.loadstone.archive;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.time.Instant;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.loadstone.units.InputException;
import org.loadstone.units.LoadstoneException;

/**
 * The JSON sidecar: {@link RunMetadata} ↔ a JSON object with snake_case field names carrying
 * units. Fields this version does not know are kept in {@link RunMetadata#extra()} and written
 * back unchanged.
 */
final class RunJson {
  static final ObjectMapper PRETTY = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);
  static final ObjectMapper LINE = new ObjectMapper();

  /** Fields that describe the end of a run; a journal header has none of them. */
  static final List<String> END_FIELDS = List.of("cause", "break_index", "break_time_s",
      "peak_before_break_N", "drop_at_break_pct", "return_to_zero_N");

  static final Set<String> KNOWN = Set.of("run_id", "started_at", "specimen", "group", "tags",
      "operator", "notes", "mass_g", "geometry", "test_type", "device", "sample_rate_hz",
      "sample_rate_source",
      "calibration_id", "calibration_sha256", "scale", "scale_spec", "zero_offset_counts",
      "dropped", "checksum_errors", "cause", "break_index", "break_time_s", "peak_before_break_N",
      "drop_at_break_pct", "pretrigger_s", "start_threshold_N", "return_to_zero_N", "check_weight",
      "warnings",
      "software_version");

  private RunJson() {}

  static ObjectNode toTree(RunMetadata m) {
    ObjectNode o = LINE.createObjectNode();
    o.put("run_id", m.runId());
    o.put("started_at", m.startedAt().toString());
    o.put("specimen", m.specimen());
    o.put("group", m.group());
    ArrayNode tags = o.putArray("tags");
    m.tags().forEach(tags::add);
    o.put("operator", m.operator());
    o.put("notes", m.notes());
    o.put("mass_g", m.mass_g());
    ObjectNode g = o.putObject("geometry");
    Geometry ge = m.geometry();
    g.put("span_mm", ge.span_mm());
    g.put("load_span_mm", ge.loadSpan_mm());
    g.put("width_mm", ge.width_mm());
    g.put("depth_mm", ge.depth_mm());
    g.put("facing_mm", ge.facing_mm());
    g.put("core_mm", ge.core_mm());
    g.put("area_mm2", ge.area_mm2());
    o.put("test_type", m.testType().wireName());
    ObjectNode dev = o.putObject("device");
    new java.util.TreeMap<>(m.device()).forEach(dev::put);
    o.put("sample_rate_hz", m.sampleRate_Hz());
    o.put("sample_rate_source", m.sampleRateSource());
    o.put("calibration_id", m.calibrationId());
    o.put("calibration_sha256", m.calibrationSha256());
    o.put("scale", m.scale());
    ObjectNode s = o.putObject("scale_spec");
    s.put("kind", m.scaleSpec().kind());
    ArrayNode rc = s.putArray("response_coefficients");
    m.scaleSpec().responseCoefficients().forEach(rc::add);
    s.put("valid_from_N", m.scaleSpec().validFrom_N());
    s.put("valid_to_N", m.scaleSpec().validTo_N());
    o.put("zero_offset_counts", m.zeroOffset_counts());
    o.put("dropped", m.dropped());
    o.put("checksum_errors", m.checksumErrors());
    o.put("cause", m.cause().wireName());
    o.put("break_index", m.breakIndex());
    o.put("break_time_s", m.breakTime_s());
    o.put("peak_before_break_N", m.peakBeforeBreak_N());
    o.put("drop_at_break_pct", m.dropAtBreak_pct());
    o.put("pretrigger_s", m.pretrigger_s());
    o.put("start_threshold_N", m.startThreshold_N());
    o.put("return_to_zero_N", m.returnToZero_N());
    o.set("check_weight", m.checkWeight() == null ? null : LINE.valueToTree(m.checkWeight()));
    ArrayNode w = o.putArray("warnings");
    m.warnings().forEach(w::add);
    o.put("software_version", m.softwareVersion());
    new java.util.TreeMap<>(m.extra()).forEach((k, v) -> {
      if (!KNOWN.contains(k)) {
        o.set(k, LINE.valueToTree(v));
      }
    });
    return o;
  }

  static byte[] pretty(RunMetadata m) {
    ObjectNode tree = toTree(m);
    checkFinite(tree, "", m.runId());
    try {
      return (PRETTY.writeValueAsString(tree) + "\n")
          .getBytes(java.nio.charset.StandardCharsets.UTF_8);
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("cannot serialise run " + m.runId(), e);
    }
  }

  /** JSON has no NaN or infinity: refuse them before writing a sidecar no reader would accept. */
  static void checkFinite(JsonNode n, String path, String runId) {
    if (n.isNumber() && !Double.isFinite(n.asDouble())) {
      throw new LoadstoneException("run " + runId + ": field '" + path + "' is " + n.asDouble()
          + ": the run was not stored; give a finite value or leave the field empty (null)");
    }
    if (n.isObject()) {
      n.fields().forEachRemaining(e -> checkFinite(e.getValue(),
          path.isEmpty() ? e.getKey() : path + "." + e.getKey(), runId));
    } else if (n.isArray()) {
      for (int i = 0; i < n.size(); i++) {
        checkFinite(n.get(i), path + "[" + i + "]", runId);
      }
    }
  }

  /**
   * @param where the file, for messages
   * @param causeOverride used instead of the {@code cause} field (journal headers have none), or
   *     null to read it
   */
  static RunMetadata fromTree(JsonNode root, String where, FinishCause causeOverride) {
    Fields f = new Fields(root, where);
    Map<String, Object> extra = new LinkedHashMap<>();
    root.fields().forEachRemaining(e -> {
      // an unknown field set to null says nothing: kept out, as a missing one is
      if (!KNOWN.contains(e.getKey()) && !e.getValue().isNull()) {
        extra.put(e.getKey(), LINE.convertValue(e.getValue(), Object.class));
      }
    });
    JsonNode gn = root.get("geometry");
    Geometry geometryRead = Geometry.NONE;
    if (gn != null && !gn.isNull()) {
      Fields g = new Fields(f.object("geometry"), where + ": field 'geometry'");
      geometryRead = f.wrap("geometry", () -> new Geometry(g.optDouble("span_mm"),
          g.optDouble("load_span_mm"), g.optDouble("width_mm"), g.optDouble("depth_mm"),
          g.optDouble("facing_mm"), g.optDouble("core_mm"), g.optDouble("area_mm2")));
    }
    Fields sp = new Fields(f.object("scale_spec"), where + ": field 'scale_spec'");
    ScaleSpec spec = f.wrap("scale_spec", () -> new ScaleSpec(sp.string("kind"),
        sp.doubles("response_coefficients"), sp.optDouble("valid_from_N"),
        sp.optDouble("valid_to_N")));
    Map<String, String> device = new LinkedHashMap<>();
    JsonNode dn = root.get("device");
    if (dn != null && !dn.isNull()) {
      f.object("device").fields().forEachRemaining(e -> device.put(e.getKey(),
          e.getValue().isTextual() ? e.getValue().asText() : e.getValue().toString()));
    }
    Geometry geometry = geometryRead;
    String testType = f.optString("test_type");
    FinishCause cause = causeOverride != null ? causeOverride
        : f.wrap("cause", () -> FinishCause.parse(f.string("cause")));
    JsonNode cw = root.get("check_weight");
    @SuppressWarnings("unchecked")
    Map<String, Object> checkWeight = cw == null || cw.isNull() ? null
        : LINE.convertValue(f.object("check_weight"), Map.class);
    return f.wrap("(top level)", () -> RunMetadata.builder()
        .runId(f.string("run_id"))
        .startedAt(f.instant("started_at"))
        .specimen(f.string("specimen"))
        .group(f.optString("group"))
        .tags(f.strings("tags"))
        .operator(f.optString("operator"))
        .notes(f.optString("notes"))
        .mass_g(f.optDouble("mass_g"))
        .geometry(geometry)
        .testType(testType == null ? null : f.wrap("test_type", () -> TestType.parse(testType)))
        .device(device)
        .sampleRate_Hz(f.number("sample_rate_hz"))
        .sampleRateSource(f.optString("sample_rate_source"))
        .calibrationId(f.optString("calibration_id"))
        .calibrationSha256(f.optString("calibration_sha256"))
        .scale(f.optString("scale"))
        .scaleSpec(spec)
        .zeroOffset_counts(f.number("zero_offset_counts"))
        .dropped(f.optLong("dropped"))
        .checksumErrors(f.optLong("checksum_errors"))
        .cause(cause)
        .breakIndex(causeOverride != null ? null : f.optInt("break_index"))
        .breakTime_s(causeOverride != null ? null : f.optDouble("break_time_s"))
        .peakBeforeBreak_N(causeOverride != null ? null : f.optDouble("peak_before_break_N"))
        .dropAtBreak_pct(causeOverride != null ? null : f.optDouble("drop_at_break_pct"))
        .pretrigger_s(f.optDoubleOr("pretrigger_s", 0))
        .startThreshold_N(f.optDouble("start_threshold_N"))
        .returnToZero_N(causeOverride != null ? null : f.optDouble("return_to_zero_N"))
        .checkWeight(checkWeight)
        .warnings(f.strings("warnings"))
        .softwareVersion(f.optString("software_version"))
        .extra(extra)
        .build());
  }

  /** Typed access to one JSON object's fields, with messages naming the file and field. */
  private static final class Fields {
    private final JsonNode o;
    private final String where;

    Fields(JsonNode o, String where) {
      this.o = o;
      this.where = where;
    }

    private LoadstoneException bad(String name, String what) {
      return new LoadstoneException(where + ": field '" + name + "' " + what
          + "; correct the file (keep a copy) or restore it from a backup");
    }

    <T> T wrap(String name, java.util.function.Supplier<T> s) {
      try {
        return s.get();
      } catch (LoadstoneException e) {
        if (e.getMessage().startsWith(where)) {
          throw e;
        }
        throw bad(name, "is invalid: " + e.getMessage());
      } catch (IllegalArgumentException e) {
        throw bad(name, "is invalid: " + e.getMessage());
      }
    }

    private JsonNode present(String name) {
      JsonNode n = o.get(name);
      if (n == null || n.isNull()) {
        throw bad(name, "is missing");
      }
      return n;
    }

    JsonNode object(String name) {
      JsonNode n = present(name);
      if (!n.isObject()) {
        throw bad(name, "must be an object, was " + InputException.shown(n.toString()));
      }
      return n;
    }

    String string(String name) {
      JsonNode n = present(name);
      if (!n.isTextual()) {
        throw bad(name, "must be text, was " + InputException.shown(n.toString()));
      }
      return n.asText();
    }

    String optString(String name) {
      JsonNode n = o.get(name);
      return n == null || n.isNull() ? null : string(name);
    }

    double number(String name) {
      JsonNode n = present(name);
      if (!n.isNumber() || !Double.isFinite(n.asDouble())) {
        throw bad(name, "must be a number, was " + InputException.shown(n.toString()));
      }
      return n.asDouble();
    }

    Double optDouble(String name) {
      JsonNode n = o.get(name);
      return n == null || n.isNull() ? null : number(name);
    }

    double optDoubleOr(String name, double dflt) {
      Double d = optDouble(name);
      return d == null ? dflt : d;
    }

    long optLong(String name) {
      JsonNode n = o.get(name);
      if (n == null || n.isNull()) {
        return 0;
      }
      if (!n.canConvertToLong() || !n.isIntegralNumber() || n.asLong() < 0) {
        throw bad(name, "must be a whole number ≥ 0, was " + InputException.shown(n.toString()));
      }
      return n.asLong();
    }

    Integer optInt(String name) {
      JsonNode n = o.get(name);
      if (n == null || n.isNull()) {
        return null;
      }
      if (!n.isIntegralNumber() || !n.canConvertToInt() || n.asInt() < 0) {
        throw bad(name, "must be a whole number ≥ 0, was " + InputException.shown(n.toString()));
      }
      return n.asInt();
    }

    Instant instant(String name) {
      String s = string(name);
      try {
        return Instant.parse(s);
      } catch (DateTimeParseException e) {
        throw bad(name, "must be a UTC time like 2026-12-02T18:12:33.417Z, was " + InputException.shown(s));
      }
    }

    List<String> strings(String name) {
      JsonNode n = o.get(name);
      if (n == null || n.isNull()) {
        return List.of();
      }
      if (!n.isArray()) {
        throw bad(name, "must be a list of text, was " + InputException.shown(n.toString()));
      }
      List<String> out = new ArrayList<>();
      for (JsonNode e : n) {
        if (!e.isTextual()) {
          throw bad(name, "must be a list of text, has " + InputException.shown(e.toString()));
        }
        out.add(e.asText());
      }
      return out;
    }

    List<Double> doubles(String name) {
      JsonNode n = present(name);
      if (!n.isArray() || n.isEmpty()) {
        throw bad(name, "must be a non-empty list of numbers, was " + InputException.shown(n.toString()));
      }
      List<Double> out = new ArrayList<>();
      for (JsonNode e : n) {
        if (!e.isNumber() || !Double.isFinite(e.asDouble())) {
          throw bad(name, "must be a list of numbers, has " + InputException.shown(e.toString()));
        }
        out.add(e.asDouble());
      }
      return out;
    }
  }
}
