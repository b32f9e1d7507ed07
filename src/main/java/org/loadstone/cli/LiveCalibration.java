package org.loadstone.cli;

import java.io.PrintWriter;
import java.util.List;
import java.util.Locale;
import org.loadstone.calibration.CalibrationPlan;
import org.loadstone.calibration.CalibrationPoint;
import org.loadstone.calibration.CalibrationSession;
import org.loadstone.calibration.ForceFromMass;
import org.loadstone.calibration.MassText;
import org.loadstone.calibration.StabilityDetector;
import org.loadstone.units.LoadstoneException;

/**
 * The command line's face of the calibration walk: asks for each weight, waits for a settled
 * reading and shows it. The walk and its rules (masses that fit the step, no repeated load,
 * which steps may be skipped) are {@link CalibrationSession}'s, as in the console. The operator
 * may type the mass actually placed instead of pressing Enter; after a time-out they choose to
 * wait again, skip the step (when the session allows it) or quit.
 */
final class LiveCalibration {
  /**
   * What the walk produced.
   *
   * @param points the points captured, in order
   * @param stopped whether the operator quit before the end
   * @param skipped how many load steps were skipped
   */
  record Outcome(List<CalibrationPoint> points, boolean stopped, int skipped) {}

  private final LiveDevice device;
  private final Answers answers;
  private final PrintWriter out;
  private final ForceFromMass model;
  private final StabilityDetector.Settings stability;

  LiveCalibration(LiveDevice device, Answers answers, PrintWriter out, ForceFromMass model,
      StabilityDetector.Settings stability) {
    this.device = device;
    this.answers = answers;
    this.out = out;
    this.model = model;
    this.stability = stability;
  }

  /**
   * @throws LoadstoneException when the answers end before the last step
   * @throws LiveDevice.DeviceLostException when the device goes away
   */
  Outcome walk(CalibrationPlan plan) {
    CalibrationSession session = new CalibrationSession(plan, model, stability);
    while (!session.done()) {
      CalibrationPlan.Step step = session.current();
      Double mass = askMass(session, step);
      if (mass == null) {
        return new Outcome(session.points(), true, session.skipped());
      }
      device.weights().load(mass);
      if (device.weights().automatic()) {
        out.println("  (simulator: " + (mass == 0 ? "all weights removed" : MassText.format(mass)
            + " now on the simulated cell") + ")");
      }
      while (true) {
        try {
          device.settle(session.detector(), session::offer);
          CalibrationPoint p = session.capture(mass);
          out.printf(Locale.ROOT, "  captured %s (%.6g N): mean %.1f counts, sd %.1f, %d"
              + " samples%n", mass == 0 ? "zero" : MassText.format(mass), p.force_N(),
              p.counts_mean(), p.counts_sd(), p.samples());
          break;
        } catch (LiveDevice.DeviceLostException e) {
          throw e;
        } catch (LoadstoneException e) {
          out.println("  " + e.getMessage());
          char c = answers.afterTimeout(session.canSkip());
          if (c == 'q') {
            return new Outcome(session.points(), true, session.skipped());
          }
          if (c == 's') {
            session.skip();
            out.println("  step skipped");
            break;
          }
        }
      }
      out.flush();
    }
    return new Outcome(session.points(), false, session.skipped());
  }

  /** @return the mass placed for {@code step}, or null when the operator quits */
  private Double askMass(CalibrationSession session, CalibrationPlan.Step step) {
    String what = step.mass_kg() == 0 ? "remove all weights (zero point)"
        : "place " + MassText.format(step.mass_kg())
            + " (sum of weights allowed, e.g. '1 kg + 500 g')";
    String prompt = String.format(Locale.ROOT, "[%d/%d] series %d, %s: %s, then press Enter%s: ",
        step.number(), session.stepCount(), step.series(), step.direction().label(), what,
        step.mass_kg() == 0 ? " (q quits)" : " (or type the mass placed; q quits)");
    while (true) {
      String a = answers.ask(prompt);
      if (a == null) {
        throw new LoadstoneException("the answers ended at step " + step.number() + " of "
            + session.stepCount() + " (" + step.prompt() + "): nothing was fitted or saved; run"
            + " the calibration again and answer every step (q quits)");
      }
      if (Answers.isQuit(a)) {
        return null;
      }
      try {
        double mass = a.isEmpty() ? step.mass_kg() : MassText.parse_kg(a);
        session.checkMass(mass);
        return mass;
      } catch (LoadstoneException e) {
        out.println("  " + e.getMessage());
      }
    }
  }
}
