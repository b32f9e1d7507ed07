package org.loadstone.device;

import org.loadstone.sim.SimulatedFrame;
import org.loadstone.units.Precondition;

/** Adapts the simulated frame's physical model to the {@link SampleSource} a transport streams. */
public final class FrameSampleSource implements SampleSource {
  private final SimulatedFrame frame;
  private SampleSlot target;
  private final org.loadstone.sim.SampleSink sink = (seq, us, load, pos) -> {
    target.seq = seq;
    target.deviceUs = us;
    target.counts = load;
    target.positionCounts = pos;
  };

  /** @param frame the model to sample; this source drives it from now on */
  public FrameSampleSource(SimulatedFrame frame) {
    this.frame = Precondition.notNull(frame, "frame");
  }

  /** @return the model, e.g. for its ground truth */
  public SimulatedFrame frame() {
    return frame;
  }

  @Override
  public double rateHz() {
    return frame.info().rateHz();
  }

  @Override
  public boolean hasPosition() {
    return frame.info().channels() >= 2;
  }

  @Override
  public double countsPerMm() {
    return frame.info().positionCountsPerMm();
  }

  @Override
  public String adcKind() {
    return frame.info().adcKind();
  }

  @Override
  public String cellFields() {
    org.loadstone.sim.FrameInfo i = frame.info();
    return "cell=" + i.cellId() + " cap=" + SimTransport.trim(i.cellCapacity_N())
        + " cpn=" + SimTransport.trim(i.cellCountsPerN());
  }

  @Override
  public void next(SampleSlot slot) {
    target = slot;
    frame.next(sink);
  }

  @Override
  public void halt() {
    frame.halt();
  }

  @Override
  public boolean setRateHz(int hz) {
    if (!SimulatedFrame.isSupportedRate(hz)) {
      return false;
    }
    frame.setRateHz(hz);
    return true;
  }
}
