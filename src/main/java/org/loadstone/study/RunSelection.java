package org.loadstone.study;

import java.util.ArrayList;
import java.util.Collection;
import java.util.EnumSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import org.loadstone.archive.FinishCause;
import org.loadstone.archive.RunMetadata;
import org.loadstone.study.LeftOut.Kind;
import org.loadstone.units.Precondition;

/**
 * Which runs a study counts: the one rule for the command line, the console and the reports.
 *
 * <p>By default ({@link #DEFAULT}) a run counts when it ended in a break and its force came from a
 * calibration (the run names a calibration id). Every other run is left out with its reason: a
 * nominal scale ({@link Kind#UNCALIBRATED}), another program's file ({@link Kind#IMPORTED}), a
 * manual stop, the time limit, an overload stop, a lost device or a recovered journal. Each of
 * those kinds can be let in by {@link #admitting}. An imported run carries no calibration of ours,
 * so letting imported runs in lets them in whatever their scale. A run retired by an amendment
 * ({@link Kind#RETIRED}) is always left out, whatever is let in.
 *
 * @param admitted kinds of run counted although the default rule leaves them out; only
 *     {@linkplain Kind#admissible() admissible} kinds, never null
 * @param groups the groups asked for, in the order asked (any case); empty for every group. When
 *     one group is asked for, it is compared with each of the others.
 */
public record RunSelection(Set<Kind> admitted, List<String> groups) {
  /** Broken, calibrated runs of every group. */
  public static final RunSelection DEFAULT = new RunSelection(Set.of(), List.of());

  /** Checks the kinds, copies the sets and trims the group names (dropping blank and repeats). */
  public RunSelection {
    Precondition.notNull(admitted, "admitted");
    Precondition.notNull(groups, "groups");
    for (Kind k : admitted) {
      if (!k.admissible()) {
        throw new IllegalArgumentException("runs of kind " + k.word() + " cannot be counted");
      }
    }
    admitted = admitted.isEmpty() ? Set.of() : Set.copyOf(EnumSet.copyOf(admitted));
    List<String> g = new ArrayList<>();
    for (String name : groups) {
      String t = name == null ? "" : name.trim();
      if (!t.isEmpty() && g.stream().noneMatch(x -> x.equalsIgnoreCase(t))) {
        g.add(t);
      }
    }
    groups = List.copyOf(g);
  }

  /** @return a copy that also counts runs of these kinds */
  public RunSelection admitting(Collection<Kind> kinds) {
    Set<Kind> all = EnumSet.noneOf(Kind.class);
    all.addAll(admitted);
    all.addAll(kinds);
    return new RunSelection(all, groups);
  }

  /** @return a copy that also counts runs of these kinds */
  public RunSelection admitting(Kind... kinds) {
    return admitting(List.of(kinds));
  }

  /** @return a copy limited to these groups (empty: every group) */
  public RunSelection withGroups(List<String> names) {
    return new RunSelection(admitted, names);
  }

  /** @return whether runs of this kind are counted although the default leaves them out */
  public boolean admits(Kind k) {
    return admitted.contains(k);
  }

  /**
   * The kinds of the default rule that a run falls under, whether admitted or not: {@link
   * Kind#RETIRED} first when an amendment retired it, its ending when not a break, and {@link Kind#UNCALIBRATED} when a run recorded by Loadstone names no
   * calibration.
   *
   * @param m the run's metadata, not null
   * @return the kinds, empty for a broken, calibrated run
   */
  public static List<Kind> kindsOf(RunMetadata m) {
    Precondition.notNull(m, "metadata");
    List<Kind> kinds = new ArrayList<>();
    if (m.amendments().retired()) {
      kinds.add(Kind.RETIRED);
    }
    ending(m.cause()).ifPresent(kinds::add);
    boolean calibrated = m.calibrationId() != null && !m.calibrationId().isBlank();
    if (m.cause() != FinishCause.IMPORTED && !calibrated) {
      kinds.add(Kind.UNCALIBRATED);
    }
    return kinds;
  }

  /**
   * Applies the rule to one run.
   *
   * @param m the run's metadata, not null
   * @return why the run is left out, empty when it counts
   */
  public Optional<LeftOut> judge(RunMetadata m) {
    List<Kind> against = new ArrayList<>();
    for (Kind k : kindsOf(m)) {
      if (!admits(k)) {
        against.add(k);
      }
    }
    if (against.isEmpty()) {
      return Optional.empty();
    }
    List<String> why = new ArrayList<>();
    for (Kind k : against) {
      why.add(k == Kind.RETIRED ? "retired: " + m.amendments().retiredReason()
          : k == Kind.UNCALIBRATED && !m.scale().isBlank()
          ? "force from a nominal scale (" + m.scale() + "), not a calibration" : k.meaning());
    }
    return Optional.of(new LeftOut(m.runId(), m.specimen(), m.group(), against,
        String.join("; ", why)));
  }

  /** @return whether a group name is one asked for (any case); every group when none is asked */
  public boolean asks(String group) {
    return groups.isEmpty() || groups.stream().anyMatch(g -> g.equalsIgnoreCase(group));
  }

  private static Optional<Kind> ending(FinishCause c) {
    return switch (c) {
      case BREAK -> Optional.empty();
      case IMPORTED -> Optional.of(Kind.IMPORTED);
      case MANUAL -> Optional.of(Kind.MANUAL);
      case TIME_LIMIT -> Optional.of(Kind.TIME_LIMIT);
      case OVERLOAD -> Optional.of(Kind.OVERLOAD);
      case DEVICE_LOST -> Optional.of(Kind.DEVICE_LOST);
      case DEVICE_RESET -> Optional.of(Kind.DEVICE_RESET);
      case DISK_FULL -> Optional.of(Kind.DISK_FULL);
      case RECOVERED -> Optional.of(Kind.RECOVERED);
    };
  }
}
