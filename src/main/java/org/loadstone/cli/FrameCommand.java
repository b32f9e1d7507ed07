package org.loadstone.cli;

import java.nio.file.Path;
import java.time.Instant;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.loadstone.analysis.position.Compliance;
import org.loadstone.study.FrameProfile;
import org.loadstone.study.RunMetrics;
import org.loadstone.cli.RunResolver.ResolvedRun;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code loadstone frame}: measures a load frame's own stiffness from a rigid-block run. */
@Command(
    name = "frame",
    description = {
      "Measure the load frame's own stiffness from a run against a rigid block.",
      "",
      "The slope of force against crosshead travel on a block far stiffer than the frame is "
          + "the frame's stiffness; it is saved as a frame profile for 'analyze --frame FILE'."
    })
public final class FrameCommand implements Callable<Integer> {
  @Mixin ArchiveOption archive;

  @Parameters(paramLabel = "RUN", description = "The rigid-block run: an id (or prefix) in the archive or a run CSV.")
  String run;

  @Option(names = "--id", paramLabel = "ID", required = true, description = "Name of the frame, e.g. bench-press.")
  String id;

  @Option(names = "--notes", paramLabel = "TEXT", defaultValue = "", description = "Free text about the frame.")
  String description;

  @Option(names = "--out", defaultValue = "calibration/frames", paramLabel = "DIR", description = "Folder for the profile (default: ${DEFAULT-VALUE}).")
  Path dir;

  @Option(names = "--json", description = "Write the frame profile as one JSON document on standard output (schema loadstone-frame); the text goes to standard error.")
  boolean json;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public Integer call() {
    ResolvedRun r = CliWiring.resolve(run, archive.folder());
    RunMetrics m = RunMetrics.of(r.metadata(), r.data());
    double k = Compliance.frameStiffness_N_per_mm(m.analysis());
    FrameProfile p = new FrameProfile(id, description, k, r.metadata().runId(),
        Instant.now().toString());
    Path file = p.save(dir);
    java.io.PrintWriter h = JsonDocument.human(spec, json);
    h.printf(Locale.ROOT, "frame %s: stiffness %.5g N/mm (from run %s), saved to %s%n", id, k,
        r.metadata().runId(), file);
    h.flush();
    if (json) {
      java.util.Map<String, Object> j = new java.util.LinkedHashMap<>();
      j.put("frame_id", id);
      j.put("frame_stiffness_N_per_mm", k);
      j.put("run_id", r.metadata().runId());
      j.put("profile_file", file.toString());
      JsonDocument.write(spec.commandLine().getOut(), JsonDocument.Kind.FRAME, j);
    }
    return 0;
  }
}
