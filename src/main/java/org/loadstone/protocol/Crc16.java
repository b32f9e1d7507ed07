package org.loadstone.protocol;

import java.lang.invoke.MethodHandles;
import java.lang.invoke.VarHandle;
import java.nio.ByteOrder;

/**
 * CRC-16/CCITT-FALSE: polynomial 0x1021, initial value 0xFFFF, no reflection, no final XOR.
 * The ASCII bytes {@code 123456789} give 0x29B1.
 *
 * <p>Computed sixteen bytes at a time ("slicing by 16"). A message whose length is not a multiple
 * of sixteen is read as if it were preceded by zero bytes, with a start value chosen so that those
 * zeros bring the register to 0xFFFF exactly where the message begins (zero bytes only multiply
 * the register by x^8 modulo the polynomial, which can be undone). That leaves no byte-at-a-time
 * tail.
 */
public final class Crc16 {
  private static final int INIT = 0xFFFF;
  private static final VarHandle BIG_ENDIAN_LONGS =
      MethodHandles.byteArrayViewVarHandle(long[].class, ByteOrder.BIG_ENDIAN);

  /** T[k * 256 + i]: the CRC contribution of byte i followed by k zero bytes, k = 0…15. */
  private static final char[] T = new char[16 * 256];
  /**
   * LOW_NIBBLES[p * 256 + v]: the CRC, from a register of 0, of two bytes holding only low
   * nibbles ({@code v & 15}, then {@code v >>> 4}) followed by {@code 2p} zero bytes. See {@link
   * #lowNibbles}.
   */
  private static final char[] LOW_NIBBLES = new char[6 * 1024];

  /** Words of a message that {@link #lowNibbles} can place: messages up to 48 bytes. */
  static final int LOW_NIBBLE_WORDS = 6;

  /** START[z]: the register value that z zero bytes turn into 0xFFFF. */
  private static final int[] START = new int[16];

  static {
    for (int i = 0; i < 256; i++) {
      int crc = i << 8;
      for (int b = 0; b < 8; b++) {
        crc = (crc & 0x8000) != 0 ? (crc << 1) ^ 0x1021 : crc << 1;
      }
      T[i] = (char) (crc & 0xFFFF);
    }
    for (int k = 1; k < 16; k++) {
      for (int i = 0; i < 256; i++) {
        int prev = T[(k - 1) * 256 + i];
        T[k * 256 + i] = (char) (((prev << 8) ^ T[prev >>> 8]) & 0xFFFF);
      }
    }
    int[] beforeZero = new int[1 << 16]; // the inverse of one zero-byte step
    for (int s = 0; s < 1 << 16; s++) {
      beforeZero[zeroByte(s)] = s;
    }
    int s = INIT;
    for (int z = 0; z < 16; z++) {
      START[z] = s;
      s = beforeZero[s];
    }
    for (int v = 0; v < 256; v++) {
      int pair = zeroByte(T[v & 15]) ^ T[v >>> 4]; // the two bytes, from a register of 0
      for (int p = 0; p < LOW_NIBBLE_WORDS * 4; p++) {
        LOW_NIBBLES[p * 256 + v] = (char) pair;
        pair = zeroByte(zeroByte(pair));
      }
    }
  }

  private Crc16() {}

  private static int zeroByte(int crc) {
    return ((crc << 8) ^ T[crc >>> 8]) & 0xFFFF;
  }

  /**
   * @param data bytes
   * @param off first byte
   * @param len number of bytes
   * @return the CRC, 0…0xFFFF
   * @throws IndexOutOfBoundsException when the range is outside the array
   */
  public static int compute(byte[] data, int off, int len) {
    java.util.Objects.checkFromIndexSize(off, len, data.length);
    if (len == 0) {
      return INIT;
    }
    int z = -len & 15;
    if (z >= 8 && off >= z - 8) {
      // one eight-byte step first, so no step is spent on a word of padding alone
      int pad = z - 8;
      long v = (long) BIG_ENDIAN_LONGS.get(data, off - pad) & (-1L >>> (pad << 3));
      int crc = step8(START[pad], v);
      int next = off - pad + 8;
      return next == off + len ? crc : steps(data, next, off + len, crc, -1L);
    }
    if (z < 8 && off >= z) {
      return steps(data, off - z, off + len, START[z], -1L >>> (z << 3));
    }
    int crc = INIT;
    int i = off;
    for (; i < off + (len & 15); i++) { // too near the array start for the padding words
      crc = ((crc << 8) ^ T[((crc >>> 8) ^ data[i]) & 0xFF]) & 0xFFFF;
    }
    return i == off + len ? crc : steps(data, i, off + len, crc, -1L);
  }

  /**
   * Sixteen-byte steps from {@code i} to {@code end}; {@code firstMask} clears the padding in the
   * first word. Only the first two bytes of a step depend on the register, so the other fourteen
   * lookups run ahead of it.
   */
  private static int steps(byte[] data, int i, int end, int crc, long firstMask) {
    long mask = firstMask;
    do {
      crc = step16(crc, (long) BIG_ENDIAN_LONGS.get(data, i) & mask,
          (long) BIG_ENDIAN_LONGS.get(data, i + 8));
      mask = -1L;
      i += 16;
    } while (i < end);
    return crc;
  }

  /** One eight-byte step: the register after the bytes of big-endian word {@code v}. */
  private static int step8(int crc, long v) {
    int x = crc ^ (int) (v >>> 48);
    return word(T, v, 0) ^ T[7 * 256 + (x >>> 8)] ^ T[6 * 256 + (x & 0xFF)];
  }

  /**
   * One sixteen-byte step: the register after bytes {@code v} then {@code w}, each read as a
   * big-endian word (first byte in the top bits).
   */
  static int step16(int crc, long v, long w) {
    final char[] t = T;
    int rest = word(t, v, 8) ^ t[7 * 256 + (int) (w >>> 56)]
        ^ t[6 * 256 + ((int) (w >>> 48) & 0xFF)] ^ word(t, w, 0);
    int x = crc ^ (int) (v >>> 48);
    return rest ^ t[15 * 256 + (x >>> 8)] ^ t[14 * 256 + (x & 0xFF)];
  }

  /**
   * The CRC of a message of at most sixteen bytes held in registers: the message, read as a
   * big-endian 16-byte number {@code v:w}, is preceded by {@code 16 - len} zero bytes, which the
   * caller has shifted in.
   */
  static int ofPadded16(long v, long w, int len) {
    return step16(START[16 - len], v, w);
  }

  /**
   * The CRC is linear: the CRC of a message is the CRC of the message with some bits cleared (from
   * the usual start value) XOR the CRC of those bits alone (from a register of 0). When all but the
   * low nibbles of some bytes are known in advance — as for a text line of a known layout, whose
   * digits are all 0x3_ — the known part is a constant and only those low nibbles need table
   * lookups, two of them per lookup. This gives the part of one word: the 8 bytes of
   * little-endian word {@code w} (first byte lowest), the {@code j}-th word counted back from the
   * message end (0 for the last eight bytes), with every bit outside the wanted low nibbles
   * already cleared by the caller.
   *
   * @param j 0 to {@link #LOW_NIBBLE_WORDS} - 1
   */
  static int lowNibbles(long w, int j) {
    long pairs = w | (w >>> 4); // bytes 0, 2, 4, 6 hold the pairs, the later byte's nibble on top
    int o = j << 10;
    final char[] t = LOW_NIBBLES;
    return t[o + 768 + ((int) pairs & 0xFF)] ^ t[o + 512 + ((int) (pairs >>> 16) & 0xFF)]
        ^ t[o + 256 + ((int) (pairs >>> 32) & 0xFF)] ^ t[o + ((int) (pairs >>> 48) & 0xFF)];
  }

  /**
   * The contribution of bytes 2…7 of big-endian word {@code v} when followed by {@code k} zero
   * bytes; bytes 0 and 1 are left to the caller, which mixes the register into them.
   */
  private static int word(char[] t, long v, int k) {
    int o = k * 256;
    return t[o + 5 * 256 + ((int) (v >>> 40) & 0xFF)] ^ t[o + 4 * 256 + ((int) (v >>> 32) & 0xFF)]
        ^ t[o + 3 * 256 + ((int) (v >>> 24) & 0xFF)] ^ t[o + 2 * 256 + ((int) (v >>> 16) & 0xFF)]
        ^ t[o + 256 + ((int) (v >>> 8) & 0xFF)] ^ t[o + ((int) v & 0xFF)];
  }
}
