package org.loadstone.cli;

import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.loadstone.calibration.CalibrationDocument;
import org.loadstone.calibration.CalibrationFiles;
import org.loadstone.calibration.CalibrationPlan;
import org.loadstone.calibration.CalibrationReport;
import org.loadstone.calibration.CalibrationService;
import org.loadstone.calibration.CalibrationSettings;
import org.loadstone.calibration.FitKind;
import org.loadstone.units.LoadstoneException;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code loadstone calibrate}: fits captured points, or captures them live and fits them. */
@Command(
    name = "calibrate",
    description = {
      "Calibrate a load cell with dead weights.",
      "With --points, fit points captured earlier (a points CSV). Otherwise capture them live on "
          + "--port: for each step you are asked to place the weights and press Enter (or type "
          + "the mass actually placed); the reading is taken when it has settled. On --port sim "
          + "the program puts each mass on the simulated cell (scenario dead-weight unless "
          + "--scenario is given)."
    },
    exitCodeListHeading = "%nExit codes:%n",
    exitCodeList = {
      "0:done",
      "1:stopped by the operator: nothing fitted or saved",
      "2:bad usage or input: the message names the fault and the fix",
      "3:the device was lost: nothing saved",
      "70:internal error (a bug; please report it)"
    })
public final class CalibrateCommand implements Callable<Integer>, CommandInput.Reader {
  /** Exit code when the operator quits before the calibration is complete. */
  public static final int EXIT_STOPPED = 1;
  /** Same rule as the calibration document's ids. */
  private static final String ID_PATTERN = "[A-Za-z0-9][A-Za-z0-9._-]{0,79}";

  @Option(names = "--points", paramLabel = "FILE.csv",
      description = "Fit the points in this CSV file (mass_g or force_N, counts, direction, "
          + "series, counts_sd, samples) instead of capturing them live.")
  Path from;

  @Option(names = "--cell", required = true, paramLabel = "ID",
      description = "Id of the load cell calibrated (letters, digits, '.', '_', '-').")
  String cellId;

  @Option(names = "--json", description = "Write the calibration's figures as one JSON document on standard output (schema loadstone-calibrate); prompts and text go to standard error.")
  boolean json;

  @Mixin ForceModelOptions force;

  @Option(names = "--full-scale-n", paramLabel = "N",
      description = "Reference of the %%FS figures, e.g. the cell's rated capacity in N "
          + "(default: the largest load).")
  Double fullScale_N;

  @Option(names = "--fit", paramLabel = "KIND",
      description = "Adopt this fit: linear, linear-zero, quadratic or cubic "
          + "(default: the recommended one).")
  String fit;

  @Option(names = "--out", paramLabel = "DIR",
      description = "Save the calibration as DIR/ID.json (never overwrites); live points also "
          + "go to DIR/ID.points.csv.")
  Path saveDir;

  @Option(names = "--id", paramLabel = "ID", description = "Calibration id (default: CELL-DATE).")
  String id;

  @Option(names = "--operator", paramLabel = "NAME",
      description = "Who calibrated (default: the login name).")
  String operator;

  @Option(names = "--valid-days", paramLabel = "DAYS", defaultValue = "365",
      description = "Days the calibration stays valid (default: ${DEFAULT-VALUE}).")
  int validDays;

  @Option(names = "--notes", paramLabel = "TEXT",
      description = "Remark stored with the calibration (site, weights used, ...).")
  String note;

  @Mixin DeviceOptions device;

  @Option(names = "--loads", paramLabel = "MASSES",
      description = "Live: the weights to place, e.g. \"0.5 kg, 1 kg, 2 kg, 5 kg\".")
  String loads;

  @Option(names = "--loads-file", paramLabel = "FILE",
      description = "Live: read the weights from a file, one or more per line, '#' comments.")
  Path loadsFile;

  @Option(names = "--descending", description = "Live: read on the way down too (hysteresis, zero return).")
  boolean descending;

  @Option(names = "--series", paramLabel = "COUNT", defaultValue = "1",
      description = "Live: number of series, 1 to 10 (default: ${DEFAULT-VALUE}; ISO 7500-1 asks for 3).")
  int series;

  @Mixin StabilityOptions stability;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  private InputStream input = System.in;

  @Override
  public void input(InputStream in) {
    this.input = in;
  }

  @Override
  public Integer call() {
    checkIds();
    FitKind kind = fit == null ? null : fitKind(fit);
    CalibrationSettings settings =
        new CalibrationSettings(force.model(), fullScale_N, kind);
    LocalDate today = LocalDate.now();
    String calId = id != null ? id : cellId + "-" + today;
    if (saveDir != null) {
      requireFree(saveDir, calId);
    }
    if (from != null) {
      refuseLiveOptions();
      CalibrationReport report = CalibrationService.fitFromCsv(from, settings);
      String desc = note != null ? note : "fitted from points file " + from.getFileName();
      finish(report, calId, today, desc, null);
      return 0;
    }
    return live(settings, calId, today);
  }

  private int live(CalibrationSettings settings, String calId, LocalDate today) {
    PrintWriter out = JsonDocument.human(spec, json);
    CalibrationPlan plan = new CalibrationPlan(LoadList.parse(loads, loadsFile), descending,
        series);
    if (saveDir != null && Files.exists(saveDir.resolve(calId + ".points.csv"))) {
      throw new LoadstoneException("points file " + saveDir.resolve(calId + ".points.csv")
          + " exists and is never overwritten: give another --id, e.g. '"
          + freeId(saveDir, calId) + "'");
    }
    LiveDevice.useDeadWeight(device, matched("--scenario"));
    LiveCalibration.Outcome o;
    String identity;
    try (LiveDevice dev = LiveDevice.open(device, spec.commandLine().getErr())) {
      identity = dev.identity();
      out.println("Calibrating cell " + cellId + " on " + identity + ": "
          + plan.steps().size() + " readings, " + series + " series"
          + (descending ? " up and down" : " up"));
      if (dev.weights().automatic()) {
        out.println("Simulator: each mass you confirm is put on the simulated cell.");
      }
      o = new LiveCalibration(dev, new Answers(input, out), out, settings.forceModel(),
          stability.settings(dev.rateHz())).walk(plan);
    } catch (LiveDevice.DeviceLostException e) {
      PrintWriter err = spec.commandLine().getErr();
      err.println("loadstone: " + e.getMessage() + "; nothing was saved");
      err.flush();
      return LoadstoneCommand.EXIT_DEVICE_LOST;
    }
    if (o.stopped()) {
      out.println("Stopped: " + o.points().size() + " reading(s) discarded, nothing fitted or"
          + " saved.");
      out.flush();
      return EXIT_STOPPED;
    }
    String desc = note != null ? note : String.format(Locale.ROOT,
        "captured live on %s: loads %s kg, %d series%s%s", identity, plan.loads_kg(), series,
        descending ? " up and down" : " up",
        o.skipped() > 0 ? ", " + o.skipped() + " step(s) skipped" : "");
    Path pointsFile = saveDir == null ? null
        : CalibrationService.savePoints(saveDir, calId, o.points(), desc);
    CalibrationReport report = CalibrationService.fitFromPoints(o.points(), settings);
    finish(report, calId, today, desc, pointsFile);
    return 0;
  }

  private void finish(CalibrationReport report, String calId, LocalDate today, String desc,
      Path pointsFile) {
    PrintWriter out = JsonDocument.human(spec, json);
    out.println();
    out.println("Calibration of cell " + cellId + (from != null ? " from " + from : ""));
    out.print(CalibrationService.fitTable(report));
    out.println();
    out.println("Figures " + CalibrationService.STANDARDS_NOTE + ".");
    CalibrationDocument doc = null;
    Path file = null;
    if (saveDir != null) {
      String who = operator != null ? operator : System.getProperty("user.name", "unknown");
      try {
        Files.createDirectories(saveDir);
      } catch (IOException e) {
        throw new LoadstoneException("cannot create the folder " + saveDir + ": "
            + e.getMessage() + ": check the path and permissions", e);
      }
      doc = CalibrationService.save(saveDir, report, calId, today, who, cellId,
          today.plusDays(validDays), desc);
      file = CalibrationFiles.fileFor(saveDir, calId);
      out.println("Saved " + file + " (content SHA-256 " + doc.contentSha256() + ")");
      if (pointsFile != null) {
        out.println("Points in " + pointsFile);
      }
    }
    if (json) {
      Map<String, Object> m = new LinkedHashMap<>();
      m.put("cell_id", cellId);
      m.put("calibration_id", doc == null ? null : doc.id());
      m.put("calibration_sha256", doc == null ? null : doc.contentSha256());
      m.put("calibration_file", JsonViews.path(file));
      m.put("points_file", JsonViews.path(pointsFile));
      Map<String, Object> summary = new LinkedHashMap<>(CalibrationService.summary(report));
      Object note = summary.remove("note");
      m.putAll(summary);
      m.put("notes", note == null ? List.of() : List.of(note));
      JsonDocument.write(spec.commandLine().getOut(), JsonDocument.Kind.CALIBRATE, m);
    }
    out.flush();
  }

  private void checkIds() {
    if (!cellId.matches(ID_PATTERN)) {
      throw new LoadstoneException("--cell '" + cellId + "' is not a valid id: use 1 to 80"
          + " letters, digits, '.', '_' or '-', starting with a letter or digit");
    }
    if (id != null && !id.matches(ID_PATTERN)) {
      throw new LoadstoneException("--id '" + id + "' is not a valid id: use 1 to 80 letters,"
          + " digits, '.', '_' or '-', starting with a letter or digit");
    }
    if (validDays < 1 || validDays > 3660) {
      throw new LoadstoneException("--valid-days " + validDays + " is out of range: give 1 to"
          + " 3660 days");
    }
    if (operator != null && operator.isBlank()) {
      throw new LoadstoneException("--operator is empty: give who calibrated");
    }
  }

  /** @return the fit kind; accepts "linear-zero" for the line through zero */
  static FitKind fitKind(String text) {
    String t = text.trim().toLowerCase(Locale.ROOT);
    if (t.equals("linear-zero")) {
      return FitKind.LINEAR_THROUGH_ZERO;
    }
    try {
      return FitKind.parse(t);
    } catch (LoadstoneException e) {
      throw new LoadstoneException("--fit '" + text + "' is not known: use linear, linear-zero,"
          + " quadratic or cubic");
    }
  }

  private void refuseLiveOptions() {
    List<String> given = new ArrayList<>();
    List<String> live = new ArrayList<>(List.of("--port", "--baud", "--reset-wait-ms", "--loads",
        "--loads-file", "--descending", "--series", "--scenario", "--seed", "--rate-hz", "--hand",
        "--sim-speed", "--sim-start-delay-s",
        "--window-s", "--max-sd-counts", "--max-drift-counts-per-s", "--timeout-s"));
    live.addAll(SimImperfectionOptions.NAMES);
    for (String o : live) {
      if (matched(o)) {
        given.add(o);
      }
    }
    if (!given.isEmpty()) {
      throw new LoadstoneException("--points fits points captured earlier, so " + given
          + " cannot be used with it: drop --points to capture live, or drop those options");
    }
  }

  private boolean matched(String option) {
    return spec.commandLine().getParseResult().hasMatchedOption(option);
  }

  private static void requireFree(Path dir, String calId) {
    if (Files.exists(CalibrationFiles.fileFor(dir, calId))) {
      throw new LoadstoneException("calibration " + CalibrationFiles.fileFor(dir, calId)
          + " exists and is never overwritten: give another --id, e.g. '"
          + freeId(dir, calId) + "'");
    }
  }

  private static String freeId(Path dir, String calId) {
    for (int i = 2; ; i++) {
      if (!Files.exists(CalibrationFiles.fileFor(dir, calId + "-" + i))) {
        return calId + "-" + i;
      }
    }
  }
}
