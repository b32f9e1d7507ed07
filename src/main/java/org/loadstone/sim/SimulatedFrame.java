package org.loadstone.sim;

import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * Loadstone's built-in simulated load frame: a physical model of crosshead drive, specimen, frame
 * compliance, load cell, 24-bit converter and position encoder. Pure computation: no I/O, no
 * threads, no pacing (the caller decides when to ask for the next sample). The same settings and
 * seed give the same samples; a different seed gives another specimen and other noise.
 *
 * <pre>
 *   SimulatedFrame frame = SimulatedFrame.builder().scenario(Scenario.BRITTLE).rateHz(80).seed(42).build();
 *   frame.next((seq, us, load, pos) -> ...);
 *   SimTruth truth = frame.truth();
 * </pre>
 *
 * <p>Load counts: a fast converter (100…50 000 samples/s) reports the force at the instant the
 * conversion finishes. An HX711-class converter (10 or 80 samples/s) integrates its input, so by
 * default its counts are the mean of the noise-free output over the conversion period just ended
 * (a first-order stand-in for its digital filter): a fracture lasting a few milliseconds shows as
 * one or two lowered samples, as on a real slow converter. The per-sample truth ({@link
 * SimSample#force_N()}, {@link #lastForce_N()}) is always the instantaneous force.
 *
 * <p>Not thread-safe: one caller drives a frame. Producing a sample allocates nothing.
 */
public final class SimulatedFrame {
  /** Longest model step between samples, s. */
  static final double MAX_STEP_S = 1e-4;

  private final Scenario scenario;
  private final long seed;
  private final LoadCell cell;
  private final String cellId;
  private final double positionCountsPerMm;
  private final double gravity_m_per_s2;
  private final SampleClock clock;
  private final SimRandom noise;
  private final Press press;
  private final DeadWeightRig rig;
  private final boolean averagingConverter;
  private final SimImperfections imperfections;
  private final CellErrors errors;
  private double rateHz;

  private int lastSeq;
  private long lastDeviceTime_us;
  private int lastLoad;
  private int lastPosition;
  private double lastTime_s;
  private double lastCrosshead_mm;
  private double lastDeflection_mm;
  private double lastForce_N;
  private boolean lastSaturated;
  private long saturatedCount;
  private double deadWeightPeak_N;
  private double deadWeightPeak_s = Double.NaN;

  SimulatedFrame(SimulatedFrameBuilder b, LoadCell cell) {
    this.averagingConverter = b.averaging;
    this.scenario = b.scenario;
    this.seed = b.seed;
    this.cell = cell;
    this.cellId = b.cellId;
    this.positionCountsPerMm = b.positionCountsPerMm;
    this.gravity_m_per_s2 = b.gravity_m_per_s2;
    this.rateHz = b.rateHz;
    this.clock = new SampleClock(b.rateHz, b.jitter_us, b.rateError_pct, b.firstSequence,
        b.clockStart_us, SimRandom.stream(b.seed, SimRandom.TIMING));
    this.noise = SimRandom.stream(b.seed, SimRandom.NOISE);
    this.imperfections = b.imperfections;
    this.errors = new CellErrors(b.imperfections, cell, b.seed);
    if (b.scenario.hasSpecimen()) {
      press = new Press(b);
      rig = null;
    } else {
      press = null;
      rig = new DeadWeightRig(b.gravity_m_per_s2, b.settling_s);
    }
  }

  /** @return a builder with the defaults (panel-foam, seed 1, 80 samples/s) */
  public static SimulatedFrameBuilder builder() {
    return new SimulatedFrameBuilder();
  }

  /**
   * Whether a rate is one the simulated converter supports: 10 or 80 (HX711-class) or 100…50 000
   * samples/s (fast converter).
   */
  public static boolean isSupportedRate(double rateHz) {
    return rateHz == 10 || rateHz == 80 || (rateHz >= 100 && rateHz <= 50_000);
  }

  private void produce() {
    double t = clock.next_s();
    double force;
    double converted_counts;
    if (press != null) {
      FrameMechanics mechanics = press.mechanics();
      double t0 = mechanics.time_s();
      int n = Math.max(1, (int) Math.ceil((t - t0) / MAX_STEP_S - 1e-9));
      boolean averaging = averagingConverter && (rateHz == 10 || rateHz == 80);
      double previous = averaging ? cell.idealCounts(mechanics.force_N()) : 0;
      double area = 0;
      double tPrevious = t0;
      for (int i = 1; i <= n; i++) {
        double ti = i == n ? t : t0 + (t - t0) * i / n;
        mechanics.step(press.position_mm(ti), ti);
        if (averaging) {
          double c = cell.idealCounts(mechanics.force_N());
          area += 0.5 * (previous + c) * (ti - tPrevious);
          previous = c;
          tPrevious = ti;
        }
      }
      force = mechanics.force_N();
      converted_counts = averaging ? area / (t - t0) : cell.idealCounts(force);
      lastCrosshead_mm = mechanics.crosshead_mm();
      lastDeflection_mm = mechanics.deflection_mm();
    } else {
      force = rig.force_N(t);
      converted_counts = cell.idealCounts(force);
      lastCrosshead_mm = 0;
      lastDeflection_mm = 0;
      if (force > deadWeightPeak_N) {
        deadWeightPeak_N = force;
        deadWeightPeak_s = t;
      }
    }
    converted_counts += errors.counts(t, force);
    long counts = Math.round(converted_counts + cell.noiseRms_counts() * noise.nextGaussian());
    lastSaturated = counts > LoadCell.MAX_COUNTS || counts < LoadCell.MIN_COUNTS;
    if (lastSaturated) {
      saturatedCount++;
      counts = Math.max(LoadCell.MIN_COUNTS, Math.min(LoadCell.MAX_COUNTS, counts));
    }
    long pos = Math.round(lastCrosshead_mm * positionCountsPerMm);
    lastPosition = (int) Math.max(Integer.MIN_VALUE, Math.min(Integer.MAX_VALUE, pos));
    lastLoad = (int) counts;
    lastSeq = clock.nextSequence();
    lastDeviceTime_us = clock.deviceTime_us(t);
    lastTime_s = t;
    lastForce_N = force;
    clock.advance();
  }

  /**
   * Produces the next sample in device-time order and hands it to the sink. Its ground truth is
   * then readable through {@link #lastTime_s()} and the other {@code last…} methods.
   *
   * @param sink receives the sample, not null
   */
  public void next(SampleSink sink) {
    Precondition.notNull(sink, "sink");
    produce();
    sink.sample(lastSeq, lastDeviceTime_us, lastLoad, lastPosition);
  }

  /** @return the next sample with its ground truth, as a record (allocates) */
  public SimSample next() {
    produce();
    return lastSample();
  }

  /**
   * Fills a block with the next samples, from index 0.
   *
   * @param block the buffer, not null
   * @param max how many samples, 0…block capacity
   * @return the number written (= max)
   */
  public int fill(SampleBlock block, int max) {
    Precondition.notNull(block, "block");
    if (max < 0 || max > block.capacity()) {
      throw new IllegalArgumentException(
          "'max' must be 0…" + block.capacity() + " (the block capacity), was " + max);
    }
    for (int i = 0; i < max; i++) {
      produce();
      block.put(i, lastSeq, lastDeviceTime_us, lastLoad, lastPosition, lastTime_s,
          lastCrosshead_mm, lastDeflection_mm, lastForce_N, lastSaturated);
    }
    block.setSize(max);
    return max;
  }

  /**
   * Writes the next samples into caller-owned arrays (raw values only; truth through a {@link
   * SampleBlock}).
   *
   * @param seq sequence numbers, not null
   * @param deviceTime_us device times, µs, not null
   * @param loadCounts load counts, not null
   * @param positionCounts position counts, not null
   * @param offset first index written, ≥ 0
   * @param max how many samples, ≥ 0, fitting every array from {@code offset}
   * @return the number written (= max)
   */
  public int fill(int[] seq, long[] deviceTime_us, int[] loadCounts, int[] positionCounts,
      int offset, int max) {
    Precondition.notNull(seq, "seq");
    Precondition.notNull(deviceTime_us, "deviceTime_us");
    Precondition.notNull(loadCounts, "loadCounts");
    Precondition.notNull(positionCounts, "positionCounts");
    int room = Math.min(Math.min(seq.length, deviceTime_us.length),
        Math.min(loadCounts.length, positionCounts.length));
    if (offset < 0 || max < 0 || offset > room - max) {
      throw new IllegalArgumentException("'offset' " + offset + " and 'max' " + max
          + " do not fit arrays of length " + room);
    }
    for (int i = offset; i < offset + max; i++) {
      produce();
      seq[i] = lastSeq;
      deviceTime_us[i] = lastDeviceTime_us;
      loadCounts[i] = lastLoad;
      positionCounts[i] = lastPosition;
    }
    return max;
  }

  /** @return the last sample with its truth as a record (allocates); before any, throws */
  public SimSample lastSample() {
    if (clock.count() == 0) {
      throw new IllegalStateException("no sample produced yet: call next() first");
    }
    return new SimSample(lastSeq, lastDeviceTime_us, lastLoad, lastPosition, lastTime_s,
        lastCrosshead_mm, lastDeflection_mm, lastForce_N, lastSaturated);
  }

  /** @return true time of the last sample, s */
  public double lastTime_s() {
    return lastTime_s;
  }

  /** @return true crosshead displacement at the last sample, mm */
  public double lastCrosshead_mm() {
    return lastCrosshead_mm;
  }

  /** @return true specimen deflection at the last sample, mm */
  public double lastDeflection_mm() {
    return lastDeflection_mm;
  }

  /** @return true force at the last sample, N */
  public double lastForce_N() {
    return lastForce_N;
  }

  /** @return whether the last sample was clipped at a 24-bit limit */
  public boolean lastSaturated() {
    return lastSaturated;
  }

  /** @return the cell's and amplifier's imperfections this frame simulates */
  public SimImperfections imperfections() {
    return imperfections;
  }

  /**
   * @return the true shift of the zero at the last sample (warm-up plus drift, without creep,
   *     noise or spikes), counts
   */
  public double lastZeroShift_counts() {
    return errors.zeroShift_counts();
  }

  /** @return the true creep at the last sample, as apparent force, N */
  public double lastCreep_N() {
    return errors.creep_N();
  }

  /** @return whether the last sample carried a spike */
  public boolean lastSpike() {
    return errors.lastSpike();
  }

  /** @return how many samples carried a spike so far */
  public long spikeCount() {
    return errors.spikes();
  }

  /** @return true time the next sample will be taken, s (for pacing) */
  public double nextTime_s() {
    return clock.next_s();
  }

  /**
   * Changes the sample rate from the next sample on.
   *
   * @param newRateHz a rate for which {@link #isSupportedRate} holds
   * @throws LoadstoneException naming the rate and the supported ones
   */
  public void setRateHz(double newRateHz) {
    SimulatedFrameBuilder.checkRate(newRateHz);
    clock.setRate(newRateHz);
    rateHz = newRateHz;
  }

  /**
   * Stops a motorised crosshead where it is now (at the last sample's time).
   *
   * @return true if halted; false if the crosshead is hand-operated or absent (nothing to stop)
   */
  public boolean halt() {
    return press != null && press.halt(lastTime_s);
  }

  /**
   * The operator starts loading (a run has been armed): a crosshead that waits for the operator
   * starts its set delay after the last sample's time; one that started by itself, or has
   * started already, carries on. Nothing in the dead-weight mode.
   */
  public void operatorStarts() {
    if (press != null) {
      press.operatorStarts(lastTime_s);
    }
  }

  /** @return whether there is a crosshead that waits for the operator to start it */
  public boolean waitsForOperator() {
    return press != null && press.waitsForOperator();
  }

  /** @return whether the crosshead has been started on the present specimen */
  public boolean crossheadStarted() {
    return press != null && press.started();
  }

  /**
   * Takes the tested specimen out and mounts the next one of the same scenario (its own scatter,
   * drawn from the seed and its number), with the crosshead back at its start, waiting for the
   * operator. Its ground truth starts afresh.
   *
   * @throws IllegalStateException in the dead-weight mode (no specimen)
   */
  public void nextSpecimen() {
    if (press == null) {
      throw new IllegalStateException("the dead-weight scenario has no specimen to change");
    }
    press.nextSpecimen(lastTime_s);
  }

  /** @return the number of the present specimen, 0 for the first (0 in the dead-weight mode) */
  public int specimenNumber() {
    return press == null ? 0 : press.specimenNumber();
  }

  /**
   * Places a mass on the cell (dead-weight mode) at the time of the last sample; the force then
   * settles to the new total times g.
   *
   * @param mass_kg mass added, kg, &gt; 0
   * @throws IllegalStateException when the scenario is not {@link Scenario#DEAD_WEIGHT}
   */
  public void placeMass(double mass_kg) {
    Precondition.positive(mass_kg, "mass_kg");
    requireRig().setMass(rig.mass_kg() + mass_kg, lastTime_s);
  }

  /**
   * Takes a mass off the cell (dead-weight mode) at the time of the last sample.
   *
   * @param mass_kg mass removed, kg, &gt; 0, at most the mass on the cell
   * @throws IllegalArgumentException when more is removed than is on the cell
   * @throws IllegalStateException when the scenario is not {@link Scenario#DEAD_WEIGHT}
   */
  public void removeMass(double mass_kg) {
    Precondition.positive(mass_kg, "mass_kg");
    DeadWeightRig r = requireRig();
    if (mass_kg > r.mass_kg() * (1 + 1e-12)) {
      throw new IllegalArgumentException(
          "cannot remove " + mass_kg + " kg: only " + r.mass_kg() + " kg is on the cell");
    }
    r.setMass(Math.max(0, r.mass_kg() - mass_kg), lastTime_s);
  }

  /** Removes all masses (dead-weight mode). @throws IllegalStateException if not dead-weight */
  public void removeAll() {
    requireRig().setMass(0, lastTime_s);
  }

  /** @return total mass on the cell, kg (0 outside the dead-weight mode) */
  public double placedMass_kg() {
    return rig == null ? 0 : rig.mass_kg();
  }

  private DeadWeightRig requireRig() {
    if (rig == null) {
      throw new IllegalStateException(
          "masses can only be placed in the dead-weight scenario, this frame runs " + scenario.cliName());
    }
    return rig;
  }

  /** @return identity of the simulated device */
  public FrameInfo info() {
    String adc = rateHz == 10 || rateHz == 80 ? "hx711" : "fast";
    return new FrameInfo(adc, rateHz, 2, positionCountsPerMm, press != null && press.motorised(),
        "loadstone-sim",
        cellId, cell.capacity_N(), cell.countsPerN());
  }

  /** @return a snapshot of the ground truth so far */
  public SimTruth truth() {
    if (press == null) {
      return new SimTruth(scenario, seed, rateHz, cell, positionCountsPerMm, gravity_m_per_s2,
          Double.NaN, Double.NaN, Double.NaN, null, Double.NaN, deadWeightPeak_N, deadWeightPeak_s, Double.NaN, Double.NaN,
          Double.NaN, Double.NaN, Double.NaN, Double.NaN, clock.count(), saturatedCount,
          rig.mass_kg());
    }
    FrameMechanics mechanics = press.mechanics();
    SpecimenSummary specimen = press.specimen();
    double kf = mechanics.frameStiffness_N_per_mm();
    double ks = specimen.stiffness_N_per_mm();
    return new SimTruth(scenario, seed, rateHz, cell, positionCountsPerMm, gravity_m_per_s2,
        press.driveRate_mm_per_s(), press.gap_mm(), kf,
        specimen, 1 / (1 / ks + 1 / kf), mechanics.peak_N(), mechanics.peak_s(),
        mechanics.break_s(), mechanics.breakForce_N(), mechanics.energyToPeak_J(),
        mechanics.energyToBreak_J(), mechanics.crossheadEnergyToPeak_J(),
        mechanics.crossheadEnergyToBreak_J(), clock.count(), saturatedCount, 0);
  }
}
