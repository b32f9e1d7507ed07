package org.loadstone.study;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.lifecycle.AfterContainer;
import net.jqwik.api.lifecycle.BeforeContainer;
import org.loadstone.archive.Run;
import org.loadstone.archive.RunReader;
import org.loadstone.units.Fuzz;

/**
 * Fuzzing where the study reads: a frame profile, and a demo archive in which one run's samples
 * file is damaged. A damaged run that still reads is analysed into figures or refused in words,
 * and the study of the archive never stops for it: the other runs are counted and the damaged
 * one is either counted or listed as left out (issue 14: one bad run file stopped
 * {@code compare} for the whole archive).
 */
class StudyReadersFuzzTest {
  private static final List<String> RUNS = List.of("20261204T181011.533Z-foam-01",
      "20261204T181024.715Z-foam-02", "20261204T181107.589Z-balsa-01",
      "20261204T181117.470Z-balsa-02");

  private static Path dir;
  private static byte[] profile;
  private static byte[] runCsv;

  @BeforeContainer
  static void corpus() throws Exception {
    dir = Fuzz.tempDir("study");
    Path p = new FrameProfile("bench-press", "shelf rig, steel frame", 48_500.0,
        "20261203T221000.000Z-rigid-block", "2026-12-03T22:10:00Z")
        .save(Files.createDirectories(dir.resolve("frames")));
    profile = Files.readAllBytes(p);
    runCsv = Files.readAllBytes(Path.of("sample-runs", RUNS.get(0) + ".csv"));
  }

  @AfterContainer
  static void clean() {
    Fuzz.delete(dir);
  }

  @Property(tries = 150, seed = "140631")
  void frameProfileReadsOrIsRefused(@ForAll long seed) {
    Fuzz.eachCopy(profile, seed, dir.resolve("frame.json"), f -> {
      FrameProfile p = Fuzz.readOrRefuse(() -> FrameProfile.read(f));
      if (p != null) {
        assertThat(p.frameStiffness_N_per_mm()).isPositive().isFinite();
      }
    });
  }

  @Property(tries = 40, seed = "140632")
  void aDamagedRunIsAnalysedOrLeftOutAndTheOthersStillCount(@ForAll long seed)
      throws Exception {
    Path arc = Files.createDirectories(dir.resolve("arc-" + Long.toHexString(seed)));
    try {
      for (String name : RUNS) {
        for (String ext : List.of(".csv", ".json")) {
          Files.copy(Path.of("sample-runs", name + ext), arc.resolve(name + ext));
        }
      }
      Path damaged = arc.resolve(RUNS.get(0) + ".csv");
      Fuzz.eachCopy(runCsv, seed, damaged, f -> {
        Run run = Fuzz.readOrRefuse(() -> RunReader.read(f));
        if (run != null) {
          Fuzz.readOrRefuse(() -> RunMetrics.of(run.metadata(), run.data()));
        }
        Selection sel = ArchiveRuns.scan(arc).select(RunSelection.DEFAULT);
        assertThat(sel.counted()).as("the undamaged runs").isGreaterThanOrEqualTo(3);
        assertThat(sel.counted() + sel.leftOut().size()).isEqualTo(RUNS.size());
      });
    } finally {
      Fuzz.delete(arc);
    }
  }
}
