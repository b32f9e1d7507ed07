package org.loadstone.study;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.concurrent.ConcurrentHashMap;
import org.loadstone.analysis.AnalysisSettings;
import org.loadstone.archive.ArchiveIndex;
import org.loadstone.archive.Run;
import org.loadstone.archive.RunMetadata;
import org.loadstone.archive.RunReader;
import org.loadstone.study.LeftOut.Kind;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * The runs of an archive folder as a study sees them: read from the index, analysed on demand
 * (each run once; raw data is not touched) and {@linkplain #select selected} by the one rule of
 * {@link RunSelection}. Thread-safe: analyses may run on a background thread while another
 * selects.
 */
public final class ArchiveRuns {
  /** What analysing one run gave: its metrics, or why it could not be analysed. */
  private record Analysed(RunMetadata metadata, RunMetrics metrics, String failure) {}

  private final ArchiveIndex index;
  private final AnalysisSettings settings;
  private final Map<Path, Analysed> analysed = new ConcurrentHashMap<>();

  private ArchiveRuns(ArchiveIndex index, AnalysisSettings settings) {
    this.index = index;
    this.settings = settings;
  }

  /**
   * Reads the index of a folder; nothing is analysed yet.
   *
   * @param dir the archive folder, not null
   * @throws LoadstoneException when the folder does not exist or cannot be listed
   */
  public static ArchiveRuns scan(Path dir) {
    return new ArchiveRuns(ArchiveIndex.scan(dir), AnalysisSettings.DEFAULTS);
  }

  /**
   * Reads the index of a folder again, keeping the analyses of runs whose sidecar is unchanged
   * since {@code before} was read (a stored run's samples are never rewritten).
   *
   * @param dir the archive folder, not null
   * @param before an earlier scan of the same folder, or null
   */
  public static ArchiveRuns rescan(Path dir, ArchiveRuns before) {
    org.loadstone.units.SlowWork.check("reading the archive folder");
    ArchiveRuns now = scan(dir);
    if (before != null) {
      for (ArchiveIndex.Entry e : now.index.entries()) {
        Analysed a = before.analysed.get(e.json());
        if (a != null && a.metadata().equals(e.metadata())) {
          now.analysed.put(e.json(), a);
        }
      }
    }
    return now;
  }

  /** @return the folder */
  public Path folder() {
    return index.folder();
  }

  /** @return how many runs the folder holds (readable sidecars) */
  public int size() {
    return index.entries().size();
  }

  /** Analyses every run not analysed yet, so later selections need no file access. */
  public void analyseAll() {
    org.loadstone.units.SlowWork.check("analysing the archive's runs");
    index.entries().forEach(this::analysis);
  }

  /**
   * Selects the runs that count.
   *
   * @param sel the selection settings, not null
   * @return the counted runs by group and the left-out runs with their reasons
   * @throws LoadstoneException when a group asked for has no runs at all in the folder (the
   *     message names the groups there are)
   */
  public Selection select(RunSelection sel) {
    Precondition.notNull(sel, "selection");
    TreeSet<String> inArchive = new TreeSet<>();
    index.entries().forEach(e -> inArchive.add(groupName(e.metadata().group())));
    List<String> asked = matchGroups(sel.groups(), inArchive, folder());
    List<LeftOut> leftOut = new ArrayList<>();
    for (ArchiveIndex.Unreadable u : index.unreadable()) {
      leftOut.add(new LeftOut(u.json().getFileName().toString(), "", "", Kind.UNREADABLE,
          Kind.UNREADABLE.meaning() + ": " + u.message()));
    }
    Map<String, List<RunMetrics>> counted = new TreeMap<>();
    for (ArchiveIndex.Entry e : index.entries()) {
      RunMetadata m = e.metadata();
      String group = groupName(m.group());
      if (asked.size() > 1 && !asked.contains(group)) {
        continue; // several groups asked for: the others are not part of this study
      }
      Optional<LeftOut> against = sel.judge(m);
      if (against.isPresent()) {
        leftOut.add(against.get());
        continue;
      }
      Analysed a = analysis(e);
      if (a.metrics() == null) {
        leftOut.add(new LeftOut(m.runId(), m.specimen(), m.group(), Kind.UNREADABLE,
            Kind.UNREADABLE.meaning() + ": " + a.failure()));
      } else {
        counted.computeIfAbsent(group, k -> new ArrayList<>()).add(a.metrics());
      }
    }
    Map<String, List<RunMetrics>> ordered = new LinkedHashMap<>();
    for (String g : asked) {
      if (counted.containsKey(g)) {
        ordered.put(g, counted.remove(g));
      }
    }
    ordered.putAll(counted);
    return new Selection(folder(), sel, ordered, leftOut, List.copyOf(inArchive));
  }

  /** @return the group a run is studied in: its group name, {@code (none)} when it has none */
  public static String groupName(String group) {
    return group == null || group.isBlank() ? "(none)" : group;
  }

  private static List<String> matchGroups(List<String> wanted, TreeSet<String> inArchive,
      Path folder) {
    List<String> found = new ArrayList<>();
    List<String> missing = new ArrayList<>();
    for (String w : wanted) {
      inArchive.stream().filter(g -> g.equalsIgnoreCase(w)).findFirst()
          .ifPresentOrElse(found::add, () -> missing.add("'" + w + "'"));
    }
    if (!missing.isEmpty()) {
      throw new LoadstoneException("no runs of group" + (missing.size() > 1 ? "s " : " ")
          + String.join(", ", missing) + " in " + folder + ": the groups there are "
          + (inArchive.isEmpty() ? "none (no runs yet)" : String.join(", ", inArchive)));
    }
    return found;
  }

  private Analysed analysis(ArchiveIndex.Entry e) {
    return analysed.computeIfAbsent(e.json(), k -> {
      try {
        Run run = RunReader.read(e.json());
        return new Analysed(e.metadata(), RunMetrics.of(run.metadata(), run.data(), settings),
            null);
      } catch (LoadstoneException ex) {
        return new Analysed(e.metadata(), null, ex.getMessage());
      }
    });
  }
}
