package org.loadstone.protocol;

import java.nio.charset.StandardCharsets;
import java.util.Optional;

/**
 * The general rules for one text line (firmware-protocol/PROTOCOL.md, "Text encoding" and
 * "Decoder details"): shape, tag, printable body, CRC, then the sample fields or the message. It
 * parses and classifies; {@link StreamDecoder} delivers and counts. No side effects except on the
 * {@code out} sample and the last message.
 */
final class TextLineParser {
  static final int MALFORMED = 1;
  static final int BAD_CRC = 2;
  static final int SAMPLE = 3;
  static final int MESSAGE = 4;
  static final int UNKNOWN = 5;

  /** Longest text line without its line end, body and checksum included. */
  private static final int MAX_TEXT_BODY = 200;

  private DeviceMessage message;

  static boolean isUpper(byte b) {
    return b >= 'A' && b <= 'Z';
  }

  /**
   * Parses one text line [s, e) of {@code buf}, without its line end.
   *
   * @param out receives the sample when the result is {@link #SAMPLE}
   * @return {@link #SAMPLE}, {@link #MESSAGE} (see {@link #message()}), {@link #UNKNOWN},
   *     {@link #BAD_CRC} or {@link #MALFORMED}
   */
  int parse(byte[] buf, int s, int e, SampleFastPath.Fields out) {
    // body " ~" 4 hex
    if (e - s < 7 || e - s > MAX_TEXT_BODY) { // the shortest: a one-letter tag, " ~", four digits
      return MALFORMED;
    }
    int tilde = e - 5;
    if (buf[tilde] != '~' || buf[tilde - 1] != ' ') {
      return MALFORMED;
    }
    int crc = SampleFastPath.hex4(buf, tilde + 1);
    if (crc < 0) {
      return MALFORMED;
    }
    int bodyEnd = tilde - 1;
    int t = s;
    while (t < bodyEnd && isUpper(buf[t])) {
      t++;
    }
    int tagLen = t - s;
    if (tagLen < 1 || tagLen > 3 || (t < bodyEnd && buf[t] != ' ')) {
      return MALFORMED;
    }
    for (int k = s; k < bodyEnd; k++) {
      if (buf[k] < 0x20 || buf[k] > 0x7E) {
        return MALFORMED;
      }
    }
    if (Crc16.compute(buf, s, bodyEnd - s) != crc) {
      return BAD_CRC;
    }
    if (tagLen == 1 && buf[s] == 'S') {
      return sample(buf, s + 1, bodyEnd, out) ? SAMPLE : MALFORMED;
    }
    return message(buf, s, bodyEnd);
  }

  private final long[] fields = new long[4];

  /** Parses " seq us load [pos]" from [p, e). */
  private boolean sample(byte[] buf, int p, int e, SampleFastPath.Fields out) {
    int n = 0;
    while (p < e) {
      if (buf[p] != ' ' || n == 4) {
        return false;
      }
      p++;
      int q = p;
      boolean neg = false;
      if (q < e && buf[q] == '-') {
        neg = true;
        q++;
      }
      int digitsStart = q;
      long v = 0;
      while (q < e && buf[q] >= '0' && buf[q] <= '9') {
        v = v * 10 + (buf[q] - '0');
        if (v > 0x1_0000_0000L) {
          return false;
        }
        q++;
      }
      if (q == digitsStart || (q < e && buf[q] != ' ')) {
        return false;
      }
      if (buf[digitsStart] == '0' && (q - digitsStart > 1 || neg)) {
        return false; // no leading zeros, no "-0"
      }
      fields[n++] = neg ? -v : v;
      p = q;
    }
    if (n < 3) {
      return false;
    }
    long seq = fields[0];
    long us = fields[1];
    if (seq < 0 || seq > RawSample.SEQ_MAX || us < 0 || us > RawSample.TIME_MAX_US) {
      return false;
    }
    if (!SampleFastPath.fitsInt(fields[2]) || (n == 4 && !SampleFastPath.fitsInt(fields[3]))) {
      return false;
    }
    out.seq = (int) seq;
    out.us = us;
    out.load = (int) fields[2];
    out.hasPos = n == 4;
    out.pos = n == 4 ? (int) fields[3] : 0;
    return true;
  }

  private int message(byte[] buf, int s, int e) {
    String body = new String(buf, s, e - s, StandardCharsets.US_ASCII);
    int sp = body.indexOf(' ');
    String tag = sp < 0 ? body : body.substring(0, sp);
    if (!DeviceMessage.isKnownTag(tag)) {
      return UNKNOWN;
    }
    Optional<DeviceMessage> m = DeviceMessage.parse(body);
    if (m.isEmpty()) {
      return MALFORMED;
    }
    message = m.get();
    return MESSAGE;
  }

  /** @return the message of the last {@link #MESSAGE} result */
  DeviceMessage message() {
    return message;
  }
}
