package org.loadstone.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.time.Clock;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.concurrent.TimeUnit;
import org.loadstone.acquire.BreakDetector;
import org.loadstone.acquire.DeviceReader;
import org.loadstone.acquire.JournalRunStore;
import org.loadstone.acquire.Recorder;
import org.loadstone.acquire.RunControl;
import org.loadstone.acquire.RunPreset;
import org.loadstone.acquire.RunSettings;
import org.loadstone.acquire.RunTemplate;
import org.loadstone.acquire.SampleRing;
import org.loadstone.acquire.RunSetup;
import org.loadstone.acquire.SampleRate;
import org.loadstone.acquire.ScaleChoice;
import org.loadstone.acquire.ScalePolicy;
import org.loadstone.archive.FinishCause;
import org.loadstone.archive.Geometry;
import org.loadstone.archive.JournalRecovery;
import org.loadstone.archive.StoredRun;
import org.loadstone.archive.TestType;
import org.loadstone.units.LoadstoneException;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code loadstone record}: one hands-free run, started by load and stopped at the load drop. */
@Command(
    name = "record",
    sortOptions = false,
    description = {
      "Record one hands-free run and store it in the archive.",
      "",
      "Zero, wait for load, record with a pre-trigger history, stop by itself at the load "
          + "drop (or overload, time limit, Ctrl-C). A crush test (--test crush) goes on through "
          + "the load drops to its travel limit, low force, time limit or Ctrl-C."
    },
    exitCodeListHeading = "%nExit codes:%n",
    exitCodeList = {
      "0:a run was stored, or none was started (stopped while armed)",
      "2:refused or failed: the message names the fault and the fix",
      "3:the device was lost or restarted; a run recorded until then is stored",
      "5:the archive's disk filled during the run; the run is stored up to the last sample"
          + " received, and the message says what was kept",
      "70:internal error (a bug; please report it)",
      "130:stopped by Ctrl-C: the run recorded until then is stored and printed first"
    })
public final class RecordCommand implements Callable<Integer> {
  @Mixin DeviceOptions device;
  @Mixin ArchiveOption archive;
  @Mixin StiffnessOptions stiffness;
  @Mixin CrushOptions crush;

  @Option(names = "--cal", paramLabel = "FILE", description = "Calibration file to turn counts into force.")
  Path cal;

  @Option(names = "--accept-changed-calibration", description = "Use the --cal calibration even though its content changed since it was saved (refused otherwise; the run stores the warning).")
  boolean acceptChanged;

  @Option(names = "--counts-per-n", paramLabel = "COUNTS-PER-N", description = "Without a calibration: a nominal sensitivity (counts per N); the run is marked uncalibrated.")
  Double countsPerN;

  @Option(names = "--specimen", paramLabel = "ID", required = true, description = "Specimen id.")
  String specimen;

  @Option(names = "--group", paramLabel = "GROUP", defaultValue = "", description = "Group for comparisons, e.g. balsa.")
  String group;

  @Option(names = "--tag", paramLabel = "TAG", description = "A tag (repeatable).")
  List<String> tags = new ArrayList<>();

  @Option(names = "--operator", paramLabel = "NAME", defaultValue = "", description = "Who ran the test.") String operator;

  @Option(names = "--notes", paramLabel = "TEXT", defaultValue = "", description = "Free notes kept with the run.") String notes;

  @Option(names = "--mass-g", paramLabel = "G", description = "Specimen mass in g (for strength per weight).")
  Double mass_g;

  @Option(names = "--test", paramLabel = "KIND", defaultValue = "three-point", description = "Test kind: three-point, four-point, compression, tension or crush (default: ${DEFAULT-VALUE}).")
  String test;

  @Option(names = "--span-mm", paramLabel = "MM", description = "Support span L (bend tests).") Double span;
  @Option(names = "--load-span-mm", paramLabel = "MM", description = "Load span (four-point bend).") Double loadSpan;
  @Option(names = "--width-mm", paramLabel = "MM", description = "Specimen width b.") Double width;
  @Option(names = "--depth-mm", paramLabel = "MM", description = "Specimen depth (total thickness) d.") Double depth;
  @Option(names = "--facing-mm", paramLabel = "MM", description = "Sandwich facing thickness t.") Double facing;
  @Option(names = "--core-mm", paramLabel = "MM", description = "Sandwich core thickness c.") Double core;
  @Option(names = "--area-mm2", paramLabel = "MM2", description = "Loaded area (compression, tension), mm².") Double area;

  @Option(names = "--start-at-n", paramLabel = "N", defaultValue = "5", description = "Start recording at this force (default: ${DEFAULT-VALUE}).")
  double startAt;

  @Option(names = "--stop-drop-pct", paramLabel = "PCT", defaultValue = "40", description = "Break when force falls this many per cent below the peak (default: ${DEFAULT-VALUE}).")
  double dropPct;

  @Option(names = "--arm-at-n", paramLabel = "N", description = "The peak must pass this before a break counts (default: twice --start-at-n).")
  Double armAt;

  @Option(names = "--stop-below-n", paramLabel = "N", defaultValue = "0", description = "Also break when force falls back below this (default: ${DEFAULT-VALUE}, off).")
  double stopBelow;

  @Option(names = "--debounce-s", paramLabel = "S", defaultValue = "0.01", description = "The drop must last this long (default: ${DEFAULT-VALUE}).")
  double debounce;

  @Option(names = "--tail-s", paramLabel = "S", defaultValue = "0.5", description = "Keep recording this long after the break (default: ${DEFAULT-VALUE}).")
  double tail;

  @Option(names = "--pretrigger-s", paramLabel = "S", defaultValue = "1", description = "History kept before the start (default: ${DEFAULT-VALUE}).")
  double pretrigger;

  @Option(names = "--capacity-n", paramLabel = "N", description = "The load cell's rated capacity (default: from the calibration's cell profile, or the simulated cell).")
  Double capacity;

  @Option(names = "--warn-pct", paramLabel = "PCT", defaultValue = "80", description = "Overload warning, per cent of rated capacity (default: ${DEFAULT-VALUE}).")
  double warnPct;

  @Option(names = "--overload-pct", paramLabel = "PCT", defaultValue = "100", description = "Overload stop, per cent of rated capacity (default: ${DEFAULT-VALUE}).")
  double overloadPct;

  @Option(names = "--max-duration-s", paramLabel = "S", defaultValue = "0", description = "Longest run (default: ${DEFAULT-VALUE}, no limit).")
  double maxSeconds;

  @Option(names = "--travel-limit-mm", paramLabel = "MM", description = "Crush test: end the run at this crosshead travel from the start (default: no travel limit).")
  Double travelLimit;

  @Option(names = "--low-force-pct", paramLabel = "PCT", description = "Crush test: end the run when force stays below this per cent of the peak for --low-force-s (default: 5; 0 = off).")
  Double lowForcePct;

  @Option(names = "--low-force-s", paramLabel = "S", description = "Crush test: how long force must stay low (default: 1).")
  Double lowForceS;

  @Option(names = "--preset", description = "Start from the test type's run preset (start force, break drop, tail, time limit and a crush's end, as the console's Run settings) instead of the defaults shown; options given still win.")
  boolean preset;

  @Option(names = "--manual-start", description = "Start recording at once instead of waiting for load.")
  boolean manualStart;

  @Option(names = "--zero-samples", paramLabel = "COUNT", description = "Samples averaged for the zero (default: half a second).")
  Integer zeroSamples;

  @Option(names = "--zero-drift-n", paramLabel = "N", description = "Warn before the run when the zero moved more than this since the last tare (default: 0.1 %% of rated capacity).")
  Double zeroDriftLimit;

  @Option(names = "--second-archive", paramLabel = "DIR", description = "Where the run goes when the archive's disk is full (best on another disk); without it a run waits in memory for space.")
  Path secondArchive;

  @Option(names = "--json", description = "Write the stored run and its figures as one JSON document on standard output (schema loadstone-record); the text goes to standard error.")
  boolean json;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  /**
   * The run's start and stop rules from the options: the defaults shown, or with {@code --preset}
   * the test type's {@link RunPreset}, and over either every option given.
   */
  RunSettings.Builder settings(TestType type) {
    CommandLine.ParseResult given = spec.commandLine().getParseResult();
    RunSettings.Builder b = RunSettings.builder();
    if (preset) {
      RunPreset.of(type).applyTo(b);
    }
    java.util.function.Predicate<String> take = name -> !preset || given.hasMatchedOption(name);
    if (take.test("--start-at-n")) {
      b.startThreshold_N(startAt);
    }
    if (take.test("--stop-drop-pct")) {
      b.breakDropPct(dropPct);
    }
    if (take.test("--tail-s")) {
      b.postBreak_s(tail);
    }
    if (take.test("--max-duration-s")) {
      b.maxSeconds(maxSeconds);
    }
    b.absoluteStop_N(stopBelow).debounce_s(debounce).pretrigger_s(pretrigger)
        .overloadWarnPct(warnPct).overloadStopPct(overloadPct);
    if (armAt != null) {
      b.armingLevel_N(armAt);
    }
    if (travelLimit != null || lowForcePct != null || lowForceS != null) {
      org.loadstone.acquire.CrushEnd d = b.crushEnd() != null ? b.crushEnd()
          : org.loadstone.acquire.CrushEnd.DEFAULTS;
      b.crushEnd(new org.loadstone.acquire.CrushEnd(
          travelLimit != null ? travelLimit : d.travelLimit_mm(),
          lowForcePct != null ? lowForcePct / 100 : d.lowForceFraction(),
          lowForceS != null ? lowForceS : d.lowForce_s()));
    }
    return b;
  }

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    PrintWriter err = spec.commandLine().getErr();
    Path dir = archive.folder();
    org.loadstone.analysis.AnalysisSettings analysis =
        crush.apply(stiffness.apply(org.loadstone.analysis.AnalysisSettings.DEFAULTS)); // refuse
    // a bad band or stroke before a run
    JournalRunStore store = new JournalRunStore(dir, secondArchive);
    store.checkWritable();
    for (StoredRun r : JournalRecovery.recoverAll(dir, n -> say(err, n))) {
      say(err, "recovered an unfinished run into " + r.csv());
    }

    ScaleChoice scale = ScalePolicy.choose(cal, countsPerN,
        device.simulated() ? device.simSetup() : null, LocalDate.now(), acceptChanged);
    Geometry geometry = new Geometry(span, loadSpan, width, depth, facing, core, area);
    TestType type = TestType.parse(test);
    RunSettings.Builder b = settings(type);
    RunSetup.Request request = new RunSetup.Request(new RunTemplate(specimen, group, tags,
        operator, notes, mass_g, geometry, type), scale, capacity, b, zeroDriftLimit, zeroSamples,
        manualStart, LoadstoneCommand.softwareVersion());
    RunSetup.check(request, device.port); // before the device is opened

    DeviceReader reader = new DeviceReader(device.open(), new SampleRing(
        SampleRing.capacityFor(1 << 21, Runtime.getRuntime().maxMemory())));
    reader.start();
    try {
      RunSetup setup = new RunSetup(reader, dir, device.simulated() ? device.simSetup() : null,
          simFields(), Clock.systemUTC());
      RunSetup.Prepared run = setup.prepare(request, text -> say(err, text));
      if (run.rate().source() == SampleRate.Source.IDENTITY) {
        say(err, "sample rate " + run.rate().describe());
      }
      for (String w : run.warnings()) {
        say(err, "warning: " + w);
      }
      Progress progress = new Progress(err);
      int width = StatusLine.width(System.getenv("COLUMNS"));
      Recorder rec = setup.recorder(run, store, progress);
      java.util.concurrent.CountDownLatch printed = new java.util.concurrent.CountDownLatch(1);
      Thread hook = new Thread(() -> {
        rec.stop(); // Ctrl-C: store what was recorded, and let the command print it
        try {
          rec.await(30, TimeUnit.SECONDS);
          printed.await(30, TimeUnit.SECONDS);
        } catch (InterruptedException e) {
          Thread.currentThread().interrupt();
        }
      });
      hookPrinted = printed;
      Runtime.getRuntime().addShutdownHook(hook);
      if (manualStart) {
        say(err, "recording now (manual start)");
        rec.startNow();
      } else {
        say(err, String.format(Locale.ROOT, "armed: recording starts at %.4g N; %s (Ctrl-C stops "
            + "it by hand)", run.settings().startThreshold_N(),
                run.settings().endWords()));
        rec.arm(run.decideFrom());
      }
      boolean tty = Terminal.statusLines();
      java.util.Optional<Recorder.Result> result = java.util.Optional.empty();
      while (result.isEmpty() && rec.failure().isEmpty() && !rec.ended()) {
        result = rec.await(200, TimeUnit.MILLISECONDS);
        if (tty && result.isEmpty()) {
          Recorder.Status s = rec.status();
          long since = progress.startedNanos;
          String line = StatusLine.format(s.state().name().toLowerCase(Locale.ROOT),
              since == 0 ? Double.NaN : (System.nanoTime() - since) / 1e9, s.force_N(),
              s.travel_mm(), s.peak_N(), s.rateHz(), width);
          err.print("\r" + line + " ".repeat(Math.max(0, width - 1 - line.length())));
          err.flush();
        }
        if (result.isEmpty() && reader.lostReason().isPresent()
            && rec.status().state() != RunControl.State.RECORDING
            && rec.status().state() != RunControl.State.TAIL
            && rec.status().state() != RunControl.State.FINISHED) { // not while it is stored
          rec.stop();
        }
      }
      try {
        Runtime.getRuntime().removeShutdownHook(hook);
      } catch (IllegalStateException shuttingDown) {
        // Ctrl-C
      }
      if (tty) {
        err.println();
      }
      if (rec.failure().isPresent()) {
        throw new LoadstoneException(rec.failure().get());
      }
      if (result.isEmpty()) {
        java.util.Optional<String> gone = reader.lostReason().or(reader::resetReason);
        say(err, gone.map(why -> why + ": no run recorded (the device was lost or restarted"
            + " before load came on)").orElse("stopped before any load: no run recorded"));
        return gone.isPresent() ? LoadstoneCommand.EXIT_DEVICE_LOST : 0;
      }
      RecordSummary.print(result.get(), json, archive.archive, analysis, out, err);
      FinishCause cause = result.get().cause();
      if (cause == FinishCause.DEVICE_LOST || cause == FinishCause.DEVICE_RESET) {
        say(err, (cause == FinishCause.DEVICE_LOST ? reader.lostReason() : reader.resetReason())
            .orElse("the device went away") + ": the run is stored up to the last sample"
            + " received before (" + result.get().samples() + " samples, cause "
            + cause.wireName() + ")");
        return LoadstoneCommand.EXIT_DEVICE_LOST;
      }
      if (cause == FinishCause.DISK_FULL) {
        say(err, org.loadstone.archive.RunReader.readMetadata(result.get().stored().json())
            .warnings().stream()
            .filter(w -> w.startsWith("the disk holding the archive filled")).findFirst()
            .orElse("the disk holding the archive filled during the run"));
        return LoadstoneCommand.EXIT_DISK_FULL;
      }
      return 0;
    } finally {
      reader.close();
      if (hookPrinted != null) {
        out.flush();
        err.flush();
        hookPrinted.countDown();
      }
    }
  }

  /** Opened when the command has printed its outcome; the Ctrl-C hook waits for it. */
  private java.util.concurrent.CountDownLatch hookPrinted;

  private Map<String, String> simFields() {
    Map<String, String> m = new LinkedHashMap<>();
    if (device.simulated()) {
      m.put("sim_scenario", device.scenario());
      m.put("sim_seed", Long.toString(device.seed));
    }
    return m;
  }

  static void say(PrintWriter err, String text) {
    synchronized (err) {
      err.println(text);
      err.flush();
    }
  }

  /** Prints run events as they happen. */
  private static final class Progress implements Recorder.Listener {
    private final PrintWriter err;
    /** When recording started (System.nanoTime), 0 before: the status line's clock. */
    volatile long startedNanos;

    Progress(PrintWriter err) {
      this.err = err;
    }

    @Override
    public void onStarted(RunControl.Started e) {
      startedNanos = System.nanoTime();
      say(err, "\nrecording" + (e.manual() ? "" : String.format(Locale.ROOT,
          " (load reached the start threshold at %.3f s)", e.triggerTime_s())));
    }

    @Override
    public void onWarning(String text) {
      say(err, "\n" + text.toUpperCase(Locale.ROOT).charAt(0) + text.substring(1));
    }

    @Override
    public void onBreak(BreakDetector.Break b) {
      say(err, String.format(Locale.ROOT, "\nbreak at %.3f s: force fell %.0f %% below the peak "
          + "of %.2f N", b.time_s(), b.dropPct(), b.peakBefore_N()));
    }

    @Override
    public void onFailed(String why) {
      say(err, "\n" + why);
    }
  }
}
