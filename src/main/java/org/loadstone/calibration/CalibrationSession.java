package org.loadstone.calibration;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * The calibration walk, one for the console and the command line: steps an operator through a
 * {@link CalibrationPlan}. Live counts go in through {@link #offer}; when the reading is stable,
 * {@link #capture} records the point and moves to the next step.
 *
 * <p>The rules of the walk, here and nowhere else:
 *
 * <ul>
 *   <li>the mass placed may differ from the plan (the operator types it), but a zero step takes
 *       no mass and a load step some mass;
 *   <li>a load already read in the same series and direction is refused: the fit keeps one
 *       reading per load in a series and direction, so a repeat would only be refused later,
 *       after the weights were handled;
 *   <li>a load step may be skipped (a weight missing, a reading that will not settle); a zero
 *       step may not: the ascending zero is the reference of the series' counts and the
 *       descending zero its zero return. The number skipped is reported;
 *   <li>the last step, captured or skipped, may be taken again.
 * </ul>
 *
 * <p>Pure (no clock, no device); not thread-safe: call it from one thread.
 */
public final class CalibrationSession {
  private final List<CalibrationPlan.Step> steps;
  private final ForceFromMass model;
  private final StabilityDetector detector;
  /** One entry per step taken: its point, or null when it was skipped. */
  private final List<CalibrationPoint> taken = new ArrayList<>();
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
    return done() ? null : steps.get(taken.size());
  }

  /** @return how many steps the plan has */
  public int stepCount() {
    return steps.size();
  }

  /** @return whether every step has been captured or skipped */
  public boolean done() {
    return taken.size() == steps.size();
  }

  /**
   * Feeds one live sample to the stability judgement of the current step.
   *
   * @param counts raw counts
   * @return the state of the reading
   * @throws LoadstoneException when the reading has not settled within the time-out, naming the
   *     step (the judgement restarts, so the operator can fix the cause and go on feeding)
   * @throws IllegalStateException when the session is done
   */
  public StabilityDetector.State offer(double counts) {
    CalibrationPlan.Step s = requireCurrent();
    try {
      last = detector.offer(counts);
      return last;
    } catch (LoadstoneException e) {
      restartJudgement();
      throw new LoadstoneException(s.prompt() + ": " + e.getMessage(), e);
    }
  }

  /** @return the detector, e.g. to show its last SD and drift */
  public StabilityDetector detector() {
    return detector;
  }

  /**
   * Checks that {@code mass_kg} may be placed for the current step, before anyone handles the
   * weights.
   *
   * @param mass_kg conventional mass the operator means to place, kg
   * @return the force it exerts, N
   * @throws LoadstoneException when the mass is invalid, does not fit the step (zero on a load
   *     step or the reverse), or was already read in this series and direction
   * @throws IllegalStateException when the session is done
   */
  public double checkMass(double mass_kg) {
    CalibrationPlan.Step s = requireCurrent();
    double force = model.force_N(mass_kg);
    if (s.mass_kg() == 0 && mass_kg != 0) {
      throw new LoadstoneException(s.prompt() + ": this is a zero point, yet " + MassText.format(
          mass_kg) + " was given: remove all weights");
    }
    if (s.mass_kg() != 0 && mass_kg == 0) {
      throw new LoadstoneException(s.prompt() + ": a load step needs a mass above zero: place"
          + " the weights, or skip the step");
    }
    boolean repeat = taken.stream().filter(Objects::nonNull).anyMatch(p -> p.series()
        == s.series() && p.direction() == s.direction() && p.force_N() == force);
    if (repeat) {
      throw new LoadstoneException(s.prompt() + ": " + MassText.format(mass_kg) + " was already"
          + " read in this series and direction, and the fit keeps one reading per load: place"
          + " a different mass, or the planned " + MassText.format(s.mass_kg()) + " if it was"
          + " not read yet");
    }
    return force;
  }

  /**
   * Records the current step's point from the stable window, with the planned mass.
   *
   * @return the point recorded
   * @throws LoadstoneException when the reading is not stable yet or the mass is refused by
   *     {@link #checkMass}
   * @throws IllegalStateException when the session is done
   */
  public CalibrationPoint capture() {
    return capture(requireCurrent().mass_kg());
  }

  /**
   * Records the current step's point with the mass actually placed (e.g. parsed with
   * {@link MassText#parse_kg} when the weights differ from the plan).
   *
   * @param mass_kg conventional mass on the cell, ≥ 0; must be 0 on a zero step
   * @throws LoadstoneException when not stable, or the mass is refused by {@link #checkMass}
   * @throws IllegalStateException when the session is done
   */
  public CalibrationPoint capture(double mass_kg) {
    CalibrationPlan.Step s = requireCurrent();
    checkMass(mass_kg);
    if (last != StabilityDetector.State.STABLE) {
      throw new LoadstoneException(s.prompt() + ": the reading is not stable yet; wait until"
          + " it settles, then capture");
    }
    CalibrationPoint p =
        CalibrationPoint.ofMass(mass_kg, model, s.direction(), s.series(), detector.reading());
    taken.add(p);
    restartJudgement();
    return p;
  }

  /** @return whether the current step may be skipped (a load step) */
  public boolean canSkip() {
    CalibrationPlan.Step s = current();
    return s != null && s.mass_kg() != 0;
  }

  /**
   * Skips the current load step: no point is recorded for it.
   *
   * @throws LoadstoneException on a zero step, which cannot be skipped
   * @throws IllegalStateException when the session is done
   */
  public void skip() {
    CalibrationPlan.Step s = requireCurrent();
    if (!canSkip()) {
      throw new LoadstoneException(s.prompt() + ": a zero point cannot be skipped, it is the"
          + " series' reference (or its zero return): remove all weights and let the reading"
          + " settle, or stop the calibration");
    }
    taken.add(null);
    restartJudgement();
  }

  /** @return how many load steps were skipped so far */
  public int skipped() {
    return (int) taken.stream().filter(Objects::isNull).count();
  }

  /** Undoes the last step, captured or skipped, so that it is taken again; nothing when none. */
  public void retakeLast() {
    if (!taken.isEmpty()) {
      taken.remove(taken.size() - 1);
      restartJudgement();
    }
  }

  /** @return the points captured so far, in order (skipped steps have none) */
  public List<CalibrationPoint> points() {
    return taken.stream().filter(Objects::nonNull).toList();
  }

  private CalibrationPlan.Step requireCurrent() {
    if (done()) {
      throw new IllegalStateException("all steps are taken");
    }
    return current();
  }

  private void restartJudgement() {
    detector.reset();
    last = StabilityDetector.State.FILLING;
  }
}
