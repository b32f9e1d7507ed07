package org.loadstone.protocol;

/**
 * CRC-16/CCITT-FALSE: polynomial 0x1021, initial value 0xFFFF, no reflection, no final XOR.
 * The ASCII bytes {@code 123456789} give 0x29B1.
 */
public final class Crc16 {
  static final int[] TABLE = new int[256];

  static {
    for (int i = 0; i < 256; i++) {
      int crc = i << 8;
      for (int b = 0; b < 8; b++) {
        crc = (crc & 0x8000) != 0 ? (crc << 1) ^ 0x1021 : crc << 1;
      }
      TABLE[i] = crc & 0xFFFF;
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
    for (int i = off, end = off + len; i < end; i++) {
      crc = ((crc << 8) ^ TABLE[((crc >>> 8) ^ data[i]) & 0xFF]) & 0xFFFF;
    }
    return crc;
  }
}
