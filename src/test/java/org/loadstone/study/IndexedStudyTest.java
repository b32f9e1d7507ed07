package org.loadstone.study;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.HangGuard;
import org.loadstone.analysis.AnalysisSettings;
import org.loadstone.archive.ArchiveIndex;
import org.loadstone.archive.RunIndex;
import org.loadstone.archive.RunMetadata;
import org.loadstone.archive.RunWriter;
import org.loadstone.archive.TestRuns;
import org.loadstone.files.ChildProgram;
import org.loadstone.study.LeftOut.Kind;

/**
 * The study through the archive index ({@link ArchiveRuns#scan}: runs listed by the index,
 * figures kept in it) against the reference that reads and analyses every run file ({@link
 * ArchiveRuns#of} over {@link ArchiveIndex#scan}): the same runs, the same figures to the bit and
 * the same statistics, the first time (figures computed and kept), the second (figures read from
 * the index), after the index is deleted, and after two programs add runs at the same time.
 */
class IndexedStudyTest {
  static final Path DEMO =
      Path.of(System.getProperty("loadstone.projectDir", "."), "sample-runs");
  private static final RunSelection ALL = RunSelection.DEFAULT.admitting(Kind.admissibleOnes());

  @TempDir Path dir;

  /** Stores run {@code n} of a group: peaks and stiffnesses differ from run to run. */
  static void store(Path dir, String group, int n) {
    RunMetadata m = TestRuns.meta(group + "-" + n, group, TestRuns.panel(), 48.0 + n % 5)
        .toBuilder().runId(String.format("20261204T09%04d.000Z-%s-%d", n, group, n))
        .startedAt(Instant.parse("2026-12-04T09:00:00Z").plusSeconds(n)).build();
    RunWriter.write(dir, m, TestRuns.bend(50 + n % 9, 280 + 7 * n + (group.hashCode() & 31)));
  }

  /** Everything a study says, as text: each run's figures to the bit, then the statistics. */
  private static String answers(ArchiveRuns runs) throws IOException {
    Selection s = runs.select(ALL);
    ObjectMapper om = new ObjectMapper();
    StringBuilder b = new StringBuilder();
    for (RunMetrics m : s.runs()) {
      b.append(om.writeValueAsString(m.toJsonMap())).append('\n');
      b.append(m.analysis()).append('\n'); // every field, doubles as their exact shortest text
    }
    s.leftOut().forEach(l -> b.append(l).append('\n'));
    if (s.groups().size() >= 2) {
      for (Metric metric : List.of(Metric.PEAK, Metric.STIFFNESS, Metric.ENERGY,
          Metric.FLEXURAL_MODULUS, Metric.SPECIFIC_PEAK)) {
        b.append(om.writeValueAsString(GroupStudy.compare(s, metric, 0.1).toJsonView()))
            .append('\n');
      }
    }
    return b.toString();
  }

  private String reference() throws IOException {
    return answers(ArchiveRuns.of(ArchiveIndex.scan(dir)));
  }

  @Test
  void figuresFromTheIndexAreTheFiguresOfTheFilesFirstSecondAndAfterTheIndexIsDeleted()
      throws IOException {
    MixedArchive.write(dir);
    String reference = reference();
    assertThat(reference).contains("foam-1").contains("one_way_anova");
    String first = answers(ArchiveRuns.scan(dir)); // computed, then kept in the index
    String second = answers(ArchiveRuns.scan(dir)); // read from the index
    assertThat(first).isEqualTo(reference);
    assertThat(second).isEqualTo(reference);
    assertThat(ArchiveIndex.load(dir).figures()
        .load(KeptFigures.settingsKey(AnalysisSettings.DEFAULTS)))
        .hasSize(ArchiveIndex.scan(dir).entries().size());
    for (String suffix : new String[] {"", "-wal", "-shm"}) {
      Files.deleteIfExists(dir.resolve(RunIndex.FILE_NAME + suffix));
    }
    assertThat(answers(ArchiveRuns.scan(dir))).isEqualTo(reference);
    assertThat(answers(ArchiveRuns.scan(dir))).isEqualTo(reference);
  }

  @Test
  void theDemoArchiveGivesTheSameFiguresThroughTheIndex() throws IOException {
    try (Stream<Path> s = Files.list(DEMO)) {
      for (Path p : s.filter(f -> f.toString().endsWith(".csv")
          || f.toString().endsWith(".json")).toList()) {
        Files.copy(p, dir.resolve(p.getFileName()));
      }
    }
    String reference = reference();
    assertThat(reference).contains("foam").contains("balsa").contains("board");
    assertThat(answers(ArchiveRuns.scan(dir))).isEqualTo(reference);
    assertThat(answers(ArchiveRuns.scan(dir))).isEqualTo(reference);
  }

  @Test
  void keptFiguresAreReadBackWholeAndCurvesReadAgainFromTheFiles() throws IOException {
    MixedArchive.write(dir);
    Selection fromFiles = ArchiveRuns.of(ArchiveIndex.scan(dir)).select(ALL);
    ArchiveRuns.scan(dir).select(ALL);
    Selection kept = ArchiveRuns.scan(dir).select(ALL);
    // record equality: every figure, the settings used, the notes and the samples (a kept run's
    // curve is read from its file when asked)
    assertThat(kept.runs()).isEqualTo(fromFiles.runs());
  }

  @Test
  void aSecondStudyTakesTheFiguresKeptInTheIndex() {
    store(dir, "foam", 1);
    store(dir, "balsa", 2);
    ArchiveRuns.scan(dir).select(ALL);
    ArchiveIndex idx = ArchiveIndex.load(dir);
    String key = KeptFigures.settingsKey(AnalysisSettings.DEFAULTS);
    Map<Path, String> kept = idx.figures().load(key);
    assertThat(kept).hasSize(2);
    RunMetrics first = ArchiveRuns.scan(dir).select(ALL).runs().get(0);
    ArchiveIndex.Entry foam = idx.find(first.metadata().runId());
    double peak = first.analysis().peakForce_N();
    String text = kept.get(foam.json());
    assertThat(text).contains("\"peakForce_N\":" + peak);
    // a kept figure altered by hand shows: the study read the index, not the samples
    idx.figures().store(key, Map.of(foam.json(),
        text.replace("\"peakForce_N\":" + peak, "\"peakForce_N\":" + (peak + 1000))));
    assertThat(ArchiveRuns.scan(dir).select(ALL).runs().get(0).analysis().peakForce_N())
        .isEqualTo(peak + 1000);
  }

  @Test
  void figuresKeptForOtherMetadataAreNotUsed() {
    MixedArchive.write(dir);
    RunMetrics m = ArchiveRuns.of(ArchiveIndex.scan(dir)).select(ALL).runs().get(0);
    String text = KeptFigures.text(new KeptFigures.Analysed(m.metadata(), m, null));
    assertThat(KeptFigures.read(text, m.metadata(), m::curve).metrics()).isEqualTo(m);
    // an amendment changes the metadata the listing hands out, not the run's files: the kept
    // figures (per gram here) no longer belong to it
    RunMetadata amended = m.metadata().toBuilder().mass_g(m.metadata().mass_g() + 1).build();
    assertThat(KeptFigures.read(text, amended, m::curve)).isNull();
  }

  @Test
  void theMetadataCheckDoesNotDependOnTheOrderOfAMap() {
    // Map.of and Map.copyOf iterate in an order that changes from one JVM to the next: figures
    // kept by one program were refused by the next until maps were read in key order
    Map<String, Object> ab = new java.util.LinkedHashMap<>();
    ab.put("name", "bench-frame");
    ab.put("port", "sim");
    Map<String, Object> ba = new java.util.LinkedHashMap<>();
    ba.put("port", "sim");
    ba.put("name", "bench-frame");
    assertThat(ab.toString()).isNotEqualTo(ba.toString());
    assertThat(KeptFigures.stable(List.of(ab))).isEqualTo(KeptFigures.stable(List.of(ba)));
    assertThat(KeptFigures.stable(ab)).isNotEqualTo(KeptFigures.stable(Map.of("name", "x",
        "port", "sim")));
  }

  @Test
  void aRunChangedSinceItsFiguresWereKeptIsAnalysedAgain() throws IOException {
    store(dir, "foam", 1);
    store(dir, "balsa", 2);
    ArchiveRuns.scan(dir).select(ALL);
    Path csv;
    try (Stream<Path> s = Files.list(dir)) {
      csv = s.filter(p -> p.toString().endsWith("foam-1.csv")).findFirst().orElseThrow();
    }
    // the same size, other forces: a repaired file
    String text = Files.readString(csv);
    Files.writeString(csv, text.replace(",1.", ",2."));
    assertThat(Files.readString(csv)).isNotEqualTo(text);
    assertThat(answers(ArchiveRuns.scan(dir))).isEqualTo(reference());
  }

  @Test
  @Timeout(value = HangGuard.TEST_S, unit = TimeUnit.SECONDS) // a hang guard, not the check
  void twoProgramsAddingRunsAtOnceLeaveEveryRunListedOnceAndTheSameStudy() throws Exception {
    int each = 6;
    List<String> answers = new ArrayList<>();
    try (ChildProgram one = new ChildProgram(StudyChild.class);
        ChildProgram two = new ChildProgram(StudyChild.class)) {
      for (int i = 0; i < each; i++) {
        one.send(dir + " foam " + (2 * i));
        two.send(dir + " balsa " + (2 * i + 1));
      }
      for (int i = 0; i < each; i++) {
        answers.add(one.answer());
        answers.add(two.answer());
      }
      assertThat(one.finish()).isZero();
      assertThat(two.finish()).isZero();
    }
    // each answer: runs counted, notes; no program ever found the index unusable
    assertThat(answers).allSatisfy(a -> assertThat(a).endsWith(" 0"));
    ArchiveIndex idx = ArchiveIndex.load(dir);
    assertThat(idx.notes()).isEmpty();
    assertThat(idx.entries()).hasSize(2 * each);
    assertThat(idx.entries().stream().map(e -> e.metadata().runId()).distinct())
        .hasSize(2 * each);
    Map<String, Long> seen = new HashMap<>();
    idx.entries().forEach(e -> seen.merge(e.metadata().runId(), 1L, Long::sum));
    assertThat(seen.values()).containsOnly(1L);
    // the figures the two programs kept are taken by this one (nothing in them depends on the
    // program that wrote them, such as the iteration order of a map)
    Map<Path, String> kept = idx.figures().load(KeptFigures.settingsKey(AnalysisSettings.DEFAULTS));
    assertThat(kept).hasSize(2 * each);
    for (ArchiveIndex.Entry e : idx.entries()) {
      assertThat(KeptFigures.read(kept.get(e.json()), e.metadata(), () -> null))
          .as(e.metadata().runId()).isNotNull();
    }
    String reference = reference();
    assertThat(answers(ArchiveRuns.scan(dir))).isEqualTo(reference);
    for (String suffix : new String[] {"", "-wal", "-shm"}) {
      Files.deleteIfExists(dir.resolve(RunIndex.FILE_NAME + suffix));
    }
    assertThat(answers(ArchiveRuns.scan(dir))).isEqualTo(reference);
  }
}
