package org.loadstone.ui;

import java.util.List;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import javafx.application.Platform;
import javafx.scene.Parent;
import javafx.scene.control.Button;
import javafx.scene.control.Label;
import javafx.scene.control.TextField;
import javafx.scene.layout.FlowPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.VBox;
import org.loadstone.acquire.DeviceReader;
import org.loadstone.acquire.JournalRunStore;
import org.loadstone.acquire.LiveFeed;
import org.loadstone.acquire.Recorder;
import org.loadstone.acquire.RunControl;
import org.loadstone.acquire.RunSettings;
import org.loadstone.acquire.RunSetup;
import org.loadstone.acquire.RunTemplate;
import org.loadstone.acquire.ScaleChoice;
import org.loadstone.acquire.StationStatus;
import org.loadstone.archive.SpecimenIds;
import org.loadstone.device.PressOperator;
import org.loadstone.study.RunMetrics;
import org.loadstone.units.LoadstoneException;

/**
 * The run section of the console: specimen, group and mass; arm and stop; the run's state; and,
 * once a run is stored, its post-run figures (peak, break, stiffness, energy, per gram) as the
 * archive's analysis gives them ({@link RunFigures}). Thin: recording is {@link Recorder}'s,
 * figures {@link RunMetrics}'.
 */
final class RunPanel {
  /** Where the device and its live feed are, once connected. */
  interface Device {
    DeviceReader reader();

    LiveFeed feed();

    /** How counts become force for the next run, or null while none is chosen. */
    ScaleChoice scale();

    /** The connected device's run set-up, or null before it is connected. */
    RunSetup setup();
  }

  private final ConsoleConfig config;
  private final Device device;
  private final Runnable onArmed;
  private final Label runResult = LivePane.label("run-result", "");
  /** The last run's figures, read back from the archive. */
  private final RunFigures figures = new RunFigures();
  private final RunForm form;
  /** The specimen id of the run armed last. */
  private volatile String armedSpecimen;
  private final VBox root;
  /** Arm, stop (and next specimen on the simulated press), for the state band. */
  private final HBox actions;
  private volatile Recorder recorder;
  /** A run is being set up (zero, zero check) off the JavaFX thread. */
  private volatile boolean preparing;
  /** Stop was asked for while the run was being set up: disarm as soon as it is armed. */
  private volatile boolean stopWhilePreparing;
  /** The live view's tares already told to the set-up. */
  private long taresNoted;
  private volatile boolean runEnded;
  /** The last run was disarmed before it started: nothing was stored. */
  private volatile boolean disarmed;
  /** What the run set-up is doing, or why the last run was not stored; null for nothing. */
  private volatile String note;
  /** The last run could not be stored. */
  private volatile boolean notStored;
  /** How the last stored run ended, or null. */
  private volatile org.loadstone.archive.FinishCause lastCause;
  /** The force at which the armed run starts. */
  private volatile double startThreshold_N = RunSettings.DEFAULTS.startThreshold_N();
  private volatile String endWords; // how the prepared run ends by itself, from its settings
  /** A was pressed while connecting or zeroing: arm as soon as the zero is done. */
  private boolean armQueued;
  /** Journals left by a run that never finished are being stored: no new run until then. */
  private volatile boolean recovering;

  /**
   * @param config the console's device and archive
   * @param device the connected device, or nulls before it is
   * @param onArmed run on the JavaFX thread when a run is armed (a new specimen: new peak, new
   *     curve)
   */
  RunPanel(ConsoleConfig config, Device device, Runnable onArmed) {
    this.config = config;
    this.device = device;
    this.onArmed = onArmed;
    this.form = new RunForm(config.home(), this::arm);
    Button arm = new Button("Arm run  [A]");
    arm.setId("arm-button");
    arm.setOnAction(e -> arm());
    Button stop = new Button("Stop run  [S]");
    stop.setId("stop-button");
    stop.setOnAction(e -> stop());
    arm.setMaxWidth(Double.MAX_VALUE);
    stop.setMaxWidth(Double.MAX_VALUE);
    HBox buttons = new HBox(8, arm, stop);
    buttons.getStyleClass().add("run-actions");
    root = new VBox(6, LivePane.label("run-caption", "RUN"));
    root.getChildren().addAll(form.nodes());
    if (config.deviceFields().containsKey("sim_scenario")) {
      // the simulated press: the program stands in for the hands that change the specimen
      Button next = new Button("Next specimen  [N]");
      next.setId("next-specimen-button");
      next.setOnAction(e -> nextSpecimen());
      next.setMaxWidth(Double.MAX_VALUE);
      root.getChildren().add(next);
    }
    runResult.setWrapText(true);
    actions = buttons;
    root.getChildren().add(runResult);
  }

  /** A text field with an id (for tests and styles) and a prompt. */
  static TextField field(String id, String prompt) {
    TextField f = new TextField();
    f.setId(id);
    f.setPromptText(prompt);
    return f;
  }

  Parent node() {
    return root;
  }

  /** Arm and stop (and next specimen on the simulated press), placed by the live pane. */
  HBox actions() {
    return actions;
  }

  Label result() {
    return runResult;
  }

  /** The last run's figures, for a place of their own (empty until a run is stored). */
  FlowPane figures() {
    return figures.node();
  }

  /**
   * Arms a hands-free run: it starts when load reaches the start threshold, stops by itself at the
   * load drop (or overload), and is stored in the archive through the journal.
   */
  void arm() {
    DeviceReader reader = device.reader();
    LiveFeed feed = device.feed();
    RunSetup setup = device.setup();
    Recorder r = recorder;
    if (preparing || (r != null && !runEnded
        && r.status().state() != RunControl.State.FINISHED && r.failure().isEmpty())) {
      return;
    }
    if (form.idMissing()) {
      armQueued = false;
      runResult.setText("type the specimen's id first (after each run the next id is filled in)");
      form.focusId();
      return;
    }
    if (reader == null || feed == null || setup == null || feed.taring() || recovering) {
      armQueued = true; // never lost: armed as soon as the zero is done (S cancels)
      note = null;
      runResult.setText("arming once the zero is done");
      root.requestFocus();
      return;
    }
    armQueued = false;
    RunSetup.Request request;
    JournalRunStore store;
    try {
      RunTemplate template = form.template(); // a bad mass or size is refused before arming
      request = new RunSetup.Request(template,
          device.scale(), config.ratedCapacity_N(), form.settings(),
          config.zeroDriftLimit_N(), null, false,
          org.loadstone.units.SoftwareVersion.get());
      RunSetup.check(request, config.deviceLabel());
      store = new JournalRunStore(config.archive(), config.secondArchive());
      store.checkWritable();
      form.remember();
      armedSpecimen = template.specimen();
    } catch (LoadstoneException e) {
      form.runSettings().show(e); // under the field it concerns, too
      runResult.setText(ConsoleHints.withHow(e));
      return;
    }
    if (feed.taresDone() != taresNoted) {
      taresNoted = feed.taresDone();
      setup.noteTare(feed.zeroCounts()); // the live view's zero is the last tare
    }
    preparing = true;
    stopWhilePreparing = false;
    runEnded = false;
    disarmed = false;
    notStored = false;
    lastCause = null;
    note = null;
    figures.clear();
    runResult.setText("");
    Thread t = new Thread(() -> prepareAndArm(setup, feed, request, store), "run set-up");
    t.setDaemon(true);
    t.start();
    root.requestFocus(); // out of the text fields, so the one-key commands (S: stop) work
  }

  /** Zero, zero check and arming, off the JavaFX thread (the zero takes half a second). */
  private void prepareAndArm(RunSetup setup, LiveFeed feed, RunSetup.Request request,
      JournalRunStore store) {
    try {
      RunSetup.Prepared p = setup.prepare(request,
          text -> note = text);
      startThreshold_N = p.settings().startThreshold_N();
      endWords = p.settings().endWords();
      feed.useZero(p.zero_counts());
      List<String> before = SpecimenIds.runsOf(config.archive(),
          request.template().specimen());
      Recorder rec = setup.recorder(p, store, new Events());
      recorder = rec;
      rec.arm(p.decideFrom());
      if (stopWhilePreparing) {
        rec.stop();
      }
      List<String> notes = new java.util.ArrayList<>();
      if (!before.isEmpty()) {
        notes.add("specimen " + request.template().specimen() + " was tested before ("
            + before.get(before.size() - 1) + (before.size() > 1 ? " and " + (before.size() - 1)
            + " more" : "") + "): this run is stored beside it, not over it");
      }
      notes.addAll(p.warnings());
      Platform.runLater(() -> {
        preparing = false;
        onArmed.run();
        runResult.setText(notes.isEmpty() ? "" : "note: " + String.join(" · ", notes));
      });
    } catch (LoadstoneException e) {
      Platform.runLater(() -> {
        preparing = false;
        recorder = null; // the one before has ended: no run now
        runResult.setText(ConsoleHints.withHow(e));
      });
    }
  }

  /**
   * Puts a new specimen in the simulated press (a real press: the operator does). Refused while a
   * run is armed or recording.
   */
  void nextSpecimen() {
    DeviceReader reader = device.reader();
    Recorder r = recorder;
    if (reader == null) {
      return;
    }
    if (r != null && !runEnded && r.status().state() != RunControl.State.FINISHED) {
      runResult.setText("a run is armed or recording: stop it before changing the specimen");
      return;
    }
    PressOperator.forTransport(reader.transport()).nextSpecimen();
    runResult.setText("a new specimen is in the press: arm to load it");
  }

  /** Shows forces in {@code u}: the figures and the start force's field. */
  void setUnit(org.loadstone.units.ForceUnit u) {
    form.setUnit(u);
    figures.setUnit(u);
  }

  /** @return the run form */
  RunForm form() {
    return form;
  }

  void stop() {
    if (armQueued) {
      armQueued = false;
      runResult.setText("arming cancelled");
    }
    if (preparing) {
      stopWhilePreparing = true;
    }
    Recorder r = recorder;
    if (r != null) {
      r.stop();
    }
  }

  /** Called every display frame: arms a run asked for while the zero was being taken. */
  void refresh() {
    LiveFeed feed = device.feed();
    if (armQueued && feed != null && !feed.taring() && !recovering) {
      arm();
    }
  }

  /** The run's phase for the state band ({@link StationStatus} puts it in words). */
  StationStatus.Run status() {
    if (armQueued || preparing) {
      return new StationStatus.Run(StationStatus.Phase.ARMING, null,
          armQueued ? (recovering ? "arming once the left runs are stored"
              : "arming once the zero is done") : note, startThreshold_N);
    }
    Recorder r = recorder;
    StationStatus.Phase phase;
    if (r == null) {
      phase = StationStatus.Phase.NONE;
    } else if (runEnded) {
      phase = notStored ? StationStatus.Phase.NOT_STORED : disarmed
          ? StationStatus.Phase.DISARMED : StationStatus.Phase.STORED;
    } else {
      phase = switch (r.status().state()) {
        case IDLE, ARMED -> StationStatus.Phase.ARMED;
        case RECORDING -> StationStatus.Phase.RECORDING;
        case TAIL -> StationStatus.Phase.TAIL;
        case FINISHED -> StationStatus.Phase.STORING;
      };
    }
    return new StationStatus.Run(phase, lastCause, note, startThreshold_N, endWords);
  }

  /**
   * Stores the runs whose journals a killed or crashed console left, through the same service as
   * {@code record}, off the JavaFX thread; the result line names them. Arming waits for it.
   */
  void recoverJournals() {
    recovering = true;
    LeftJournals.recover(config.archive(), notice -> {
      recovering = false;
      if (notice != null) {
        runResult.setText(notice);
      }
    });
  }

  /** Whether recovery of left journals is still running. */
  boolean recovering() {
    return recovering;
  }

  /** Whether a run is armed or recording, so its zero and peak must stay as they are. */
  boolean holdsZero() {
    Recorder r = recorder;
    return preparing || armQueued
        || (r != null && !runEnded && r.status().state().holdsZero());
  }

  /** Shows why a one-key command was refused. */
  void refuse(String what) {
    runResult.setText(what + " refused: a run is armed or recording (stop it first: S)");
  }

  /** Stops a run in progress, waits for it to be stored, and lets the recorder go. */
  void close() {
    Recorder r = recorder;
    if (r != null) {
      r.stop();
      try {
        r.await(5, TimeUnit.SECONDS);
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
      }
      r.close();
    }
  }

  /** Run events arrive on the recorder's thread; labels change on the JavaFX thread. */
  private final class Events implements Recorder.Listener {
    @Override
    public void onWarning(String text) {
      Platform.runLater(() -> runResult.setText(text));
    }

    @Override
    public void onFinished(Recorder.Result r) {
      lastCause = r.cause();
      runEnded = true;
      String text = String.format(Locale.ROOT, "run %s: %s · %d samples", r.stored().runId(),
          r.cause().wireName(), r.samples()) + (r.returnToZero_N() == null ? ""
              : String.format(Locale.ROOT, " · return to zero %+.3g N", r.returnToZero_N()));
      String tested = armedSpecimen;
      Platform.runLater(() -> {
        runResult.setText(text);
        form.advance(tested);
      });
      figures.analyse(r.stored().csv(),
          why -> runResult.setText(runResult.getText() + " · not analysed: " + why));
    }

    @Override
    public void onFailed(String why) {
      note = why;
      notStored = true;
      runEnded = true;
      Platform.runLater(() -> runResult.setText(why));
    }

    @Override
    public void onDisarmed(String why) {
      runEnded = true;
      disarmed = true;
      Platform.runLater(() -> runResult.setText(why));
    }
  }
}
