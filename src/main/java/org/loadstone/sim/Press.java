package org.loadstone.sim;

/**
 * The crosshead and the specimen mounted under it. Specimen {@code k} of a seed is drawn from its
 * own random streams, so the same seed gives the same series of specimens. The crosshead either
 * starts by itself at time zero or waits for the operator: then it starts a set delay after
 * {@link #operatorStarts}, as a person at a press starts loading once the run is armed.
 */
final class Press {
  private final Scenario scenario;
  private final long seed;
  private final double frameStiffness_N_per_mm;
  private final double handStroke_mm;
  private final double crossheadRate_mm_per_s;
  private final double operatorDelay_s;

  private int specimenNumber;
  private Presets.Setup setup;
  private FrameMechanics mechanics;
  private CrossheadDrive drive;
  private double driveRate_mm_per_s;
  private double start_s;
  private double halt_s;

  Press(SimulatedFrameBuilder b) {
    this.scenario = b.scenario;
    this.seed = b.seed;
    this.frameStiffness_N_per_mm = b.frameStiffness_N_per_mm;
    this.handStroke_mm = b.handStroke_mm;
    this.crossheadRate_mm_per_s = b.crossheadRate_mm_per_s;
    this.operatorDelay_s = b.operatorDelay_s;
    mount(0, 0);
    if (Double.isNaN(operatorDelay_s)) {
      start_s = 0;
    }
  }

  /** The seed of specimen k: the frame's seed for the first, a mix of both after it. */
  private long specimenSeed(int k) {
    return k == 0 ? seed : seed ^ (0x9E3779B97F4A7C15L * k);
  }

  /** Mounts specimen {@code k} with the crosshead back at its start, waiting. */
  private void mount(int k, double now_s) {
    specimenNumber = k;
    long s = specimenSeed(k);
    setup = Presets.setup(scenario, s);
    mechanics = new FrameMechanics(setup.model(), frameStiffness_N_per_mm, setup.gap_mm(), now_s);
    if (hand()) {
      drive = new CrossheadDrive.HandPump(handStroke_mm, SimRandom.stream(s, SimRandom.DRIVE));
      driveRate_mm_per_s = Double.NaN;
    } else {
      driveRate_mm_per_s = Double.isNaN(crossheadRate_mm_per_s)
          ? setup.crossheadRate_mm_per_s() : crossheadRate_mm_per_s;
      drive = new CrossheadDrive.ConstantRate(driveRate_mm_per_s);
    }
    start_s = Double.POSITIVE_INFINITY;
    halt_s = Double.POSITIVE_INFINITY;
  }

  private boolean hand() {
    return !Double.isNaN(handStroke_mm);
  }

  /**
   * Takes the tested specimen out and mounts the next one; the crosshead waits for the operator
   * again (or starts at once on a press that starts by itself).
   */
  void nextSpecimen(double now_s) {
    mount(specimenNumber + 1, now_s);
    if (!waitsForOperator()) {
      start_s = now_s;
    }
  }

  /**
   * The operator starts loading: the crosshead starts the set delay after {@code now_s}
   * (at once when the frame starts by itself). Nothing happens once it has started.
   */
  void operatorStarts(double now_s) {
    if (!started()) {
      start_s = now_s + (Double.isNaN(operatorDelay_s) ? 0 : operatorDelay_s);
    }
  }

  /** @return whether the crosshead waits for the operator (else it started by itself) */
  boolean waitsForOperator() {
    return !Double.isNaN(operatorDelay_s);
  }

  /** @return whether the crosshead has been started (or will start at a set time) */
  boolean started() {
    return start_s != Double.POSITIVE_INFINITY;
  }

  /** @return crosshead position at a time, mm, 0 before the start */
  double position_mm(double time_s) {
    if (time_s <= start_s) {
      return 0;
    }
    return drive.position_mm(Math.min(time_s, halt_s) - start_s);
  }

  /** Stops a motorised crosshead at {@code now_s}; false for a hand press. */
  boolean halt(double now_s) {
    if (hand()) {
      return false;
    }
    halt_s = Math.min(halt_s, now_s);
    return true;
  }

  boolean motorised() {
    return !hand();
  }

  FrameMechanics mechanics() {
    return mechanics;
  }

  SpecimenSummary specimen() {
    return setup.summary();
  }

  double gap_mm() {
    return setup.gap_mm();
  }

  double driveRate_mm_per_s() {
    return driveRate_mm_per_s;
  }

  int specimenNumber() {
    return specimenNumber;
  }
}
