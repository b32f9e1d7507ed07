package org.loadstone.study;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.loadstone.units.Precondition;

/**
 * The runs a study counts, by group, and those it left out with the reason.
 *
 * @param folder the archive folder, not null
 * @param settings the selection settings applied, not null
 * @param groups group name → counted runs (oldest first); groups asked for first, in the order
 *     asked, then the others by name; a group whose runs were all left out is absent
 * @param leftOut runs of the groups asked for that do not count, with the reason (oldest first;
 *     unreadable sidecars first)
 * @param groupsInArchive every group name in the folder, counted or not, by name
 */
public record Selection(Path folder, RunSelection settings, Map<String, List<RunMetrics>> groups,
    List<LeftOut> leftOut, List<String> groupsInArchive) {
  /** Checks the fields and copies the collections, keeping their order. */
  public Selection {
    Precondition.notNull(folder, "folder");
    Precondition.notNull(settings, "settings");
    Precondition.notNull(groups, "groups");
    Map<String, List<RunMetrics>> copy = new LinkedHashMap<>();
    groups.forEach((g, list) -> copy.put(g, List.copyOf(list)));
    groups = Collections.unmodifiableMap(copy);
    leftOut = List.copyOf(leftOut);
    groupsInArchive = List.copyOf(groupsInArchive);
  }

  /** @return how many runs count, over all groups */
  public int counted() {
    return groups.values().stream().mapToInt(List::size).sum();
  }

  /** @return every counted run, group by group */
  public List<RunMetrics> runs() {
    List<RunMetrics> all = new ArrayList<>();
    groups.values().forEach(all::addAll);
    return all;
  }

  /**
   * The same selection limited to one of its groups.
   *
   * @param group a group name as in {@link #groups()}
   * @return the selection with only that group's counted runs and left-out runs
   */
  public Selection onlyGroup(String group) {
    Map<String, List<RunMetrics>> one = new LinkedHashMap<>();
    if (groups.containsKey(group)) {
      one.put(group, groups.get(group));
    }
    List<LeftOut> left = leftOut.stream()
        .filter(l -> ArchiveRuns.groupName(l.group()).equals(group)).toList();
    return new Selection(folder, settings.withGroups(List.of(group)), one, left,
        groupsInArchive);
  }
}
