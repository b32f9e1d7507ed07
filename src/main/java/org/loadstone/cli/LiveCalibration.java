package org.loadstone.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.loadstone.calibration.CalibrationPlan;
import org.loadstone.calibration.CalibrationPoint;
import org.loadstone.calibration.CapturedReading;
import org.loadstone.calibration.ForceFromMass;
import org.loadstone.calibration.MassText;
import org.loadstone.calibration.StabilityDetector;
import org.loadstone.units.LoadstoneException;

/**
 * Walks the operator through a {@link CalibrationPlan} on a live device: asks for each weight,
 * waits for a settled reading and records the point. The operator may type the mass actually
 * placed instead of pressing Enter; after a time-out they choose to wait again, skip the step
 * (load steps only) or quit.
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
    List<CalibrationPlan.Step> steps = plan.steps();
    List<CalibrationPoint> points = new ArrayList<>();
    int skipped = 0;
    for (CalibrationPlan.Step step : steps) {
      Double mass = askMass(step, steps.size(), points);
      if (mass == null) {
        return new Outcome(points, true, skipped);
      }
      device.weights().load(mass);
      if (device.weights().automatic()) {
        out.println("  (simulator: " + (mass == 0 ? "all weights removed" : MassText.format(mass)
            + " now on the simulated cell") + ")");
      }
      while (true) {
        try {
          CapturedReading r = device.settle(new StabilityDetector(stability));
          CalibrationPoint p =
              CalibrationPoint.ofMass(mass, model, step.direction(), step.series(), r);
          points.add(p);
          out.printf(Locale.ROOT, "  captured %s (%.6g N): mean %.1f counts, sd %.1f, %d"
              + " samples%n", mass == 0 ? "zero" : MassText.format(mass), p.force_N(), r.mean_counts(),
              r.sd_counts(), r.samples());
          break;
        } catch (LiveDevice.DeviceLostException e) {
          throw e;
        } catch (LoadstoneException e) {
          out.println("  " + step.prompt() + ": " + e.getMessage());
          char c = answers.afterTimeout(mass != 0);
          if (c == 'q') {
            return new Outcome(points, true, skipped);
          }
          if (c == 's') {
            skipped++;
            out.println("  step skipped");
            break;
          }
        }
      }
      out.flush();
    }
    return new Outcome(points, false, skipped);
  }

  /** @return the mass placed for {@code step}, or null when the operator quits */
  private Double askMass(CalibrationPlan.Step step, int total, List<CalibrationPoint> done) {
    String what = step.mass_kg() == 0 ? "remove all weights (zero point)"
        : "place " + MassText.format(step.mass_kg()) + " (sum of weights allowed, e.g. '1 kg + 500 g')";
    String prompt = String.format(Locale.ROOT, "[%d/%d] series %d, %s: %s, then press Enter%s: ",
        step.number(), total, step.series(), step.direction().label(), what,
        step.mass_kg() == 0 ? " (q quits)" : " (or type the mass placed; q quits)");
    while (true) {
      String a = answers.ask(prompt);
      if (a == null) {
        throw new LoadstoneException("the answers ended at step " + step.number() + " of "
            + total + " (" + step.prompt() + "): nothing was fitted or saved; run the"
            + " calibration again and answer every step (q quits)");
      }
      if (Answers.isQuit(a)) {
        return null;
      }
      double mass = step.mass_kg();
      if (!a.isEmpty()) {
        try {
          mass = MassText.parse_kg(a);
          model.force_N(mass);
        } catch (LoadstoneException e) {
          out.println("  " + e.getMessage());
          continue;
        }
      }
      if (step.mass_kg() == 0 && mass != 0) {
        out.println("  this is the zero point: remove all weights and press Enter");
        continue;
      }
      if (step.mass_kg() != 0 && mass == 0) {
        out.println("  a load step needs a mass above zero: place the weights, or q to quit");
        continue;
      }
      double force = model.force_N(mass);
      boolean repeat = done.stream().anyMatch(p -> p.series() == step.series()
          && p.direction() == step.direction() && p.force_N() == force);
      if (repeat) {
        out.println("  " + MassText.format(mass) + " was already read in series " + step.series()
            + ", " + step.direction().label() + ": place a different mass, or press Enter for"
            + " the planned " + MassText.format(step.mass_kg()));
        continue;
      }
      return mass;
    }
  }
}
