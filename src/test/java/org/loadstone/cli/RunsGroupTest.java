package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.TreeSet;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code runs --group} takes groups as {@code compare} and {@code report} do: comma separated or
 * repeated, any case, an unknown group refused naming those there are. The reference is the demo
 * archive's sidecars read as plain JSON, not through the archive index.
 */
class RunsGroupTest {
  @TempDir Path tmp;

  /** Run ids of the demo sidecars whose group is one of {@code groups} (any case). */
  private static Set<String> sidecarsOf(Path folder, String... groups) throws IOException {
    Set<String> wanted = new TreeSet<>();
    for (String g : groups) {
      wanted.add(g.toLowerCase(Locale.ROOT));
    }
    Set<String> ids = new TreeSet<>();
    ObjectMapper om = new ObjectMapper();
    try (Stream<Path> s = Files.list(folder)) {
      for (Path p : s.filter(f -> f.toString().endsWith(".json")).toList()) {
        JsonNode j = om.readTree(p.toFile());
        String group = j.path("group").asText("");
        if (wanted.contains((group.isBlank() ? "(none)" : group).toLowerCase(Locale.ROOT))) {
          ids.add(j.get("run_id").asText());
        }
      }
    }
    return ids;
  }

  private static Set<String> listed(RecordCommandTest.Outcome o) throws Exception {
    assertThat(o.exit()).as(o.err()).isZero();
    Set<String> ids = new TreeSet<>();
    o.json().get("runs").forEach(r -> ids.add(r.get("run_id").asText()));
    assertThat(o.json().get("run_count").asInt()).isEqualTo(ids.size());
    return ids;
  }

  @Test
  void severalGroupsCommaSeparatedOrRepeatedInAnyCase() throws Exception {
    String arc = CompareCommandTest.SAMPLES.toString();
    Set<String> expected = sidecarsOf(CompareCommandTest.SAMPLES, "balsa", "foam");
    assertThat(expected).hasSize(10); // five specimens per core (sample-runs/README.md)
    assertThat(listed(RecordCommandTest.run("runs", "--archive", arc, "--group", "balsa,FOAM",
        "--json"))).isEqualTo(expected);
    assertThat(listed(RecordCommandTest.run("runs", "--archive", arc, "--group", "Balsa",
        "--group", "foam", "--json"))).isEqualTo(expected);
    assertThat(listed(RecordCommandTest.run("runs", "--archive", arc, "--group", "board",
        "--json"))).isEqualTo(sidecarsOf(CompareCommandTest.SAMPLES, "board"));
    // the old spelling still works, with a note
    RecordCommandTest.Outcome old = RecordCommandTest.run("runs", "--archive", arc, "--groups",
        "balsa,foam", "--json");
    assertThat(listed(old)).isEqualTo(expected);
    assertThat(old.err()).contains("--groups is now --group");
  }

  @Test
  void anUnknownGroupIsRefusedAsCompareRefusesIt() {
    String arc = CompareCommandTest.SAMPLES.toString();
    RecordCommandTest.Outcome runs = RecordCommandTest.run("runs", "--archive", arc, "--group",
        "foam,oak", "--json");
    RecordCommandTest.Outcome compare = RecordCommandTest.run("compare", "--archive", arc,
        "--group", "foam,oak");
    assertThat(runs.exit()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(runs.out()).isEmpty();
    assertThat(runs.err()).contains("no runs of group 'oak'")
        .contains("the groups there are balsa, board, foam");
    assertThat(compare.err()).contains("no runs of group 'oak'")
        .contains("the groups there are balsa, board, foam");
  }

  @Test
  void runsWithoutAGroupAreTheGroupNone() throws Exception {
    Path arc = Files.createDirectories(tmp.resolve("arc"));
    String run = "20261204T181011.533Z-foam-01";
    for (String ext : List.of(".csv", ".json")) {
      Files.copy(CompareCommandTest.SAMPLES.resolve(run + ext), arc.resolve(run + ext));
    }
    RecordCommandTest.Outcome regroup = RecordCommandTest.run("amend", run, "--archive",
        arc.toString(), "--clear", "group", "--reason", "group unknown");
    assertThat(regroup.exit()).as(regroup.err()).isZero();
    assertThat(listed(RecordCommandTest.run("runs", "--archive", arc.toString(), "--group",
        "(none)", "--json"))).containsExactly(run);
  }
}
