package org.loadstone.device;

import org.loadstone.sim.Scenario;
import org.loadstone.sim.SimImperfections;
import org.loadstone.sim.SimulatedFrame;
import org.loadstone.sim.SimulatedFrameBuilder;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * How to set up the built-in simulated frame from user options.
 *
 * @param scenario scenario name as the command line takes it, e.g. {@code panel-foam}
 * @param seed random seed; the same seed gives the same bytes
 * @param rateHz samples per second: 10 or 80 (bridge amplifier) or 100…50 000 (fast converter)
 * @param hand whether the press is pumped by hand (uneven strokes, pauses) instead of a constant
 *     crosshead rate
 * @param speed how many times faster than real time the simulated clock runs (at least 1)
 * @param operatorDelay_s the press waits for the operator: its crosshead starts this many
 *     simulated seconds after a run is armed (0…60); NaN for a press that starts by itself when
 *     the stream starts (a stand-alone byte stream, where nobody arms)
 * @param imperfections the cell's and amplifier's noise, warm-up, drift, creep and spikes, not
 *     null ({@link SimImperfections#TYPICAL} unless set)
 */
public record SimSetup(String scenario, long seed, double rateHz, boolean hand, double speed,
    double operatorDelay_s, SimImperfections imperfections) {
  /** Simulated seconds from arming a run to the crosshead moving, by default. */
  public static final double DEFAULT_OPERATOR_DELAY_S = 1.0;
  /** The console's default: a foam-core shelf panel at 80 samples/s, real time. */
  public static final SimSetup DEFAULT = new SimSetup("panel-foam", 1, 80, false, 1);

  /** A press that waits for the operator, with the default delay, on a typical amplifier. */
  public SimSetup(String scenario, long seed, double rateHz, boolean hand, double speed) {
    this(scenario, seed, rateHz, hand, speed, DEFAULT_OPERATOR_DELAY_S);
  }

  /** A typical bridge amplifier ({@link SimImperfections#TYPICAL}). */
  public SimSetup(String scenario, long seed, double rateHz, boolean hand, double speed,
      double operatorDelay_s) {
    this(scenario, seed, rateHz, hand, speed, operatorDelay_s, SimImperfections.TYPICAL);
  }

  public SimSetup {
    Precondition.notNull(imperfections, "imperfections");
    if (!Double.isNaN(operatorDelay_s) && !(operatorDelay_s >= 0 && operatorDelay_s <= 60)) {
      throw new LoadstoneException("the simulated press's start delay must be 0 to 60 s, was "
          + operatorDelay_s);
    }
    Scenario.parse(scenario);
    if (!SimulatedFrame.isSupportedRate(rateHz)) {
      throw new LoadstoneException("the simulated converter cannot run at " + rateHz
          + " samples/s: use 10 or 80 (bridge amplifier) or 100…50000 (fast converter)");
    }
    if (!(speed >= 1) || Double.isNaN(speed)) {
      throw new LoadstoneException("the simulation speed must be 1 (real time) or more, was "
          + speed + ": give how many times faster than real time the simulated frame runs",
          org.loadstone.units.Setting.SIM_SPEED);
    }
  }

  /** @return the physical model these settings describe */
  public SimulatedFrame buildFrame() {
    SimulatedFrameBuilder b =
        SimulatedFrame.builder().scenario(Scenario.parse(scenario)).seed(seed).rateHz(rateHz)
            .imperfections(imperfections);
    if (hand) {
      b.handPumped(2.0);
    }
    if (!Double.isNaN(operatorDelay_s)) {
      b.waitForOperator(operatorDelay_s);
    }
    return b.build();
  }

  /** @return a simulated device streaming this model */
  public SimTransport openTransport() {
    org.loadstone.units.SlowWork.check("opening the port");
    return new SimTransport(new FrameSampleSource(buildFrame()), speed, 100);
  }

  /** @return the simulated cell's nominal sensitivity in counts per N (its data-sheet value) */
  public double nominalCountsPerN() {
    return cell().countsPerN();
  }

  /** @return the simulated load cell (sensitivity, capacity, offset, noise, non-linearity) */
  public org.loadstone.sim.LoadCell cell() {
    return buildFrame().truth().loadCell();
  }
}
