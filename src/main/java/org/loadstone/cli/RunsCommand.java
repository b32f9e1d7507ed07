package org.loadstone.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
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
  @Mixin ArchiveOption archive;

  @Option(names = "--from", paramLabel = "DATE", description = "Started on or after this date (YYYY-MM-DD, UTC).")
  String from;

  @Option(names = "--to", paramLabel = "DATE", description = "Started before the end of this date (UTC).")
  String to;

  @Option(names = "--specimen", description = "Specimen id contains this text.")
  String specimen;

  @Option(names = "--group", description = "Exactly this group.")
  String group;

  @Option(names = "--tag", description = "Has this tag.")
  String tag;

  @Option(names = "--cause", description = "Finished for this cause: break, overload, manual, time-limit, device-lost, device-reset, disk-full, recovered, imported.")
  String cause;

  @Option(names = "--json", description = "One JSON object per run, then a summary object on the last line.")
  boolean json;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    PrintWriter err = spec.commandLine().getErr();
    ArchiveIndex idx = ArchiveIndex.scan(archive.folder());
    ArchiveIndex.Query q = new ArchiveIndex.Query(day(from, "--from", 0), day(to, "--to", 1),
        specimen, group, tag, cause == null ? null : FinishCause.parse(cause));
    List<ArchiveIndex.Entry> found = idx.search(q);
    ObjectMapper om = new ObjectMapper();
    if (!json) {
      out.printf("%-40s %-14s %-10s %-12s %-20s %s%n", "run", "specimen", "group", "cause",
          "started (UTC)", "amendments");
    }
    List<String> ids = new ArrayList<>();
    for (ArchiveIndex.Entry e : found) {
      RunMetadata m = e.metadata();
      ids.add(m.runId());
      if (json) {
        Map<String, Object> row = new LinkedHashMap<>();
        row.put("run_id", m.runId());
        row.put("specimen", m.specimen());
        row.put("group", m.group());
        row.put("tags", m.tags());
        row.put("cause", m.cause().wireName());
        row.put("started_at", m.startedAt().toString());
        row.put("csv", e.csv().toString());
        row.put("amendments", m.amendments().log().size());
        row.put("retired", m.amendments().retired());
        out.println(om.writeValueAsString(row));
      } else {
        out.printf(Locale.ROOT, "%-40s %-14s %-10s %-12s %-20s %s%n", m.runId(), m.specimen(),
            m.group(), m.cause().wireName(), m.startedAt().toString().substring(0, 19),
            m.amendments().summary());
      }
    }
    for (String p : idx.problems()) {
      err.println("warning: " + p);
    }
    if (json) {
      out.println(om.writeValueAsString(Map.of("runs", found.size(), "unreadable",
          idx.problems().size())));
    } else {
      out.println(found.size() + " of " + idx.entries().size() + " runs");
    }
    out.flush();
    return 0;
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
