package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.loadstone.protocol.DecoderCounters;

/** What {@code monitor} says when no sample came: nothing at all, or bytes that are not samples. */
class MonitorSilenceTest {
  @Test
  void nothingAtAllAndBytesThatAreNotSamplesGetTheirOwnFixes() {
    String none = MonitorCommand.silence("/dev/ttyACM0", new DecoderCounters(0, 0, 0, 0, 0, 0, 0));
    assertThat(none).contains("port /dev/ttyACM0 sent nothing", "powered", "--reset-wait-ms");
    String junk = MonitorCommand.silence("/dev/ttyACM0",
        new DecoderCounters(0, 0, 3, 12, 0, 0, 3200));
    assertThat(junk).contains("sent 3200 bytes but none could be read as samples",
        "12 resyncs, 3 checksum errors", "--baud");
  }
}
