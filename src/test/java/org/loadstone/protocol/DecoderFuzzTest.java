package org.loadstone.protocol;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayOutputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.BitSet;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.regex.Pattern;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import org.loadstone.units.Fuzz;

/**
 * The decoder against damaged streams: records of both encodings damaged by bit flips,
 * substituted, inserted and deleted bytes and bursts, fed in random chunks as a serial port
 * delivers them. A reference written here from PROTOCOL.md alone (a bitwise CRC-16/CCITT-FALSE,
 * a plain COBS encoder, the text line grammar) is the oracle:
 *
 * <ul>
 *   <li>no damaged sample is accepted: every sample delivered is either one that was sent, in
 *       order, or one whose complete valid record the damaged bytes really hold (a chance CRC
 *       match the protocol cannot tell from a real record);
 *   <li>no intact sample is lost: every record whose bytes were not touched is delivered;
 *   <li>nothing escapes the decoder, whatever the bytes.
 * </ul>
 *
 * <p>Tries are modest for CI; {@code -Dloadstone.fuzz.scale=N} multiplies the streams per try.
 */
class DecoderFuzzTest {
  private static final int RECORDS = 80;

  /** What was done to a stream: its bytes and which records were touched. */
  private record Damaged(byte[] bytes, BitSet touched) {}

  @Property(tries = 150, seed = "140641")
  void damagedStreamsLoseNoIntactSampleAndAcceptNoDamagedOne(@ForAll long seed,
      @ForAll boolean binary, @ForAll @IntRange(min = 0, max = 4) int mode,
      @ForAll @IntRange(min = 1, max = 64) int chunk) {
    for (int k = 0; k < Fuzz.SCALE; k++) {
      Random r = new Random(seed + k);
      List<RawSample> sent = samples(r);
      List<byte[]> records = new ArrayList<>();
      WireEncoder enc = new WireEncoder(binary ? Encoding.BINARY : Encoding.TEXT);
      byte[] tmp = new byte[WireEncoder.MAX_SAMPLE_BYTES];
      for (RawSample s : sent) {
        records.add(Arrays.copyOf(tmp, enc.sample(tmp, 0, s)));
      }
      Damaged d = damage(records, mode, r);
      CollectingListener out = new CollectingListener();
      StreamDecoder dec = new StreamDecoder(out, binary ? Encoding.BINARY : Encoding.TEXT);
      DecoderPropertyTest.feedChunked(dec, d.bytes(), chunk);

      String wire = new String(d.bytes(), StandardCharsets.ISO_8859_1);
      int from = 0;
      List<Integer> delivered = new ArrayList<>();
      for (RawSample s : out.samples) {
        int at = sent.subList(from, sent.size()).indexOf(s);
        if (at >= 0) {
          delivered.add(from + at);
          from += at + 1;
        } else {
          assertThat(holdsValidRecord(wire, s, binary))
              .as("sample %s accepted, but no valid record of it is in the damaged bytes", s)
              .isTrue();
        }
      }
      for (int i = 0; i < sent.size(); i++) {
        if (!d.touched().get(i)) {
          assertThat(delivered).as("intact record %d (%s), mode %d", i, sent.get(i), mode)
              .contains(i);
        }
      }
    }
  }

  private static List<RawSample> samples(Random r) {
    List<RawSample> out = new ArrayList<>();
    int seq = r.nextInt(65536);
    long us = r.nextLong() & 0xFFFF_FFFFL;
    boolean pos = r.nextBoolean();
    for (int i = 0; i < RECORDS; i++) {
      out.add(new RawSample((seq + i) & 0xFFFF, (us + 1000L * i) & 0xFFFF_FFFFL,
          r.nextInt(1 << 24) - (1 << 23), pos, pos ? r.nextInt(200_000) - 100_000 : 0));
    }
    return out;
  }

  /**
   * Damages about one record in eight, each in one mode: 0 a flipped bit, 1 a substituted byte,
   * 2 inserted bytes, 3 deleted bytes, 4 a burst of noise that may run into the next records.
   */
  private static Damaged damage(List<byte[]> records, int mode, Random r) {
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    BitSet touched = new BitSet();
    int i = 0;
    while (i < records.size()) {
      byte[] rec = records.get(i).clone();
      if (r.nextInt(8) != 0) {
        out.writeBytes(rec);
        i++;
        continue;
      }
      int at = r.nextInt(rec.length);
      touched.set(i);
      switch (mode) {
        case 0 -> rec[at] ^= (byte) (1 << r.nextInt(8));
        case 1 -> rec[at] = (byte) (rec[at] + 1 + r.nextInt(255));
        case 2 -> {
          byte[] ins = new byte[1 + r.nextInt(4)];
          r.nextBytes(ins);
          rec = Fuzz.splice(rec, at, 0, ins);
        }
        case 3 -> rec = Fuzz.splice(rec, at, Math.min(rec.length - at, 1 + r.nextInt(4)),
            new byte[0]);
        default -> {
          // a burst from here over up to 40 bytes, possibly into the following records
          int len = 1 + r.nextInt(40);
          ByteArrayOutputStream span = new ByteArrayOutputStream();
          span.writeBytes(rec);
          int j = i + 1;
          while (span.size() < at + len && j < records.size()) {
            span.writeBytes(records.get(j));
            touched.set(j);
            j++;
          }
          byte[] all = span.toByteArray();
          int end = Math.min(all.length, at + len);
          for (int b = at; b < end; b++) {
            all[b] = (byte) r.nextInt(256);
          }
          out.writeBytes(all);
          i = j;
          continue;
        }
      }
      out.writeBytes(rec);
      i++;
    }
    return new Damaged(out.toByteArray(), touched);
  }

  /** Whether the bytes hold a complete valid record of {@code s}, by the reference alone. */
  static boolean holdsValidRecord(String wire, RawSample s, boolean binary) {
    if (binary) {
      return wire.contains(new String(frame(s), StandardCharsets.ISO_8859_1));
    }
    String body = "S " + s.seq() + " " + s.deviceUs() + " " + s.counts()
        + (s.hasPosition() ? " " + s.positionCounts() : "");
    String crc = String.format(Locale.ROOT, "%04X", crc16(body.getBytes(StandardCharsets.US_ASCII)));
    return Pattern.compile(Pattern.quote(body + " ~") + "(?i:" + crc + ")\r?\n").matcher(wire)
        .find();
  }

  /** PROTOCOL.md, binary encoding: cobs(type, seq u16, time u32, load i32 [, pos i32], crc) 0. */
  static byte[] frame(RawSample s) {
    ByteArrayOutputStream p = new ByteArrayOutputStream();
    p.write(s.hasPosition() ? 0x02 : 0x01);
    le(p, s.seq(), 2);
    le(p, s.deviceUs(), 4);
    le(p, s.counts(), 4);
    if (s.hasPosition()) {
      le(p, s.positionCounts(), 4);
    }
    int crc = crc16(p.toByteArray());
    p.write(crc >>> 8);
    p.write(crc & 0xFF);
    byte[] payload = p.toByteArray();
    // COBS (Cheshire and Baker 1999): each block is its length + 1, then its non-zero bytes
    ByteArrayOutputStream f = new ByteArrayOutputStream();
    int start = 0;
    for (int i = 0; i <= payload.length; i++) {
      if (i == payload.length || payload[i] == 0) {
        f.write(i - start + 1);
        f.write(payload, start, i - start);
        start = i + 1;
      }
    }
    f.write(0);
    return f.toByteArray();
  }

  private static void le(ByteArrayOutputStream p, long v, int bytes) {
    for (int i = 0; i < bytes; i++) {
      p.write((int) (v >>> (8 * i)) & 0xFF);
    }
  }

  /** CRC-16/CCITT-FALSE bit by bit: poly 0x1021, init 0xFFFF, no reflection, no final XOR. */
  static int crc16(byte[] b) {
    int crc = 0xFFFF;
    for (byte x : b) {
      crc ^= (x & 0xFF) << 8;
      for (int k = 0; k < 8; k++) {
        crc = (crc & 0x8000) != 0 ? (crc << 1) ^ 0x1021 : crc << 1;
        crc &= 0xFFFF;
      }
    }
    return crc;
  }

  @Property(tries = 5, seed = "140642")
  void theReferenceAgreesWithTheCatalogueAndTheEncoder(@ForAll long seed) {
    // CRC catalogue (Greg Cook), CRC-16/IBM-3740 a.k.a. CCITT-FALSE: check value 0x29B1
    assertThat(crc16("123456789".getBytes(StandardCharsets.US_ASCII))).isEqualTo(0x29B1);
    Random r = new Random(seed);
    WireEncoder bin = new WireEncoder(Encoding.BINARY);
    WireEncoder text = new WireEncoder(Encoding.TEXT);
    byte[] tmp = new byte[WireEncoder.MAX_SAMPLE_BYTES];
    for (RawSample s : samples(r)) {
      String b = new String(tmp, 0, bin.sample(tmp, 0, s), StandardCharsets.ISO_8859_1);
      assertThat(holdsValidRecord(b, s, true)).as("binary %s", s).isTrue();
      String t = new String(tmp, 0, text.sample(tmp, 0, s), StandardCharsets.ISO_8859_1);
      assertThat(holdsValidRecord(t, s, false)).as("text %s", s).isTrue();
    }
  }

  @Property(tries = 100, seed = "140643")
  void mutatedStreamsNeverThrow(@ForAll long seed, @ForAll boolean binary,
      @ForAll @IntRange(min = 1, max = 64) int chunk) {
    Random r = new Random(seed);
    WireEncoder enc = new WireEncoder(binary ? Encoding.BINARY : Encoding.TEXT);
    ByteArrayOutputStream wire = new ByteArrayOutputStream();
    byte[] tmp = new byte[WireEncoder.MAX_SAMPLE_BYTES];
    for (RawSample s : samples(r)) {
      wire.write(tmp, 0, enc.sample(tmp, 0, s));
    }
    for (int k = 0; k < Fuzz.SCALE; k++) {
      byte[] bad = Fuzz.mutate(wire.toByteArray(), seed + k);
      CollectingListener out = new CollectingListener();
      StreamDecoder d = new StreamDecoder(out);
      DecoderPropertyTest.feedChunked(d, bad, chunk);
      assertThat(d.counters().bytes()).isEqualTo(bad.length);
      String w = new String(bad, StandardCharsets.ISO_8859_1);
      for (RawSample s : out.samples) {
        assertThat(holdsValidRecord(w, s, true) || holdsValidRecord(w, s, false))
            .as("sample %s has no valid record in the bytes", s).isTrue();
      }
    }
  }
}
