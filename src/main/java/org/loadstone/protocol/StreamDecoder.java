package org.loadstone.protocol;

import java.nio.charset.StandardCharsets;
import java.util.Optional;
import org.loadstone.units.Precondition;

/**
 * Incremental decoder for wire protocol v1, both encodings at once (firmware-protocol/PROTOCOL.md,
 * "Decoder behaviour"). Feed it byte chunks of any size as they arrive; it calls the listener for
 * each record, counts checksum errors, resyncs, sequence gaps and unknown records, and never throws
 * on bad bytes. Not thread-safe: one feeding thread. Decoding a sample allocates nothing.
 */
public final class StreamDecoder {
  /** Longest candidate record considered, in bytes; older bytes are discarded. */
  public static final int MAX_CANDIDATE = 512;

  /** Longest text line without its line end, body and checksum included. */
  private static final int MAX_TEXT_BODY = 200;
  /** Longest record body (a 200-byte line less " ~XXXX"). */
  private static final int MAX_BODY = 194;

  private final DecodeListener listener;
  private final byte[] buf = new byte[64 * 1024];
  private final byte[] frame = new byte[MAX_CANDIDATE];
  private int len;
  private int end; // just past the terminator being handled
  private int lineStart;
  private int frameStart;
  private boolean lineOverflow;
  private boolean frameOverflow;
  private Encoding following;

  private int lastSeq = -1;
  private long samples;
  private long messages;
  private long checksumErrors;
  private long resyncs;
  private long dropped;
  private long unknown;
  private long bytes;

  /**
   * @param listener receives records; not null
   * @param start the encoding followed until the first valid record, or null to follow none
   *     until then (failures before the first valid record are not counted)
   */
  public StreamDecoder(DecodeListener listener, Encoding start) {
    this.listener = Precondition.notNull(listener, "listener");
    this.following = start;
  }

  /**
   * A decoder in automatic mode: it follows no encoding until the first valid record, so the noise
   * of a board booting or a port opening mid-record is not counted.
   */
  public StreamDecoder(DecodeListener listener) {
    this(listener, null);
  }

  /** @return the encoding of the last valid record (or the start encoding); empty in auto mode before the first record */
  public java.util.Optional<Encoding> following() {
    return java.util.Optional.ofNullable(following);
  }

  /** @return a snapshot of the counters */
  public DecoderCounters counters() {
    return new DecoderCounters(samples, messages, checksumErrors, resyncs, dropped, unknown, bytes);
  }

  /** Forgets the previous sample so the next one does not count as a gap (e.g. after STOP/START). */
  public void resetSequence() {
    lastSeq = -1;
  }

  /** Feeds a whole array. */
  public void feed(byte[] data) {
    feed(data, 0, data.length);
  }

  /**
   * Feeds {@code n} bytes from {@code data} at {@code off}.
   *
   * @throws IndexOutOfBoundsException when the range is outside the array (a caller mistake)
   */
  public void feed(byte[] data, int off, int n) {
    java.util.Objects.checkFromIndexSize(off, n, data.length);
    bytes += n;
    int i = off;
    int stop = off + n;
    while (i < stop) {
      if (len == buf.length) {
        compact();
      }
      int k = Math.min(stop - i, buf.length - len);
      System.arraycopy(data, i, buf, len, k);
      int from = len;
      len += k;
      i += k;
      scan(from);
    }
  }

  private static final java.lang.invoke.VarHandle LONGS = java.lang.invoke.MethodHandles
      .byteArrayViewVarHandle(long[].class, java.nio.ByteOrder.LITTLE_ENDIAN);
  private static final long ONES = 0x0101010101010101L;
  private static final long HIGHS = 0x8080808080808080L;
  private static final long LFS = 0x0A0A0A0A0A0A0A0AL;

  /**
   * Looks for record boundaries in buf[from, len). Eight bytes at a time: a word with neither a
   * 0x00 nor an LF byte (the classic "has a zero byte" bit trick) is skipped whole.
   */
  private void scan(int from) {
    byte[] b = buf;
    int n = len;
    int p = from;
    while (p < n) {
      if (p + 8 <= n) {
        long v = (long) LONGS.get(b, p);
        long lf = v ^ LFS;
        if (((((v - ONES) & ~v) | ((lf - ONES) & ~lf)) & HIGHS) == 0) {
          p += 8;
          continue;
        }
      }
      int stop = Math.min(n, p + 8);
      for (; p < stop; p++) {
        byte c = b[p];
        if (c == '\n') {
          end = p + 1;
          capLine(p);
          endOfLine();
        } else if (c == 0) {
          end = p + 1;
          capFrame(p);
          endOfFrame();
        }
      }
    }
    capLine(len);
    capFrame(len);
  }

  /** Keeps a text candidate ending at {@code at} (exclusive) to the newest MAX_CANDIDATE bytes. */
  private void capLine(int at) {
    if (at - lineStart > MAX_CANDIDATE) {
      lineStart = at - MAX_CANDIDATE;
      if (!lineOverflow && following == Encoding.TEXT) {
        resyncs++;
      }
      lineOverflow = true;
    }
  }

  private void capFrame(int at) {
    if (at - frameStart > MAX_CANDIDATE) {
      frameStart = at - MAX_CANDIDATE;
      if (!frameOverflow && following == Encoding.BINARY) {
        resyncs++;
      }
      frameOverflow = true;
    }
  }

  private void compact() {
    int base = Math.min(lineStart, frameStart);
    System.arraycopy(buf, base, buf, 0, len - base);
    len -= base;
    lineStart -= base;
    frameStart -= base;
  }

  // ---------------------------------------------------------------- text

  private void endOfLine() {
    int s = lineStart;
    int e = end - 1; // exclude LF
    if (e > s && buf[e - 1] == '\r') {
      e--;
    }
    lineOverflow = false;
    lineStart = end;
    if (e <= s) {
      return; // empty line
    }
    int r = parseLine(s, e);
    if (r == OK) {
      accepted(Encoding.TEXT);
      return;
    }
    for (int p = s + 1; p < e; p++) {
      if (isUpper(buf[p]) && parseLine(p, e) == OK) {
        accepted(Encoding.TEXT);
        return;
      }
    }
    if (following == Encoding.TEXT) {
      if (r == BAD_CRC) {
        checksumErrors++;
      } else {
        resyncs++;
      }
    }
  }

  private static boolean isUpper(byte b) {
    return b >= 'A' && b <= 'Z';
  }

  private static final int OK = 0;
  private static final int MALFORMED = 1;
  private static final int BAD_CRC = 2;

  /** Parses and delivers one text line [s, e) without its line end. */
  private int parseLine(int s, int e) {
    if (buf[s] == 'S' && e - s >= 12 && buf[s + 1] == ' ' && fastTextSample(s, e)) {
      return OK;
    }
    // body " ~" 4 hex
    if (e - s < 8 || e - s > MAX_TEXT_BODY) {
      return MALFORMED;
    }
    int tilde = e - 5;
    if (buf[tilde] != '~' || buf[tilde - 1] != ' ') {
      return MALFORMED;
    }
    int crc = 0;
    for (int k = tilde + 1; k < e; k++) {
      int h = hex(buf[k]);
      if (h < 0) {
        return MALFORMED;
      }
      crc = (crc << 4) | h;
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
      return textSample(s + 1, bodyEnd) ? OK : MALFORMED;
    }
    return textMessage(s, bodyEnd) ? OK : MALFORMED;
  }

  /**
   * The hot path: one pass over a well-formed sample line, checksum computed while parsing. Any
   * deviation returns false and the general parser classifies the line.
   */
  private boolean fastTextSample(int s, int e) {
    final byte[] b = buf;
    int bodyEnd = e - 6;
    if (b[bodyEnd] != ' ' || b[bodyEnd + 1] != '~' || s < 8 || bodyEnd + 8 > b.length) {
      return false;
    }
    int sent = 0;
    for (int k = bodyEnd + 2; k < e; k++) {
      int h = hex(b[k]);
      if (h < 0) {
        return false;
      }
      sent = (sent << 4) | h;
    }
    if (Crc16.compute(b, s, bodyEnd - s) != sent) {
      return false;
    }
    // the spaces between fields, found a word at a time
    int[] sp = spaces;
    int nsp = 0;
    for (int p = s + 1; p < bodyEnd; p += 8) {
      long x = (long) LONGS.get(b, p) ^ 0x2020202020202020L;
      long m = (x - ONES) & ~x & HIGHS;
      int left = bodyEnd - p;
      if (left < 8) {
        m &= (1L << (8 * left)) - 1;
      }
      while (m != 0) {
        if (nsp == 4) {
          return false;
        }
        sp[nsp++] = p + (Long.numberOfTrailingZeros(m) >>> 3);
        m &= m - 1;
      }
    }
    if (nsp < 3 || sp[0] != s + 1) {
      return false;
    }
    long[] f = fields;
    for (int i = 0; i < nsp; i++) {
      int start = sp[i] + 1;
      int end = i + 1 < nsp ? sp[i + 1] : bodyEnd;
      boolean neg = start < end && b[start] == '-';
      if (neg) {
        start++;
      }
      int digits = end - start;
      if (digits == 0 || digits > 10 || (b[start] == '0' && (digits > 1 || neg))) {
        return false;
      }
      long v = digits <= 8 ? digits8(b, end, digits)
          : digits8(b, end - 8, digits - 8) * 100_000_000L + digits8(b, end, 8);
      if (v < 0) {
        return false;
      }
      f[i] = neg ? -v : v;
    }
    int n = nsp;
    long seq = f[0];
    long us = f[1];
    if (seq < 0 || seq > RawSample.SEQ_MAX || us < 0 || us > RawSample.TIME_MAX_US
        || !fitsInt(f[2]) || (n == 4 && !fitsInt(f[3]))) {
      return false;
    }
    deliverSample((int) seq, us, (int) f[2], n == 4, n == 4 ? (int) f[3] : 0);
    return true;
  }

  private final int[] spaces = new int[4];

  /**
   * The value of the {@code len} (1…8) decimal digits that end just before {@code end}, read as
   * one 8-byte word (the bytes before the digits are masked to zero; Lemire's eight-digit SWAR
   * parse). Needs {@code end ≥ 8}: the fast path only runs on lines that start at buffer index 8
   * or later.
   *
   * @return the value, or -1 when a byte is not a decimal digit
   */
  private static long digits8(byte[] b, int end, int len) {
    long mask = -1L << (8 * (8 - len)); // the top len bytes hold the digits, first digit lowest
    long raw = (long) LONGS.get(b, end - 8) & mask;
    // every kept byte must be 0x30…0x39: high nibble 3, low nibble at most 9
    if ((raw & 0xF0F0F0F0F0F0F0F0L) != (0x3030303030303030L & mask)
        || (((raw & 0x0F0F0F0F0F0F0F0FL) + 0x0606060606060606L) & 0xF0F0F0F0F0F0F0F0L & mask) != 0) {
      return -1;
    }
    long w = raw - (0x3030303030303030L & mask);
    w = (w * 10) + (w >>> 8);
    return (((w & 0x000000FF000000FFL) * (100 + (1000000L << 32)))
        + (((w >>> 16) & 0x000000FF000000FFL) * (1 + (10000L << 32)))) >>> 32;
  }

  private static int hex(byte b) {
    if (b >= '0' && b <= '9') {
      return b - '0';
    }
    if (b >= 'A' && b <= 'F') {
      return b - 'A' + 10;
    }
    if (b >= 'a' && b <= 'f') {
      return b - 'a' + 10;
    }
    return -1;
  }

  private final long[] fields = new long[4];

  /** Parses " seq us load [pos]" from [p, e). */
  private boolean textSample(int p, int e) {
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
    if (!fitsInt(fields[2]) || (n == 4 && !fitsInt(fields[3]))) {
      return false;
    }
    deliverSample((int) seq, us, (int) fields[2], n == 4, n == 4 ? (int) fields[3] : 0);
    return true;
  }

  private static boolean fitsInt(long v) {
    return v >= Integer.MIN_VALUE && v <= Integer.MAX_VALUE;
  }

  private boolean textMessage(int s, int e) {
    String body = new String(buf, s, e - s, StandardCharsets.US_ASCII);
    int sp = body.indexOf(' ');
    String tag = sp < 0 ? body : body.substring(0, sp);
    if (!DeviceMessage.isKnownTag(tag)) {
      unknown++;
      return true;
    }
    Optional<DeviceMessage> m = DeviceMessage.parse(body);
    if (m.isEmpty()) {
      return false;
    }
    deliverMessage(m.get());
    return true;
  }

  // ---------------------------------------------------------------- binary

  private void endOfFrame() {
    int s = frameStart;
    int e = end - 1; // exclude the 0x00
    frameOverflow = false;
    frameStart = end;
    if (e <= s) {
      return; // empty frame: a leading delimiter
    }
    int r = parseFrame(s, e);
    if (r == OK) {
      accepted(Encoding.BINARY);
      return;
    }
    for (int p = s + 1; p < e; p++) {
      if (parseFrame(p, e) == OK) {
        accepted(Encoding.BINARY);
        return;
      }
    }
    if (following == Encoding.BINARY) {
      if (r == BAD_CRC) {
        checksumErrors++;
      } else {
        resyncs++;
      }
    }
  }

  private int parseFrame(int s, int e) {
    int n = Cobs.decode(buf, s, e - s, frame);
    if (n < 3) {
      return MALFORMED;
    }
    int type = frame[0] & 0xFF;
    int bodyLen = n - 3;
    boolean knownShape =
        (type == 0x01 && bodyLen == 10) || (type == 0x02 && bodyLen == 14) || (type == 0x10);
    int crc = ((frame[n - 2] & 0xFF) << 8) | (frame[n - 1] & 0xFF);
    if (Crc16.compute(frame, 0, n - 2) != crc) {
      return knownShape ? BAD_CRC : MALFORMED;
    }
    if (type == 0x01 || type == 0x02) {
      if (!knownShape) {
        return MALFORMED;
      }
      int seq = (frame[1] & 0xFF) | ((frame[2] & 0xFF) << 8);
      long us = le32(3) & 0xFFFF_FFFFL;
      int load = le32(7);
      boolean pos = type == 0x02;
      deliverSample(seq, us, load, pos, pos ? le32(11) : 0);
      return OK;
    }
    if (type == 0x10) {
      if (bodyLen < 1 || bodyLen > MAX_BODY) {
        return MALFORMED;
      }
      for (int k = 1; k < n - 2; k++) {
        if (frame[k] < 0x20 || frame[k] > 0x7E) {
          return MALFORMED;
        }
      }
      String body = new String(frame, 1, bodyLen, StandardCharsets.US_ASCII);
      int sp = body.indexOf(' ');
      String tag = sp < 0 ? body : body.substring(0, sp);
      if (tag.equals("S")) {
        return MALFORMED; // samples travel in 0x01/0x02 frames only
      }
      if (!DeviceMessage.isKnownTag(tag)) {
        unknown++;
        return OK;
      }
      Optional<DeviceMessage> m = DeviceMessage.parse(body);
      if (m.isEmpty()) {
        return MALFORMED;
      }
      deliverMessage(m.get());
      return OK;
    }
    unknown++;
    return OK;
  }

  private int le32(int at) {
    return (frame[at] & 0xFF)
        | ((frame[at + 1] & 0xFF) << 8)
        | ((frame[at + 2] & 0xFF) << 16)
        | ((frame[at + 3] & 0xFF) << 24);
  }

  // ---------------------------------------------------------------- delivery

  private void accepted(Encoding e) {
    following = e;
    lineStart = end;
    frameStart = end;
    lineOverflow = false;
    frameOverflow = false;
  }

  private void deliverSample(int seq, long us, int load, boolean hasPos, int pos) {
    if (lastSeq >= 0) {
      dropped += (seq - lastSeq - 1) & 0xFFFF;
    }
    lastSeq = seq;
    samples++;
    listener.onSample(seq, us, load, hasPos, pos);
  }

  private void deliverMessage(DeviceMessage m) {
    if (m instanceof DeviceMessage.Identity) {
      lastSeq = -1;
    }
    messages++;
    listener.onMessage(m);
  }
}
