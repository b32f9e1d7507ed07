package org.loadstone.protocol;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayOutputStream;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import org.junit.jupiter.api.Test;

/**
 * The one-pass sample parser must decide exactly as the general path. The reference is a decoder
 * that applies the general rules only ({@link StreamDecoder#generalRulesOnly}); the same bytes
 * fed whole, and in random chunks that cut records, go through the one-pass parser wherever a
 * record starts at a boundary. Records, order and every counter must agree.
 */
class FastPathEquivalenceTest {

  /** Field spellings: canonical, edge of range, and ones the protocol forbids. */
  private static final String[] FIELDS = {
    "0", "7", "65535", "65536", "4294967295", "4294967296", "2147483647", "2147483648",
    "-2147483648", "-2147483649", "-1", "-0", "007", "00", "", "-", "+5", "12345678901",
    "99999999", "123456789", "1234567890", "9999999999", "1a", " ", "~"
  };

  @Property(tries = 400, seed = "31337")
  void wholeFeedDecidesAsByteByByteFeed(
      @ForAll("seeds") long seed, @ForAll @IntRange(min = 1, max = 60) int records) {
    byte[] wire = stream(new Random(seed), records);
    assertSameDecisions(wire);
  }

  @net.jqwik.api.Provide
  net.jqwik.api.Arbitrary<Long> seeds() {
    return net.jqwik.api.Arbitraries.longs();
  }

  @Test
  void rejectedContentWithAValidChecksumIsNotASample() {
    // Every body below carries a correct CRC, so only its content can make it fail
    // (firmware-protocol/PROTOCOL.md, "Valid CRC, bad content").
    for (String body : List.of("S 1 2", "S 1 2 3 4 5", "S 007 2 3", "S -0 2 3", "S 65536 2 3",
        "S 1 4294967296 3", "S 1 2 2147483648", "S 1 2 3 -2147483649", "S 1  2 3", "S -1 2 3",
        "S 1 2 12345678901", "S 1 2 +3")) {
      CollectingListener out = new CollectingListener();
      StreamDecoder d = new StreamDecoder(out, Encoding.TEXT);
      d.feed(line(body, true, "\n"));
      assertThat(out.samples).as(body).isEmpty();
      assertThat(d.counters().resyncs()).as(body).isEqualTo(1);
    }
  }

  @Test
  void lowerCaseChecksumAndCrLfAreAccepted() {
    CollectingListener out = new CollectingListener();
    StreamDecoder d = new StreamDecoder(out, Encoding.TEXT);
    byte[] a = line("S 1 4294967295 -2147483648 2147483647", false, "\r\n");
    byte[] b = line("S 2 1234567890 5", true, "\n");
    byte[] both = new byte[a.length + b.length];
    System.arraycopy(a, 0, both, 0, a.length);
    System.arraycopy(b, 0, both, a.length, b.length);
    d.feed(both);
    assertThat(out.samples).containsExactly(
        new RawSample(1, 4294967295L, Integer.MIN_VALUE, true, Integer.MAX_VALUE),
        new RawSample(2, 1234567890L, 5, false, 0));
  }

  /**
   * An LF inside a binary frame also ends a text candidate. Whole frames with an LF are taken by
   * the one-pass parser while the decoder follows binary, unless a text record could end there:
   * this frame carries a complete text record ({@code Q ~XXXX}, an unknown tag with its CRC) in
   * its time and load bytes, which the general rules find and follow.
   */
  @Test
  void textRecordInsideABinaryFrameIsFoundAsTheGeneralRulesFindIt() {
    byte[] q = line("Q", true, "\n"); // 8 bytes: Q, space, ~, four hex digits, LF
    long us = (q[0] & 0xFF) | (q[1] & 0xFF) << 8 | (q[2] & 0xFF) << 16 | (long) (q[3] & 0xFF) << 24;
    int load = (q[4] & 0xFF) | (q[5] & 0xFF) << 8 | (q[6] & 0xFF) << 16 | (q[7] & 0xFF) << 24;
    WireEncoder bin = new WireEncoder(Encoding.BINARY);
    byte[] tmp = new byte[WireEncoder.MAX_SAMPLE_BYTES];
    ByteArrayOutputStream wire = new ByteArrayOutputStream();
    for (int i = 0; i < 3; i++) {
      wire.write(tmp, 0, bin.sample(tmp, 0, i, 1000L * i, 5000, true, 7));
    }
    wire.write(tmp, 0, bin.sample(tmp, 0, 3, us, load, true, 7)); // the text record inside
    wire.write(tmp, 0, bin.sample(tmp, 0, 4, 0x0A0A0A0AL, 0x0A0A0A0A, true, 0x0A)); // LFs only
    for (int i = 5; i < 8; i++) {
      wire.write(tmp, 0, bin.sample(tmp, 0, i, 1000L * i, 5000, true, 7));
    }
    byte[] all = wire.toByteArray();
    assertSameDecisions(all);
    CollectingListener out = new CollectingListener();
    StreamDecoder d = new StreamDecoder(out);
    d.feed(all);
    assertThat(d.counters().unknown()).isEqualTo(1);
    assertThat(out.samples).extracting(RawSample::seq).doesNotContain(3).contains(4, 5, 6, 7);
  }

  private static void assertSameDecisions(byte[] wire) {
    assertSameDecisions(wire, null);
  }

  /**
   * The same bytes fed whole and in random chunks give the records and counters of the general
   * rules, for a decoder starting in {@code start}.
   */
  static void assertSameDecisions(byte[] wire, Encoding start) {
    // the reference: the general rules only, fed one byte at a time
    CollectingListener reference = new CollectingListener();
    StreamDecoder r = StreamDecoder.generalRulesOnly(reference, start);
    for (int i = 0; i < wire.length; i++) {
      r.feed(wire, i, 1);
    }
    // the decoder as used: fed whole, and in random chunks (records cut at the chunk ends)
    CollectingListener whole = new CollectingListener();
    StreamDecoder w = new StreamDecoder(whole, start);
    w.feed(wire);
    assertThat(whole.all).containsExactlyElementsOf(reference.all);
    assertThat(w.counters()).isEqualTo(r.counters());
    CollectingListener chunked = new CollectingListener();
    StreamDecoder c = new StreamDecoder(chunked, start);
    Random sizes = new Random(wire.length);
    for (int i = 0; i < wire.length; ) {
      int n = Math.min(wire.length - i, 1 + sizes.nextInt(40));
      c.feed(wire, i, n);
      i += n;
    }
    assertThat(chunked.all).containsExactlyElementsOf(reference.all);
    assertThat(c.counters()).isEqualTo(r.counters());
  }

  /** A mix of valid samples (both encodings), near-valid text lines, damaged frames and noise. */
  static byte[] stream(Random r, int records) {
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    WireEncoder text = new WireEncoder(Encoding.TEXT);
    WireEncoder bin = new WireEncoder(Encoding.BINARY);
    byte[] tmp = new byte[WireEncoder.MAX_SAMPLE_BYTES];
    for (int i = 0; i < records; i++) {
      int kind = r.nextInt(6);
      int seq = r.nextInt(0x10000);
      long us = r.nextLong() & 0xFFFF_FFFFL;
      int load = r.nextInt();
      boolean hasPos = r.nextBoolean();
      int pos = hasPos ? r.nextInt() : 0;
      if (kind <= 1) {
        int n = (kind == 0 ? text : bin).sample(tmp, 0, seq, us, load, hasPos, pos);
        if (r.nextInt(4) == 0) {
          tmp[r.nextInt(n)] ^= (byte) (1 << r.nextInt(8)); // one flipped bit
        }
        out.write(tmp, 0, n);
      } else if (kind <= 3) {
        StringBuilder body = new StringBuilder("S");
        int fields = 2 + r.nextInt(4);
        for (int f = 0; f < fields; f++) {
          body.append(' ').append(r.nextInt(3) == 0
              ? FIELDS[r.nextInt(FIELDS.length)] : Long.toString(r.nextInt(100_000)));
        }
        String[] ends = {"\n", "\r\n", "\r\r\n", ""};
        out.writeBytes(line(body.toString(), r.nextBoolean(), ends[r.nextInt(ends.length)]));
      } else if (kind == 4) {
        out.writeBytes(line("T streaming", true, "\n"));
      } else {
        byte[] noise = new byte[r.nextInt(12)];
        r.nextBytes(noise);
        out.writeBytes(noise);
      }
    }
    return out.toByteArray();
  }

  /** A text line with the correct CRC of {@code body}. */
  static byte[] line(String body, boolean upperHex, String end) {
    byte[] b = body.getBytes(StandardCharsets.US_ASCII);
    String hex = String.format(upperHex ? "%04X" : "%04x", Crc16.compute(b, 0, b.length));
    return (body + " ~" + hex + end).getBytes(StandardCharsets.US_ASCII);
  }
}
