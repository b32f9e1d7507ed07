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


  /**
   * Frames are read with the COBS codes of the frame before when the same codes stand at the same
   * places. Two frames alike but for their last CRC byte, zero in the second, so that only the
   * codes in the last bytes differ: both must be taken, with their own values.
   */
  @Test
  void framesWhoseZerosMoveAreReadWithTheirOwnCodes() {
    WireEncoder bin = new WireEncoder(Encoding.BINARY);
    byte[] a = null;
    byte[] z = null;
    RawSample sa = null;
    RawSample sz = null;
    byte[] f = new byte[WireEncoder.MAX_SAMPLE_BYTES];
    byte[] payload = new byte[StreamDecoder.MAX_CANDIDATE];
    for (int pos = 0x01010101; a == null || z == null; pos++) {
      if ((pos & 0xFF) == 0 || (pos & 0xFF00) == 0 || (pos & 0xFF0000) == 0) {
        continue;
      }
      RawSample s = new RawSample(7, 300, 5, true, pos); // zeros in time and load
      int n = bin.sample(f, 0, s);
      int p = Cobs.decode(f, 0, n - 1, payload);
      if (payload[p - 2] != 0) {
        continue; // both frames have a zero high CRC byte
      }
      if (payload[p - 1] == 0 && z == null) {
        z = java.util.Arrays.copyOf(f, n);
        sz = s;
      } else if (payload[p - 1] != 0 && a == null) {
        a = java.util.Arrays.copyOf(f, n);
        sa = s;
      }
    }
    SampleFastPath fast = new SampleFastPath();
    for (byte[] frame : List.of(a, z, a, z)) {
      byte[] buf = java.util.Arrays.copyOf(frame, frame.length + SampleFastPath.SLACK);
      SampleList got = new SampleList();
      assertThat(fast.binaryRun(buf, 0, frame.length, true, got)).isEqualTo(frame.length);
      assertThat(got.samples).containsExactly(frame == a ? sa : sz);
    }
  }
}
