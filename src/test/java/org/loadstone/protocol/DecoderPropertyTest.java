package org.loadstone.protocol;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayOutputStream;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.From;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.Size;

/** Round trips and garbage resistance, fed in random chunk sizes as a serial port delivers. */
class DecoderPropertyTest {

  @Provide
  Arbitrary<RawSample> samples() {
    Arbitrary<Integer> seq = Arbitraries.integers().between(0, 0xFFFF);
    Arbitrary<Long> us = Arbitraries.longs().between(0, 0xFFFF_FFFFL);
    Arbitrary<Integer> load = Arbitraries.integers();
    Arbitrary<Boolean> hasPos = Arbitraries.of(true, false);
    Arbitrary<Integer> pos = Arbitraries.integers();
    return Combinators.combine(seq, us, load, hasPos, pos)
        .as((s, t, l, h, p) -> new RawSample(s, t, l, h, h ? p : 0));
  }

  @Property(tries = 300, seed = "424242")
  void roundTripBothEncodings(
      @ForAll @Size(min = 1, max = 60) List<@From("samples") RawSample> in,
      @ForAll boolean binary,
      @ForAll @IntRange(min = 1, max = 40) int chunk) {
    Encoding enc = binary ? Encoding.BINARY : Encoding.TEXT;
    byte[] wire = encode(in, enc);
    CollectingListener out = new CollectingListener();
    StreamDecoder d = new StreamDecoder(out, enc);
    feedChunked(d, wire, chunk);
    assertThat(out.samples).containsExactlyElementsOf(in);
    DecoderCounters c = d.counters();
    assertThat(c.checksumErrors()).isZero();
    assertThat(c.resyncs()).isZero();
  }

  @Property(tries = 300, seed = "777")
  void garbageNeverMakesAWrongRecordAndIntactOnesAfterItSurvive(
      @ForAll @Size(min = 2, max = 40) List<@From("samples") RawSample> in,
      @ForAll boolean binary,
      @ForAll @Size(min = 1, max = 80) byte[] garbage,
      @ForAll @IntRange(min = 0, max = 39) int insertBefore,
      @ForAll @IntRange(min = 1, max = 17) int chunk) {
    Encoding enc = binary ? Encoding.BINARY : Encoding.TEXT;
    int at = Math.min(insertBefore, in.size() - 1);
    ByteArrayOutputStream wire = new ByteArrayOutputStream();
    WireEncoder e = new WireEncoder(enc);
    byte[] tmp = new byte[WireEncoder.MAX_SAMPLE_BYTES];
    for (int i = 0; i < in.size(); i++) {
      if (i == at) {
        wire.writeBytes(garbage);
      }
      int n = e.sample(tmp, 0, in.get(i));
      wire.write(tmp, 0, n);
    }
    CollectingListener out = new CollectingListener();
    StreamDecoder d = new StreamDecoder(out, enc);
    feedChunked(d, wire.toByteArray(), chunk);
    // nothing wrong: every delivered sample is one that was sent, in order
    List<RawSample> sent = new ArrayList<>(in);
    int cursor = 0;
    for (RawSample s : out.samples) {
      int found = sent.subList(cursor, sent.size()).indexOf(s);
      assertThat(found).as("decoded sample %s was never sent (or out of order)", s).isNotNegative();
      cursor += found + 1;
    }
    // every intact record after the garbage (all of at..end) is recovered
    assertThat(out.samples).containsSubsequence(sent.subList(at, sent.size()));
  }

  @Property(tries = 200, seed = "99")
  void randomBytesNeverThrow(@ForAll @Size(max = 3000) byte[] noise) {
    StreamDecoder d = new StreamDecoder(new CollectingListener());
    d.feed(noise);
    assertThat(d.counters().bytes()).isEqualTo(noise.length);
  }

  static byte[] encode(List<RawSample> in, Encoding enc) {
    ByteArrayOutputStream wire = new ByteArrayOutputStream();
    WireEncoder e = new WireEncoder(enc);
    byte[] tmp = new byte[WireEncoder.MAX_SAMPLE_BYTES];
    for (RawSample s : in) {
      int n = e.sample(tmp, 0, s);
      wire.write(tmp, 0, n);
    }
    return wire.toByteArray();
  }

  static void feedChunked(StreamDecoder d, byte[] wire, int maxChunk) {
    Random r = new Random(maxChunk);
    int i = 0;
    while (i < wire.length) {
      int n = Math.min(wire.length - i, 1 + r.nextInt(maxChunk));
      d.feed(wire, i, n);
      i += n;
    }
  }
}
