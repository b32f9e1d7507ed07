package org.loadstone.protocol;

import java.nio.charset.StandardCharsets;

/**
 * Encodes device records into wire bytes, in either encoding. Used by the built-in simulated frame
 * (so it emits exactly what the firmware does) and by tests. Sample encoding writes into a caller's
 * buffer and allocates nothing. An instance is not safe for concurrent sample encoding; use one per
 * thread.
 */
public final class WireEncoder {
  /** Longest encoded sample in either encoding, in bytes. */
  public static final int MAX_SAMPLE_BYTES = 64;

  private static final byte[] HEX = "0123456789ABCDEF".getBytes(StandardCharsets.US_ASCII);

  private final Encoding encoding;
  private final byte[] scratch = new byte[256];
  private final byte[] payload = new byte[18];

  /** @param encoding the encoding to produce */
  public WireEncoder(Encoding encoding) {
    this.encoding = org.loadstone.units.Precondition.notNull(encoding, "encoding");
  }

  /** @return the encoding this encoder produces */
  public Encoding encoding() {
    return encoding;
  }

  /**
   * Writes one sample.
   *
   * @param out destination; needs {@link #MAX_SAMPLE_BYTES} free bytes from {@code off}
   * @param seq 0…65535
   * @param deviceUs 0…4 294 967 295
   * @param load signed counts
   * @param hasPosition whether to send the position channel
   * @param position signed position counts (ignored without position)
   * @return number of bytes written
   */
  public int sample(
      byte[] out, int off, int seq, long deviceUs, int load, boolean hasPosition, int position) {
    return encoding == Encoding.TEXT
        ? textSample(out, off, seq, deviceUs, load, hasPosition, position)
        : binarySample(out, off, seq, deviceUs, load, hasPosition, position);
  }

  /** Encodes a whole {@link RawSample}; see {@link #sample}. */
  public int sample(byte[] out, int off, RawSample s) {
    return sample(out, off, s.seq(), s.deviceUs(), s.counts(), s.hasPosition(), s.positionCounts());
  }

  /**
   * Encodes a non-sample record.
   *
   * @param message the message; its {@link DeviceMessage#body()} is what is sent
   * @return the wire bytes
   */
  public byte[] message(DeviceMessage message) {
    return body(message.body());
  }

  /**
   * Encodes an arbitrary text body (tag and fields) as one record.
   *
   * @param body printable ASCII, at most 194 bytes
   */
  public byte[] body(String body) {
    byte[] b = body.getBytes(StandardCharsets.US_ASCII);
    if (b.length > 194) {
      throw new IllegalArgumentException("record body longer than 194 bytes: " + body);
    }
    if (encoding == Encoding.TEXT) {
      byte[] out = new byte[b.length + 7];
      System.arraycopy(b, 0, out, 0, b.length);
      int n = appendCrcAndEnd(out, b.length, Crc16.compute(b, 0, b.length));
      return java.util.Arrays.copyOf(out, n);
    }
    synchronized (scratch) {
      scratch[0] = 0x10;
      System.arraycopy(b, 0, scratch, 1, b.length);
      int n = 1 + b.length;
      int crc = Crc16.compute(scratch, 0, n);
      scratch[n++] = (byte) (crc >>> 8);
      scratch[n++] = (byte) crc;
      byte[] out = new byte[Cobs.maxEncodedLength(n) + 1];
      int w = Cobs.encode(scratch, 0, n, out, 0);
      out[w++] = 0;
      return java.util.Arrays.copyOf(out, w);
    }
  }

  static int textSample(
      byte[] out, int off, int seq, long deviceUs, int load, boolean hasPosition, int position) {
    int w = off;
    out[w++] = 'S';
    out[w++] = ' ';
    w = writeLong(out, w, seq & 0xFFFF);
    out[w++] = ' ';
    w = writeLong(out, w, deviceUs & 0xFFFF_FFFFL);
    out[w++] = ' ';
    w = writeLong(out, w, load);
    if (hasPosition) {
      out[w++] = ' ';
      w = writeLong(out, w, position);
    }
    int crc = Crc16.compute(out, off, w - off);
    return appendCrcAndEnd(out, w, crc) - off;
  }

  private int binarySample(
      byte[] out, int off, int seq, long deviceUs, int load, boolean hasPosition, int position) {
    byte[] p = payload;
    int n = 0;
    p[n++] = (byte) (hasPosition ? 0x02 : 0x01);
    p[n++] = (byte) seq;
    p[n++] = (byte) (seq >>> 8);
    for (int k = 0; k < 4; k++) {
      p[n++] = (byte) (deviceUs >>> (8 * k));
    }
    for (int k = 0; k < 4; k++) {
      p[n++] = (byte) (load >>> (8 * k));
    }
    if (hasPosition) {
      for (int k = 0; k < 4; k++) {
        p[n++] = (byte) (position >>> (8 * k));
      }
    }
    int crc = Crc16.compute(p, 0, n);
    p[n++] = (byte) (crc >>> 8);
    p[n++] = (byte) crc;
    int w = Cobs.encode(p, 0, n, out, off);
    out[off + w] = 0;
    return w + 1;
  }

  private static int appendCrcAndEnd(byte[] out, int w, int crc) {
    out[w++] = ' ';
    out[w++] = '~';
    out[w++] = HEX[(crc >>> 12) & 0xF];
    out[w++] = HEX[(crc >>> 8) & 0xF];
    out[w++] = HEX[(crc >>> 4) & 0xF];
    out[w++] = HEX[crc & 0xF];
    out[w++] = '\n';
    return w;
  }

  private static int writeLong(byte[] out, int w, long v) {
    if (v == 0) {
      out[w++] = '0';
      return w;
    }
    if (v < 0) {
      out[w++] = '-';
      v = -v;
    }
    int start = w;
    while (v > 0) {
      out[w++] = (byte) ('0' + (v % 10));
      v /= 10;
    }
    for (int i = start, j = w - 1; i < j; i++, j--) {
      byte t = out[i];
      out[i] = out[j];
      out[j] = t;
    }
    return w;
  }
}
