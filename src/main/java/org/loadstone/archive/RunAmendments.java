package org.loadstone.archive;

import java.util.ArrayList;
import java.util.List;
import org.loadstone.units.Precondition;

/**
 * What a run's amendment log did to it, carried by the amended {@link RunMetadata} so that every
 * face can mark the run and say what was corrected.
 *
 * @param log the amendments applied, oldest first; empty when the run was never amended
 * @param changes each field whose value now differs from the stored sidecar, with both values
 * @param retiredBy the amendment that retired the run, or null when it is not retired
 */
public record RunAmendments(List<Amendment> log, List<Change> changes, Amendment retiredBy) {
  /** A run never amended. */
  public static final RunAmendments NONE = new RunAmendments(List.of(), List.of(), null);

  /** Copies the lists. */
  public RunAmendments {
    Precondition.notNull(log, "log");
    Precondition.notNull(changes, "changes");
    log = List.copyOf(log);
    changes = List.copyOf(changes);
  }

  /**
   * One field as stored and as amended, in the sidecar's words.
   *
   * @param field the sidecar field name, e.g. {@code mass_g}
   * @param stored the value in the sidecar, as text ({@code none} when empty)
   * @param now the amended value, as text
   */
  public record Change(String field, String stored, String now) {
    /** @return e.g. {@code mass_g 41.2 (was 48)} */
    public String line() {
      return field + " " + now + " (was " + stored + ")";
    }
  }

  /** @return whether the run has any amendment */
  public boolean any() {
    return !log.isEmpty();
  }

  /** @return whether the run is retired (left out of every study) */
  public boolean retired() {
    return retiredBy != null;
  }

  /** @return why the run was retired, empty when it is not */
  public String retiredReason() {
    return retiredBy == null ? "" : retiredBy.reason();
  }

  /**
   * @return the amendments in one line for lists, e.g. {@code amended: mass_g 41.2 (was 48);
   *     retired: cracked before loading}; empty when never amended
   */
  public String summary() {
    if (!any()) {
      return "";
    }
    List<String> parts = new ArrayList<>();
    if (!changes.isEmpty()) {
      parts.add("amended: " + String.join(", ", changes.stream().map(Change::line).toList()));
    }
    if (retired()) {
      parts.add("retired: " + retiredReason());
    }
    if (parts.isEmpty()) {
      parts.add("amended: values as recorded (" + log.size() + " amendment"
          + (log.size() == 1 ? "" : "s") + ")");
    }
    return String.join("; ", parts);
  }

  /** @return a short mark for tables: {@code retired}, {@code amended} or empty */
  public String mark() {
    return retired() ? "retired" : any() ? "amended" : "";
  }
}
