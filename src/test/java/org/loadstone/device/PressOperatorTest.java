package org.loadstone.device;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.loadstone.sim.SimulatedFrame;

/** The program stands in for the operator's hands on the simulated press only. */
class PressOperatorTest {
  @Test
  void armingStartsTheWaitingPressAndASecondArmingMountsANewSpecimenFirst() {
    SimulatedFrame frame = new SimSetup("panel-foam", 3, 80, false, 1, 0.5).buildFrame();
    PressOperator op = PressOperator.forTransport(new SimTransport(new FrameSampleSource(frame)));
    assertThat(op.automatic()).isTrue();
    frame.next();
    assertThat(frame.crossheadStarted()).isFalse();
    op.runArmed();
    assertThat(frame.crossheadStarted()).isTrue();
    assertThat(frame.specimenNumber()).isZero();
    op.runArmed(); // the next run: the tested specimen is taken out, a new one loaded
    assertThat(frame.specimenNumber()).isEqualTo(1);
    assertThat(frame.crossheadStarted()).isTrue();
    op.nextSpecimen();
    assertThat(frame.specimenNumber()).isEqualTo(2);
    assertThat(frame.crossheadStarted()).isFalse();
  }

  @Test
  void aPressThatStartsByItselfOrDeadWeightsAreLeftAlone() {
    SimulatedFrame auto = new SimSetup("panel-foam", 3, 80, false, 1, Double.NaN).buildFrame();
    PressOperator op = PressOperator.forTransport(new SimTransport(new FrameSampleSource(auto)));
    op.runArmed();
    op.nextSpecimen();
    assertThat(auto.specimenNumber()).isZero();
    SimulatedFrame dw = new SimSetup("dead-weight", 3, 80, false, 1).buildFrame();
    PressOperator.forTransport(new SimTransport(new FrameSampleSource(dw))).runArmed();
    assertThat(dw.crossheadStarted()).isFalse();
    assertThat(PressOperator.person().automatic()).isFalse();
  }
}
