package org.loadstone.ui;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import javafx.scene.Scene;
import javafx.scene.control.ComboBox;
import javafx.scene.control.Label;
import javafx.scene.control.TextField;
import javafx.stage.Stage;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.loadstone.HangGuard;
import org.loadstone.acquire.CrushEnd;
import org.loadstone.acquire.LiveFeed;
import org.loadstone.acquire.RunPreset;
import org.loadstone.archive.TestType;
import org.loadstone.device.SimSetup;
import org.loadstone.units.ForceUnit;
import org.testfx.api.FxRobot;
import org.testfx.framework.junit5.ApplicationExtension;
import org.testfx.framework.junit5.Start;
import org.testfx.util.WaitForAsyncUtils;

/**
 * The live window's run settings, display unit and scrolling chart in a real JavaFX scene
 * (headless Monocle), on the simulated frame.
 */
@ExtendWith(ApplicationExtension.class)
class LiveSettingsTest {
  /** One pound-force in newtons, exactly (NIST SP 811, appendix B: 4.448 221 615 260 5 N). */
  private static final double LBF_N = 4.4482216152605;

  private LivePane pane;
  private Path archive;
  private final SimSetup sim = new SimSetup("brittle", 3, 1000, false, 1);

  @Start
  void start(Stage stage) throws Exception {
    Path home = Files.createTempDirectory("loadstone-home");
    archive = home.resolve("runs");
    pane = new LivePane(DefaultDevice.simulated(sim, archive, home));
    Scene scene = new Scene(pane.root(), 1100, 700);
    scene.getStylesheets().add(
        LivePane.class.getResource("/org/loadstone/ui/console.css").toExternalForm());
    pane.installKeys(scene);
    stage.setScene(scene);
    stage.show();
    // a specimen id, as an operator types before arming (an empty one is refused)
    ((TextField) pane.root().lookup("#specimen-field")).setText("set-00");
    pane.connect().get(HangGuard.S, TimeUnit.SECONDS);
  }

  @AfterEach
  void stop() throws Exception {
    WaitForAsyncUtils.asyncFx(() -> pane.disconnect()).get(HangGuard.S, TimeUnit.SECONDS)
        .get(HangGuard.S, TimeUnit.SECONDS);
  }

  private static String text(FxRobot robot, String id) {
    return robot.lookup(id).queryAs(TextField.class).getText();
  }

  private static boolean shown(FxRobot robot, String id) {
    return robot.lookup(id).query().isVisible();
  }

  @SuppressWarnings("unchecked")
  private static <T> ComboBox<T> combo(FxRobot robot, String id) {
    return robot.lookup(id).queryAs(ComboBox.class);
  }

  @Test
  void choosingATestTypeAppliesItsPreset(FxRobot robot) {
    robot.interact(() -> combo(robot, "#test-type").setValue(TestType.CRUSH));
    RunPreset crush = RunPreset.of(TestType.CRUSH);
    assertThat(text(robot, "#start-field")).isEqualTo(RunSettingsFields.fmt(
        crush.startThreshold_N()));
    assertThat(text(robot, "#time-limit-field")).isEqualTo(RunSettingsFields.fmt(
        crush.maxSeconds()));
    // the crush end rule in its own fields, in per cent and seconds (CrushEnd keeps a fraction)
    assertThat(text(robot, "#low-force-field")).isEqualTo("5");
    assertThat(text(robot, "#low-force-time-field")).isEqualTo(RunSettingsFields.fmt(
        CrushEnd.DEFAULTS.lowForce_s()));
    assertThat(shown(robot, "#travel-limit-field")).isTrue();

    robot.interact(() -> combo(robot, "#test-type").setValue(TestType.TENSION));
    RunPreset tension = RunPreset.of(TestType.TENSION);
    assertThat(text(robot, "#drop-field")).isEqualTo(RunSettingsFields.fmt(
        tension.breakDropPct()));
    assertThat(text(robot, "#tail-field")).isEqualTo(RunSettingsFields.fmt(
        tension.postBreak_s()));
    assertThat(shown(robot, "#travel-limit-field")).isFalse(); // a crush's rule only

    // a preset chosen on its own fills the fields without changing the test
    robot.interact(() -> combo(robot, "#preset-choice").setValue(TestType.COMPRESSION));
    assertThat(text(robot, "#drop-field")).isEqualTo(RunSettingsFields.fmt(
        RunPreset.of(TestType.COMPRESSION).breakDropPct()));
    assertThat(combo(robot, "#test-type").getValue()).isEqualTo(TestType.TENSION);
  }

  @Test
  void aBadValueIsRefusedAtItsFieldAndNoRunIsArmed(FxRobot robot) throws Exception {
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> !pane.feed().taring());
    // a break drop must lie between 0 and 100 % of the peak (RunSettings' own range)
    robot.interact(() -> robot.lookup("#drop-field").queryAs(TextField.class).setText("140"));
    Label fault = robot.lookup("#drop-fault").queryAs(Label.class);
    assertThat(fault.isVisible()).isTrue();
    assertThat(fault.getText()).contains("break drop").contains("between 0 and 100");
    assertThat(robot.lookup("#drop-field").query().getStyleClass()).contains("field-bad");
    robot.interact(() -> robot.lookup("#tail-field").queryAs(TextField.class).setText("half"));
    assertThat(robot.lookup("#tail-fault").queryAs(Label.class).getText())
        .contains("'half' is not a number");

    robot.clickOn("#arm-button");
    WaitForAsyncUtils.waitForFxEvents();
    assertThat(pane.runResult().getText()).contains("in the console: Live tab, Run settings");
    assertThat(robot.lookup("#run-state").queryAs(Label.class).getText()).isEqualTo("NOT ARMED");
    assertThat(robot.lookup("#run-settings-pane").queryAs(javafx.scene.control.TitledPane.class)
        .isExpanded()).isTrue(); // unfolded, so the field's fault is seen

    robot.interact(() -> {
      robot.lookup("#drop-field").queryAs(TextField.class).setText("40");
      robot.lookup("#tail-field").queryAs(TextField.class).setText("0.5");
    });
    assertThat(robot.lookup("#drop-fault").queryAs(Label.class).isVisible()).isFalse();
    assertThat(robot.lookup("#tail-fault").queryAs(Label.class).isVisible()).isFalse();
  }

  @Test
  void theUnitChangesReadoutAxisAndFiguresButTheStoredRunStaysInNewtons(FxRobot robot)
      throws Exception {
    robot.interact(() -> combo(robot, "#unit-choice").setValue(ForceUnit.KN));
    assertThat(pane.chart().yAxis()).isEqualTo("force (kN)");
    assertThat(robot.lookup("#start-field").queryAs(TextField.class).getText())
        .isEqualTo("0.005"); // the 5 N start, typed in kN
    robot.clickOn("#arm-button");
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> pane.runResult().getText().startsWith("run "));
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> robot.lookup("#figure-peak").tryQuery().isPresent());
    WaitForAsyncUtils.waitForFxEvents();

    // the stored file, read as text: forces in N whatever the display, near the simulated
    // specimen's designed failure load (its own truth)
    Path csv;
    try (var files = Files.list(archive)) {
      csv = files.filter(f -> f.getFileName().toString().endsWith("set-00.csv")).findFirst()
          .orElseThrow();
    }
    List<String> lines = Files.readAllLines(csv);
    List<String> header = List.of(lines.get(0).split(","));
    int col = header.indexOf("force_N");
    assertThat(col).isGreaterThanOrEqualTo(0);
    double peak_N = lines.stream().skip(1).mapToDouble(l -> Double.parseDouble(l.split(",")[col]))
        .max().orElseThrow();
    double failure_N = sim.buildFrame().truth().specimen().failureLoad_N();
    assertThat(peak_N).isBetween(0.9 * failure_N, 1.1 * failure_N);
    assertThat(robot.lookup("#figure-peak").queryAs(Label.class).getText())
        .isEqualTo(RunFigures.fmt(peak_N / 1000, "kN"));

    // the readout and the chart of the same frame, frozen once the device is closed
    WaitForAsyncUtils.asyncFx(() -> pane.disconnect()).get(HangGuard.S, TimeUnit.SECONDS)
        .get(HangGuard.S, TimeUnit.SECONDS);
    String[] seen = new String[4];
    double[] truth = new double[2];
    long t0 = System.nanoTime();
    robot.interact(() -> {
      // the display's own clock, passed on: far enough on that the chart is drawn again
      pane.refresh(t0 + 1_000_000_000L);
      LiveFeed.Snapshot s = pane.feed().poll();
      truth[0] = s.force_N();
      truth[1] = s.peak_N();
      seen[0] = robot.lookup("#force-value").queryAs(Label.class).getText();
      seen[1] = robot.lookup("#peak-value").queryAs(Label.class).getText();
      combo(robot, "#unit-choice").setValue(ForceUnit.LBF);
      pane.refresh(t0 + 2_000_000_000L);
      seen[2] = robot.lookup("#force-value").queryAs(Label.class).getText();
      seen[3] = pane.chart().yAxis();
    });
    assertThat(seen[0]).isEqualTo(Readout.fmt(truth[0] / 1000));
    assertThat(seen[1]).isEqualTo("peak " + Readout.fmt(truth[1] / 1000) + " kN");
    assertThat(seen[2]).isEqualTo(Readout.fmt(truth[0] / LBF_N));
    assertThat(seen[3]).isEqualTo("force (lbf)");
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> robot.lookup("#figure-peak")
        .queryAs(Label.class).getText().endsWith(" lbf"));
    assertThat(robot.lookup("#figure-peak").queryAs(Label.class).getText())
        .isEqualTo(RunFigures.fmt(peak_N / LBF_N, "lbf"));
    // nothing stored was rewritten by showing it in other units
    assertThat(Files.readAllLines(csv)).isEqualTo(lines);
  }

  @Test
  void theTimeAxisFollowsTheNewestSamplesAndThePeakIsMarked(FxRobot robot) throws Exception {
    robot.interact(() -> pane.chart().setWindow(5));
    // counted by the device's own sample clock: 8 s of samples, so the 5 s window has moved
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> lastTime(robot) > 8);
    double[] first = axis(robot);
    assertThat(first[2] - first[1]).isCloseTo(5.0, org.assertj.core.data.Offset.offset(1e-9));
    assertThat(first[1]).isCloseTo(first[0] - 5, org.assertj.core.data.Offset.offset(1e-9));
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS,
        () -> lastTime(robot) > first[0] + 2);
    double[] later = axis(robot);
    assertThat(later[1]).isGreaterThan(first[1] + 2); // the lower bound moved with the samples
    assertThat(later[1]).isCloseTo(later[0] - 5, org.assertj.core.data.Offset.offset(1e-9));
    // the peak line is at the readout's peak
    String[] peak = new String[2];
    long t0 = System.nanoTime();
    robot.interact(() -> {
      pane.refresh(t0 + 1_000_000_000L); // far enough on that the chart is drawn again
      peak[0] = robot.lookup("#peak-value").queryAs(Label.class).getText();
      peak[1] = "peak " + Readout.fmt(pane.chart().peakMark()) + " N";
    });
    assertThat(peak[1]).isEqualTo(peak[0]);
  }

  /** The newest time drawn, s. */
  private double lastTime(FxRobot robot) {
    double[] t = new double[] {-1};
    robot.interact(() -> {
      double[] p = pane.chart().lastPoint();
      t[0] = p == null ? -1 : p[0];
    });
    return t[0];
  }

  /** The newest time drawn and the time axis' bounds, read in one step. */
  private double[] axis(FxRobot robot) {
    double[] a = new double[3];
    robot.interact(() -> {
      a[0] = pane.chart().lastPoint()[0];
      double[] r = pane.chart().xRange();
      a[1] = r[0];
      a[2] = r[1];
    });
    return a;
  }
}
