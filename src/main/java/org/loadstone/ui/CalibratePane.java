package org.loadstone.ui;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.Locale;
import java.util.function.Consumer;
import java.util.function.Supplier;
import javafx.animation.AnimationTimer;
import javafx.geometry.Pos;
import javafx.scene.Parent;
import javafx.scene.control.Button;
import javafx.scene.control.CheckBox;
import javafx.scene.control.Label;
import javafx.scene.control.Spinner;
import javafx.scene.control.TextArea;
import javafx.scene.control.TextField;
import javafx.scene.layout.BorderPane;
import javafx.scene.layout.GridPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.VBox;
import org.loadstone.acquire.DeviceReader;
import org.loadstone.acquire.SampleRing;
import org.loadstone.calibration.CalibrationDocument;
import org.loadstone.calibration.CalibrationFiles;
import org.loadstone.calibration.CalibrationPlan;
import org.loadstone.calibration.CalibrationPoint;
import org.loadstone.calibration.CalibrationReport;
import org.loadstone.calibration.CalibrationService;
import org.loadstone.calibration.CalibrationSession;
import org.loadstone.calibration.CalibrationSettings;
import org.loadstone.calibration.ForceFromMass;
import org.loadstone.calibration.MassText;
import org.loadstone.calibration.StabilityDetector;
import org.loadstone.device.WeightHandler;
import org.loadstone.units.LoadstoneException;

/**
 * Calibrating a load cell with known weights, in the console: the plan (cell, loads, series, up
 * and down), then step by step the weight to place, the live counts with the steadiness of the
 * reading, and a capture when it has settled; then the fits and their figures in the style of
 * ASTM E74 and ISO 7500-1, saved as a calibration file and, on request, used for the next runs.
 * Thin: the walk is {@link CalibrationSession}'s, the fit and the file {@link
 * CalibrationService}'s, as for {@code loadstone calibrate}.
 */
final class CalibratePane {
  private final Supplier<DeviceReader> reader;
  private final Consumer<Path> useCalibration;
  private final BorderPane root = new BorderPane();
  private final TextField cell = RunPanel.field("cal-cell", "cell id, e.g. beam-500N");
  private final TextField loads = RunPanel.field("cal-loads", "");
  private final Spinner<Integer> series = new Spinner<>(1, 3, 1);
  private final CheckBox descending = new CheckBox("up and down");
  private final TextField folder = RunPanel.field("cal-folder", "");
  private final TextField gravity = RunPanel.field("cal-gravity", "9.80665 (standard)");
  private CalibrationSettings settings = CalibrationSettings.defaults();
  private final TextField placed = RunPanel.field("cal-placed", "mass placed, if not as planned");
  private final Label step = LivePane.label("cal-step", "set the plan, then Start");
  private final Label counts = LivePane.label("cal-counts", "—");
  private final Label steadiness = LivePane.label("cal-steadiness", "");
  private final Label message = LivePane.label("cal-message", "");
  private final TextArea result = new TextArea();
  private final Button capture = new Button("Capture when steady  [C]");
  private final Button save = new Button("Save");
  private final Button use = new Button("Use for the next runs");
  private final Button skip = new Button("Skip step");
  private CalibrationSession session;
  private SampleRing.Cursor cursor;
  private WeightHandler weights = WeightHandler.operator();
  private boolean captureWanted;
  private CalibrationReport report;
  private Path saved;
  private final AnimationTimer timer = new AnimationTimer() {
    @Override
    public void handle(long now) {
      poll();
    }
  };

  /**
   * @param reader the connected device, or null before it is
   * @param useCalibration makes a saved calibration file the scale of the next runs
   */
  CalibratePane(Supplier<DeviceReader> reader, Consumer<Path> useCalibration) {
    this.reader = reader;
    this.useCalibration = useCalibration;
    loads.setText("0.5 kg, 1 kg, 2 kg, 5 kg");
    folder.setText(Path.of("calibration").toAbsolutePath().toString());
    build();
  }

  Parent root() {
    return root;
  }

  private void build() {
    root.getStyleClass().add("archive");
    series.setId("cal-series");
    series.setPrefWidth(70);
    descending.setId("cal-descending");
    Button start = new Button("Start");
    start.setId("cal-start");
    start.setOnAction(e -> start());
    GridPane plan = new GridPane();
    plan.setHgap(10);
    plan.setVgap(8);
    plan.addRow(0, new Label("cell"), cell, new Label("loads"), loads);
    plan.addRow(1, new Label("series"), new HBox(10, series, descending), new Label("save in"),
        folder, start);
    plan.addRow(2, new Label("local g m/s²"), gravity);
    GridPane.setHgrow(loads, Priority.ALWAYS);
    GridPane.setHgrow(folder, Priority.ALWAYS);
    plan.getStyleClass().add("archive-bar");
    root.setTop(plan);

    capture.setId("cal-capture");
    capture.setOnAction(e -> captureWanted = true);
    Button retake = new Button("Retake last");
    retake.setId("cal-retake");
    retake.setOnAction(e -> retake());
    skip.setId("cal-skip");
    skip.setOnAction(e -> skip());
    skip.setDisable(true);
    capture.setDisable(true);
    HBox actions = new HBox(10, capture, skip, retake);
    actions.setAlignment(Pos.CENTER_LEFT);
    HBox.setHgrow(capture, Priority.ALWAYS);
    capture.setMaxWidth(Double.MAX_VALUE);
    message.setWrapText(true);
    step.setWrapText(true);
    VBox live = new VBox(10, step, counts, steadiness, placed, actions, message);
    live.getStyleClass().add("readout");
    live.setPrefWidth(520);

    result.setId("cal-result");
    result.setEditable(false);
    result.getStyleClass().add("cal-result");
    save.setId("cal-save");
    save.setDisable(true);
    save.setOnAction(e -> save());
    use.setId("cal-use");
    use.setDisable(true);
    use.setOnAction(e -> use());
    HBox resultButtons = new HBox(10, save, use);
    VBox results = new VBox(8, result, resultButtons);
    VBox.setVgrow(result, Priority.ALWAYS);
    results.getStyleClass().add("archive-statistics");
    HBox body = new HBox(live, results);
    HBox.setHgrow(results, Priority.ALWAYS);
    root.setCenter(body);
    Label hint = LivePane.label("cal-hint", "Place each weight gently and keep the press "
        + "still; the reading is taken once it has settled. Keep hands and feet clear of hanging "
        + "weights and never load the cell beyond its rated capacity. On the simulated frame "
        + "start the console with --scenario dead-weight and the weights are placed for you.");
    hint.setWrapText(true);
    HBox bottom = new HBox(hint);
    bottom.getStyleClass().add("bottom-bar");
    root.setBottom(bottom);
  }

  /** C captures the current step once steady, while {@code active} (this tab is shown). */
  void installKeys(javafx.scene.Scene scene, java.util.function.BooleanSupplier active) {
    scene.addEventHandler(javafx.scene.input.KeyEvent.KEY_PRESSED, e -> {
      if (active.getAsBoolean() && e.getCode() == javafx.scene.input.KeyCode.C
          && !(e.getTarget() instanceof javafx.scene.control.TextInputControl)
          && !capture.isDisabled()) {
        captureWanted = true;
      }
    });
  }

  /** Starts a new walk through the plan typed in. */
  void start() {
    DeviceReader r = reader.get();
    if (r == null) {
      message.setText("no device: connect on the Live tab first");
      return;
    }
    try {
      if (!cell.getText().trim().matches("[A-Za-z0-9][A-Za-z0-9._-]{0,79}")) {
        throw new LoadstoneException("cell id '" + cell.getText().trim() + "' is not valid: "
            + "use 1 to 80 letters, digits, '.', '_' or '-', starting with a letter or digit");
      }
      CalibrationPlan plan = new CalibrationPlan(MassText.parseList_kg(loads.getText(), "loads"),
          descending.isSelected(), series.getValue());
      double rate = org.loadstone.acquire.SampleRate.known(r).orElseThrow(() ->
          new LoadstoneException("the device has not stated its sample rate, and too few "
              + "samples have arrived to measure it: wait until the live force shows, then "
              + "start again")).rate_Hz();
      Double g = SpecimenFields.number(gravity, "local g", "m/s²");
      settings = new CalibrationSettings(
          g == null ? ForceFromMass.standard() : ForceFromMass.withGravity(g), null, null);
      session = new CalibrationSession(plan, settings.forceModel(),
          StabilityDetector.Settings.defaults(rate));
      weights = WeightHandler.forTransport(r.transport());
      cursor = r.ring().cursorAtEnd();
      report = null;
      saved = null;
      result.clear();
      save.setDisable(true);
      use.setDisable(true);
      message.setText("");
      prepareStep();
      timer.start();
    } catch (LoadstoneException e) {
      message.setText(ConsoleHints.withHow(e));
    }
  }

  /** Shows the current step and, on the simulator, puts its weights on. */
  private void prepareStep() {
    CalibrationPlan.Step s = session.current();
    if (s == null) {
      finish();
      return;
    }
    step.setText(String.format(Locale.ROOT, "[%d/%d] series %d, %s: %s", s.number(),
        session.stepCount(),
        s.series(), s.direction().label(), s.mass_kg() == 0 ? "remove all weights"
            : "place " + MassText.format(s.mass_kg())));
    placed.clear();
    captureWanted = false;
    capture.setDisable(false);
    skip.setDisable(!session.canSkip());
    try {
      weights.load(s.mass_kg());
    } catch (LoadstoneException e) {
      message.setText(ConsoleHints.withHow(e));
    }
  }

  /** Feeds the newest samples to the steadiness judgement; captures when asked and steady. */
  private void poll() {
    if (session == null || session.done()) {
      return;
    }
    double[] last = {Double.NaN};
    StabilityDetector.State[] state = {null};
    try {
      cursor.drain((i, seq, dev, tUs, c, hasPos, pos) -> {
        last[0] = c;
        state[0] = session.offer(c);
      }, Integer.MAX_VALUE);
    } catch (LoadstoneException e) {
      message.setText(ConsoleHints.withHow(e)); // not settled in time: the judgement starts again
      return;
    }
    if (Double.isNaN(last[0])) {
      return;
    }
    StabilityDetector d = session.detector();
    counts.setText(String.format(Locale.ROOT, "%.0f counts", last[0]));
    steadiness.setText(String.format(Locale.ROOT, "%s   sd %.1f   drift %+.1f/s",
        state[0] == StabilityDetector.State.STABLE ? "STEADY" : "settling",
        d.lastSd_counts(), d.lastDrift_counts_per_s()));
    steadiness.getStyleClass().removeAll("cal-steady");
    if (state[0] == StabilityDetector.State.STABLE) {
      steadiness.getStyleClass().add("cal-steady");
    }
    if (captureWanted && state[0] == StabilityDetector.State.STABLE) {
      takeReading();
    }
  }

  private void takeReading() {
    try {
      String typed = placed.getText().trim();
      CalibrationPoint p = typed.isEmpty() ? session.capture()
          : session.capture(MassText.parse_kg(typed));
      message.setText(String.format(Locale.ROOT, "captured %.6g N: mean %.1f counts, sd %.1f",
          p.force_N(), p.counts_mean(), p.counts_sd()));
      prepareStep();
    } catch (LoadstoneException e) {
      captureWanted = false;
      message.setText(ConsoleHints.withHow(e));
    }
  }

  /** Skips the current load step (the session refuses a zero step). */
  private void skip() {
    if (session == null || session.done()) {
      return;
    }
    try {
      session.skip();
      message.setText("step skipped (" + session.skipped() + " so far)");
      prepareStep();
    } catch (LoadstoneException e) {
      message.setText(ConsoleHints.withHow(e));
    }
  }

  private void retake() {
    if (session != null && !session.points().isEmpty()) {
      session.retakeLast();
      report = null;
      save.setDisable(true);
      use.setDisable(true);
      result.clear();
      timer.start();
      prepareStep();
    }
  }

  /** All steps are in: fit and show. */
  private void finish() {
    timer.stop();
    capture.setDisable(true);
    skip.setDisable(true);
    counts.setText("");
    steadiness.setText("");
    step.setText("all readings taken: " + session.points().size() + " points"
        + (session.skipped() > 0 ? ", " + session.skipped() + " step(s) skipped" : ""));
    try {
      report = CalibrationService.fitFromPoints(session.points(), settings);
      result.setText("Calibration of cell " + cell.getText().trim() + "\n"
          + CalibrationService.fitTable(report) + "\nFigures " + CalibrationService.STANDARDS_NOTE
          + ".\n");
      save.setDisable(false);
      weights.load(0);
    } catch (LoadstoneException e) {
      message.setText("not fitted: " + e.getMessage());
    }
  }

  /** Saves the calibration (never over another) with the points beside it. */
  private void save() {
    Path dir = Path.of(folder.getText().trim());
    LocalDate today = LocalDate.now();
    try {
      Files.createDirectories(dir);
      String id = CalibrationService.unusedId(dir, cell.getText().trim() + "-" + today);
      String desc = "captured live in the console: " + session.points().size() + " points"
          + (session.skipped() > 0 ? ", " + session.skipped() + " step(s) skipped" : "");
      Path points = CalibrationService.savePoints(dir, id, session.points(), desc);
      CalibrationDocument doc = CalibrationService.save(dir, report, id, today,
          System.getProperty("user.name", "unknown"), cell.getText().trim(),
          today.plusDays(365), desc);
      saved = CalibrationFiles.fileFor(dir, doc.id());
      message.setText("saved " + saved + " (content SHA-256 " + doc.contentSha256()
          + "), points in " + points.getFileName());
      save.setDisable(true);
      use.setDisable(false);
    } catch (IOException e) {
      message.setText("cannot create the folder " + dir + ": " + e.getMessage());
    } catch (LoadstoneException e) {
      message.setText(ConsoleHints.withHow(e));
    }
  }

  private void use() {
    try {
      useCalibration.accept(saved);
      message.setText("the live force and the next runs use " + saved.getFileName());
      use.setDisable(true);
    } catch (LoadstoneException e) {
      message.setText(ConsoleHints.withHow(e));
    }
  }

  /** Stops following the device. */
  void close() {
    timer.stop();
  }

}
