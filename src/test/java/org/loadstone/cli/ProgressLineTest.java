package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.archive.RunMetadata;
import org.loadstone.archive.RunWriter;
import org.loadstone.archive.TestRuns;
import org.loadstone.study.ArchiveRuns;
import org.loadstone.study.RunSelection;

/** Progress of a long comparison on standard error, and none for a short one. */
class ProgressLineTest {
  @TempDir Path dir;

  @Test
  void aLongSelectionReportsEachQuarterToALogAndEveryRunToATerminal() throws Exception {
    for (int i = 0; i < 60; i++) {
      RunMetadata m = TestRuns.meta("p-" + i, i % 2 == 0 ? "foam" : "balsa", TestRuns.panel(),
          50.0).toBuilder().runId(String.format("20261202T10%04d-p", i)).build();
      RunWriter.write(dir, m, TestRuns.bend(50, 300 + i));
    }
    StringWriter log = new StringWriter();
    ArchiveRuns.scan(dir).select(RunSelection.DEFAULT,
        new ProgressLine(new PrintWriter(log), false, "analysing runs"));
    assertThat(log.toString().lines()).containsExactly("analysing runs 15/60",
        "analysing runs 30/60", "analysing runs 45/60", "analysing runs 60/60");

    StringWriter tty = new StringWriter();
    ArchiveRuns.scan(dir).select(RunSelection.DEFAULT,
        new ProgressLine(new PrintWriter(tty), true, "analysing runs"));
    assertThat(tty.toString()).startsWith("\ranalysing runs 1/60\ranalysing runs 2/60")
        .endsWith("\ranalysing runs 60/60\n");

    StringWriter few = new StringWriter();
    ProgressLine p = new ProgressLine(new PrintWriter(few), true, "x");
    for (int i = 1; i <= ProgressLine.LONG - 1; i++) {
      p.analysed(i, ProgressLine.LONG - 1);
    }
    assertThat(few.toString()).isEmpty();
    // the run files only (the archive's index lives beside them)
    assertThat(Files.list(dir).filter(f -> f.toString().endsWith(".csv")
        || f.toString().endsWith(".json")).count()).isEqualTo(120);
  }
}
