package org.loadstone.cli;

import java.io.PrintWriter;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.loadstone.archive.ArchiveIndex;
import org.loadstone.archive.FinishCause;
import org.loadstone.archive.RunMetadata;
import org.loadstone.units.LoadstoneException;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code loadstone runs}: lists and searches the archive. */
@Command(name = "runs", description = "List the runs in the archive, optionally filtered.")
public final class RunsCommand implements Callable<Integer> {
  /** The mark of a run whose samples cannot be read; a warning below the list says why. */
  static final String DAMAGED = "DAMAGED (see below)";

  @Mixin ArchiveOption archive;

  @Option(names = "--from", paramLabel = "DATE", description = "Started on or after this date (YYYY-MM-DD, UTC).")
  String from;

  @Option(names = "--to", paramLabel = "DATE", description = "Started before the end of this date (UTC).")
  String to;

  @Option(names = "--specimen", paramLabel = "ID", description = "Specimen id contains this text.")
  String specimen;

  @Option(names = "--group", split = ",", paramLabel = "GROUP",
      description = "In one of these groups (comma separated or repeated; exact names, any case).")
  List<String> groups;

  @Option(names = "--tag", paramLabel = "TAG", description = "Has this tag.")
  String tag;

  @Option(names = "--cause", paramLabel = "CAUSE", description = "Finished for this cause: break, overload, manual, time-limit, travel-limit, low-force, device-lost, device-reset, disk-full, recovered, imported.")
  String cause;

  @Option(names = "--json", description = "Write the list as one JSON document on standard output (schema loadstone-runs); the text goes to standard error.")
  boolean json;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = JsonDocument.human(spec, json);
    PrintWriter err = spec.commandLine().getErr();
    ArchiveIndex idx = ArchiveIndex.load(archive.folder());
    idx.notes().forEach(n -> err.println("note: " + n)); // the index rebuilt, busy or unusable
    ArchiveIndex.Query q = new ArchiveIndex.Query(day(from, "--from", 0), day(to, "--to", 1),
        specimen, groups == null ? List.of() : idx.groupsNamed(groups), tag, cause == null ? null : FinishCause.parse(cause));
    List<ArchiveIndex.Entry> found = idx.search(q);
    out.printf("%-40s %-14s %-10s %-12s %-20s %s%n", "run", "specimen", "group", "cause",
        "started (UTC)", "amendments");
    List<Map<String, Object>> rows = new ArrayList<>();
    List<String> problems = new ArrayList<>(idx.problems());
    for (ArchiveIndex.Entry e : found) {
      RunMetadata m = e.metadata();
      rows.add(JsonViews.run(e));
      String amended = m.amendments().summary();
      out.printf(Locale.ROOT, "%-40s %-14s %-10s %-12s %-20s %s%n", m.runId(), m.specimen(),
          m.group(), m.cause().wireName(), m.startedAt().toString().substring(0, 19),
          e.damaged() ? (DAMAGED + " " + amended).strip() : amended);
      if (e.damaged()) {
        problems.add(e.damage());
      }
    }
    for (String p : problems) {
      err.println("warning: " + p);
    }
    out.println(found.size() + " of " + idx.entries().size() + " runs");
    if (json) {
      Map<String, Object> j = new LinkedHashMap<>();
      j.put("archive", idx.folder().toString());
      j.put("run_count", found.size());
      j.put("archive_run_count", idx.entries().size());
      j.put("runs", rows);
      List<Map<String, Object>> unreadable = new ArrayList<>();
      for (ArchiveIndex.Unreadable u : idx.unreadable()) {
        unreadable.add(unreadable(u.json(), u.message()));
      }
      for (ArchiveIndex.Entry e : found) {
        if (e.damaged()) {
          unreadable.add(unreadable(e.json(), e.damage()));
        }
      }
      j.put("unreadable", unreadable);
      JsonDocument.write(spec.commandLine().getOut(), JsonDocument.Kind.RUNS, j);
    }
    out.flush();
    return 0;
  }

  private static Map<String, Object> unreadable(java.nio.file.Path sidecar, String problem) {
    Map<String, Object> m = new LinkedHashMap<>();
    m.put("sidecar_file", sidecar.toString());
    m.put("problem", problem);
    return m;
  }

  static Instant day(String text, String option, int plusDays) {
    if (text == null) {
      return null;
    }
    try {
      return LocalDate.parse(text.trim()).plusDays(plusDays).atStartOfDay().toInstant(ZoneOffset.UTC);
    } catch (DateTimeParseException e) {
      throw new LoadstoneException(option + " '" + text + "' is not a date: use YYYY-MM-DD, "
          + "e.g. 2026-12-02");
    }
  }
}
