package org.loadstone.study;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.study.LeftOut.Kind;
import org.loadstone.units.LoadstoneException;

/** Comparing the selected groups: outliers by run, runs without the figure, several figures. */
class GroupStudyTest {
  @TempDir Path dir;

  @Test
  void anOutlierIsNamedByItsRun() {
    StudyResult r = GroupStudy.study(MixedArchive.write(dir), RunSelection.DEFAULT, Metric.PEAK,
        0.10);
    // 520 N among 466…469 N: Grubbs G = 1.79 above the two-sided 5 % critical value 1.715 for
    // n = 5 (NIST/SEMATECH e-Handbook of Statistical Methods, 1.3.5.17; from memory of its table)
    assertThat(r.outliers()).singleElement().satisfies(o -> {
      assertThat(o.runId()).isEqualTo(MixedArchive.FOAM_OUTLIER);
      assertThat(o.group()).isEqualTo("foam");
      assertThat(o.value()).isEqualTo(520.0);
      assertThat(o.g()).isGreaterThan(o.critical());
    });
    assertThat(r.toJsonView().get("outliers").toString()).contains(MixedArchive.FOAM_OUTLIER);
  }

  @Test
  void aRunWithoutTheFigureIsLeftOutWithTheReason() {
    Selection s = ArchiveRuns.scan(MixedArchive.write(dir))
        .select(RunSelection.DEFAULT.admitting(Kind.IMPORTED));
    StudyResult r = GroupStudy.compare(s, Metric.SPECIFIC_PEAK, 0.10);
    String imported = "20261202T102300.000Z-foam-imported";
    LeftOut l = r.leftOut().stream().filter(x -> x.runId().equals(imported)).findFirst()
        .orElseThrow();
    assertThat(l.kind()).isEqualTo(Kind.NO_VALUE);
    assertThat(l.reason()).startsWith("no peak force per gram").contains("No specimen mass");
    assertThat(r.groups().get(2).n()).isEqualTo(5);
    // with peak force the imported run counts
    assertThat(GroupStudy.compare(s, Metric.PEAK, 0.10).groups().get(2).n()).isEqualTo(6);
  }

  @Test
  void tooFewGroupsSayWhatWasLeftOut() {
    Selection s = ArchiveRuns.scan(MixedArchive.write(dir)).select(RunSelection.DEFAULT);
    assertThatThrownBy(() -> GroupStudy.compare(s.onlyGroup("foam"), Metric.PEAK, 0.1))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("comparing peak force needs counted runs with it from at least 2 "
            + "groups; found 1 (foam); left out: 1 uncalibrated, 1 imported, 1 manual, "
            + "1 time-limit");
  }

  @Test
  void severalFiguresForAReport() {
    Selection s = ArchiveRuns.scan(MixedArchive.write(dir)).select(RunSelection.DEFAULT);
    GroupStudy.Report rep = GroupStudy.compareEach(s, List.of(Metric.PEAK, Metric.STIFFNESS,
        Metric.COMPRESSION_STRESS), 0.10);
    assertThat(rep.results()).extracting(StudyResult::metric)
        .containsExactly(Metric.PEAK, Metric.STIFFNESS);
    assertThat(rep.notCompared()).singleElement().asString()
        .contains("compression stress at peak").contains("found none");
    assertThatThrownBy(() -> GroupStudy.compareEach(s.onlyGroup("foam"), List.of(Metric.PEAK),
        0.1)).isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("at least 2 groups").hasMessageContaining("found 1 (foam)")
        .hasMessageContaining("left out: 1 uncalibrated, 1 imported, 1 manual, 1 time-limit");
  }
}
