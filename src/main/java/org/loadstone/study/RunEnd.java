package org.loadstone.study;

import org.loadstone.archive.FinishCause;
import org.loadstone.archive.RunMetadata;
import org.loadstone.archive.TestType;
import org.loadstone.units.Precondition;

/**
 * How a stored run ended, in words for its figures and reports. A crush run goes on through the
 * load drops of its saw-tooth and ends by its own rule (its travel limit, force staying low, its
 * time limit or by hand), so it has no break: its figures say which end it ran to, never "break".
 */
public final class RunEnd {
  private RunEnd() {}

  /**
   * @param md a stored run's metadata, not null
   * @return the stored cause with, for a crush run, the end it ran to and the rule set for it,
   *     e.g. {@code travel-limit: the crush ended by its own rule, at its travel limit (at 4 mm
   *     of travel, …)}; for other runs the stored cause alone, e.g. {@code break}
   */
  public static String words(RunMetadata md) {
    Precondition.notNull(md, "md");
    String cause = md.cause().wireName();
    if (md.testType() != TestType.CRUSH) {
      return cause;
    }
    String how = switch (md.cause()) {
      case TRAVEL_LIMIT -> "the crush ended by its own rule, at its travel limit";
      case LOW_FORCE -> "the crush ended by its own rule, force staying low";
      case TIME_LIMIT -> "the crush ended by its own rule, at its time limit";
      case MANUAL -> "the crush was ended by hand";
      default -> "the crush did not reach its own end";
    };
    Object rule = md.extra().get(RunMetadata.CRUSH_END_KEY);
    return cause + ": " + how + (rule == null ? "" : " (" + rule + ")");
  }

  /**
   * Why the analysis finds no break in this run: a crush run has none, whatever its load drops.
   *
   * @param md a stored run's metadata, not null
   * @return the reason in words, or null when the run's break is to be found by the drop rule
   */
  static String noBreak(RunMetadata md) {
    if (md.testType() != TestType.CRUSH) {
      return null;
    }
    FinishCause c = md.cause();
    boolean own = c == FinishCause.TRAVEL_LIMIT || c == FinishCause.LOW_FORCE
        || c == FinishCause.TIME_LIMIT || c == FinishCause.MANUAL;
    return "a crush run goes on through its load drops and has no break; it ended "
        + (own ? "by its own rule (" + c.wireName() + ")" : "with cause " + c.wireName());
  }
}
