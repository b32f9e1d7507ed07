package org.loadstone.cli;

import java.io.PrintWriter;
import java.time.Instant;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import org.loadstone.archive.Amendment;
import org.loadstone.archive.Amendments;
import org.loadstone.archive.RunAmendments;
import org.loadstone.archive.RunMetadata;
import org.loadstone.units.LoadstoneException;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code loadstone amend}: corrects what a stored run says about its specimen. */
@Command(
    name = "amend",
    sortOptions = false,
    description = {
      "Correct a stored run's specimen record (mass, group, geometry, ids, notes).",
      "",
      "The run's files are not touched: the correction is appended, with its reason, to the "
          + "run's amendment log beside them, and every command, report and the console read "
          + "the run with it. Retire a run with 'loadstone retire'."
    })
public final class AmendCommand implements Callable<Integer> {
  @Mixin ArchiveOption archive;

  @Parameters(paramLabel = "RUN", description = "A run id, the start of one, or a specimen id in the archive.")
  String run;

  @Mixin SpecimenOptions values;

  @Option(names = "--position-measures", paramLabel = "WHERE", description = "What the position measures: crosshead, mid-span-gauge, video-load-point or video-mid-span.")
  String positionMeasures;

  @Option(names = "--clear", split = ",", paramLabel = "FIELD", description = "Clear these values (unknown), by field name, e.g. mass_g,width_mm.")
  List<String> clear;

  @Option(names = "--reason", paramLabel = "TEXT", required = true, description = "Why the record is corrected (kept with the amendment).")
  String reason;

  @Option(names = "--by", paramLabel = "NAME", defaultValue = "", description = "Who makes the correction.")
  String by;

  @Option(names = "--json", description = "Write the amended run's record as one JSON document on standard output (schema loadstone-amend); the text goes to standard error.")
  boolean json;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public Integer call() throws Exception {
    Map<String, Object> changes = new LinkedHashMap<>(values.given());
    if (positionMeasures != null) {
      changes.put("position_source", positionMeasures);
    }
    for (String f : clear == null ? List.<String>of() : clear) {
      String field = f.strip();
      if (changes.containsKey(field)) {
        throw new LoadstoneException("'" + field + "' is both given and cleared: do one");
      }
      changes.put(field, null);
    }
    if (changes.isEmpty()) {
      throw new LoadstoneException("nothing to amend: give the corrected values, e.g. "
          + "--mass-g 41.2, or --clear FIELD");
    }
    return amend(spec, archive, run, new Amendment(Instant.now(), by, reason, changes, null,
        LoadstoneCommand.softwareVersion()), json);
  }

  /** Appends an amendment to the run {@code reference} names and shows the result. */
  static int amend(CommandLine.Model.CommandSpec spec, ArchiveOption archive, String reference,
      Amendment a, boolean json) throws Exception {
    java.nio.file.Path sidecar = CliWiring.sidecar(reference, archive.folder());
    RunMetadata m = Amendments.append(sidecar, a);
    PrintWriter out = JsonDocument.human(spec, json);
    RunAmendments am = m.amendments();
    if (json) {
      Map<String, Object> j = new LinkedHashMap<>();
      j.put("run_id", m.runId());
      j.put("specimen", m.specimen());
      j.put("amendment_log_file", Amendments.file(sidecar).toString());
      j.put("amendment_count", am.log().size());
      j.put("retired", am.retired());
      j.put("retired_reason", am.retired() ? am.retiredReason() : null);
      j.put("changes", am.changes().stream().map(c -> Map.of("field", c.field(),
          "stored", c.stored(), "now", c.now())).toList());
      JsonDocument.write(spec.commandLine().getOut(), spec.name().equals("retire")
          ? JsonDocument.Kind.RETIRE : JsonDocument.Kind.AMEND, j);
    }
    {
      out.println("run " + m.runId() + " (specimen " + m.specimen() + "): amendment "
          + am.log().size() + " kept in " + Amendments.file(sidecar));
      out.println(am.summary().isEmpty() ? "the run reads as recorded" : am.summary());
    }
    out.flush();
    return 0;
  }
}
