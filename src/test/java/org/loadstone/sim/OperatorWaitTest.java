package org.loadstone.sim;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

/** A press that waits for the operator, and a new specimen without a new frame. */
class OperatorWaitTest {
  private static SimulatedFrame waiting(double delay_s) {
    return SimulatedFrame.builder().scenario(Scenario.PANEL_FOAM).seed(4).rateHz(80)
        .waitForOperator(delay_s).build();
  }

  private static void run(SimulatedFrame f, double seconds) {
    for (int i = 0; i < seconds * 80; i++) {
      f.next();
    }
  }

  @Test
  void theCrossheadStaysStillUntilTheOperatorStartsThenMovesAfterTheDelay() {
    SimulatedFrame f = waiting(1.5);
    run(f, 20); // far longer than the 2.5 s approach of a press that starts by itself
    assertThat(f.lastCrosshead_mm()).isZero();
    assertThat(f.truth().peakForce_N()).isZero();
    assertThat(f.crossheadStarted()).isFalse();
    double armed_s = f.lastTime_s();
    f.operatorStarts();
    run(f, 1.4);
    assertThat(f.lastCrosshead_mm()).isZero();
    run(f, 1.0);
    // constant rate from armed + 1.5 s: the panels' crosshead rate is 0.2 mm/s
    double rate = f.truth().crossheadRate_mm_per_s();
    assertThat(f.lastCrosshead_mm())
        .isCloseTo(rate * (f.lastTime_s() - armed_s - 1.5), within(1e-9));
  }

  @Test
  void aDelayedStartGivesTheSameSpecimenAndPeakAsOneThatStartsAtOnce() {
    SimulatedFrame auto = SimulatedFrame.builder().scenario(Scenario.PANEL_FOAM).seed(4)
        .rateHz(80).build();
    SimulatedFrame f = waiting(0.5);
    run(f, 3);
    f.operatorStarts();
    while (!f.truth().broken()) {
      f.next();
    }
    while (!auto.truth().broken()) {
      auto.next();
    }
    assertThat(f.truth().specimen()).isEqualTo(auto.truth().specimen());
    // the same specimen at the same crosshead rate: the same peak, to the model's step size
    assertThat(f.truth().peakForce_N()).isCloseTo(auto.truth().peakForce_N(), within(0.05));
  }

  @Test
  void theNextSpecimenIsANewOneWaitingAndTheSeriesRepeatsForTheSameSeed() {
    SimulatedFrame a = waiting(0.2);
    SimulatedFrame b = waiting(0.2);
    SpecimenSummary first = a.truth().specimen();
    a.operatorStarts();
    run(a, 8);
    assertThat(a.truth().peakForce_N()).isGreaterThan(10);
    a.nextSpecimen();
    run(a, 5);
    assertThat(a.specimenNumber()).isEqualTo(1);
    assertThat(a.crossheadStarted()).isFalse();
    assertThat(a.lastCrosshead_mm()).isZero();
    assertThat(a.truth().peakForce_N()).as("truth starts afresh").isZero();
    assertThat(a.truth().specimen()).isNotEqualTo(first);
    b.nextSpecimen();
    assertThat(b.truth().specimen()).isEqualTo(a.truth().specimen());
  }

  @Test
  void theHandPressWaitsToo() {
    SimulatedFrame f = SimulatedFrame.builder().scenario(Scenario.PANEL_BALSA).seed(2).rateHz(80)
        .handPumped(2.0).waitForOperator(0).build();
    run(f, 10);
    assertThat(f.lastCrosshead_mm()).isZero();
    f.operatorStarts();
    run(f, 10);
    assertThat(f.lastCrosshead_mm()).isGreaterThan(1);
    assertThat(f.halt()).as("a hand press has nothing to halt").isFalse();
  }
}
