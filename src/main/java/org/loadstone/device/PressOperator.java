package org.loadstone.device;

import org.loadstone.sim.SimulatedFrame;

/**
 * Who starts loading the specimen once a run is armed, and who puts a new specimen in. On a real
 * frame the operator does, and the program only waits for load; on the built-in simulated frame
 * the program stands in for the operator's hands, so the simulated specimen is loaded only when
 * someone is ready to record it.
 */
public interface PressOperator {
  /**
   * A run has been armed: the operator starts the press. On the simulated frame a specimen that
   * was loaded already (the run before) is taken out and a new one mounted first; the crosshead
   * then starts after the frame's set delay.
   */
  void runArmed();

  /** Puts a new specimen in, with the crosshead back at its start (simulated frame only). */
  void nextSpecimen();

  /** @return whether the program stands in for the operator (the simulated frame) */
  boolean automatic();

  /** @return the operator of a real frame: the program does nothing, the person does */
  static PressOperator person() {
    return new PressOperator() {
      @Override
      public void runArmed() {}

      @Override
      public void nextSpecimen() {}

      @Override
      public boolean automatic() {
        return false;
      }
    };
  }

  /**
   * @param t the open device
   * @return the stand-in for the simulated frame, else {@link #person()}
   */
  static PressOperator forTransport(Transport t) {
    if (!(t instanceof SimTransport sim)) {
      return person();
    }
    return new PressOperator() {
      @Override
      public void runArmed() {
        onFrame(sim, frame -> {
          if (!frame.waitsForOperator()) {
            return; // dead weights, or a press that started by itself
          }
          if (frame.crossheadStarted()) {
            frame.nextSpecimen();
          }
          frame.operatorStarts();
        });
      }

      @Override
      public void nextSpecimen() {
        onFrame(sim, frame -> {
          if (frame.waitsForOperator()) {
            frame.nextSpecimen();
          }
        });
      }

      @Override
      public boolean automatic() {
        return true;
      }
    };
  }

  private static void onFrame(SimTransport sim,
      java.util.function.Consumer<SimulatedFrame> action) {
    sim.withSource(src -> {
      if (src instanceof FrameSampleSource f) {
        action.accept(f.frame());
      }
    });
  }
}
