package org.loadstone.protocol;

import java.nio.charset.StandardCharsets;
import java.util.Optional;

/**
 * The general rules for one binary frame (firmware-protocol/PROTOCOL.md, "Binary encoding" and
 * "Decoder details"): COBS, shape, CRC, then the sample or the message. It parses and classifies;
 * {@link StreamDecoder} delivers and counts, as for text lines ({@link TextLineParser}). No side
 * effects except on the {@code out} sample and the last message.
 */
final class FrameParser {
  /** Longest record body (a 200-byte line less " ~XXXX"). */
  private static final int MAX_BODY = 194;

  private final byte[] frame = new byte[StreamDecoder.MAX_CANDIDATE];
  private DeviceMessage message;

  /**
   * Parses the frame {@code buf[s, e)} without its 0x00 delimiter.
   *
   * @param out receives the sample when the result is {@link TextLineParser#SAMPLE}
   * @return {@link TextLineParser#SAMPLE}, {@link TextLineParser#MESSAGE} (see {@link
   *     #message()}), {@link TextLineParser#UNKNOWN}, {@link TextLineParser#BAD_CRC} or {@link
   *     TextLineParser#MALFORMED}
   */
  int parse(byte[] buf, int s, int e, SampleFastPath.Fields out) {
    int n = Cobs.decode(buf, s, e - s, frame);
    if (n < 3) {
      return TextLineParser.MALFORMED;
    }
    int type = frame[0] & 0xFF;
    int bodyLen = n - 3;
    boolean knownShape =
        (type == 0x01 && bodyLen == 10) || (type == 0x02 && bodyLen == 14) || (type == 0x10);
    int crc = ((frame[n - 2] & 0xFF) << 8) | (frame[n - 1] & 0xFF);
    if (Crc16.compute(frame, 0, n - 2) != crc) {
      return knownShape ? TextLineParser.BAD_CRC : TextLineParser.MALFORMED;
    }
    if (type == 0x01 || type == 0x02) {
      if (!knownShape) {
        return TextLineParser.MALFORMED;
      }
      out.seq = (frame[1] & 0xFF) | ((frame[2] & 0xFF) << 8);
      out.us = SampleFastPath.le32(frame, 3) & 0xFFFF_FFFFL;
      out.load = SampleFastPath.le32(frame, 7);
      out.hasPos = type == 0x02;
      out.pos = out.hasPos ? SampleFastPath.le32(frame, 11) : 0;
      return TextLineParser.SAMPLE;
    }
    if (type != 0x10) {
      return TextLineParser.UNKNOWN;
    }
    if (bodyLen < 1 || bodyLen > MAX_BODY) {
      return TextLineParser.MALFORMED;
    }
    for (int k = 1; k < n - 2; k++) {
      if (frame[k] < 0x20 || frame[k] > 0x7E) {
        return TextLineParser.MALFORMED;
      }
    }
    String body = new String(frame, 1, bodyLen, StandardCharsets.US_ASCII);
    int sp = body.indexOf(' ');
    String tag = sp < 0 ? body : body.substring(0, sp);
    if (tag.equals("S")) {
      return TextLineParser.MALFORMED; // samples travel in 0x01/0x02 frames only
    }
    if (!DeviceMessage.isKnownTag(tag)) {
      return TextLineParser.UNKNOWN;
    }
    Optional<DeviceMessage> m = DeviceMessage.parse(body);
    if (m.isEmpty()) {
      return TextLineParser.MALFORMED;
    }
    message = m.get();
    return TextLineParser.MESSAGE;
  }

  /** @return the message of the last {@link TextLineParser#MESSAGE} result */
  DeviceMessage message() {
    return message;
  }
}
