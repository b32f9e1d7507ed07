package org.loadstone.device;

import java.util.ArrayList;
import java.util.List;

/**
 * A slow, plain decoder of the samples in a byte stream, written from PROTOCOL.md alone (text
 * lines and COBS frames, CRC-16/CCITT-FALSE computed bit by bit, the suffix search of "Decoder
 * details" 1 and 3), used by the fault tests as the oracle for what the real decoder must
 * accept. It reads one encoding per stream and only sample records.
 */
final class ReferenceDecoder {
  /** One sample as sent: sequence, device clock, load and position (or null). */
  record Sample(int seq, long deviceUs, int load, Integer pos) {}

  private ReferenceDecoder() {}

  /** CRC-16/CCITT-FALSE, one bit at a time (PROTOCOL.md "Checksum"; check value 0x29B1). */
  static int crc16(byte[] b, int from, int to) {
    int crc = 0xFFFF;
    for (int i = from; i < to; i++) {
      crc ^= (b[i] & 0xFF) << 8;
      for (int k = 0; k < 8; k++) {
        crc = (crc & 0x8000) != 0 ? ((crc << 1) ^ 0x1021) & 0xFFFF : (crc << 1) & 0xFFFF;
      }
    }
    return crc;
  }

  /** @return the samples of a text stream, in order */
  static List<Sample> text(byte[] b) {
    List<Sample> out = new ArrayList<>();
    int start = 0;
    for (int p = 0; p < b.length; p++) {
      if (b[p] == '\n') {
        for (int s = start; s <= p; s++) { // the earliest start that gives a record wins
          Sample r = textLine(b, s, p);
          if (r != null) {
            out.add(r);
            break;
          }
        }
        start = p + 1;
      }
    }
    return out;
  }

  /** {@code b[from..lf]}: {@code body " ~" 4HEX CR? LF} with a sample body, or null. */
  private static Sample textLine(byte[] b, int from, int lf) {
    int end = lf;
    if (end > from && b[end - 1] == '\r') {
      end--;
    }
    if (end - from < 8 || b[end - 6] != ' ' || b[end - 5] != '~') {
      return null;
    }
    int crc = 0;
    for (int i = end - 4; i < end; i++) {
      int d = Character.digit(b[i], 16);
      if (d < 0) {
        return null;
      }
      crc = crc * 16 + d;
    }
    int bodyEnd = end - 6;
    String body = new String(b, from, bodyEnd - from, java.nio.charset.StandardCharsets.ISO_8859_1);
    String[] f = body.split(" ", -1);
    if (!f[0].equals("S") || (f.length != 4 && f.length != 5)) {
      return null;
    }
    Long seq = number(f[1], 0, 65535);
    Long us = number(f[2], 0, 4_294_967_295L);
    Long load = number(f[3], Integer.MIN_VALUE, Integer.MAX_VALUE);
    Long pos = f.length == 5 ? number(f[4], Integer.MIN_VALUE, Integer.MAX_VALUE) : null;
    if (seq == null || us == null || load == null || (f.length == 5 && pos == null)
        || crc16(b, from, bodyEnd) != crc) {
      return null;
    }
    return new Sample(seq.intValue(), us, load.intValue(), pos == null ? null : pos.intValue());
  }

  /** A canonical decimal (no "+", no leading zeros, no "-0") within the range, or null. */
  private static Long number(String s, long min, long max) {
    if (!s.matches("-?(0|[1-9][0-9]{0,10})") || s.equals("-0")) {
      return null;
    }
    long v = Long.parseLong(s);
    return v < min || v > max ? null : v;
  }

  /** @return the samples of a binary stream, in order */
  static List<Sample> binary(byte[] b) {
    List<Sample> out = new ArrayList<>();
    int start = 0;
    for (int p = 0; p < b.length; p++) {
      if (b[p] == 0) {
        for (int s = start; s < p; s++) {
          Sample r = frame(b, s, p);
          if (r != null) {
            out.add(r);
            break;
          }
        }
        start = p + 1;
      }
    }
    return out;
  }

  /** COBS-decodes {@code b[from..to)} and reads a sample payload, or null. */
  private static Sample frame(byte[] b, int from, int to) {
    byte[] payload = new byte[to - from];
    int n = 0;
    int i = from;
    while (i < to) {
      int code = b[i] & 0xFF; // never 0 inside a candidate
      if (i + code > to) {
        return null;
      }
      for (int k = 1; k < code; k++) {
        payload[n++] = b[i + k];
      }
      i += code;
      if (code < 0xFF && i < to) {
        payload[n++] = 0;
      }
    }
    int type = n > 0 ? payload[0] & 0xFF : -1;
    if (!(type == 1 && n == 13) && !(type == 2 && n == 17)) {
      return null;
    }
    int crc = ((payload[n - 2] & 0xFF) << 8) | (payload[n - 1] & 0xFF);
    if (crc16(payload, 0, n - 2) != crc) {
      return null;
    }
    java.nio.ByteBuffer le = java.nio.ByteBuffer.wrap(payload, 1, n - 3)
        .order(java.nio.ByteOrder.LITTLE_ENDIAN);
    int seq = le.getShort() & 0xFFFF;
    long us = le.getInt() & 0xFFFF_FFFFL;
    int load = le.getInt();
    Integer pos = type == 2 ? le.getInt() : null;
    return new Sample(seq, us, load, pos);
  }
}
