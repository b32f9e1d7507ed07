package org.loadstone.protocol;

import java.util.ArrayList;
import java.util.List;

/** Collects what the one-pass parser delivers, for tests. */
final class SampleList implements SampleFastPath.Sink {
  final List<RawSample> samples = new ArrayList<>();

  @Override
  public void sample(int seq, long us, int load, boolean hasPos, int pos) {
    samples.add(new RawSample(seq, us, load, hasPos, pos));
  }
}
