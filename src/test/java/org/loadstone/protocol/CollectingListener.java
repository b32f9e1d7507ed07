package org.loadstone.protocol;

import java.util.ArrayList;
import java.util.List;

/** Test listener that keeps every record. */
final class CollectingListener implements DecodeListener {
  final List<RawSample> samples = new ArrayList<>();
  final List<DeviceMessage> messages = new ArrayList<>();
  final List<Object> all = new ArrayList<>();

  @Override
  public void onSample(int seq, long deviceUs, int counts, boolean hasPosition, int positionCounts) {
    RawSample s = new RawSample(seq, deviceUs, counts, hasPosition, positionCounts);
    samples.add(s);
    all.add(s);
  }

  @Override
  public void onMessage(DeviceMessage message) {
    messages.add(message);
    all.add(message);
  }
}
