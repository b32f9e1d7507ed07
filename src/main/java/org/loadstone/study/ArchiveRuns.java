package org.loadstone.study;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import java.util.concurrent.ConcurrentHashMap;
import org.loadstone.analysis.AnalysisSettings;
import org.loadstone.archive.ArchiveIndex;
import org.loadstone.archive.Run;
import org.loadstone.archive.RunMetadata;
import org.loadstone.archive.RunReader;
import org.loadstone.study.KeptFigures.Analysed;
import org.loadstone.study.LeftOut.Kind;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * The runs of an archive folder as a study sees them: listed by the archive index ({@link
 * ArchiveIndex#load}), analysed on demand and {@linkplain #select selected} by the one rule of
 * {@link RunSelection}. This is the one way {@code compare}, {@code report --group}, {@code runs}
 * and the console's archive reach the figures of stored runs.
 *
 * <p>Each run is analysed once: its figures are kept in the archive index under the run's
 * content, the analysis settings and the analysing code ({@link KeptFigures}), so a later call
 * reads them instead of the samples; a run that is new, changed, or whose listed metadata
 * changed (an amendment) is analysed again. The figures kept for a study hold no samples: a
 * run's curve is read from its file when a chart asks for it. Thread-safe: analyses may run on a
 * background thread while another selects.
 */
public final class ArchiveRuns {
  private final ArchiveIndex index;
  private final AnalysisSettings settings;
  private final String settingsKey;
  private final Map<Path, Analysed> analysed = new ConcurrentHashMap<>();
  private final Map<Path, String> toKeep = new ConcurrentHashMap<>();
  private volatile Map<Path, String> kept;

  private ArchiveRuns(ArchiveIndex index, AnalysisSettings settings) {
    this.index = index;
    this.settings = settings;
    this.settingsKey = KeptFigures.settingsKey(settings);
  }

  /**
   * Lists the runs of a folder through its archive index (brought up to date with the files
   * first); nothing is analysed yet.
   *
   * @param dir the archive folder, not null
   * @throws LoadstoneException when the folder does not exist or cannot be listed
   */
  public static ArchiveRuns scan(Path dir) {
    return of(ArchiveIndex.load(dir));
  }

  /**
   * The runs of a listing already made ({@link ArchiveIndex#load}, or {@link ArchiveIndex#scan}
   * for the reference that reads every file and keeps nothing).
   *
   * @param listing the runs of one folder, not null
   */
  public static ArchiveRuns of(ArchiveIndex listing) {
    Precondition.notNull(listing, "listing");
    return new ArchiveRuns(listing, AnalysisSettings.DEFAULTS);
  }

  /**
   * @return what the reader should know about how the runs were listed (the archive index
   *     rebuilt, busy or not usable, so the files were read), empty as a rule
   */
  public List<String> notes() {
    return index.notes();
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

  /**
   * Analyses every run not analysed yet and reads its samples, so that later selections and
   * their charts need no file access (the console's archive view, whose charts are drawn on the
   * display thread). Holds every run's samples: a command that needs figures only should
   * {@link #select} alone.
   */
  public void analyseAll() {
    org.loadstone.units.SlowWork.check("analysing the archive's runs");
    for (ArchiveIndex.Entry e : index.entries()) {
      Analysed a = analysis(e);
      if (a.metrics() != null) {
        try {
          analysed.put(e.json(), new Analysed(a.metadata(),
              KeptFigures.withSamples(a.metrics(), a.metrics().curve().read()), null));
        } catch (LoadstoneException ex) {
          analysed.put(e.json(), new Analysed(a.metadata(), null, ex.getMessage()));
        }
      }
    }
    keep();
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
    return select(sel, Progress.NONE);
  }

  /** Told how far a long selection has come. */
  @FunctionalInterface
  public interface Progress {
    /** Tells nothing. */
    Progress NONE = (done, total) -> { };

    /**
     * @param done runs analysed so far (those analysed before count at once)
     * @param total runs this selection analyses
     */
    void analysed(int done, int total);
  }

  /**
   * As {@link #select(RunSelection)}, telling {@code progress} after each run it analyses.
   *
   * @param progress told on this thread, not null
   */
  public Selection select(RunSelection sel, Progress progress) {
    Precondition.notNull(sel, "selection");
    Precondition.notNull(progress, "progress");
    List<String> asked = index.groupsNamed(sel.groups());
    List<LeftOut> leftOut = new ArrayList<>();
    for (ArchiveIndex.Unreadable u : index.unreadable()) {
      leftOut.add(new LeftOut(u.json().getFileName().toString(), "", "", Kind.UNREADABLE,
          Kind.UNREADABLE.meaning() + ": " + u.message()));
    }
    Map<String, List<RunMetrics>> counted = new TreeMap<>();
    List<ArchiveIndex.Entry> studied = new ArrayList<>();
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
      studied.add(e);
    }
    int done = 0;
    for (ArchiveIndex.Entry e : studied) {
      RunMetadata m = e.metadata();
      String group = groupName(m.group());
      Analysed a = analysis(e);
      progress.analysed(++done, studied.size());
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
    keep();
    return new Selection(folder(), sel, ordered, leftOut, List.copyOf(index.groups()));
  }

  /** @return the group a run is studied in: its group name, {@code (none)} when it has none */
  public static String groupName(String group) {
    return ArchiveIndex.groupName(group);
  }

  private Analysed analysis(ArchiveIndex.Entry e) {
    return analysed.computeIfAbsent(e.json(), k -> {
      if (e.damaged()) {
        return new Analysed(e.metadata(), null, e.samplesProblem()); // the listing read them
      }
      String text = keptFigures().get(e.json());
      Analysed a = text == null ? null : KeptFigures.read(text, e.metadata(), samples(e));
      if (a != null) {
        return a;
      }
      try {
        Run run = RunReader.read(e.json());
        RunMetrics m = RunMetrics.of(e.metadata(), run.data(), settings);
        a = new Analysed(e.metadata(), KeptFigures.withoutSamples(m, samples(e)), null);
      } catch (LoadstoneException ex) {
        a = new Analysed(e.metadata(), null, ex.getMessage());
      }
      String keep = KeptFigures.text(a);
      if (keep != null) {
        toKeep.put(e.json(), keep);
      }
      return a;
    });
  }

  /** The figures the index kept for these settings, read once. */
  private Map<Path, String> keptFigures() {
    Map<Path, String> k = kept;
    if (k == null) {
      k = index.figures().load(settingsKey);
      kept = k;
    }
    return k;
  }

  /** Hands the figures computed since the last call to the index, in one write. */
  private synchronized void keep() {
    if (toKeep.isEmpty()) {
      return;
    }
    Map<Path, String> batch = new java.util.HashMap<>(toKeep);
    batch.keySet().forEach(toKeep::remove);
    index.figures().store(settingsKey, batch);
  }

  /** Reads a run's curve again when a chart asks for it; the run's samples are the truth. */
  private static java.util.function.Supplier<org.loadstone.analysis.Curve> samples(
      ArchiveIndex.Entry e) {
    return () -> RunMetrics.curveOf(RunReader.read(e.json()).data());
  }
}
