package org.loadstone.ui;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.concurrent.TimeUnit;
import javafx.scene.Scene;
import javafx.scene.control.Label;
import javafx.scene.control.TextField;
import javafx.stage.Stage;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.loadstone.HangGuard;
import org.loadstone.analysis.AnalysisSettings;
import org.loadstone.analysis.AnalysisSettings.StiffnessBounds;
import org.loadstone.archive.Geometry;
import org.loadstone.archive.Run;
import org.loadstone.archive.RunData;
import org.loadstone.archive.TestRuns;
import org.loadstone.study.RunMetrics;
import org.testfx.api.FxRobot;
import org.testfx.framework.junit5.ApplicationExtension;
import org.testfx.framework.junit5.Start;
import org.testfx.util.WaitForAsyncUtils;

/**
 * The post-run stiffness window in a real JavaFX scene (headless Monocle): drawn on the run's
 * curve, refitted over a typed force band with the figures following, a band outside the curve
 * refused with the analysis' reason, and back to the automatic search.
 */
@ExtendWith(ApplicationExtension.class)
class StiffnessViewTest {
  private RunFigures figures;
  private final RunData data = TestRuns.bend(60, 460);
  private final Run run = new Run(TestRuns.meta("SV-1", "foam", Geometry.NONE, null), data,
      java.nio.file.Path.of("SV-1.csv"), java.nio.file.Path.of("SV-1.json"));

  @Start
  void start(Stage stage) {
    figures = new RunFigures();
    Scene scene = new Scene(figures.node(), 1000, 700);
    stage.setScene(scene);
    stage.show();
  }

  private static String text(FxRobot robot, String id) {
    return robot.lookup(id).queryAs(Label.class).getText();
  }

  @Test
  void theWindowIsDrawnAndABandTypedRefitsTheFigures(FxRobot robot) throws Exception {
    robot.interact(() -> figures.analyse(run));
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> robot.lookup("#stiffness-view").tryQuery().isPresent());
    WaitForAsyncUtils.waitForFxEvents();
    RunMetrics auto = RunMetrics.of(run.metadata(), run.data());
    var fit = auto.analysis().stiffness().orElseThrow();
    assertThat(text(robot, "#figure-stiffness"))
        .isEqualTo(RunFigures.fmt(fit.slope_N_per_mm(), "N/mm"));
    assertThat(text(robot, "#stiffness-note")).startsWith("automatic");
    assertThat(robot.lookup("#stiffness-from-field").queryAs(TextField.class).getText())
        .isEqualTo(String.format(java.util.Locale.ROOT, "%.4g", fit.fromForce_N()));

    // a band of one's own: the figures are the analysis' over every sample from 50 to 250 N
    robot.interact(() -> {
      robot.lookup("#stiffness-from-field").queryAs(TextField.class).setText("50");
      robot.lookup("#stiffness-to-field").queryAs(TextField.class).setText("250");
    });
    robot.clickOn("#stiffness-band-button");
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> text(robot, "#stiffness-note").startsWith("force band"));
    WaitForAsyncUtils.waitForFxEvents();
    RunMetrics band = RunMetrics.of(run.metadata(), run.data(),
        AnalysisSettings.DEFAULTS.withStiffnessBounds(StiffnessBounds.force_N(50, 250)));
    assertThat(text(robot, "#figure-stiffness")).isEqualTo(RunFigures.fmt(
        band.analysis().stiffness_N_per_mm().getAsDouble(), "N/mm"));
    // the synthetic run rises at 60 N/mm by construction (TestRuns.bend)
    assertThat(band.analysis().stiffness_N_per_mm().getAsDouble()).isBetween(59.0, 61.0);

    // a band outside the curve: the analysis' refusal, the figures left as they were
    robot.interact(() -> {
      robot.lookup("#stiffness-from-field").queryAs(TextField.class).setText("400");
      robot.lookup("#stiffness-to-field").queryAs(TextField.class).setText("900");
    });
    robot.clickOn("#stiffness-band-button");
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> text(robot, "#stiffness-note").contains("outside the curve"));
    robot.interact(() -> robot.lookup("#stiffness-to-field").queryAs(TextField.class)
        .setText("lots"));
    robot.clickOn("#stiffness-band-button");
    WaitForAsyncUtils.waitForFxEvents();
    assertThat(text(robot, "#stiffness-note")).contains("'lots' is not a number");

    robot.clickOn("#stiffness-auto-button");
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> text(robot, "#stiffness-note").startsWith("automatic"));
  }

  @Test
  void thePostRunChartMarksThePeakAndTheBreakInTheDisplayUnit(FxRobot robot) throws Exception {
    robot.interact(() -> figures.analyse(run));
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> robot.lookup("#stiffness-view").tryQuery().isPresent());
    WaitForAsyncUtils.waitForFxEvents();
    // TestRuns.bend(60, 460) by construction: a straight rise to 80 % of the peak at 0.01 mm a
    // sample (613 samples), a rounding of 307 samples to 460 N at 9.20 mm, then 20 samples
    // falling by 4 % of the peak each
    double[] peak = figures.stiffnessView().marks().get("peak");
    assertThat(peak[0]).isCloseTo(9.20, org.assertj.core.data.Offset.offset(1e-9));
    assertThat(peak[1]).isEqualTo(460.0);
    double[] brk = figures.stiffnessView().marks().get("break");
    assertThat(brk).as("a break is marked").isNotNull();
    int j = (int) Math.round((brk[0] - 9.20) / 0.01);
    assertThat(j).isBetween(1, 20); // on the fall, after the peak
    assertThat(brk[1]).isCloseTo(460 * (1 - 0.8 * j / 20.0),
        org.assertj.core.data.Offset.offset(1e-9));
    // the fitted line is drawn over its window (the window's series beside the curve)
    assertThat(figures.stiffnessView().yAxis()).isEqualTo("force (N)");

    // in kN the marks and the axis follow; the run stays as it was
    robot.interact(() -> figures.setUnit(org.loadstone.units.ForceUnit.KN));
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> figures.stiffnessView().yAxis().equals("force (kN)"));
    WaitForAsyncUtils.waitForFxEvents();
    assertThat(figures.stiffnessView().marks().get("peak")[1]).isEqualTo(0.46);
    assertThat(text(robot, "#figure-peak")).isEqualTo(RunFigures.fmt(0.46, "kN"));
    assertThat(run.data().size()).isEqualTo(data.size());
  }
}
