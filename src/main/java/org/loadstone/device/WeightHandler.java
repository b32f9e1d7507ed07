package org.loadstone.device;

import org.loadstone.sim.SimulatedFrame;
import org.loadstone.units.LoadstoneException;

/**
 * Who puts the weights on the cell when a command asks for them. On a real device the operator
 * does, and the program only waits; on the built-in simulated frame the program stands in for
 * the operator's hands and puts the mass on the model.
 */
public interface WeightHandler {
  /**
   * Makes {@code total_kg} the whole mass on the cell (0 removes every weight).
   *
   * @param total_kg conventional mass, ≥ 0
   */
  void load(double total_kg);

  /** @return whether the weights are placed by the program (the simulator) */
  boolean automatic();

  /** @return the handler for a real device: the operator places the weights */
  static WeightHandler operator() {
    return new WeightHandler() {
      @Override
      public void load(double total_kg) {}

      @Override
      public boolean automatic() {
        return false;
      }
    };
  }

  /**
   * @param t the open device
   * @return a handler that loads the simulated cell for the simulator, else {@link #operator()}
   */
  static WeightHandler forTransport(Transport t) {
    if (!(t instanceof SimTransport sim)) {
      return operator();
    }
    return new WeightHandler() {
      @Override
      public void load(double total_kg) {
        sim.withSource(src -> {
          if (!(src instanceof FrameSampleSource f)) {
            throw new IllegalStateException("the simulated device has no frame model");
          }
          SimulatedFrame frame = f.frame();
          try {
            frame.removeAll();
            if (total_kg > 0) {
              frame.placeMass(total_kg);
            }
          } catch (IllegalStateException e) {
            throw new LoadstoneException(e.getMessage() + ": only the dead-weight scenario"
                + " puts weights on the simulated cell; choose it to calibrate or verify on the"
                + " simulated frame", e, org.loadstone.units.Setting.SIM_SCENARIO);
          }
        });
      }

      @Override
      public boolean automatic() {
        return true;
      }
    };
  }
}
