package org.loadstone.archive;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Collections;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.SortedSet;
import java.util.TreeSet;
import java.util.stream.Stream;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * The runs in an archive folder, found by their JSON sidecars, with search by date, specimen,
 * group, tag and finish cause. A damaged sidecar does not hide the others: it is listed in
 * {@link #problems()}. A run whose samples cannot be read is listed and marked ({@link
 * Entry#damaged}); the archive index checks each run's samples once and keeps the answer while
 * its files stay as they were.
 */
public final class ArchiveIndex {
  /**
   * One run in the index.
   *
   * @param metadata its sidecar
   * @param json the sidecar file
   * @param csv the samples file beside it
   * @param samplesProblem null when its samples read; else what is wrong with them and the fix
   *     ({@link RunReader#samplesProblem}): the run is listed, but is damaged
   */
  public record Entry(RunMetadata metadata, Path json, Path csv, String samplesProblem) {
    /** A run whose samples read. */
    public Entry(RunMetadata metadata, Path json, Path csv) {
      this(metadata, json, csv, null);
    }

    /** @return whether its samples cannot be read ({@link #samplesProblem} says why) */
    public boolean damaged() {
      return samplesProblem != null;
    }

    /**
     * @return the damage in the words every listing uses: the run, why it cannot be read and
     *     the fix; null when it is not damaged
     */
    public String damage() {
      return samplesProblem == null ? null
          : "run " + metadata.runId() + " cannot be read: " + samplesProblem;
    }
  }

  /**
   * A sidecar that could not be read.
   *
   * @param json the file
   * @param message what is wrong with it, naming the file and the field
   */
  public record Unreadable(Path json, String message) {}

  private final Path dir;
  private final List<Entry> entries;
  private final List<Unreadable> problems;
  private final List<String> notes;
  private final FigureCache figures;

  ArchiveIndex(Path dir, List<Entry> entries, List<Unreadable> problems, List<String> notes,
      FigureCache figures) {
    this.dir = dir;
    List<Entry> sorted = new ArrayList<>(entries);
    sorted.sort(Comparator.comparing((Entry e) -> e.metadata().startedAt())
        .thenComparing(e -> e.metadata().runId()));
    this.entries = List.copyOf(sorted);
    this.problems = List.copyOf(problems);
    this.notes = List.copyOf(notes);
    this.figures = figures;
  }

  /**
   * Reads every sidecar of a folder (not its sub-folders): the reference the archive index is
   * held to. Keeps no figures.
   *
   * @throws LoadstoneException when the folder does not exist or cannot be listed
   */
  public static ArchiveIndex scan(Path dir) {
    return scan(dir, List.of());
  }

  /**
   * The runs of a folder from its archive index ({@link RunIndex}), brought up to date with the
   * run files first: only sidecars that are new or changed since the index last saw them are
   * read. The run files stay the truth: when the index cannot be used (damaged, busy past its
   * wait, written by a newer Loadstone, or the folder cannot be written), the sidecars are read
   * as {@link #scan} does and {@link #notes()} says why.
   *
   * @param dir the archive folder, not null
   * @throws LoadstoneException when the folder does not exist or cannot be listed
   */
  public static ArchiveIndex load(Path dir) {
    Precondition.notNull(dir, "dir");
    checkFolder(dir);
    return RunIndex.listing(dir);
  }

  static ArchiveIndex scan(Path dir, List<String> notes) {
    Precondition.notNull(dir, "dir");
    checkFolder(dir);
    List<Entry> found = new ArrayList<>();
    List<Unreadable> problems = new ArrayList<>();
    for (Path json : sidecars(dir)) {
      Object one = read(json);
      if (one instanceof Entry e) {
        found.add(e);
      } else {
        problems.add((Unreadable) one);
      }
    }
    return new ArchiveIndex(dir, found, problems, notes, FigureCache.NONE);
  }

  private static void checkFolder(Path dir) {
    if (!Files.isDirectory(dir)) {
      throw new LoadstoneException("archive folder " + dir + " does not exist: record a run "
          + "first, or choose the archive folder that holds your runs",
          org.loadstone.units.Setting.ARCHIVE_FOLDER);
    }
  }

  /** @return the sidecars of a folder, by name */
  static List<Path> sidecars(Path dir) {
    try (Stream<Path> s = Files.list(dir)) {
      return s.filter(p -> p.toString().endsWith(".json")).sorted().toList();
    } catch (IOException e) {
      throw new LoadstoneException("archive folder " + dir + " cannot be listed: "
          + e.getMessage(), e);
    }
  }

  /** @return the run of one sidecar as an {@link Entry}, or why not as an {@link Unreadable} */
  static Object read(Path json) {
    try {
      RunMetadata m = RunReader.readMetadata(json);
      return entry(json, m, RunReader.samplesProblem(m, json));
    } catch (LoadstoneException e) {
      return new Unreadable(json, e.getMessage());
    }
  }

  static Entry entry(Path json, RunMetadata m, String samplesProblem) {
    String stem = json.getFileName().toString().replaceFirst("\\.json$", "");
    return new Entry(m, json, json.resolveSibling(stem + ".csv"), samplesProblem);
  }

  /**
   * @return what the reader should know about how the runs were found (the index rebuilt, busy,
   *     or not usable), empty when the index answered as usual
   */
  public List<String> notes() {
    return notes;
  }

  /** @return where figures computed from these runs are kept between calls */
  public FigureCache figures() {
    return figures;
  }

  /** @return the folder */
  public Path folder() {
    return dir;
  }

  /** @return every run, oldest first */
  public List<Entry> entries() {
    return entries;
  }

  /** @return sidecars that could not be read, as messages naming the file and the field */
  public List<String> problems() {
    return problems.stream().map(Unreadable::message).toList();
  }

  /** @return sidecars that could not be read, with their files */
  public List<Unreadable> unreadable() {
    return problems;
  }

  /**
   * Finds one run the way a person names it: its run id, the start of its id, or its specimen id
   * (any case; the amended one when amended). An exact run id wins; otherwise the runs whose id
   * starts with {@code reference} and those whose specimen id is {@code reference} are the
   * candidates, and there must be exactly one.
   *
   * @param reference what the user typed, not null
   * @throws LoadstoneException when none match, or when several do (the message lists them, up
   *     to ten, with their specimen, start and mark, and asks for more of the id)
   */
  public Entry find(String reference) {
    Precondition.notNull(reference, "reference");
    String ref = reference.strip();
    Optional<Entry> exact = entries.stream().filter(e -> e.metadata().runId().equals(ref))
        .findFirst();
    if (exact.isPresent()) {
      return exact.get();
    }
    List<Entry> m = ref.isEmpty() ? List.of() : entries.stream()
        .filter(e -> e.metadata().runId().startsWith(ref)
            || e.metadata().specimen().strip().equalsIgnoreCase(ref))
        .toList();
    if (m.size() == 1) {
      return m.get(0);
    }
    if (m.isEmpty()) {
      // a run whose sidecar cannot be read is named by its file: say why instead of "no run"
      List<Unreadable> bad = problems.stream()
          .filter(u -> u.json().getFileName().toString().startsWith(ref)).toList();
      if (bad.size() == 1) {
        throw new LoadstoneException("run '" + ref + "' cannot be read: "
            + bad.get(0).message());
      }
      throw new LoadstoneException("no run '" + ref + "' in " + dir
          + ": give the id (or its start) or the specimen id of a run the archive lists, or "
          + "choose the archive folder that holds it", org.loadstone.units.Setting.ARCHIVE_FOLDER);
    }
    StringBuilder list = new StringBuilder();
    m.stream().limit(10).forEach(e -> {
      RunMetadata md = e.metadata();
      list.append("\n  ").append(md.runId()).append("  specimen ").append(md.specimen())
          .append(", started ").append(md.startedAt())
          .append(md.amendments().mark().isEmpty() ? "" : ", " + md.amendments().mark());
    });
    if (m.size() > 10) {
      list.append("\n  … and ").append(m.size() - 10).append(" more");
    }
    throw new LoadstoneException("'" + ref + "' matches " + m.size() + " runs in " + dir
        + ": give more of the run id to choose one of" + list);
  }

  /**
   * What to look for; null fields (and an empty group list) match everything.
   *
   * @param from earliest start, inclusive
   * @param to latest start, exclusive
   * @param specimen text the specimen id contains (any case)
   * @param groups group names, each exact (any case); a run matches when it is in one of them
   *     ({@link #groupName}: {@code (none)} for runs without a group); null or empty for all
   * @param tag a tag the run has (any case)
   * @param cause finish cause
   */
  public record Query(Instant from, Instant to, String specimen, List<String> groups, String tag,
      FinishCause cause) {
    /** Matches every run. */
    public static final Query ALL = new Query(null, null, null, null, null, null);

    /** Copies the group list. */
    public Query {
      groups = groups == null ? List.of() : List.copyOf(groups);
    }

    boolean matches(RunMetadata m) {
      return (from == null || !m.startedAt().isBefore(from))
          && (to == null || m.startedAt().isBefore(to))
          && (specimen == null || m.specimen().toLowerCase(Locale.ROOT)
              .contains(specimen.toLowerCase(Locale.ROOT)))
          && (groups.isEmpty() || groups.stream().anyMatch(g -> g.equalsIgnoreCase(groupName(m.group()))))
          && (tag == null || m.tags().stream().anyMatch(t -> t.equalsIgnoreCase(tag)))
          && (cause == null || m.cause() == cause);
    }
  }

  /**
   * The group a run is listed and studied in.
   *
   * @param group the run's group, may be null or blank
   * @return the group's name, {@code (none)} when it has none
   */
  public static String groupName(String group) {
    return group == null || group.isBlank() ? "(none)" : group;
  }

  /** @return the groups of the runs here ({@link #groupName}), sorted, each once */
  public SortedSet<String> groups() {
    TreeSet<String> names = new TreeSet<>();
    entries.forEach(e -> names.add(groupName(e.metadata().group())));
    return Collections.unmodifiableSortedSet(names);
  }

  /**
   * The groups asked for, each as it is spelt in the archive (names match in any case).
   *
   * @param wanted group names as typed, not null
   * @return the groups found, in the order asked
   * @throws LoadstoneException when a group asked for has no runs here, naming the groups there
   *     are
   */
  public List<String> groupsNamed(List<String> wanted) {
    Precondition.notNull(wanted, "wanted");
    SortedSet<String> here = groups();
    List<String> found = new ArrayList<>();
    List<String> missing = new ArrayList<>();
    for (String w : wanted) {
      here.stream().filter(g -> g.equalsIgnoreCase(w.trim())).findFirst()
          .ifPresentOrElse(found::add, () -> missing.add(org.loadstone.units.InputException.shown(w)));
    }
    if (!missing.isEmpty()) {
      throw new LoadstoneException("no runs of group" + (missing.size() > 1 ? "s " : " ")
          + String.join(", ", missing) + " in " + dir + ": the groups there are "
          + (here.isEmpty() ? "none (no runs yet)" : String.join(", ", here)));
    }
    return found;
  }

  /** @return the runs matching {@code q}, oldest first */
  public List<Entry> search(Query q) {
    return entries.stream().filter(e -> q.matches(e.metadata())).toList();
  }
}
