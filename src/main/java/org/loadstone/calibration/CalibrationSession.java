package org.loadstone.calibration;

import java.util.ArrayList;
import java.util.List;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * Walks an operator through a {@link CalibrationPlan}: live counts go in through
 * {@link #offer}; when the reading is stable, {@link #capture} records the point and moves to the
 * next step. Pure (no clock, no device); not thread-safe: call it from one thread.
 */
public final class CalibrationSession {
  private final List<CalibrationPlan.Step> steps;
  private final ForceFromMass model;
  private final StabilityDetector detector;
  private final List<CalibrationPoint> points = new ArrayList<>();
  private StabilityDetector.State last = StabilityDetector.State.FILLING;

  /**
   * @param plan the steps to walk through
   * @param model turns each step's mass into force
   * @param stability window and limits of the stability judgement
   */
  public CalibrationSession(
      CalibrationPlan plan, ForceFromMass model, StabilityDetector.Settings stability) {
    this.steps = Precondition.notNull(plan, "plan").steps();
    this.model = Precondition.notNull(model, "model");
    this.detector = new StabilityDetector(Precondition.notNull(stability, "stability"));
  }

  /** @return the step waiting for a reading, or null when all are done */
  public CalibrationPlan.Step current() {
    return done() ? null : steps.get(points.size());
  }

  /** @return whether every step has a point */
  public boolean done() {
    return points.size() == steps.size();
  }

  /**
   * Feeds one live sample to the stability judgement of the current step.
   *
   * @param counts raw counts
   * @return the state of the reading
   * @throws LoadstoneException when the reading has not settled within the time-out (the
   *     judgement restarts, so the operator can fix the cause and go on feeding)
   * @throws IllegalStateException when the session is done
   */
  public StabilityDetector.State offer(double counts) {
    if (done()) {
      throw new IllegalStateException("all steps are captured");
    }
    try {
      last = detector.offer(counts);
      return last;
    } catch (LoadstoneException e) {
      detector.reset();
      last = StabilityDetector.State.FILLING;
      throw new LoadstoneException(current().prompt() + ": " + e.getMessage(), e);
    }
  }

  /** @return the detector, e.g. to show its last SD and drift */
  public StabilityDetector detector() {
    return detector;
  }

  /**
   * Records the current step's point from the stable window, with the planned mass.
   *
   * @return the point recorded
   * @throws LoadstoneException when the reading is not stable yet
   */
  public CalibrationPoint capture() {
    CalibrationPlan.Step s = current();
    return capture(s == null ? 0 : s.mass_kg());
  }

  /**
   * Records the current step's point with the mass actually placed (e.g. parsed with
   * {@link MassText#parse_kg} when the weights differ from the plan).
   *
   * @param mass_kg conventional mass on the cell, ≥ 0; must be 0 on a zero step
   * @throws LoadstoneException when not stable, or the mass does not fit the step
   */
  public CalibrationPoint capture(double mass_kg) {
    CalibrationPlan.Step s = current();
    if (s == null) {
      throw new IllegalStateException("all steps are captured");
    }
    if (last != StabilityDetector.State.STABLE) {
      throw new LoadstoneException(s.prompt() + ": the reading is not stable yet; wait until"
          + " it settles, then capture");
    }
    if ((s.mass_kg() == 0) != (mass_kg == 0)) {
      throw new LoadstoneException(s.prompt() + ": a mass of " + mass_kg + " kg does not fit"
          + " this step; " + (s.mass_kg() == 0 ? "remove all weights" : "place the weights"));
    }
    CalibrationPoint p =
        CalibrationPoint.ofMass(mass_kg, model, s.direction(), s.series(), detector.reading());
    points.add(p);
    detector.reset();
    last = StabilityDetector.State.FILLING;
    return p;
  }

  /** Discards the last captured point, so its step is taken again. */
  public void retakeLast() {
    if (!points.isEmpty()) {
      points.remove(points.size() - 1);
      detector.reset();
      last = StabilityDetector.State.FILLING;
    }
  }

  /** @return the points captured so far, in order */
  public List<CalibrationPoint> points() {
    return List.copyOf(points);
  }
}
