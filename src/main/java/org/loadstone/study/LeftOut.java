package org.loadstone.study;

import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.stream.Collectors;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * A run a study did not count, and why.
 *
 * @param runId the run's id (for a sidecar that cannot be read, its file name), not blank
 * @param specimen the specimen id, empty when unknown
 * @param group the group name, empty when unknown or none
 * @param kinds the kinds of reason that apply, at least one, the main one first
 * @param reason the reasons in a sentence, naming what was found
 */
public record LeftOut(String runId, String specimen, String group, List<Kind> kinds,
    String reason) {
  /** Checks the fields and copies the kinds. */
  public LeftOut {
    Precondition.notNull(runId, "runId");
    specimen = specimen == null ? "" : specimen;
    group = group == null ? "" : group;
    if (kinds == null || kinds.isEmpty()) {
      throw new IllegalArgumentException("a left-out run needs at least one kind of reason");
    }
    kinds = List.copyOf(kinds);
    Precondition.notNull(reason, "reason");
  }

  /** A run left out for one kind of reason. */
  public LeftOut(String runId, String specimen, String group, Kind kind, String reason) {
    this(runId, specimen, group, List.of(kind), reason);
  }

  /** @return the main kind of reason */
  public Kind kind() {
    return kinds.get(0);
  }

  /**
   * @return a JSON-friendly view: {@code run_id}, {@code specimen}, {@code group}, {@code kinds}
   *     (the words, main one first) and {@code reason}
   */
  public java.util.Map<String, Object> toJsonView() {
    java.util.Map<String, Object> m = new java.util.LinkedHashMap<>();
    m.put("run_id", runId);
    m.put("specimen", specimen);
    m.put("group", group);
    m.put("kinds", kinds.stream().map(Kind::word).toList());
    m.put("reason", reason);
    return m;
  }

  /** @return the run id, specimen and reason in one line for lists */
  public String line() {
    return runId + (specimen.isEmpty() ? "" : " (" + specimen + ")") + ": " + reason;
  }

  /**
   * Why a run is left out. All but {@link #RETIRED}, {@link #UNREADABLE} and {@link #NO_VALUE}
   * can be let in by the {@link RunSelection}: a retired run is reinstated by another amendment,
   * and the other two have no figure to count.
   */
  public enum Kind {
    /** an amendment retired the run (its reason follows) */
    RETIRED("retired", "retired"),
    /** force came from a nominal (data-sheet) scale, not from a calibration */
    UNCALIBRATED("uncalibrated", "force from a nominal scale, not a calibration"),
    /** the run came from another program's file; its scale cannot be traced */
    IMPORTED("imported", "imported from another program's file; its force scale cannot be traced"),
    /** the operator stopped the run */
    MANUAL("manual", "stopped by the operator, not ended by a break"),
    /** the run reached its longest allowed duration */
    TIME_LIMIT("time-limit", "reached its time limit without a break"),
    /** a run not of the crush type that stopped at a crush limit (travel or low force) */
    CRUSH_LIMIT("crush-limit", "stopped at a travel or low-force limit, not ended by a break"),
    /** the run stopped at the overload level */
    OVERLOAD("overload", "stopped at the overload level, not ended by a break"),
    /** the device stopped answering during the run */
    DEVICE_LOST("device-lost", "the device stopped answering during the run"),
    /** the device restarted during the run */
    DEVICE_RESET("device-reset", "the device restarted during the run"),
    /** the journal could not be written during the run */
    DISK_FULL("disk-full", "the disk filled during the run, which ended there"),
    /** rebuilt from its journal after the program ended before storing it */
    RECOVERED("recovered", "rebuilt from its journal after the program stopped before storing it; "
        + "how it ended is unknown"),
    /** its files cannot be read or its curve not analysed */
    UNREADABLE("unreadable", "cannot be read or analysed"),
    /** the run lacks the figure compared (no position channel, no mass, no geometry) */
    NO_VALUE("no-value", "lacks the figure compared");

    private final String word;
    private final String meaning;

    Kind(String word, String meaning) {
      this.word = word;
      this.meaning = meaning;
    }

    /** @return the word naming it, e.g. {@code time-limit} */
    public String word() {
      return word;
    }

    /** @return what it means, as a reason in a sentence */
    public String meaning() {
      return meaning;
    }

    /** @return whether a {@link RunSelection} can let such runs in */
    public boolean admissible() {
      return this != UNREADABLE && this != NO_VALUE && this != RETIRED;
    }

    /** @return the kinds a selection can let in, in declaration order */
    public static List<Kind> admissibleOnes() {
      return Arrays.stream(values()).filter(Kind::admissible).toList();
    }

    /**
     * The admissible kind with this word, any case.
     *
     * @throws LoadstoneException naming the text and the valid words
     */
    public static Kind parse(String text) {
      String t = text == null ? "" : text.trim().toLowerCase(Locale.ROOT);
      for (Kind k : admissibleOnes()) {
        if (k.word.equals(t)) {
          return k;
        }
      }
      throw new LoadstoneException("unknown kind of run '" + text + "' to count: the kinds are "
          + admissibleOnes().stream().map(Kind::word).collect(Collectors.joining(", ")));
    }
  }
}
