package org.loadstone.protocol;

/** Consistent Overhead Byte Stuffing (Cheshire and Baker, 1999). */
final class Cobs {
  private Cobs() {}

  /** Worst-case encoded length of {@code n} bytes (without the delimiter). */
  static int maxEncodedLength(int n) {
    return n + n / 254 + 1;
  }

  /**
   * Encodes {@code len} bytes of {@code in} into {@code out} at {@code outOff}; writes no delimiter.
   *
   * @return number of bytes written
   */
  static int encode(byte[] in, int off, int len, byte[] out, int outOff) {
    int codeAt = outOff;
    int w = outOff + 1;
    int code = 1;
    for (int i = off, end = off + len; i < end; i++) {
      byte b = in[i];
      if (b != 0) {
        out[w++] = b;
        code++;
      }
      if (b == 0 || code == 0xFF) {
        out[codeAt] = (byte) code;
        codeAt = w++;
        code = 1;
      }
    }
    out[codeAt] = (byte) code;
    return w - outOff;
  }

  /**
   * Decodes one COBS block (no zero bytes, no delimiter) into {@code out}.
   *
   * @return decoded length, or -1 when the block is not valid COBS or does not fit
   */
  static int decode(byte[] in, int off, int len, byte[] out) {
    int r = off;
    int end = off + len;
    int w = 0;
    while (r < end) {
      int code = in[r++] & 0xFF;
      if (code == 0) {
        return -1;
      }
      int copy = code - 1;
      if (r + copy > end || w + copy > out.length) {
        return -1;
      }
      for (int k = 0; k < copy; k++) {
        byte b = in[r++];
        if (b == 0) {
          return -1;
        }
        out[w++] = b;
      }
      if (code != 0xFF && r < end) {
        if (w >= out.length) {
          return -1;
        }
        out[w++] = 0;
      }
    }
    return w;
  }
}
