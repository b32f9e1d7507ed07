package org.loadstone.protocol;

import java.lang.invoke.VarHandle;

/**
 * The shape of the text sample lines a device is sending, learnt from one valid line: which bytes
 * are digits, which are fixed characters ({@code S}, spaces, minus signs, {@code ~}, CR, LF) and
 * where the checksum digits are. A streaming device sends line after line of one shape — a field
 * gains or loses a digit only now and then — so the next line is checked against the shape eight
 * bytes at a time, its fields are read at known places, and its CRC needs table lookups only for
 * the digits' low nibbles, two per lookup ({@link Crc16#lowNibbles}).
 *
 * <p>A run of lines stops at a line that does not fit, and the caller uses the one-pass parser,
 * whose success teaches the new shape. A line that fits gets the one-pass parser's verdict: it is
 * exactly a well-formed sample line of that shape, so only its values, its range rules and its CRC
 * remain to decide, and they are decided the same way.
 *
 * <p>The check of one word {@code w} is {@code y = w ^ tpl; bad = (((y & 0x7F…) + add) | y) & care}
 * with, per byte: a digit — {@code tpl 0x30, add 0x76}: {@code y} is 0…9 exactly for a digit and
 * adding 0x76 sets bit 7 from 0x0A up; a fixed character — {@code tpl} the character, {@code add
 * 0x7F}: any difference sets bit 7; checksum digits and bytes past the line — {@code care 0}. The
 * {@code | y} catches bytes from 0x80 up, and no byte's sum carries into the next.
 */
final class TextLayout {
  /** Longest line a shape covers, in bytes: seven words (a sample line is at most 50). */
  private static final int MAX_LINE = 56;

  private static final VarHandle LONGS = SampleFastPath.LONGS;
  private static final long LOW7 = 0x7F7F_7F7F_7F7F_7F7FL;

  private boolean known;
  private boolean refused;
  /** Bytes in the line, LF included. */
  private int length;
  private boolean longLine;
  /** Per word: template, adder and care mask of the check above. */
  private long tpl0, tpl1, tpl2, tpl3, tpl4, tpl5, tpl6;
  private long add0, add1, add2, add3, add4, add5, add6;
  private long care0, care1, care2, care3, care4, care5, care6;
  /** Per field: offset of its first digit, its digit count, its smallest and largest magnitude. */
  private int at0, at1, at2, at3;
  private int digits0, digits1, digits2, digits3;
  private long min0, min1, min2, min3;
  private long max2, max3;
  /** 0 or -1 (negative) for the load and position fields. */
  private long sign2, sign3;
  private boolean hasPos;
  /** A field of more than eight digits: read in two words. */
  private boolean wide;
  private int hexAt;
  private int bodyLength;
  /** Words the CRC reads back from the body end, and the masks keeping only digits' low nibbles. */
  private int crcWords;
  private long crcMask0, crcMask1, crcMask2, crcMask3, crcMask4, crcMask5;
  /** The CRC, from the usual start value, of the body with every digit a '0'. */
  private int crcFixed;

  /**
   * Decodes the lines from {@code s} on while they have the learnt shape.
   *
   * @param b buffer, with {@link SampleFastPath#SLACK} readable bytes past {@code limit}
   * @param s first byte of a line (a record boundary)
   * @param limit end of the valid bytes (exclusive)
   * @param sink receives each sample, in order
   * @return the index just past the last line decoded, {@code s} when none was; {@link
   *     #refused()} then tells whether the next line had the shape but is not a valid sample
   */
  int run(byte[] b, int s, int limit, SampleFastPath.Sink sink) {
    refused = false;
    if (!known) {
      return s;
    }
    for (; s + length <= limit; s += length) {
      long bad = check((long) LONGS.get(b, s), tpl0, add0, care0)
          | check((long) LONGS.get(b, s + 8), tpl1, add1, care1)
          | check((long) LONGS.get(b, s + 16), tpl2, add2, care2)
          | check((long) LONGS.get(b, s + 24), tpl3, add3, care3);
      if (longLine) {
        bad |= check((long) LONGS.get(b, s + 32), tpl4, add4, care4)
            | check((long) LONGS.get(b, s + 40), tpl5, add5, care5)
            | check((long) LONGS.get(b, s + 48), tpl6, add6, care6);
      }
      if (bad != 0) {
        return s;
      }
      long seq = SampleFastPath.digitsValue((long) LONGS.get(b, s + at0), digits0);
      long us;
      long load;
      long pos;
      if (!wide) {
        us = SampleFastPath.digitsValue((long) LONGS.get(b, s + at1), digits1);
        load = SampleFastPath.digitsValue((long) LONGS.get(b, s + at2), digits2);
        pos = hasPos ? SampleFastPath.digitsValue((long) LONGS.get(b, s + at3), digits3) : 0;
      } else {
        us = value(b, s + at1, digits1);
        load = value(b, s + at2, digits2);
        pos = hasPos ? value(b, s + at3, digits3) : 0;
      }
      int crc = s >= 8 * Crc16.LOW_NIBBLE_WORDS
          ? crc(b, s + bodyLength) : Crc16.compute(b, s, bodyLength);
      // the smallest magnitudes rule out leading zeros and "-0"
      if (seq < min0 | seq > RawSample.SEQ_MAX | us < min1 | us > RawSample.TIME_MAX_US
          | load < min2 | load > max2 | pos < min3 | pos > max3
          || (SampleFastPath.le32(b, s + hexAt) != hexDigits(crc)
              && SampleFastPath.hex4(b, s + hexAt) != crc)) { // else lower case, or wrong
        refused = true;
        return s;
      }
      sink.sample((int) seq, us, (int) ((load ^ sign2) - sign2), hasPos,
          (int) ((pos ^ sign3) - sign3));
    }
    return s;
  }

  /** @return true when the last {@link #run} stopped at a line of the shape that is not a sample */
  boolean refused() {
    return refused;
  }

  private static long check(long w, long tpl, long add, long care) {
    long y = w ^ tpl;
    return (((y & LOW7) + add) | y) & care;
  }

  /** The value of the {@code k} (1…10) digits at {@code p}. */
  private static long value(byte[] b, int p, int k) {
    long w = (long) LONGS.get(b, p);
    if (k <= 8) {
      return SampleFastPath.digitsValue(w, k);
    }
    return SampleFastPath.digitsValue(w, 8) * (k == 9 ? 10 : 100)
        + SampleFastPath.digitsValue((long) LONGS.get(b, p + 8), k - 8);
  }

  /** The CRC of the body ending at {@code end}: a constant for its fixed part, then its digits. */
  private int crc(byte[] b, int end) {
    int crc = crcFixed
        ^ Crc16.lowNibbles((long) LONGS.get(b, end - 8) & crcMask0, 0)
        ^ Crc16.lowNibbles((long) LONGS.get(b, end - 16) & crcMask1, 1)
        ^ Crc16.lowNibbles((long) LONGS.get(b, end - 24) & crcMask2, 2);
    if (crcWords > 3) {
      crc ^= Crc16.lowNibbles((long) LONGS.get(b, end - 32) & crcMask3, 3);
      if (crcWords > 4) {
        crc ^= Crc16.lowNibbles((long) LONGS.get(b, end - 40) & crcMask4, 4)
            ^ Crc16.lowNibbles((long) LONGS.get(b, end - 48) & crcMask5, 5);
      }
    }
    return crc;
  }

  /** HEX_PAIRS[v]: the two upper-case hex digits of byte v, the first in the low byte. */
  private static final int[] HEX_PAIRS = new int[256];

  static {
    byte[] digits = "0123456789ABCDEF".getBytes(java.nio.charset.StandardCharsets.US_ASCII);
    for (int v = 0; v < 256; v++) {
      HEX_PAIRS[v] = digits[v >>> 4] | digits[v & 15] << 8;
    }
  }

  /** The four upper-case hex digits of {@code crc} as a device sends them, first in the low byte. */
  static int hexDigits(int crc) {
    return HEX_PAIRS[(crc >>> 8) & 0xFF] | HEX_PAIRS[crc & 0xFF] << 16;
  }

  /**
   * Learns the shape of {@code b[s, end)}, a line the one-pass parser has just accepted as a
   * sample. Runs only when the shape changes.
   */
  void learn(byte[] b, int s, int end) {
    int n = end - s;
    known = false;
    if (n > MAX_LINE) {
      return;
    }
    long[] tpl = new long[7];
    long[] add = new long[7];
    long[] care = new long[7];
    int[] at = new int[4];
    int[] k = new int[4];
    boolean[] neg = new boolean[4];
    fixed(tpl, add, care, 0, b[s]);
    fixed(tpl, add, care, 1, b[s + 1]);
    int fields = 0;
    int p = 2;
    while (b[s + p] != '~') {
      if (b[s + p] == '-') {
        neg[fields] = true;
        fixed(tpl, add, care, p, b[s + p]);
        p++;
      }
      at[fields] = p;
      while (b[s + p] != ' ') {
        digit(tpl, add, care, p++);
      }
      k[fields] = p - at[fields];
      fixed(tpl, add, care, p, b[s + p]); // the space after the field
      p++;
      fields++;
    }
    fixed(tpl, add, care, p, b[s + p]); // '~'
    hexAt = p + 1;
    for (int q = p + 5; q < n; q++) {
      fixed(tpl, add, care, q, b[s + q]); // CR, LF
    }
    tpl0 = tpl[0]; tpl1 = tpl[1]; tpl2 = tpl[2]; tpl3 = tpl[3]; tpl4 = tpl[4]; tpl5 = tpl[5];
    tpl6 = tpl[6];
    add0 = add[0]; add1 = add[1]; add2 = add[2]; add3 = add[3]; add4 = add[4]; add5 = add[5];
    add6 = add[6];
    care0 = care[0]; care1 = care[1]; care2 = care[2]; care3 = care[3]; care4 = care[4];
    care5 = care[5]; care6 = care[6];
    at0 = at[0]; at1 = at[1]; at2 = at[2]; at3 = at[3];
    digits0 = k[0]; digits1 = k[1]; digits2 = k[2]; digits3 = k[3];
    hasPos = fields == 4;
    wide = k[1] > 8 || k[2] > 8 || k[3] > 8;
    min0 = smallest(k[0], neg[0]);
    min1 = smallest(k[1], neg[1]);
    min2 = smallest(k[2], neg[2]);
    min3 = hasPos ? smallest(k[3], neg[3]) : 0;
    max2 = largest(neg[2]);
    max3 = hasPos ? largest(neg[3]) : 0;
    sign2 = neg[2] ? -1 : 0;
    sign3 = neg[3] ? -1 : 0;
    length = n;
    longLine = n > 32;
    bodyLength = p - 1;
    learnCrc(b, s, at, k, fields);
    known = true;
  }

  /**
   * The CRC reads the words that hold digits, back from the body end, keeping only the digits'
   * low nibbles; everything else of the body is fixed by the shape and is in {@link #crcFixed}.
   */
  private void learnCrc(byte[] b, int s, int[] at, int[] k, int fields) {
    crcWords = (bodyLength - at0 + 7) / 8;
    long[] mask = new long[Crc16.LOW_NIBBLE_WORDS];
    byte[] fixed = java.util.Arrays.copyOfRange(b, s, s + bodyLength);
    for (int f = 0; f < fields; f++) {
      for (int i = at[f]; i < at[f] + k[f]; i++) {
        fixed[i] = '0';
        int back = bodyLength - 1 - i; // bytes after this digit in the body
        mask[back >>> 3] |= 0x0FL << ((7 - (back & 7)) << 3);
      }
    }
    crcMask0 = mask[0]; crcMask1 = mask[1]; crcMask2 = mask[2]; crcMask3 = mask[3];
    crcMask4 = mask[4]; crcMask5 = mask[5];
    crcFixed = Crc16.compute(fixed, 0, bodyLength);
  }

  /** The smallest canonical magnitude of a field of {@code k} digits: no leading zero, no "-0". */
  private static long smallest(int k, boolean negative) {
    if (k == 1) {
      return negative ? 1 : 0;
    }
    long m = 1;
    for (int i = 1; i < k; i++) {
      m *= 10;
    }
    return m;
  }

  private static long largest(boolean negative) {
    return negative ? -(long) Integer.MIN_VALUE : Integer.MAX_VALUE;
  }

  private static void fixed(long[] tpl, long[] add, long[] care, int i, byte c) {
    put(tpl, add, care, i, c & 0xFF, 0x7F);
  }

  private static void digit(long[] tpl, long[] add, long[] care, int i) {
    put(tpl, add, care, i, '0', 0x76);
  }

  private static void put(long[] tpl, long[] add, long[] care, int i, int t, int a) {
    int sh = (i & 7) << 3;
    tpl[i >>> 3] |= (long) t << sh;
    add[i >>> 3] |= (long) a << sh;
    care[i >>> 3] |= 0x80L << sh;
  }
}
