package org.loadstone.study;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.study.LeftOut.Kind;
import org.loadstone.units.LoadstoneException;

/** Selecting the runs of an archive folder: what counts, grouping, what is left out and why. */
class ArchiveRunsTest {
  @TempDir Path dir;

  private static List<String> ids(List<RunMetrics> runs) {
    return runs.stream().map(m -> m.metadata().runId()).toList();
  }

  @Test
  void theDefaultCountsBrokenCalibratedRunsAndListsTheRestWithTheirKind() {
    Selection s = ArchiveRuns.scan(MixedArchive.write(dir)).select(RunSelection.DEFAULT);
    assertThat(s.groups().keySet()).containsExactly("balsa", "board", "foam");
    for (String g : MixedArchive.COUNTED.keySet()) {
      assertThat(ids(s.groups().get(g))).containsExactlyElementsOf(MixedArchive.countedIds(g));
    }
    assertThat(s.leftOut()).extracting(LeftOut::runId)
        .containsExactlyElementsOf(MixedArchive.LEFT_OUT.keySet());
    for (LeftOut l : s.leftOut()) {
      assertThat(l.kind().word()).as(l.runId()).isEqualTo(MixedArchive.LEFT_OUT.get(l.runId()));
    }
    assertThat(s.groupsInArchive()).containsExactly("balsa", "board", "foam");
  }

  @Test
  void everyKindCanBeLetIn() {
    Selection s = ArchiveRuns.scan(MixedArchive.write(dir))
        .select(RunSelection.DEFAULT.admitting(Kind.admissibleOnes()));
    assertThat(s.leftOut()).isEmpty();
    assertThat(s.groups().get("foam")).hasSize(5 + 4);
    assertThat(s.groups().get("balsa")).hasSize(4 + 2);
  }

  @Test
  void groupsAskedForComeFirstAndOneGroupIsComparedWithTheOthers() {
    ArchiveRuns runs = ArchiveRuns.scan(MixedArchive.write(dir));
    Selection two = runs.select(RunSelection.DEFAULT.withGroups(List.of("Foam", "board")));
    assertThat(two.groups().keySet()).containsExactly("foam", "board");
    // balsa was not asked for: its left-out runs are no part of this study
    assertThat(two.leftOut()).extracting(LeftOut::group).containsOnly("foam");
    Selection one = runs.select(RunSelection.DEFAULT.withGroups(List.of("board")));
    assertThat(one.groups().keySet()).containsExactly("board", "balsa", "foam");
    assertThatThrownBy(() -> runs.select(RunSelection.DEFAULT.withGroups(List.of("foam", "oak",
        "pine"))))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("no runs of groups 'oak', 'pine' in " + dir)
        .hasMessageContaining("the groups there are balsa, board, foam");
  }

  @Test
  void unreadableRunsAreLeftOutWithTheirFileAndTheFault() throws Exception {
    MixedArchive.write(dir);
    Files.writeString(dir.resolve("scribble.json"), "{ not a run");
    String foam1 = MixedArchive.countedIds("foam").get(0);
    Files.delete(dir.resolve(foam1 + ".csv"));
    Selection s = ArchiveRuns.scan(dir).select(RunSelection.DEFAULT);
    assertThat(s.leftOut().get(0).runId()).isEqualTo("scribble.json");
    assertThat(s.leftOut().get(0).kind()).isEqualTo(Kind.UNREADABLE);
    LeftOut missing = s.leftOut().stream().filter(l -> l.runId().equals(foam1)).findFirst()
        .orElseThrow();
    assertThat(missing.kind()).isEqualTo(Kind.UNREADABLE);
    assertThat(missing.reason()).startsWith("cannot be read or analysed: ").contains(".csv");
    assertThat(s.groups().get("foam")).hasSize(4);
  }

  @Test
  void aRescanKeepsTheAnalysesOfUnchangedRuns() {
    ArchiveRuns first = ArchiveRuns.scan(MixedArchive.write(dir));
    RunMetrics before = first.select(RunSelection.DEFAULT).groups().get("foam").get(0);
    RunMetrics after = ArchiveRuns.rescan(dir, first).select(RunSelection.DEFAULT).groups()
        .get("foam").get(0);
    assertThat(after).isSameAs(before);
  }
}
