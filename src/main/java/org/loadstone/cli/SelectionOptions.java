package org.loadstone.cli;

import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import org.loadstone.study.LeftOut;
import org.loadstone.study.RunSelection;
import picocli.CommandLine.Option;

/** Which runs a group study counts: {@code --group} and {@code --include}, shared by commands. */
public final class SelectionOptions {
  @Option(names = "--group", split = ",", paramLabel = "GROUP",
      description = "Groups to compare (comma separated or repeated); one group is compared "
          + "with each of the others (default: every group).")
  List<String> groups;

  @Option(names = "--include", split = ",", paramLabel = "KIND",
      description = "Also count runs the default leaves out: uncalibrated, imported, manual, "
          + "time-limit, crush-limit, overload, device-lost, device-reset, disk-full, recovered, "
          + "or all. By default only runs that ended in a break with force from a calibration "
          + "count.")
  List<String> include;

  /** @return the selection settings these options give */
  public RunSelection selection() {
    List<LeftOut.Kind> kinds = new ArrayList<>();
    for (String word : include == null ? List.<String>of() : include) {
      if (word.trim().equalsIgnoreCase("all")) {
        kinds.addAll(LeftOut.Kind.admissibleOnes());
      } else {
        kinds.add(LeftOut.Kind.parse(word));
      }
    }
    return RunSelection.DEFAULT.admitting(kinds)
        .withGroups(groups == null ? List.of() : groups);
  }

  /** @return how to count the left-out runs that could be counted, or "" when none could */
  static String includeHint(List<LeftOut> leftOut) {
    Set<LeftOut.Kind> kinds = new TreeSet<>();
    leftOut.stream().flatMap(l -> l.kinds().stream()).filter(LeftOut.Kind::admissible)
        .forEach(kinds::add);
    return kinds.isEmpty() ? "" : " (to count them: --include "
        + String.join(",", kinds.stream().map(LeftOut.Kind::word).toList()) + ")";
  }
}
