package org.loadstone.ui;

import java.util.Locale;
import java.util.concurrent.CompletableFuture;
import javafx.animation.AnimationTimer;
import javafx.geometry.Insets;
import javafx.geometry.Pos;
import javafx.scene.Parent;
import javafx.scene.Scene;
import javafx.scene.control.Button;
import javafx.scene.control.Label;
import javafx.scene.input.KeyCode;
import javafx.scene.layout.BorderPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.Region;
import javafx.scene.layout.VBox;
import org.loadstone.acquire.DeviceReader;
import org.loadstone.acquire.ForceScale;
import org.loadstone.acquire.RunSetup;
import org.loadstone.acquire.LiveFeed;
import org.loadstone.acquire.ScaleChoice;
import org.loadstone.acquire.CapacityGauge;
import org.loadstone.acquire.StationStatus;
import org.loadstone.protocol.DecoderCounters;
import org.loadstone.units.LoadstoneException;

/**
 * The live pane: a large force readout for reading from across the bench, peak and crosshead
 * position, a live force–time chart, and the stream's health. Thin: all figures come from {@link
 * LiveFeed}.
 */
final class LivePane {

  private final ConsoleConfig config;
  private final BorderPane root = new BorderPane();
  private final Readout readout = new Readout();
  private final Label device = label("device-line", "");
  private final Label health = label("health-line", "");
  private StateBand band;
  private StationStatus.Link link = StationStatus.Link.CONNECTING;
  private String lostReason;
  private final Button reconnect = new Button("Reconnect");
  private final Button plotAxis = new Button();
  private final RunPanel run;
  private final ForceChart chart = new ForceChart();
  /**
   * How counts become force: the configured scale until a calibration is chosen here; null while
   * none is known (the readout shows counts and runs are refused).
   */
  private volatile ScaleChoice scale;
  /** Whether the chart shows force against crosshead travel (otherwise against time). */
  private boolean againstTravel;
  private final DeviceLink deviceLink;
  private AnimationTimer timer;
  private long lastChartNanos;
  LivePane(ConsoleConfig config) {
    this.config = config;
    this.scale = config.scale();
    this.deviceLink = new DeviceLink(config);
    this.run = new RunPanel(config, new RunPanel.Device() {
      @Override
      public DeviceReader reader() {
        return deviceLink.reader();
      }

      @Override
      public LiveFeed feed() {
        return deviceLink.feed();
      }

      @Override
      public ScaleChoice scale() {
        return scale;
      }

      @Override
      public RunSetup setup() {
        return deviceLink.setup();
      }
    }, this::newSpecimen);
    build();
    run.recoverJournals(); // runs a killed console left, before any new run
  }

  Parent root() {
    return root;
  }

  static Label label(String id, String text) {
    Label l = new Label(text);
    l.setId(id);
    return l;
  }

  private void build() {
    root.getStyleClass().add("console");

    Label mark = label("wordmark", "LOADSTONE");
    Region grow = new Region();
    HBox.setHgrow(grow, Priority.ALWAYS);
    device.setText(config.deviceLabel() + (scale == null
        ? "  ·  no calibration chosen: the readout shows counts" : ""));
    HBox top = new HBox(16, mark, device, grow);
    top.getStyleClass().add("top-bar");
    top.setAlignment(Pos.CENTER_LEFT);

    VBox header = new VBox(top);
    SafetyNotice notice = new SafetyNotice(config.home());
    if (notice.needed()) {
      header.getChildren().add(SafetyBanner.of(notice, banner -> {
        header.getChildren().remove(banner);
        root.requestFocus(); // back to the window, so the one-key commands act (not a field)
      }));
    }
    band = new StateBand(run.actions());
    header.getChildren().add(band.node());
    root.setTop(header);

    Button tare = new Button("Zero [Z]");
    tare.setId("tare-button");
    tare.setOnAction(e -> tare());
    Button clearPeak = new Button("Clear peak [P]");
    clearPeak.setId("clear-peak-button");
    clearPeak.setOnAction(e -> clearPeak());
    tare.setMaxWidth(Double.MAX_VALUE);
    clearPeak.setMaxWidth(Double.MAX_VALUE);
    reconnect.setId("reconnect-button");
    reconnect.setMaxWidth(Double.MAX_VALUE);
    reconnect.setVisible(false);
    reconnect.setManaged(false);
    reconnect.setOnAction(e -> connect());
    plotAxis.setId("plot-axis-button");
    plotAxis.setMaxWidth(Double.MAX_VALUE);
    plotAxis.setOnAction(e -> togglePlot());
    showPlotChoice();
    HBox zeroAndPeak = new HBox(8, tare, clearPeak);
    HBox.setHgrow(tare, Priority.ALWAYS);
    HBox.setHgrow(clearPeak, Priority.ALWAYS);
    // the readout stays put; the controls below it scroll when the specimen sizes are open
    VBox controls = new VBox(6, run.node(), spacer(), zeroAndPeak, plotAxis, reconnect);
    controls.getStyleClass().add("controls");
    javafx.scene.control.ScrollPane scroll = new javafx.scene.control.ScrollPane(controls);
    scroll.setFitToWidth(true);
    // at least as tall as the view (so Zero and Clear peak sit at the bottom), taller when needed
    controls.minHeightProperty().bind(javafx.beans.binding.Bindings.createDoubleBinding(
        () -> scroll.getViewportBounds().getHeight(), scroll.viewportBoundsProperty()));
    scroll.setHbarPolicy(javafx.scene.control.ScrollPane.ScrollBarPolicy.NEVER);
    scroll.getStyleClass().add("controls-scroll");
    VBox.setVgrow(scroll, Priority.ALWAYS);
    VBox left = new VBox(6);
    left.getChildren().addAll(readout.nodes());
    left.getChildren().add(scroll);
    left.getStyleClass().add("readout");
    left.setPrefWidth(380);
    root.setLeft(left);
    readout.onUnit(this::useUnit);
    chart.onWindow(s -> {
      LiveFeed f = deviceLink.feed();
      if (f != null) {
        f.setTraceWindow(s); // keeps what the chart shows, not more
      }
      lastChartNanos = 0; // redraw at the next frame
    });
    useUnit(run.form().rememberedUnit());

    BorderPane chartBox = new BorderPane(chart.node());
    // the post-run figures under the live chart, scrolled when they would squeeze it away
    javafx.scene.control.ScrollPane figures = new javafx.scene.control.ScrollPane(run.figures());
    figures.setFitToWidth(true);
    figures.setHbarPolicy(javafx.scene.control.ScrollPane.ScrollBarPolicy.NEVER);
    figures.getStyleClass().add("figures-scroll");
    figures.maxHeightProperty().bind(chartBox.heightProperty().multiply(0.62));
    figures.visibleProperty().bind(run.figures().visibleProperty());
    figures.managedProperty().bind(run.figures().managedProperty());
    chart.node().setMinHeight(150);
    chartBox.setBottom(figures);
    chartBox.getStyleClass().add("chart-box");
    BorderPane.setMargin(chartBox, new Insets(12, 12, 0, 0));
    root.setCenter(chartBox);

    HBox bottom = new HBox(health);
    bottom.getStyleClass().add("bottom-bar");
    root.setBottom(bottom);
  }

  /** Shows forces in {@code u}: readout, charts, figures and the start force's field. */
  private void useUnit(org.loadstone.units.ForceUnit u) {
    if (readout.unit() != u) {
      readout.setUnit(u); // comes back here through the choice's listener
      return;
    }
    chart.setUnit(u);
    run.setUnit(u);
    lastChartNanos = 0; // redraw at the next frame
  }

  private static Region spacer() {
    Region r = new Region();
    VBox.setVgrow(r, Priority.ALWAYS);
    return r;
  }

  void installKeys(Scene scene) {
    installKeys(scene, () -> true);
  }

  /**
   * The one-key commands (Z, P, A, S, X, and N on the simulated frame; Esc stops from anywhere), active while {@code active} says so (the live view is
   * the one shown) and not while typing in a field.
   */
  void installKeys(Scene scene, java.util.function.BooleanSupplier active) {
    LiveKeys.install(scene, active, java.util.Map.of(KeyCode.Z, this::tare,
        KeyCode.P, this::clearPeak, KeyCode.A, run::arm, KeyCode.S, run::stop,
        KeyCode.X, this::togglePlot, KeyCode.N, run::nextSpecimen), run::stop);
  }

  private void tare() {
    if (run.holdsZero()) {
      run.refuse("zero");
      return;
    }
    LiveFeed feed = deviceLink.feed();
    if (feed != null) {
      feed.tare(20);
      feed.restartCurve();
    }
  }

  private void clearPeak() {
    if (run.holdsZero()) {
      run.refuse("clear peak");
      return;
    }
    newSpecimen();
  }

  /** A new specimen: its own peak and its own force–crosshead curve. */
  private void newSpecimen() {
    LiveFeed feed = deviceLink.feed();
    if (feed != null) {
      feed.resetPeak();
      feed.restartCurve();
    }
  }

  private void togglePlot() {
    againstTravel = !againstTravel;
    showPlotChoice();
    lastChartNanos = 0; // redraw at the next frame
  }

  private void showPlotChoice() {
    plotAxis.setText(againstTravel ? "Plot against time  [X]" : "Plot against crosshead  [X]");
  }

  /**
   * Opens the device off the JavaFX thread (a serial board may take seconds to reset), then
   * starts the display timer on it. A connect after a disconnect waits for that to finish.
   *
   * @return done when the device is open and streaming (or could not be opened)
   */
  CompletableFuture<Void> connect() {
    stopTimer();
    link = StationStatus.Link.CONNECTING;
    return deviceLink.connect(this::displayScale, chart.window_s(), run::close, o -> {
      reconnect.setVisible(false);
      reconnect.setManaged(false);
      link = StationStatus.Link.LIVE;
      lostReason = null;
      timer = new AnimationTimer() {
        @Override
        public void handle(long now) {
          refresh(now);
        }
      };
      timer.start();
    }, this::showLost);
  }

  private void stopTimer() {
    if (timer != null) {
      timer.stop();
      timer = null;
    }
  }

  /**
   * Stops the display at once and closes the device off the JavaFX thread (a run in progress is
   * stopped and stored first; the reader's thread may take seconds to end).
   *
   * @return done when the device is closed
   */
  CompletableFuture<Void> disconnect() {
    stopTimer();
    return deviceLink.disconnect(run::close);
  }

  /** The scale of the live readout: the chosen one, or counts while none is chosen. */
  private ForceScale displayScale() {
    ScaleChoice c = scale;
    return c != null ? c.scale() : ForceScale.linear(1, "counts: no calibration chosen");
  }

  /** One display frame at {@code now} (System.nanoTime clock; tests pass their own). */
  void refresh(long now) {
    LiveFeed.Snapshot s = deviceLink.feed().poll();
    DeviceReader r = deviceLink.reader();
    StationStatus.View view = StationStatus.of(new StationStatus.Stream(link, lostReason,
        s.samples(), r == null ? -1 : r.lastArrivalNanos(), now, s.rateHz()), run.status());
    band.show(view);
    ScaleChoice sc = scale;
    double capacity_N;
    try {
      capacity_N = org.loadstone.acquire.ScalePolicy.capacity_N(config.ratedCapacity_N(), sc);
    } catch (LoadstoneException e) {
      capacity_N = Double.NaN;
    }
    CapacityGauge gauge = CapacityGauge.of(sc == null ? Double.NaN : s.force_N(), s.counts(),
        capacity_N, org.loadstone.acquire.RunSettings.DEFAULTS);
    band.flag(gauge);
    readout.show(s, gauge, view.noData());
    DecoderCounters c = s.counters();
    health.setText(String.format(Locale.ROOT,
        "%.1f samples/s   ·   %d samples   ·   dropped %d   ·   checksum errors %d   ·   "
            + "resyncs %d%s",
        view.shownRate_Hz(), s.samples(), c.dropped(), c.checksumErrors(), c.resyncs(),
        s.displayLost() > 0 ? "   ·   display skipped " + s.displayLost() : ""));
    run.refresh();
    if (now - lastChartNanos > 100_000_000L) {
      lastChartNanos = now;
      if (againstTravel) {
        chart.showAgainstTravel(s.curveTravel_mm(), s.curveForce_N(), s.curveLength(),
            Double.isNaN(s.position_mm()) ? "this device sends no crosshead position" : null);
      } else {
        chart.showAgainstTime(s.traceTime_s(), s.traceForce_N(), s.traceLength());
      }
      chart.showPeak(sc == null ? Double.NaN : s.peak_N(), s.peakTime_s());
    }
    if (s.deviceLost() != null) {
      stopTimer();
      showLost(s.deviceLost());
    }
  }

  private void showLost(String why) {
    link = StationStatus.Link.LOST;
    lostReason = why;
    if (band != null) {
      band.show(StationStatus.of(new StationStatus.Stream(link, why, 0, -1, 0, 0),
          run.status()));
    }
    health.setText(why);
    reconnect.setVisible(true);
    reconnect.setManaged(true);
  }

  StateBand band() {
    return band;
  }

  CapacityBar capacity() {
    return readout.capacity();
  }

  Readout readout() {
    return readout;
  }

  ForceChart chart() {
    return chart;
  }

  /** The connected device, or null. */
  DeviceReader reader() {
    return deviceLink.reader();
  }

  /**
   * Makes a calibration file the scale of the live force and of the next runs.
   *
   * @throws LoadstoneException when the file cannot be used (the message says why)
   */
  void useCalibration(java.nio.file.Path file) {
    ScaleChoice c = ScaleChoice.fromCalibration(file, java.time.LocalDate.now());
    scale = c;
    LiveFeed feed = deviceLink.feed();
    if (feed != null) {
      feed.setScale(c.scale());
    }
    device.setText(config.deviceLabel() + "  ·  force from " + c.description());
  }

  Label runResult() {
    return run.result();
  }

  RunPanel run() {
    return run;
  }

  LiveFeed feed() {
    return deviceLink.feed();
  }
}
