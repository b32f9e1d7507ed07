package org.loadstone.ui;

import org.loadstone.HangGuard;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import javafx.scene.Scene;
import javafx.scene.control.Label;
import javafx.scene.control.TableView;
import javafx.stage.Stage;
import org.jfree.chart.fx.ChartViewer;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.loadstone.analysis.stats.GroupSummary;
import org.loadstone.study.ArchiveRuns;
import org.loadstone.study.GroupStudy;
import org.loadstone.study.LeftOut;
import org.loadstone.study.Metric;
import org.loadstone.study.MixedArchive;
import org.loadstone.study.RunMetrics;
import org.loadstone.study.RunSelection;
import org.loadstone.study.StudyResult;
import org.testfx.api.FxRobot;
import org.testfx.framework.junit5.ApplicationExtension;
import org.testfx.framework.junit5.Start;
import org.testfx.util.WaitForAsyncUtils;

/**
 * The archive review in a real JavaFX scene (headless Monocle), on the demo archive (whose runs
 * used the simulated cell's nominal scale, so the "uncalibrated" box lets them count) and on an
 * archive mixing runs that count with runs left out.
 */
@ExtendWith(ApplicationExtension.class)
class ArchivePaneTest {
  private static final Path DEMO = Path.of("sample-runs");
  private ArchivePane pane;

  @Start
  void start(Stage stage) {
    pane = new ArchivePane(DEMO);
    Scene scene = new Scene(pane.root(), 1200, 760);
    scene.getStylesheets().add(
        ArchivePane.class.getResource("/org/loadstone/ui/console.css").toExternalForm());
    stage.setScene(scene);
    stage.show();
    pane.reload();
  }

  private static final RunSelection NOMINAL_TOO =
      RunSelection.DEFAULT.admitting(LeftOut.Kind.UNCALIBRATED);

  /** Ticks the box that counts nominal-scale runs and waits for the demo's 15 runs. */
  private void countNominalRuns(FxRobot robot) throws Exception {
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> robot.lookup("#archive-status").queryAs(Label.class).getText().contains("counted"));
    robot.clickOn("#archive-include-uncalibrated");
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> pane.table().getItems().size() == 15);
    WaitForAsyncUtils.waitForFxEvents(); // the charts are drawn in the same step as the list
  }

  @Test
  void listsTheRunsAndComparesTheGroupsAsTheArchiveStudyDoes(FxRobot robot) throws Exception {
    countNominalRuns(robot);
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> robot.lookup("#archive-groups").tryQuery().isPresent());
    WaitForAsyncUtils.waitForFxEvents(); // the FX step that added the table may still be filling it
    StudyResult expected = GroupStudy.study(DEMO, NOMINAL_TOO, Metric.PEAK, 0.10);
    @SuppressWarnings("unchecked")
    TableView<GroupSummary> groups = robot.lookup("#archive-groups").queryAs(TableView.class);
    assertThat(groups.getItems()).containsExactlyElementsOf(expected.groups());
    assertThat(robot.lookup("#archive-sentence").queryAs(Label.class).getText())
        .isEqualTo(expected.sentence());
    assertThat(robot.lookup("#archive-test").queryAs(Label.class).getText())
        .startsWith("one-way ANOVA, p = ");

    // another figure: the stiffness comparison
    robot.interact(() -> pane.metric().setValue(Metric.STIFFNESS));
    WaitForAsyncUtils.waitForFxEvents();
    @SuppressWarnings("unchecked")
    TableView<GroupSummary> byStiffness = robot.lookup("#archive-groups").queryAs(TableView.class);
    assertThat(byStiffness.getItems().get(0).mean()).isEqualTo(GroupStudy.study(DEMO,
        NOMINAL_TOO, Metric.STIFFNESS, 0.10).groups().get(0).mean());
  }

  @Test
  void picksRunsToOverlayAndSaysWhyOneGroupCannotBeCompared(FxRobot robot) throws Exception {
    countNominalRuns(robot);
    assertThat(seriesIn("#archive-curves", robot)).isEqualTo(15);
    robot.interact(() -> {
      pane.table().getSelectionModel().select(0);
      pane.table().getSelectionModel().select(14);
    });
    WaitForAsyncUtils.waitForFxEvents();
    List<RunMetrics> picked = pane.table().getSelectionModel().getSelectedItems();
    assertThat(picked).hasSize(2);
    assertThat(seriesIn("#archive-curves", robot)).isEqualTo(2);

    robot.interact(() -> pane.picker().pick(List.of("balsa")));
    WaitForAsyncUtils.waitForFxEvents();
    assertThat(pane.table().getItems()).hasSize(5)
        .allSatisfy(m -> assertThat(m.metadata().group()).isEqualTo("balsa"));
    assertThat(robot.lookup("#archive-sentence").queryAs(Label.class).getText())
        .contains("at least 2 groups");
  }

  @Test
  void writesTheGroupComparisonAsAPdfBesideTheRuns(FxRobot robot) throws Exception {
    Path copy = java.nio.file.Files.createTempDirectory("loadstone-review");
    try (var files = java.nio.file.Files.list(DEMO)) {
      for (Path f : (Iterable<Path>) files::iterator) {
        java.nio.file.Files.copy(f, copy.resolve(f.getFileName()));
      }
    }
    robot.interact(() -> {
      robot.lookup("#archive-folder").queryAs(javafx.scene.control.TextField.class)
          .setText(copy.toString());
      pane.reload();
    });
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> robot.lookup("#archive-status")
        .queryAs(Label.class).getText().contains("counted in " + copy));
    if (!pane.include(LeftOut.Kind.UNCALIBRATED).isSelected()) {
      robot.clickOn("#archive-include-uncalibrated");
    }
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> pane.table().getItems().size() == 15);
    robot.clickOn("#archive-report");
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> robot.lookup("#archive-status").queryAs(Label.class).getText()
            .startsWith("report written to "));
    try (var files = java.nio.file.Files.list(copy)) {
      Path pdf = files.filter(f -> f.toString().endsWith(".pdf")).findFirst().orElseThrow();
      try (var doc = org.apache.pdfbox.Loader.loadPDF(pdf.toFile())) {
        String text = new org.apache.pdfbox.text.PDFTextStripper().getText(doc);
        assertThat(text).contains("Comparison of balsa, board, foam").contains("Peak force");
      }
    }
  }

  /**
   * An amended archive: the pane marks the amended run, its per-gram figure follows the corrected
   * mass (peak ÷ mass, common practice), and the retired run is listed as left out with why.
   */
  @Test
  void showsAmendedValuesAndLeavesRetiredRunsOut(FxRobot robot) throws Exception {
    Path mixed = MixedArchive.writeAmended(java.nio.file.Files.createTempDirectory(
        "loadstone-amended"));
    String foam2 = MixedArchive.countedIds("foam").get(1); // peak 468 N, recorded as 49 g
    org.loadstone.archive.Amendments.append(mixed.resolve(foam2 + ".json"),
        new org.loadstone.archive.Amendment(java.time.Instant.now(), "", "weighed with the tray",
            java.util.Map.of("mass_g", 41.2), null, "test"));
    robot.interact(() -> {
      robot.lookup("#archive-folder").queryAs(javafx.scene.control.TextField.class)
          .setText(mixed.toString());
      pane.metric().setValue(Metric.SPECIFIC_PEAK);
      pane.reload();
    });
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> robot.lookup("#archive-status")
        .queryAs(Label.class).getText().contains("counted in " + mixed));
    WaitForAsyncUtils.waitForFxEvents();
    RunMetrics amended = pane.table().getItems().stream()
        .filter(m -> m.metadata().runId().equals(foam2)).findFirst().orElseThrow();
    assertThat(amended.specificPeak_N_per_g().getAsDouble())
        .isCloseTo(468 / 41.2, org.assertj.core.api.Assertions.within(1e-9));
    @SuppressWarnings("unchecked")
    javafx.scene.control.TableColumn<RunMetrics, String> record =
        (javafx.scene.control.TableColumn<RunMetrics, String>) pane.table().getColumns().stream()
            .filter(c -> "archive-amended".equals(c.getId())).findFirst().orElseThrow();
    assertThat(record.getCellObservableValue(amended).getValue())
        .isEqualTo("amended: mass_g 41.2");
    StudyResult expected = GroupStudy.compare(ArchiveRuns.scan(mixed).select(RunSelection.DEFAULT),
        Metric.SPECIFIC_PEAK, 0.10);
    @SuppressWarnings("unchecked")
    TableView<GroupSummary> groups = robot.lookup("#archive-groups").queryAs(TableView.class);
    assertThat(groups.getItems()).containsExactlyElementsOf(expected.groups());
    double[] foamPerGram = {466 / 48.0, 468 / 41.2, 467 / 50.0, 469 / 51.0, 520 / 52.0};
    assertThat(groups.getItems().stream().filter(g -> g.name().equals("foam")).findFirst()
        .orElseThrow().mean()).isCloseTo(org.apache.commons.math3.stat.StatUtils.mean(
            foamPerGram), org.assertj.core.api.Assertions.within(1e-9));
    // the retired run is listed under the runs, with its reason
    assertThat(pane.leftOut().getItems()).anySatisfy(l -> {
      assertThat(l.runId()).isEqualTo(MixedArchive.RETIRED);
      assertThat(l.specimen()).isEqualTo("balsa-4");
      assertThat(l.reason()).isEqualTo("retired: " + MixedArchive.RETIRED_REASON);
    });
  }

  @Test
  void showsTheFiguresOfTheSharedStudyAndListsTheRunsLeftOut(FxRobot robot) throws Exception {
    Path mixed = MixedArchive.write(java.nio.file.Files.createTempDirectory("loadstone-mixed"));
    robot.interact(() -> {
      robot.lookup("#archive-folder").queryAs(javafx.scene.control.TextField.class)
          .setText(mixed.toString());
      pane.reload();
    });
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> robot.lookup("#archive-status")
        .queryAs(Label.class).getText().contains("counted in " + mixed));
    WaitForAsyncUtils.waitForFxEvents();
    // the service call the pane makes, on a fresh scan of the folder
    StudyResult expected = GroupStudy.compare(ArchiveRuns.scan(mixed).select(RunSelection.DEFAULT),
        Metric.PEAK, 0.10);
    @SuppressWarnings("unchecked")
    TableView<GroupSummary> groups = robot.lookup("#archive-groups").queryAs(TableView.class);
    assertThat(groups.getItems()).containsExactlyElementsOf(expected.groups());
    assertThat(pane.table().getItems()).hasSize(13);
    // every run left out, with its reason, in the list under the runs
    assertThat(pane.leftOut().getItems()).containsExactlyElementsOf(expected.leftOut());
    List<String> notes = robot.lookup(".archive-note").queryAllAs(Label.class).stream()
        .map(Label::getText).toList();
    assertThat(notes).anySatisfy(n -> assertThat(n).contains(MixedArchive.FOAM_OUTLIER));
    assertThat(robot.lookup("#archive-status").queryAs(Label.class).getText())
        .contains("13 runs counted")
        .contains("6 runs left out (1 uncalibrated, 1 imported, 2 manual, 1 time-limit, 1 overload)");

    // counting manual stops too: the calibrated manual run joins foam; the manual balsa run
    // stays out, its scale being nominal
    robot.clickOn("#archive-include-manual");
    WaitForAsyncUtils.waitForFxEvents();
    StudyResult withManual = GroupStudy.compare(ArchiveRuns.scan(mixed).select(
        RunSelection.DEFAULT.admitting(LeftOut.Kind.MANUAL)), Metric.PEAK, 0.10);
    @SuppressWarnings("unchecked")
    TableView<GroupSummary> after = robot.lookup("#archive-groups").queryAs(TableView.class);
    assertThat(after.getItems()).containsExactlyElementsOf(withManual.groups());
    assertThat(after.getItems().get(2).n()).isEqualTo(6);
  }

  /** Issue 14: a run that cannot be read is listed with its reason, and the others count. */
  @Test
  void listsTheRunsThatCannotBeReadWithTheirReasons(FxRobot robot) throws Exception {
    Path mixed = MixedArchive.write(java.nio.file.Files.createTempDirectory("loadstone-bad"));
    java.nio.file.Files.writeString(mixed.resolve("20261202T085900.000Z-garbled.json"), "{ ");
    String damaged = MixedArchive.countedIds("board").get(0);
    java.nio.file.Files.delete(mixed.resolve(damaged + ".csv"));
    java.nio.file.Files.writeString(mixed.resolve(damaged + ".csv"), "not a run file\n");
    robot.interact(() -> {
      robot.lookup("#archive-folder").queryAs(javafx.scene.control.TextField.class)
          .setText(mixed.toString());
      pane.reload();
    });
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> robot.lookup("#archive-status")
        .queryAs(Label.class).getText().contains("counted in " + mixed));
    WaitForAsyncUtils.waitForFxEvents();
    List<LeftOut> left = pane.leftOut().getItems();
    assertThat(left).anySatisfy(l -> {
      assertThat(l.runId()).contains("garbled.json");
      assertThat(l.reason()).contains("cannot be read");
    });
    assertThat(left).anySatisfy(l -> {
      assertThat(l.runId()).isEqualTo(damaged);
      assertThat(l.reason()).contains("cannot be read");
    });
    assertThat(robot.lookup("#archive-status").queryAs(Label.class).getText())
        .contains("12 runs counted").contains("2 unreadable");
  }

  private static int seriesIn(String id, FxRobot robot) {
    ChartViewer v = robot.lookup(id).queryAs(ChartViewer.class);
    return v.getChart().getXYPlot().getDataset().getSeriesCount();
  }
}
