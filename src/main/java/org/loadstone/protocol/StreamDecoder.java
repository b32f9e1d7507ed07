package org.loadstone.protocol;

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

  private final DecodeListener listener;
  private final boolean fastPath;
  /** Bytes kept between feeds; the buffer has {@link SampleFastPath#SLACK} spare bytes beyond. */
  private static final int BUF = 64 * 1024;

  private final byte[] buf = new byte[BUF + SampleFastPath.SLACK];
  private final SampleFastPath fast = new SampleFastPath();
  private final SampleFastPath.Fields slot = new SampleFastPath.Fields();
  private final TextLineParser lines = new TextLineParser();
  private final FrameParser frames = new FrameParser();
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
    this(listener, start, true);
  }

  private StreamDecoder(DecodeListener listener, Encoding start, boolean fastPath) {
    this.listener = Precondition.notNull(listener, "listener");
    this.following = start;
    this.fastPath = fastPath;
  }

  /**
   * A decoder that applies the general rules only, without the one-pass parser: the reference
   * the tests hold the fast decoder to.
   */
  static StreamDecoder generalRulesOnly(DecodeListener listener, Encoding start) {
    return new StreamDecoder(listener, start, false);
  }

  /**
   * A decoder in automatic mode: it follows no encoding until the first valid record, so the noise
   * of a board booting or a port opening mid-record is not counted.
   */
  public StreamDecoder(DecodeListener listener) {
    this(listener, null);
  }

  /** @return the encoding of the last valid record (or the start encoding); empty in auto mode before the first record */
  public Optional<Encoding> following() {
    return Optional.ofNullable(following);
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
      if (len == BUF) {
        compact();
      }
      int k = Math.min(stop - i, BUF - len);
      System.arraycopy(data, i, buf, len, k);
      int from = len;
      len += k;
      i += k;
      scan(from);
    }
  }

  /**
   * Looks for records in buf[from, len). At a record boundary the one-pass sample parser is tried
   * first; otherwise bytes are scanned for boundaries eight at a time: a word with neither a 0x00
   * nor an LF byte is skipped whole.
   */
  private void scan(int from) {
    byte[] b = buf;
    int n = len;
    int p = from;
    if (fastPath && lineStart == frameStart && lineStart < from && !lineOverflow && !frameOverflow) {
      // a record cut by the end of the last feed: no terminator in it so far, so nothing about it
      // has been decided, and the one-pass parser can take it whole now
      int q = fastSample(lineStart, n);
      if (q > 0) {
        p = q;
      }
    }
    while (p < n) {
      if (fastPath && (p == lineStart || p == frameStart)) {
        int q = fastSample(p, n);
        if (q > 0) {
          p = q;
          continue;
        }
      }
      if (p + 8 <= n && !SampleFastPath.hasZeroOrLf((long) SampleFastPath.LONGS.get(b, p))) {
        p += 8;
        continue;
      }
      int stop = Math.min(n, p + 8);
      for (; p < stop; p++) {
        byte c = b[p];
        if (c == '\n') {
          end = p + 1;
          capLine(p);
          endOfLine();
          p++;
          break; // a boundary: the next record may start here, so try the one-pass parser
        } else if (c == 0) {
          end = p + 1;
          capFrame(p);
          endOfFrame();
          p++;
          break;
        }
      }
    }
    capLine(len);
    capFrame(len);
  }

  /**
   * Tries the one-pass parser on the sample records starting at boundary {@code p}; what it
   * accepts the general path would accept, record by record, as the first record of the candidate.
   *
   * @return the index just past the last record decoded, or -1 to leave the bytes to the general
   *     path
   */
  private int fastSample(int p, int n) {
    if (p == lineStart && buf[p] == 'S') {
      int q = fast.textRun(buf, p, n, textSamples);
      if (q > p) {
        end = q;
        accepted(Encoding.TEXT);
        return q;
      }
    }
    if (p == frameStart) {
      int q = fast.binaryRun(buf, p, n, following == Encoding.BINARY && p == lineStart,
          binarySamples);
      if (q > p) {
        end = q;
        accepted(Encoding.BINARY);
        return q;
      }
    }
    return -1;
  }

  /**
   * Samples of a run of the one-pass parser: delivered, then the encoding followed, as a record
   * decoded on its own would be. (The field is written only when it changes: a reference store
   * costs a garbage-collector barrier on every sample.)
   */
  private final SampleFastPath.Sink textSamples = (seq, us, load, hasPos, pos) -> {
    deliverSample(seq, us, load, hasPos, pos);
    if (following != Encoding.TEXT) {
      following = Encoding.TEXT;
    }
  };

  private final SampleFastPath.Sink binarySamples = (seq, us, load, hasPos, pos) -> {
    deliverSample(seq, us, load, hasPos, pos);
    if (following != Encoding.BINARY) {
      following = Encoding.BINARY;
    }
  };

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
      if (TextLineParser.isUpper(buf[p]) && parseLine(p, e) == OK) {
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

  private static final int OK = 0;
  private static final int MALFORMED = TextLineParser.MALFORMED;
  private static final int BAD_CRC = TextLineParser.BAD_CRC;

  /** Parses and delivers one text line [s, e) without its line end. */
  private int parseLine(int s, int e) {
    return delivered(lines.parse(buf, s, e, slot), lines.message());
  }

  /** Delivers or counts what a parser classified; @return OK, BAD_CRC or MALFORMED */
  private int delivered(int kind, DeviceMessage message) {
    switch (kind) {
      case TextLineParser.SAMPLE:
        deliverSample(slot.seq, slot.us, slot.load, slot.hasPos, slot.pos);
        return OK;
      case TextLineParser.MESSAGE:
        deliverMessage(message);
        return OK;
      case TextLineParser.UNKNOWN:
        unknown++;
        return OK;
      case TextLineParser.BAD_CRC:
        return BAD_CRC;
      default:
        return MALFORMED;
    }
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
    return delivered(frames.parse(buf, s, e, slot), frames.message());
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
