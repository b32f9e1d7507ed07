package org.loadstone.protocol;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.Size;
import org.junit.jupiter.api.Test;

class CrcAndCobsTest {
  @Test
  void crcCheckValue() {
    // CRC-16/CCITT-FALSE check value for "123456789" is 0x29B1 (Greg Cook, "Catalogue of
    // parametrised CRC algorithms", entry CRC-16/IBM-3740 a.k.a. CCITT-FALSE).
    byte[] b = "123456789".getBytes(StandardCharsets.US_ASCII);
    assertThat(Crc16.compute(b, 0, b.length)).isEqualTo(0x29B1);
  }

  /**
   * The table-driven, sixteen-bytes-at-a-time CRC against the bit-by-bit shift register that
   * defines it (R. Williams, "A Painless Guide to CRC Error Detection Algorithms", 1993, the
   * "simple" register), for every length and alignment in the range.
   */
  @Property(tries = 300, seed = "5150")
  void crcMatchesTheBitwiseDefinition(
      @ForAll @Size(max = 300) byte[] data, @ForAll @net.jqwik.api.constraints.IntRange(max = 40) int cut) {
    for (int off = 0; off <= Math.min(cut, data.length); off += 1 + off / 4) {
      for (int len : new int[] {data.length - off, (data.length - off) / 2, Math.min(17, data.length - off)}) {
        assertThat(Crc16.compute(data, off, len)).isEqualTo(bitwise(data, off, len));
      }
    }
  }

  private static int bitwise(byte[] d, int off, int len) {
    int crc = 0xFFFF;
    for (int i = off; i < off + len; i++) {
      crc ^= (d[i] & 0xFF) << 8;
      for (int k = 0; k < 8; k++) {
        crc = (crc & 0x8000) != 0 ? ((crc << 1) ^ 0x1021) & 0xFFFF : (crc << 1) & 0xFFFF;
      }
    }
    return crc;
  }

  @Test
  void crcOfEmptyIsInitialValue() {
    assertThat(Crc16.compute(new byte[0], 0, 0)).isEqualTo(0xFFFF);
  }

  @Test
  void cobsPublishedExamples() {
    // Examples from the COBS description (Cheshire & Baker, IEEE/ACM Trans. Networking 1999;
    // the same table appears in the Wikipedia article "Consistent Overhead Byte Stuffing").
    assertCobs(new byte[] {0x00}, new byte[] {0x01, 0x01});
    assertCobs(new byte[] {0x00, 0x00}, new byte[] {0x01, 0x01, 0x01});
    assertCobs(new byte[] {0x00, 0x11, 0x00}, new byte[] {0x01, 0x02, 0x11, 0x01});
    assertCobs(new byte[] {0x11, 0x22, 0x00, 0x33}, new byte[] {0x03, 0x11, 0x22, 0x02, 0x33});
    assertCobs(new byte[] {0x11, 0x22, 0x33, 0x44}, new byte[] {0x05, 0x11, 0x22, 0x33, 0x44});
    assertCobs(new byte[] {0x11, 0x00, 0x00, 0x00}, new byte[] {0x02, 0x11, 0x01, 0x01, 0x01});
  }

  @Test
  void cobs254NonZeroBytes() {
    // Wikipedia COBS example 7: 01..FE (254 bytes) encodes to FF 01..FE (no trailing code byte
    // needed beyond the final 0x01 group marker in the delimiter-free form used here).
    byte[] in = new byte[254];
    for (int i = 0; i < 254; i++) {
      in[i] = (byte) (i + 1);
    }
    byte[] out = new byte[Cobs.maxEncodedLength(in.length)];
    int n = Cobs.encode(in, 0, in.length, out, 0);
    assertThat(out[0] & 0xFF).isEqualTo(0xFF);
    byte[] back = new byte[300];
    int m = Cobs.decode(out, 0, n, back);
    assertThat(Arrays.copyOf(back, m)).isEqualTo(in);
  }

  private static void assertCobs(byte[] raw, byte[] encoded) {
    byte[] out = new byte[Cobs.maxEncodedLength(raw.length)];
    int n = Cobs.encode(raw, 0, raw.length, out, 0);
    assertThat(Arrays.copyOf(out, n)).isEqualTo(encoded);
    byte[] back = new byte[64];
    int m = Cobs.decode(encoded, 0, encoded.length, back);
    assertThat(Arrays.copyOf(back, m)).isEqualTo(raw);
  }

  @Property(tries = 500, seed = "20261202")
  void cobsRoundTrip(@ForAll @Size(max = 600) byte[] raw) {
    byte[] out = new byte[Cobs.maxEncodedLength(raw.length)];
    int n = Cobs.encode(raw, 0, raw.length, out, 0);
    for (int i = 0; i < n; i++) {
      assertThat(out[i]).isNotEqualTo((byte) 0);
    }
    byte[] back = new byte[raw.length + 10];
    int m = Cobs.decode(out, 0, n, back);
    assertThat(Arrays.copyOf(back, m)).isEqualTo(raw);
  }
}
