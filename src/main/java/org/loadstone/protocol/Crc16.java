package org.loadstone.protocol;

/**
 * CRC-16/CCITT-FALSE: polynomial 0x1021, initial value 0xFFFF, no reflection, no final XOR.
 * The ASCII bytes {@code 123456789} give 0x29B1.
 */
public final class Crc16 {
  static final int[] TABLE = new int[256];
  // T2..T4[i]: the CRC contribution of byte i followed by 1, 2 or 3 zero bytes ("slicing by 4" and by 8)
  private static final int[] T2 = new int[256];
  private static final int[] T3 = new int[256];
  private static final int[] T4 = new int[256];
  private static final int[] T5 = new int[256];
  private static final int[] T6 = new int[256];
  private static final int[] T7 = new int[256];
  private static final int[] T8 = new int[256];

  static {
    for (int i = 0; i < 256; i++) {
      int crc = i << 8;
      for (int b = 0; b < 8; b++) {
        crc = (crc & 0x8000) != 0 ? (crc << 1) ^ 0x1021 : crc << 1;
      }
      TABLE[i] = crc & 0xFFFF;
    }
    for (int i = 0; i < 256; i++) {
      T2[i] = ((TABLE[i] << 8) ^ TABLE[TABLE[i] >>> 8]) & 0xFFFF;
      T3[i] = ((T2[i] << 8) ^ TABLE[T2[i] >>> 8]) & 0xFFFF;
      T4[i] = ((T3[i] << 8) ^ TABLE[T3[i] >>> 8]) & 0xFFFF;
      T5[i] = ((T4[i] << 8) ^ TABLE[T4[i] >>> 8]) & 0xFFFF;
      T6[i] = ((T5[i] << 8) ^ TABLE[T5[i] >>> 8]) & 0xFFFF;
      T7[i] = ((T6[i] << 8) ^ TABLE[T6[i] >>> 8]) & 0xFFFF;
      T8[i] = ((T7[i] << 8) ^ TABLE[T7[i] >>> 8]) & 0xFFFF;
    }
  }

  private Crc16() {}

  /**
   * @param data bytes
   * @param off first byte
   * @param len number of bytes
   * @return the CRC, 0…0xFFFF
   */
  public static int compute(byte[] data, int off, int len) {
    int crc = 0xFFFF;
    int i = off;
    int end = off + len;
    for (; i + 8 <= end; i += 8) {
      int x = crc ^ (((data[i] & 0xFF) << 8) | (data[i + 1] & 0xFF));
      crc = T8[x >>> 8] ^ T7[x & 0xFF] ^ T6[data[i + 2] & 0xFF] ^ T5[data[i + 3] & 0xFF]
          ^ T4[data[i + 4] & 0xFF] ^ T3[data[i + 5] & 0xFF] ^ T2[data[i + 6] & 0xFF]
          ^ TABLE[data[i + 7] & 0xFF];
    }
    for (; i + 4 <= end; i += 4) {
      int x = crc ^ (((data[i] & 0xFF) << 8) | (data[i + 1] & 0xFF));
      crc = T4[x >>> 8] ^ T3[x & 0xFF] ^ T2[data[i + 2] & 0xFF] ^ TABLE[data[i + 3] & 0xFF];
    }
    for (; i < end; i++) {
      crc = ((crc << 8) ^ TABLE[((crc >>> 8) ^ data[i]) & 0xFF]) & 0xFFFF;
    }
    return crc;
  }
}
