package org.loadstone.protocol;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The one-pass parser must take every valid sample it is meant for (if it refused them, the
 * general path would still decode them, only slower, so the differential test cannot see it).
 */
class SampleFastPathTest {

  @Test
  void takesEveryValidSampleOfBothEncodings() {
    Random r = new Random(2026);
    SampleFastPath fast = new SampleFastPath();
    byte[] buf = new byte[WireEncoder.MAX_SAMPLE_BYTES + SampleFastPath.SLACK];
    int binaryTried = 0;
    int lfFrames = 0;
    for (int i = 0; i < 20_000; i++) {
      boolean hasPos = r.nextBoolean();
      // small values put zero bytes in the frame, so COBS codes land all over it
      int seq = r.nextBoolean() ? r.nextInt(0x10000) : r.nextInt(3);
      long us = r.nextBoolean() ? r.nextLong() & 0xFFFF_FFFFL : r.nextInt(300);
      int load = r.nextBoolean() ? r.nextInt() : r.nextInt(600) - 300;
      int pos = hasPos ? (r.nextBoolean() ? r.nextInt() : r.nextInt(3)) : 0;
      RawSample s = new RawSample(seq, us, load, hasPos, pos);

      int n = new WireEncoder(Encoding.TEXT).sample(buf, 0, s);
      SampleList got = new SampleList();
      assertThat(fast.textRun(buf, 0, n, got)).as("text %s", s).isEqualTo(n);
      assertThat(got.samples).containsExactly(s);

      n = new WireEncoder(Encoding.BINARY).sample(buf, 0, s);
      boolean lfInside = false;
      for (int k = 0; k < n; k++) {
        lfInside |= buf[k] == '\n';
      }
      got = new SampleList();
      int end = fast.binaryRun(buf, 0, n, false, got);
      if (lfInside) {
        assertThat(end).as("frame with an LF, text candidate to be looked at").isEqualTo(0);
        lfFrames++;
        // following binary, with the text candidate starting at the frame: a frame with no "~"
        // before its LF cannot end a text record, so it is taken here
        boolean tilde = false;
        for (int k = 0; k < n; k++) {
          tilde |= buf[k] == '\n' && ((k >= 5 && buf[k - 5] == '~')
              || (k >= 6 && buf[k - 1] == '\r' && buf[k - 6] == '~'));
        }
        assertThat(fast.binaryRun(buf, 0, n, true, got)).as("binary %s", s).isEqualTo(tilde ? 0 : n);
        assertThat(got.samples).isEqualTo(tilde ? List.of() : List.of(s));
      } else {
        binaryTried++;
        assertThat(end).as("binary %s", s).isEqualTo(n);
        assertThat(got.samples).containsExactly(s);
      }
    }
    assertThat(binaryTried).isGreaterThan(15_000);
    assertThat(lfFrames).isGreaterThan(500);
  }
}
