package org.loadstone.cli;

import com.fasterxml.jackson.core.type.TypeReference;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.InputStream;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.loadstone.calibration.CalibrationDocument;
import org.loadstone.calibration.CalibrationStatus;
import org.loadstone.calibration.CapturedReading;
import org.loadstone.calibration.MassText;
import org.loadstone.calibration.CheckWeightResult;
import org.loadstone.calibration.CheckWeights;
import org.loadstone.calibration.StabilityDetector;
import org.loadstone.units.LoadstoneException;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code loadstone verify}: checks a calibration with a known weight and logs the result. */
@Command(
    name = "verify",
    description = {
      "Check a calibration with a known weight and log the result.",
      "The cell is tared with no weight, the check "
          + "weight is placed, and the force the calibration indicates is compared with the "
          + "weight's force. The result is appended to ID.checks.jsonl beside the calibration "
          + "file. On --port sim the program puts the weight on the simulated cell (scenario "
          + "dead-weight unless --scenario is given)."
    },
    exitCodeListHeading = "%nExit codes:%n",
    exitCodeList = {
      "0:the check passed",
      "1:the check failed (logged), or stopped by the operator (nothing logged)",
      "2:bad usage or input: the message names the fault and the fix",
      "3:the device was lost: nothing logged",
      "70:internal error (a bug; please report it)"
    })
public final class VerifyCommand implements Callable<Integer>, CommandInput.Reader {
  /** Exit code when the check fails or the operator stops. */
  public static final int EXIT_FAILED = 1;
  private static final ObjectMapper JSON = new ObjectMapper();

  @Mixin DeviceOptions device;

  @Option(names = "--cal", paramLabel = "FILE", description = "The calibration file to check (default: the calibration of 'loadstone config').")
  Path calFile;

  @Option(names = "--mass-g", required = true, paramLabel = "G",
      description = "Conventional mass of the check weight in g.")
  double mass_g;

  @Option(names = "--tolerance-pct", paramLabel = "PCT",
      description = "Accepted error in %% of reading (default: ${DEFAULT-VALUE}).",
      defaultValue = "" + CheckWeights.DEFAULT_TOLERANCE_PCT)
  double tolerance_pct;

  @Option(names = "--json", description = "Write the check's result as one JSON document on standard output (schema loadstone-verify); prompts and text go to standard error.")
  boolean json;

  @Option(names = "--sim-placed-g", paramLabel = "G",
      description = "Simulator only: the mass the simulated hand really places, to rehearse a "
          + "check that fails (default: --mass-g).")
  Double simPlaced_g;

  @Mixin StabilityOptions stability;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  private InputStream input = System.in;

  @Override
  public void input(InputStream in) {
    this.input = in;
  }

  @Override
  public Integer call() {
    PrintWriter out = JsonDocument.human(spec, json);
    PrintWriter err = spec.commandLine().getErr();
    if (!(mass_g > 0) || !Double.isFinite(mass_g)) {
      throw new LoadstoneException("--mass-g " + mass_g + " is invalid: give the check weight's"
          + " mass in g (> 0)");
    }
    if (!(tolerance_pct > 0) || !Double.isFinite(tolerance_pct)) {
      throw new LoadstoneException("--tolerance-pct " + tolerance_pct + " is invalid: give the"
          + " accepted error in % of reading (> 0)");
    }
    if (simPlaced_g != null && (!device.simulated() || !(simPlaced_g > 0))) {
      throw new LoadstoneException("--sim-placed-g only works with --port sim and must be > 0:"
          + " drop it for a real device (there you place the weight yourself)");
    }
    if (calFile == null) {
      throw new LoadstoneException("no calibration to check: give --cal FILE, or set "
          + "'calibration' in the config file (see 'loadstone config')");
    }
    CalibrationStatus status = CalibrationStatus.check(calFile, null, LocalDate.now());
    if (status.document() == null) {
      throw new LoadstoneException(status.warning());
    }
    if (!status.ok()) {
      err.println("loadstone: warning: " + status.warning());
      err.flush();
    }
    CalibrationDocument cal = status.document();
    LiveDevice.useDeadWeight(device,
        spec.commandLine().getParseResult().hasMatchedOption("--scenario"));
    double mass_kg = mass_g / 1000;
    Answers answers = new Answers(input, out);
    CapturedReading zero;
    CapturedReading loaded;
    try (LiveDevice dev = LiveDevice.open(device, err)) {
      out.println("Verifying calibration " + cal.id() + " of cell " + cal.cellId() + " on "
          + dev.identity());
      StabilityDetector.Settings settings = stability.settings(dev.rateHz());
      zero = reading(dev, answers, out, settings, 0,
          "remove all weights from the cell (tare), then press Enter (q quits): ");
      if (zero == null) {
        return stopped(out);
      }
      double placed_kg = simPlaced_g != null ? simPlaced_g / 1000 : mass_kg;
      loaded = reading(dev, answers, out, settings, placed_kg, "place the check weight of "
          + MassText.format(mass_kg) + ", then press Enter (q quits): ");
      if (loaded == null) {
        return stopped(out);
      }
    } catch (LiveDevice.DeviceLostException e) {
      err.println("loadstone: " + e.getMessage() + "; nothing was logged");
      err.flush();
      return LoadstoneCommand.EXIT_DEVICE_LOST;
    }
    CheckWeightResult r = CheckWeights.verify(cal, mass_kg,
        loaded.mean_counts() - zero.mean_counts(), tolerance_pct, Instant.now());
    if (device.simulated()) {
      r = r.asRehearsal(); // the simulated frame's cell is not the calibrated one
      out.println("Rehearsal on the simulated frame: logged as a rehearsal, which is never taken"
          + " as a check of the real cell");
    }
    CheckWeights.append(calFile, r);
    out.printf(Locale.ROOT, "Check weight %s: expected %.6g N, indicated %.6g N, error %+.4f %%"
            + " (tolerance ±%s %%): %s%n", MassText.format(mass_kg), r.expected_N(),
        r.indicated_N(), r.error_pct(), trim(r.tolerance_pct()), r.pass() ? "PASS" : "FAIL");
    out.println("Logged in " + CheckWeights.logFile(calFile));
    if (json) {
      Map<String, Object> m = new LinkedHashMap<>();
      m.put("mass_g", mass_g);
      m.putAll(JSON.convertValue(r, new TypeReference<Map<String, Object>>() { }));
      m.put("log_file", CheckWeights.logFile(calFile).toString());
      JsonDocument.write(spec.commandLine().getOut(), JsonDocument.Kind.VERIFY, m);
    }
    out.flush();
    return r.pass() ? 0 : EXIT_FAILED;
  }

  /** @return the settled reading with {@code mass_kg} on the cell, or null when stopped */
  private static CapturedReading reading(LiveDevice dev, Answers answers, PrintWriter out,
      StabilityDetector.Settings settings, double mass_kg, String prompt) {
    while (true) {
      String a = answers.ask(prompt);
      if (a == null || Answers.isQuit(a)) {
        return null;
      }
      if (!a.isEmpty()) {
        out.println("  press Enter when ready, or q to quit");
        continue;
      }
      break;
    }
    dev.weights().load(mass_kg);
    while (true) {
      try {
        return dev.settle(new StabilityDetector(settings));
      } catch (LiveDevice.DeviceLostException e) {
        throw e;
      } catch (LoadstoneException e) {
        out.println("  " + e.getMessage());
        if (answers.afterTimeout(false) == 'q') {
          return null;
        }
      }
    }
  }

  private static int stopped(PrintWriter out) {
    out.println("Stopped: nothing was logged.");
    out.flush();
    return EXIT_FAILED;
  }

  private static String trim(double v) {
    return v == Math.rint(v) ? Long.toString((long) v) : Double.toString(v);
  }
}
