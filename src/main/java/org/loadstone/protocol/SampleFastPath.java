package org.loadstone.protocol;

import java.lang.invoke.MethodHandles;
import java.lang.invoke.VarHandle;
import java.nio.ByteOrder;

/**
 * The decoder's hot path: one forward pass over a sample record that starts exactly at a record
 * boundary, text or binary. It accepts only a record that the general rules of {@link
 * StreamDecoder} would accept as the first valid record of its candidate, and it has no side
 * effects until it succeeds; on any doubt it returns -1 and the general byte-by-byte path decides.
 *
 * <p>Bytes are read eight at a time ({@link #LONGS}); the caller's buffer must hold at least
 * {@link #SLACK} bytes beyond the last byte it passes as {@code limit}. Those slack bytes may hold
 * anything: every accepted byte index is checked against {@code limit}.
 */
final class SampleFastPath {
  /** Bytes a buffer needs beyond its data for the word-wide reads. */
  static final int SLACK = 64;

  static final VarHandle LONGS =
      MethodHandles.byteArrayViewVarHandle(long[].class, ByteOrder.LITTLE_ENDIAN);
  static final long ONES = 0x0101010101010101L;
  static final long HIGHS = 0x8080808080808080L;
  static final long LFS = 0x0A0A0A0A0A0A0A0AL;
  private static final long ZEROS_ASCII = 0x3030303030303030L;

  /** Hex digit values by byte, -1 for a byte that is not a hex digit (either case). */
  private static final int[] HEX = new int[256];

  static {
    java.util.Arrays.fill(HEX, -1);
    for (int i = 0; i < 10; i++) {
      HEX['0' + i] = i;
    }
    for (int i = 0; i < 6; i++) {
      HEX['A' + i] = 10 + i;
      HEX['a' + i] = 10 + i;
    }
  }

  /** Where a successful parse leaves its values. Reused: the hot path allocates nothing. */
  static final class Fields {
    int seq;
    long us;
    int load;
    boolean hasPos;
    int pos;
  }

  private final long[] values = new long[4];
  private final TextLayout layout = new TextLayout();
  private final Fields slot = new Fields();

  /** Where the samples of a run go, in order. */
  interface Sink {
    void sample(int seq, long us, int load, boolean hasPos, int pos);
  }

  /** @return true when word {@code v} holds a 0x00 or an LF byte (the "has a zero byte" trick) */
  static boolean hasZeroOrLf(long v) {
    return zeroOrLfBytes(v) != 0;
  }

  /** Non-zero when word {@code v} holds a 0x00 or an LF byte (not exact about which bytes). */
  private static long zeroOrLfBytes(long v) {
    long lf = v ^ LFS;
    return (((v - ONES) & ~v) | ((lf - ONES) & ~lf)) & HIGHS;
  }

  /**
   * The number of leading (lowest-addressed) bytes of {@code w} that are decimal digits, 0…8. A
   * byte is not a digit when adding 0x46 or subtracting 0x30 sets its high bit; a carry or borrow
   * only ever reaches bytes above a non-digit, so the count is exact.
   */
  private static int digitRun(long w) {
    long notDigit = ((w + 0x4646464646464646L) | (w - ZEROS_ASCII)) & HIGHS;
    return Long.numberOfTrailingZeros(notDigit) >>> 3;
  }

  /**
   * The value of the first {@code k} (1…8) bytes of {@code w}, all decimal digits, first digit in
   * the lowest byte (Lemire's eight-digit SWAR conversion; the digits are shifted to the top so
   * the bytes below read as leading zeros).
   */
  static long digitsValue(long w, int k) {
    int sh = (8 - k) << 3;
    long x = (w << sh) - (ZEROS_ASCII << sh);
    x = (x * 10) + (x >>> 8);
    return (((x & 0x000000FF000000FFL) * (100 + (1000000L << 32)))
        + (((x >>> 16) & 0x000000FF000000FFL) * (1 + (10000L << 32)))) >>> 32;
  }

  /**
   * Decodes the text sample lines {@code S seq us load [pos] ~XXXX CR? LF} that follow one
   * another from {@code s}, each by the shape of the line before when it has that shape ({@link
   * TextLayout}), otherwise field by field, learning the new shape. Stops before the first thing
   * that is not a complete, valid sample line.
   *
   * @param b buffer, with {@link #SLACK} readable bytes past {@code limit}
   * @param s first byte of a line (a record boundary)
   * @param limit end of the valid bytes (exclusive)
   * @param sink receives each sample, in order
   * @return the index just past the last LF decoded, or {@code s} when none was
   */
  int textRun(byte[] b, int s, int limit, Sink sink) {
    int p = s;
    while (true) {
      p = layout.run(b, p, limit, sink);
      if (layout.refused()) {
        return p;
      }
      int q = textByFields(b, p, limit, slot);
      if (q < 0) {
        return p;
      }
      sink.sample(slot.seq, slot.us, slot.load, slot.hasPos, slot.pos);
      layout.learn(b, p, q);
      p = q;
    }
  }

  /**
   * One line field by field, for a line of a shape not seen just before.
   *
   * @return the index just past the LF, or -1 when this is not a complete, valid sample line
   */
  private int textByFields(byte[] b, int s, int limit, Fields out) {
    if (s + 12 > limit || b[s] != 'S' || b[s + 1] != ' ') {
      return -1;
    }
    long[] f = values;
    int n = 0;
    int q = s + 2;
    int e;
    while (true) {
      boolean neg = b[q] == '-';
      int d = neg ? q + 1 : q;
      long w = (long) LONGS.get(b, d);
      int k = digitRun(w);
      long v;
      if (k < 8) {
        if (k == 0) {
          return -1;
        }
        v = digitsValue(w, k);
      } else {
        long w2 = (long) LONGS.get(b, d + 8);
        int k2 = digitRun(w2);
        if (k2 > 2) {
          return -1; // more than ten digits
        }
        v = digitsValue(w, 8);
        if (k2 > 0) {
          v = v * (k2 == 1 ? 10 : 100) + digitsValue(w2, k2);
        }
        k += k2;
      }
      if (b[d] == '0' && (k > 1 || neg)) {
        return -1; // "007", "-0": not canonical
      }
      e = d + k;
      if (e + 1 >= limit || b[e] != ' ') {
        return -1;
      }
      f[n++] = neg ? -v : v;
      if (b[e + 1] == '~') {
        break;
      }
      if (n == 4) {
        return -1;
      }
      q = e + 1;
    }
    if (n < 3) {
      return -1;
    }
    int h = e + 2;
    int t = h + 4; // the hex digits are below t, and t is checked against limit below
    int sent = hex4(b, h);
    if (sent < 0) {
      return -1;
    }
    if (b[t] == '\r') {
      t++;
    }
    if (t >= limit || b[t] != '\n') {
      return -1;
    }
    long seq = f[0];
    long us = f[1];
    if (seq < 0 || seq > RawSample.SEQ_MAX || us < 0 || us > RawSample.TIME_MAX_US || !fitsInt(f[2])
        || (n == 4 && !fitsInt(f[3]))) {
      return -1;
    }
    if (Crc16.compute(b, s, e - s) != sent) {
      return -1;
    }
    out.seq = (int) seq;
    out.us = us;
    out.load = (int) f[2];
    out.hasPos = n == 4;
    out.pos = n == 4 ? (int) f[3] : 0;
    return t + 1;
  }

  /**
   * @return the value of the four hex digits (either case) at {@code h}, first digit highest, or
   *     -1 when one is not a hex digit
   */
  static int hex4(byte[] b, int h) {
    int h0 = hexValue(b[h]);
    int h1 = hexValue(b[h + 1]);
    int h2 = hexValue(b[h + 2]);
    int h3 = hexValue(b[h + 3]);
    return (h0 | h1 | h2 | h3) < 0 ? -1 : (h0 << 12) | (h1 << 8) | (h2 << 4) | h3;
  }

  /** @return the value of hex digit {@code c} (either case), or -1 when it is not one */
  static int hexValue(byte c) {
    return HEX[c & 0xFF];
  }

  static boolean fitsInt(long v) {
    return v >= Integer.MIN_VALUE && v <= Integer.MAX_VALUE;
  }

  /**
   * Decodes the binary sample frames (type 0x01 or 0x02, COBS, CRC, 0x00 delimiter) that follow
   * one another from {@code s}, stopping before the first thing that is not one. The payload is
   * decoded in registers: the words are read once and the bytes the COBS codes stand for are
   * cleared by mask, so nothing is stored and read back.
   *
   * <p>An LF byte inside a frame also ends a text candidate, which the general rules look at. The
   * frame is taken here anyway only when that look cannot matter: the decoder follows the binary
   * encoding (a failed text candidate then counts nothing) and the text candidate starts with the
   * frame, and the bytes before the LF cannot end a text record (no {@code ~} five or six bytes
   * back). Otherwise the frame is left to the general path. After one frame decoded here both
   * hold for the next.
   *
   * @param b buffer, with {@link #SLACK} readable bytes past {@code limit}
   * @param s first byte of a frame (a record boundary)
   * @param limit end of the valid bytes (exclusive)
   * @param quietText true when the decoder follows the binary encoding and the text candidate
   *     also starts at {@code s}
   * @param sink receives each sample, in order
   * @return the index just past the last 0x00 decoded, or {@code s} when none was
   */
  int binaryRun(byte[] b, int s, int limit, boolean quietText, Sink sink) {
    boolean quiet = quietText;
    while (true) {
      if (s + 15 > limit || (b[s] & 0xFF) < 2) {
        return s;
      }
      int type = b[s + 1];
      int encoded; // COBS bytes before the delimiter: payload + 1
      if (type == 0x02) {
        encoded = 18;
      } else if (type == 0x01) {
        encoded = 14;
      } else {
        return s;
      }
      int z = s + encoded;
      if (z >= limit || b[z] != 0) {
        return s;
      }
      long w0 = (long) LONGS.get(b, s);
      long w1 = (long) LONGS.get(b, s + 6);
      long w2 = (long) LONGS.get(b, z - 8);
      if ((zeroBytes(w0) | zeroBytes(w1) | zeroBytes(w2)) != 0
          || ((zeroBytes(w0 ^ LFS) | zeroBytes(w1 ^ LFS) | zeroBytes(w2 ^ LFS)) != 0
              && (!quiet || textMayEnd(b, s, z)))) {
        return s;
      }
      int zeros; // bit j: payload byte j is a zero that a COBS code stands for
      if (type == codesType
          && (((w0 ^ codes0) & codeMask0)
              | (((long) LONGS.get(b, s + 8) ^ codes1) & codeMask1)
              | (((long) LONGS.get(b, s + 16) ^ codes2) & codeMask2)) == 0) {
        zeros = codesZeros; // the codes of the frame before: the same chain, the same zeros
      } else {
        zeros = followCodes(b, s, z, type);
        if (zeros < 0) {
          return s; // a code runs past the delimiter
        }
      }
      // payload bytes 0…7 and 8…15, first byte lowest; byte 16 (type 0x02 only) apart
      long p0 = (long) LONGS.get(b, s + 1) & ~BYTE_MASK[zeros & 0xFF];
      long p1 = (long) LONGS.get(b, s + 9) & ~BYTE_MASK[(zeros >>> 8) & 0xFF];
      int crc;
      int sent;
      int pos;
      if (type == 0x02) {
        // 15 bytes under the CRC, after one zero byte of padding
        crc = Crc16.ofPadded16(Long.reverseBytes(p0 << 8),
            Long.reverseBytes((p0 >>> 56) | (p1 << 8)), 15);
        int last = (zeros & (1 << 16)) != 0 ? 0 : b[s + 17] & 0xFF;
        sent = ((int) (p1 >>> 56) << 8) | last;
        pos = (int) (p1 >>> 24);
      } else {
        // 11 bytes under the CRC, after five zero bytes of padding
        crc = Crc16.ofPadded16(Long.reverseBytes(p0 << 40),
            Long.reverseBytes((p0 >>> 24) | (p1 << 40)), 11);
        sent = (int) (p1 >>> 24) & 0xFFFF;
        sent = ((sent & 0xFF) << 8) | (sent >>> 8);
        pos = 0;
      }
      if (crc != sent) {
        return s;
      }
      sink.sample((int) (p0 >>> 8) & 0xFFFF, (p0 >>> 24) & 0xFFFF_FFFFL,
          (int) ((p0 >>> 56) | (p1 << 8)), type == 0x02, pos);
      s = z + 1;
      quiet = true;
    }
  }

  /**
   * The COBS codes of the last frame followed code by code: their values by position (in three
   * little-endian words from the frame start), which positions hold codes, and the zeros they
   * stand for. Successive frames mostly have their zeros in the same places; a frame whose bytes
   * at those places are the same codes has the same chain, checked without following it.
   */
  private int codesType;
  private long codes0, codes1, codes2;
  private long codeMask0, codeMask1, codeMask2;
  private int codesZeros;

  /**
   * Follows the COBS codes of the frame {@code b[s, z)} and remembers them.
   *
   * @return bit j set when payload byte j is a zero a code stands for, or -1 when a code runs past
   *     the delimiter
   */
  private int followCodes(byte[] b, int s, int z, int type) {
    long[] codes = new long[3];
    long[] mask = new long[3];
    int zeros = 0;
    int c = s;
    while (true) {
      int code = b[c] & 0xFF;
      int at = c - s;
      codes[at >>> 3] |= (long) code << ((at & 7) << 3);
      mask[at >>> 3] |= 0xFFL << ((at & 7) << 3);
      int next = c + code;
      if (next >= z) {
        if (next != z) {
          return -1;
        }
        break;
      }
      zeros |= 1 << (next - s - 1);
      c = next;
    }
    codes0 = codes[0]; codes1 = codes[1]; codes2 = codes[2];
    codeMask0 = mask[0]; codeMask1 = mask[1]; codeMask2 = mask[2];
    codesZeros = zeros;
    codesType = type;
    return zeros;
  }

  /** Non-zero when word {@code v} holds a 0x00 byte. */
  private static long zeroBytes(long v) {
    return (v - ONES) & ~v & HIGHS;
  }

  /** True when a text record could end at an LF in {@code b[s, z)}: "~" and four bytes, CR? LF. */
  private static boolean textMayEnd(byte[] b, int s, int z) {
    for (int i = s; i < z; i++) {
      if (b[i] == '\n' && ((i - 5 >= s && b[i - 5] == '~')
          || (i - 6 >= s && b[i - 1] == '\r' && b[i - 6] == '~'))) {
        return true;
      }
    }
    return false;
  }

  /** BYTE_MASK[m]: 0xFF in each byte i of the word where bit i of m is set. */
  private static final long[] BYTE_MASK = new long[256];

  static {
    for (int m = 0; m < 256; m++) {
      for (int i = 0; i < 8; i++) {
        if ((m & (1 << i)) != 0) {
          BYTE_MASK[m] |= 0xFFL << (8 * i);
        }
      }
    }
  }

  private static final VarHandle INTS =
      MethodHandles.byteArrayViewVarHandle(int[].class, ByteOrder.LITTLE_ENDIAN);

  /** The little-endian 32-bit value at {@code at}. */
  static int le32(byte[] f, int at) {
    return (int) INTS.get(f, at);
  }
}
