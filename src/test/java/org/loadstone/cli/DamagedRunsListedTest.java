package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.archive.ArchiveIndex;
import org.loadstone.archive.RunMetadata;
import org.loadstone.archive.RunWriter;
import org.loadstone.archive.StoredRun;
import org.loadstone.archive.TestRuns;

/**
 * {@code runs} marks every run whose samples cannot be read, with the reason and the fix, from
 * the archive index's check (each run's samples read once, the answer kept while its files stay
 * as they were), and names the same runs and reasons as {@code compare}. The truth is the damage
 * the test does itself: which file, which line.
 */
class DamagedRunsListedTest {
  @TempDir Path dir;

  /** Damaged run → what its reason must name (the file's line, or the fault). */
  private final Map<String, String> damaged = new TreeMap<>();

  private Path archive() throws Exception {
    Path arc = Files.createDirectories(dir.resolve("runs"));
    int minute = 0;
    for (String good : List.of("foam-1", "foam-2", "balsa-1")) {
      store(arc, minute++, good, null);
    }
    // a line cut in its second cell (a copy cut short): line 11 has two cells of six
    StoredRun cut = store(arc, minute++, "cut-short", null);
    List<String> lines = Files.readAllLines(cut.csv());
    String partial = lines.get(10).substring(0, lines.get(10).indexOf(',') + 2);
    rewrite(cut.csv(), String.join("\n", lines.subList(0, 10)) + "\n" + partial);
    damaged.put("cut-short", "line 11");
    // one force cell turned to letters (a flipped byte in a digit would still read)
    StoredRun flipped = store(arc, minute++, "letters", null);
    lines = Files.readAllLines(flipped.csv());
    String[] cells = lines.get(4).split(",");
    cells[1] = "12x4";
    lines.set(4, String.join(",", cells));
    rewrite(flipped.csv(), String.join("\n", lines) + "\n");
    damaged.put("letters", "line 5");
    StoredRun gone = store(arc, minute++, "no-samples", null);
    Files.delete(gone.csv());
    damaged.put("no-samples", "is missing");
    StoredRun empty = store(arc, minute++, "emptied", null);
    rewrite(empty.csv(), "");
    damaged.put("emptied", "emptied");
    // whole lines lost at the end: every line reads, but the break lies beyond the samples
    StoredRun shortened = store(arc, minute++, "lost-tail", 150);
    lines = Files.readAllLines(shortened.csv());
    rewrite(shortened.csv(), String.join("\n", lines.subList(0, 101)) + "\n");
    damaged.put("lost-tail", "break_index");
    return arc;
  }

  private static StoredRun store(Path arc, int minute, String specimen, Integer breakIndex) {
    RunMetadata m = TestRuns.meta(specimen, specimen.startsWith("balsa") ? "balsa" : "foam",
            TestRuns.panel(), 50.0).toBuilder()
        .runId(String.format("20261202T10%02d00.000Z-%s", minute, specimen))
        .startedAt(Instant.parse("2026-12-02T10:00:00Z").plusSeconds(60L * minute))
        .breakIndex(breakIndex)
        .build();
    return RunWriter.write(arc, m, TestRuns.bend(60, 400 + 10 * minute));
  }

  /** Run files are published read-only: a damaged copy replaces the file. */
  private static void rewrite(Path file, String text) throws Exception {
    Files.delete(file);
    Files.writeString(file, text, StandardCharsets.UTF_8);
  }

  /** @return run id suffix (specimen) → samples problem, for every run `runs --json` lists */
  private static Map<String, String> listed(CliRun r) throws Exception {
    Map<String, String> m = new TreeMap<>();
    for (JsonNode run : r.lastJson().get("runs")) {
      JsonNode p = run.get("samples_problem");
      m.put(run.get("specimen").asText(), p.isNull() ? null : p.asText());
    }
    return m;
  }

  @Test
  void runsMarksEachDamagedRunWithItsReasonAndFixAndCompareNamesTheSame() throws Exception {
    Path arc = archive();
    CliRun runs = CliRun.run("", "runs", "--archive", arc.toString(), "--json");
    assertThat(runs.exit()).as(runs.toString()).isZero();
    Map<String, String> problems = listed(runs);
    assertThat(problems).hasSize(8);
    for (String good : List.of("foam-1", "foam-2", "balsa-1")) {
      assertThat(problems.get(good)).as(good).isNull();
    }
    for (Map.Entry<String, String> d : damaged.entrySet()) {
      String why = problems.get(d.getKey());
      assertThat(why).as(d.getKey()).isNotNull().contains(d.getValue())
          .containsAnyOf("restore", "correct");
      // the text names the run (marked in its row, the reason below) as well as the JSON
      assertThat(runs.err()).contains("warning: run " + runId(runs, d.getKey())
          + " cannot be read: " + why);
    }
    assertThat(runs.lastJson().get("unreadable")).hasSize(damaged.size());
    assertThat(runs.err().lines().filter(l -> l.contains(RunsCommand.DAMAGED)))
        .hasSize(damaged.size());

    // compare leaves out exactly these runs, for the same reasons
    CliRun compare = CliRun.run("", "compare", "--archive", arc.toString(), "--metric", "peak",
        "--json");
    assertThat(compare.exit()).as(compare.toString()).isZero();
    Map<String, String> leftOut = new HashMap<>();
    compare.lastJson().get("left_out").forEach(l ->
        leftOut.put(l.get("specimen").asText(), l.get("reason").asText()));
    assertThat(leftOut.keySet()).containsExactlyInAnyOrderElementsOf(damaged.keySet());
    damaged.keySet().forEach(s -> assertThat(leftOut.get(s)).contains(problems.get(s)));

    // the index's kept answers are those of reading every file
    Map<String, String> scanned = new TreeMap<>();
    ArchiveIndex.scan(arc).entries().forEach(e ->
        scanned.put(e.metadata().specimen(), e.samplesProblem()));
    assertThat(scanned).isEqualTo(problems);
  }

  @Test
  void aRunDamagedAfterItWasListedIsMarkedNextTimeAndUnmarkedWhenRestored() throws Exception {
    Path arc = archive();
    assertThat(listed(CliRun.run("", "runs", "--archive", arc.toString(), "--json"))
        .get("foam-2")).isNull();
    Path csv;
    try (var s = Files.list(arc)) {
      csv = s.filter(p -> p.toString().endsWith("foam-2.csv")).findFirst().orElseThrow();
    }
    byte[] good = Files.readAllBytes(csv);
    String text = new String(good, StandardCharsets.UTF_8);
    int line3 = text.indexOf('\n', text.indexOf('\n') + 1) + 1;
    // the third line's first cell (its time) replaced by garbage of the same length
    rewrite(csv, text.substring(0, line3) + "#".repeat(text.indexOf(',', line3) - line3)
        + text.substring(text.indexOf(',', line3)));

    Map<String, String> after = listed(CliRun.run("", "runs", "--archive", arc.toString(),
        "--json"));
    assertThat(after.get("foam-2")).contains("line 3");

    Files.delete(csv);
    Files.write(csv, good); // restored from a backup
    assertThat(listed(CliRun.run("", "runs", "--archive", arc.toString(), "--json"))
        .get("foam-2")).isNull();
  }

  private static String runId(CliRun r, String specimen) throws Exception {
    for (JsonNode run : r.lastJson().get("runs")) {
      if (run.get("specimen").asText().equals(specimen)) {
        return run.get("run_id").asText();
      }
    }
    throw new AssertionError("no run of specimen " + specimen);
  }
}
