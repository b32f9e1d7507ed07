package org.loadstone.protocol;

import static org.assertj.core.api.Assertions.assertThat;
import static org.loadstone.protocol.FastPathEquivalenceTest.line;

import java.io.ByteArrayOutputStream;
import java.util.List;
import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import org.junit.jupiter.api.Test;

/**
 * Lines read by the shape of the line before ({@link TextLayout}) must be decided exactly as the
 * general rules decide them. The reference is a decoder that applies the general rules only (see
 * {@link FastPathEquivalenceTest}).
 */
class TextLayoutTest {

  /** Bytes a damaged or hostile line might hold where a digit or separator should be. */
  private static final byte[] REPLACEMENTS = {
    '0', '1', '5', '9', ' ', '-', '+', '~', 'S', 'a', 'A', 'f', 'F', 'g', '/', ':', '\r', '\n', 0,
    (byte) 0x80, (byte) 0xB0, (byte) 0xB5, (byte) 0xA0, (byte) 0xFF, 0x10, 0x19, 0x7F
  };

  /** Catches a shape that refuses valid lines, which the general path would hide (only slower). */
  @Test
  void linesOfTheLearntShapeAreReadByIt() {
    Random r = new Random(7);
    TextLayout layout = new TextLayout();
    byte[] first = line("S 12345 1234567 -12345 678", true, "\n");
    byte[] buf = new byte[64 + 64 + SampleFastPath.SLACK];
    r.nextBytes(buf); // whatever precedes a line must not count in its CRC
    System.arraycopy(first, 0, buf, 64, first.length);
    layout.learn(buf, 64, 64 + first.length);
    for (int i = 0; i < 2000; i++) {
      int seq = 10_000 + r.nextInt(55_536);
      long us = 1_000_000 + r.nextInt(9_000_000);
      int load = -(10_000 + r.nextInt(90_000));
      int pos = 100 + r.nextInt(900);
      byte[] next = line("S " + seq + " " + us + " " + load + " " + pos, r.nextBoolean(), "\n");
      System.arraycopy(next, 0, buf, 64, next.length);
      SampleList out = new SampleList();
      assertThat(layout.run(buf, 64, 64 + next.length, out)).isEqualTo(64 + next.length);
      assertThat(out.samples).containsExactly(new RawSample(seq, us, load, true, pos));
    }
    byte[] longer = line("S 12345 12345678 -12345 678", true, "\n");
    System.arraycopy(longer, 0, buf, 64, longer.length);
    assertThat(layout.run(buf, 64, 64 + longer.length, new SampleList())).isEqualTo(64);
    assertThat(layout.refused()).as("does not fit: the one-pass parser decides").isFalse();
  }

  /** The same for random shapes: ten-digit fields, three or four fields, CR LF, extreme values. */
  @Test
  void linesOfAnyLearntShapeAreReadByIt() {
    Random r = new Random(11);
    byte[] buf = new byte[64 + 64 + SampleFastPath.SLACK];
    for (int shapes = 0; shapes < 300; shapes++) {
      String[] shape = randomShape(r);
      String end = r.nextBoolean() ? "\r\n" : "\n";
      TextLayout layout = new TextLayout();
      for (int i = 0; i < 20; i++) {
        r.nextBytes(buf);
        String body = sameShape(shape, r);
        byte[] next = line(body, true, end);
        System.arraycopy(next, 0, buf, 64, next.length);
        if (i == 0) {
          layout.learn(buf, 64, 64 + next.length);
          continue;
        }
        SampleList out = new SampleList();
        assertThat(layout.run(buf, 64, 64 + next.length, out)).as(body).isEqualTo(64 + next.length);
        String[] f = body.split(" ");
        assertThat(out.samples).as(body).containsExactly(new RawSample(Integer.parseInt(f[1]), Long.parseLong(f[2]),
                Integer.parseInt(f[3]), f.length == 5, f.length == 5 ? Integer.parseInt(f[4]) : 0));
      }
    }
  }

  /** Extreme values the shape must still take. */
  @Test
  void edgeValuesInTheLearntShapeAreTaken() {
    List<String[]> pairs = List.of(
        new String[] {"S 65534 4294967294 -2147483647 -2147483647", "S 65535 4294967295 -2147483648 -2147483648"},
        new String[] {"S 1 1 2147483646 2147483646", "S 0 0 2147483647 2147483647"},
        new String[] {"S 1 2 -1 -9", "S 0 0 -9 -1"},
        new String[] {"S 10 1000000000 10 10", "S 99 9999999999 99 99"});
    byte[] buf = new byte[64 + 64 + SampleFastPath.SLACK];
    for (String[] p : pairs) {
      TextLayout layout = new TextLayout();
      byte[] first = line(p[0], true, "\n");
      System.arraycopy(first, 0, buf, 64, first.length);
      layout.learn(buf, 64, 64 + first.length);
      byte[] next = line(p[1], true, "\n");
      System.arraycopy(next, 0, buf, 64, next.length);
      boolean valid = !p[1].contains("9999999999");
      assertThat(layout.run(buf, 64, 64 + next.length, new SampleList())).as(p[1])
          .isEqualTo(valid ? 64 + next.length : 64);
      assertThat(layout.refused()).as(p[1]).isEqualTo(!valid);
    }
  }

  @Test
  void upperCaseChecksumDigitsAsTheFirmwareSendsThem() {
    // Reference: Java's own formatter, the same as the firmware's "%04X" (common practice).
    for (int crc = 0; crc <= 0xFFFF; crc++) {
      byte[] hex = String.format("%04X", crc).getBytes(java.nio.charset.StandardCharsets.US_ASCII);
      assertThat(TextLayout.hexDigits(crc)).isEqualTo(SampleFastPath.le32(
          java.util.Arrays.copyOf(hex, 4), 0));
    }
  }

  /** Out-of-range and non-canonical values in the shape of a valid line are not samples. */
  @Test
  void valuesBreakingTheRulesInTheSameShapeAreRefused() {
    List<String[]> pairs = List.of(
        new String[] {"S 65535 1 2 3", "S 65536 1 2 3"},
        new String[] {"S 12345 1 2 3", "S 01234 1 2 3"},
        new String[] {"S 1 4294967295 2 3", "S 1 4294967296 2 3"},
        new String[] {"S 1 4294967295 2 3", "S 1 9999999999 2 3"},
        new String[] {"S 1 2 -2147483648 3", "S 1 2 -2147483649 3"},
        new String[] {"S 1 2 2147483647 3", "S 1 2 2147483648 3"},
        new String[] {"S 1 2 3 -2147483648", "S 1 2 3 -2147483649"},
        new String[] {"S 1 2 3 2147483647", "S 1 2 3 2147483648"},
        new String[] {"S 1 2 -5 3", "S 1 2 -0 3"},
        new String[] {"S 1 2 3 -7", "S 1 2 3 -0"},
        new String[] {"S 1 22 3 4", "S 1 02 3 4"},
        new String[] {"S 1 2 33 4", "S 1 2 00 4"});
    for (String[] p : pairs) {
      ByteArrayOutputStream wire = new ByteArrayOutputStream();
      for (int i = 0; i < 4; i++) {
        wire.writeBytes(line(p[0], true, "\n"));
      }
      wire.writeBytes(line(p[1], true, "\n"));
      wire.writeBytes(line(p[0], true, "\n"));
      CollectingListener out = new CollectingListener();
      StreamDecoder d = new StreamDecoder(out, Encoding.TEXT);
      d.feed(wire.toByteArray());
      assertThat(out.samples).as(p[1]).hasSize(5);
      assertThat(d.counters().resyncs()).as(p[1]).isEqualTo(1);
      assertSameAsGeneralRules(wire.toByteArray());
    }
  }

  @Test
  void lowerCaseChecksumDigitsAreReadInTheLearntShape() {
    ByteArrayOutputStream wire = new ByteArrayOutputStream();
    for (int i = 0; i < 6; i++) {
      wire.writeBytes(line("S " + (100 + i) + " 5000 -777 12", i % 2 == 0, "\r\n"));
    }
    CollectingListener out = new CollectingListener();
    StreamDecoder d = new StreamDecoder(out, Encoding.TEXT);
    d.feed(wire.toByteArray());
    assertThat(out.samples).hasSize(6);
    assertThat(out.samples.get(5)).isEqualTo(new RawSample(105, 5000, -777, true, 12));
  }

  /**
   * Several lines of one shape (so the last ones are read by it, past the start of the buffer),
   * then one of the same shape with one byte replaced, with or without a matching CRC, then a
   * valid line: every record and counter as the general rules give them.
   */
  @Property(tries = 1500, seed = "424242")
  void anyReplacedByteIsDecidedAsTheGeneralRulesDecide(@ForAll long seed) {
    Random r = new Random(seed);
    String[] shape = randomShape(r);
    String end = r.nextInt(4) == 0 ? "\r\n" : "\n";
    ByteArrayOutputStream wire = new ByteArrayOutputStream();
    for (int i = 0; i < 3; i++) {
      wire.writeBytes(line(sameShape(shape, r), true, end));
    }
    String body = sameShape(shape, r);
    byte[] damaged = line(body, r.nextBoolean(), end);
    int at = r.nextInt(damaged.length);
    damaged[at] = REPLACEMENTS[r.nextInt(REPLACEMENTS.length)];
    if (r.nextBoolean() && at < body.length()) { // re-seal, so only the content can fail
      byte[] b = java.util.Arrays.copyOf(damaged, body.length());
      String hex = String.format("%04X", Crc16.compute(b, 0, b.length));
      byte[] h = hex.getBytes(java.nio.charset.StandardCharsets.US_ASCII);
      System.arraycopy(h, 0, damaged, body.length() + 2, 4);
    }
    wire.writeBytes(damaged);
    wire.writeBytes(line(sameShape(shape, r), true, end));
    assertSameAsGeneralRules(wire.toByteArray());
  }

  /** Field spellings of a valid line: digit counts and signs, with edge values mixed in. */
  private static String[] randomShape(Random r) {
    String[] f = new String[3 + r.nextInt(2)];
    f[0] = Integer.toString(r.nextInt(4) == 0 ? 65535 : r.nextInt(0x10000));
    f[1] = Long.toString(r.nextInt(4) == 0 ? 4294967295L : r.nextLong() & 0xFFFF_FFFFL >>> r.nextInt(32));
    for (int i = 2; i < f.length; i++) {
      int v = r.nextInt(4) == 0 ? (r.nextBoolean() ? Integer.MIN_VALUE : Integer.MAX_VALUE)
          : r.nextInt() >> r.nextInt(32);
      f[i] = Integer.toString(v);
    }
    return f;
  }

  /** A valid body whose fields have the digit counts and signs of {@code shape}. */
  private static String sameShape(String[] shape, Random r) {
    StringBuilder b = new StringBuilder("S");
    for (int i = 0; i < shape.length; i++) {
      String f = shape[i];
      boolean neg = f.startsWith("-");
      int k = f.length() - (neg ? 1 : 0);
      String v;
      do {
        StringBuilder d = new StringBuilder();
        d.append(k == 1 ? (char) ('0' + (neg ? 1 + r.nextInt(9) : r.nextInt(10)))
            : (char) ('1' + r.nextInt(9)));
        for (int j = 1; j < k; j++) {
          d.append((char) ('0' + r.nextInt(10)));
        }
        v = (neg ? "-" : "") + d;
      } while (!fits(i, v));
      b.append(' ').append(v);
    }
    return b.toString();
  }

  private static boolean fits(int field, String v) {
    long x = Long.parseLong(v);
    return switch (field) {
      case 0 -> x <= RawSample.SEQ_MAX;
      case 1 -> x <= RawSample.TIME_MAX_US;
      default -> x >= Integer.MIN_VALUE && x <= Integer.MAX_VALUE;
    };
  }

  private static void assertSameAsGeneralRules(byte[] wire) {
    FastPathEquivalenceTest.assertSameDecisions(wire, Encoding.TEXT);
  }
}
