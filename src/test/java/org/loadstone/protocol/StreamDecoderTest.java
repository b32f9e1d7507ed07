package org.loadstone.protocol;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.util.List;
import org.junit.jupiter.api.Test;

class StreamDecoderTest {
  private final CollectingListener out = new CollectingListener();
  private final StreamDecoder d = new StreamDecoder(out, Encoding.TEXT);

  private static byte[] text(String body) {
    return new WireEncoder(Encoding.TEXT).body(body);
  }

  @Test
  void sampleSplitAcrossReadsOneByteAtATime() {
    byte[] w = text("S 41 1234567 -8388608 1500");
    for (byte b : w) {
      d.feed(new byte[] {b});
    }
    assertThat(out.samples).containsExactly(new RawSample(41, 1234567, -8388608, true, 1500));
  }

  @Test
  void sequenceGapCountsDropped() {
    d.feed(text("S 10 100 1"));
    d.feed(text("S 13 200 1"));
    assertThat(d.counters().dropped()).isEqualTo(2);
  }

  @Test
  void sequenceWrapIsNotADrop() {
    d.feed(text("S 65535 4294967295 1"));
    d.feed(text("S 0 12 1"));
    assertThat(d.counters().dropped()).isZero();
    assertThat(out.samples.get(1).deviceUs()).isEqualTo(12);
  }

  @Test
  void badChecksumCountedNotDelivered() {
    byte[] w = text("S 1 2 3");
    w[2] = '7';
    d.feed(w);
    assertThat(out.samples).isEmpty();
    assertThat(d.counters().checksumErrors()).isEqualTo(1);
    assertThat(d.counters().resyncs()).isZero();
  }

  @Test
  void garbagePrefixOnTheSameLineIsDroppedWithoutCost() {
    // PROTOCOL.md: only a candidate with nothing valid in it counts as a resync
    d.feed("#%$xyz".getBytes(StandardCharsets.US_ASCII));
    d.feed(text("S 5 6 7"));
    assertThat(out.samples).hasSize(1);
    assertThat(d.counters().resyncs()).isZero();
    d.feed("noise\n".getBytes(StandardCharsets.US_ASCII));
    assertThat(d.counters().resyncs()).isEqualTo(1);
  }

  @Test
  void leadingZerosAreNotASample() {
    d.feed(text("S 2 007 2"));
    assertThat(out.samples).isEmpty();
    assertThat(d.counters().resyncs()).isEqualTo(1);
  }

  @Test
  void identityParsedAndResetsSequence() {
    d.feed(text("S 100 1 1"));
    d.feed(text("I proto=1 fw=1.0.0 adc=hx711 rate=80 ch=2 cpm=400 motor=0 name=bench"));
    d.feed(text("S 0 5 1"));
    assertThat(d.counters().dropped()).isZero();
    DeviceMessage.Identity id = (DeviceMessage.Identity) out.messages.get(0);
    assertThat(id.protocol()).isEqualTo(1);
    assertThat(id.supported()).isTrue();
    assertThat(id.rateHz()).isEqualTo(80);
    assertThat(id.channels()).isEqualTo(2);
    assertThat(id.countsPerMm()).isEqualTo(400);
    assertThat(id.name()).isEqualTo("bench");
  }

  @Test
  void switchesToBinaryAfterModeAck() {
    d.feed(text("A MODE binary"));
    byte[] buf = new byte[64];
    int n = new WireEncoder(Encoding.BINARY).sample(buf, 0, 7, 99, -3, false, 0);
    d.feed(buf, 0, n);
    assertThat(d.following()).contains(Encoding.BINARY);
    assertThat(out.samples).containsExactly(new RawSample(7, 99, -3, false, 0));
  }

  @Test
  void unknownTagWithValidCrcIsSkippedAndCounted() {
    d.feed(text("Q 1 2 3"));
    d.feed(text("S 1 2 3"));
    assertThat(d.counters().unknown()).isEqualTo(1);
    assertThat(out.samples).hasSize(1);
  }

  @Test
  void messagesInBinaryFrames() {
    WireEncoder b = new WireEncoder(Encoding.BINARY);
    d.feed(b.body("T streaming"));
    d.feed(b.body("N RATE unsupported 40"));
    assertThat(out.messages)
        .containsExactly(
            new DeviceMessage.Status("streaming", ""),
            new DeviceMessage.Refusal("RATE", "unsupported", "40"));
  }

  @Test
  void hostCommandParsing() {
    assertThat(HostCommand.parse("rate 80"))
        .isEqualTo(new HostCommand.Parsed.Accepted(HostCommand.rate(80)));
    String wire = new String(HostCommand.ping("k7").toWire(), StandardCharsets.US_ASCII).trim();
    assertThat(HostCommand.parse(wire))
        .isEqualTo(new HostCommand.Parsed.Accepted(HostCommand.ping("k7")));
    assertThat(HostCommand.parse("START ~0000"))
        .isEqualTo(new HostCommand.Parsed.Rejected("START", "checksum"));
    assertThat(HostCommand.parse("FLY"))
        .isEqualTo(new HostCommand.Parsed.Rejected("FLY", "bad-command"));
    assertThat(HostCommand.parse("RATE fast"))
        .isEqualTo(new HostCommand.Parsed.Rejected("RATE", "bad-arg"));
    assertThat(List.of(HostCommand.Verb.values())).hasSize(8); // LIGHT: the sync light for video
  }
}
