package org.loadstone.archive;

import java.time.Instant;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * One correction of a stored run's metadata, or its retirement, as kept in the run's amendment
 * log ({@link Amendments}). The run's own files are never changed: the amendment is applied when
 * the run is read.
 *
 * <p>Only what describes the specimen and its bookkeeping can be amended ({@link #EDITABLE}):
 * what was measured (samples, scale, calibration, break, finish cause) cannot.
 *
 * @param at when the amendment was made, not null
 * @param operator who made it, may be empty
 * @param reason why, not blank
 * @param changes sidecar field name (as in the JSON sidecar, geometry fields by their own name,
 *     e.g. {@code width_mm}) → new value: text ({@code String}), a number ({@code Double}), a
 *     list of text (tags) or null to clear an optional value; may be empty when only {@code
 *     retired} changes
 * @param retired true to retire the run (left out of every study), false to reinstate it, null
 *     to leave that as it was
 * @param softwareVersion the Loadstone that wrote it, may be empty
 */
public record Amendment(Instant at, String operator, String reason, Map<String, Object> changes,
    Boolean retired, String softwareVersion) {

  /** Plain text fields that can be amended; {@code specimen} must stay non-blank. */
  public static final Set<String> TEXT_FIELDS = Set.of("specimen", "group", "operator", "notes",
      "test_type", "position_source");

  /** Geometry fields (mm, mm²) that can be amended; each may be cleared. */
  public static final List<String> GEOMETRY_FIELDS = List.of("span_mm", "load_span_mm",
      "width_mm", "depth_mm", "facing_mm", "core_mm", "area_mm2");

  /** Every field that can be amended. */
  public static final Set<String> EDITABLE = editable();

  /** Checks the fields, the field names and the value types, and copies the changes. */
  public Amendment {
    Precondition.notNull(at, "at");
    operator = operator == null ? "" : operator.strip();
    if (reason == null || reason.isBlank()) {
      throw new LoadstoneException("an amendment needs a reason: say why the run's record is "
          + "corrected or retired (it is kept beside the run for whoever reads it later)");
    }
    reason = reason.strip();
    Map<String, Object> copy = new LinkedHashMap<>();
    for (Map.Entry<String, Object> e : (changes == null ? Map.<String, Object>of() : changes)
        .entrySet()) {
      copy.put(e.getKey(), checked(e.getKey(), e.getValue()));
    }
    changes = Collections.unmodifiableMap(copy);
    if (changes.isEmpty() && retired == null) {
      throw new LoadstoneException("the amendment changes nothing: give a new value for at "
          + "least one of the run's fields, or retire or reinstate the run");
    }
    softwareVersion = softwareVersion == null ? "" : softwareVersion;
  }

  /** @return whether this amendment retires the run */
  public boolean retires() {
    return Boolean.TRUE.equals(retired);
  }

  /** @return whether this amendment reinstates a retired run */
  public boolean reinstates() {
    return Boolean.FALSE.equals(retired);
  }

  private static Object checked(String field, Object v) {
    if (!EDITABLE.contains(field)) {
      throw new LoadstoneException("field '" + field + "' cannot be amended: only "
          + String.join(", ", new java.util.TreeSet<>(EDITABLE)) + " describe the specimen; "
          + "what was measured (samples, scale, calibration, break, finish cause) stays as "
          + "recorded");
    }
    if (v == null) {
      if (field.equals("specimen")) {
        throw new LoadstoneException("the specimen id cannot be cleared: give the right one");
      }
      return null;
    }
    if (field.equals("tags")) {
      if (!(v instanceof List<?> l) || l.stream().anyMatch(t -> !(t instanceof String))) {
        throw new LoadstoneException("tags must be a list of text, was " + v);
      }
      return List.copyOf(l.stream().map(t -> ((String) t).strip())
          .filter(t -> !t.isEmpty()).toList());
    }
    if (TEXT_FIELDS.contains(field)) {
      if (!(v instanceof String s)) {
        throw new LoadstoneException(field + " must be text, was " + v);
      }
      if (field.equals("specimen") && s.isBlank()) {
        throw new LoadstoneException("the specimen id cannot be blank: give the right one");
      }
      return s.strip();
    }
    if (!(v instanceof Number n) || !Double.isFinite(n.doubleValue())
        || n.doubleValue() <= 0) {
      throw new LoadstoneException(field + " must be a positive number (" + unitOf(field)
          + "), was " + v + ": give the measured value, or clear it when it is unknown");
    }
    return n.doubleValue();
  }

  /** @return the unit of a numeric field, in words */
  static String unitOf(String field) {
    return field.equals("mass_g") ? "g" : field.equals("area_mm2") ? "mm²" : "mm";
  }

  private static Set<String> editable() {
    Set<String> s = new java.util.HashSet<>(TEXT_FIELDS);
    s.add("tags");
    s.add("mass_g");
    s.addAll(GEOMETRY_FIELDS);
    return Set.copyOf(s);
  }
}
