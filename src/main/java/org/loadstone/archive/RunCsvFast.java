package org.loadstone.archive;

import com.fasterxml.jackson.core.io.NumberInput;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;

/**
 * A fast reader for the archive's own sample file, exactly as {@link RunCsv#write} makes it: the
 * header {@value RunCsv#HEADER_TEXT}, "\n" line ends, unquoted cells, no blank lines. Bytes are
 * parsed in place into primitive columns sized by a first pass that counts the lines; no object
 * is made per sample.
 *
 * <p>It accepts only what {@link RunCsv#read} accepts and gives the very same numbers (the cell
 * grammar is the strict reader's, decimals are converted with correct rounding like {@link
 * Double#parseDouble}). Anything else, valid or not (quotes, CR LF, other columns, blank lines,
 * a bad cell), makes it answer {@code null}: the caller then reads the file with the strict
 * reader, which accepts what RFC 4180 allows and names the line and column of a fault.
 */
final class RunCsvFast {
  private static final byte[] HEADER =
      (RunCsv.HEADER_TEXT + "\n").getBytes(StandardCharsets.US_ASCII);
  private static final int CHUNK = 1 << 20;
  /** A line longer than this is not one the writer makes. */
  private static final int LONGEST_LINE = 512;
  private static final double[] POW10 = new double[23];
  private static final long EXACT_MANTISSA = 1L << 53;

  static {
    double p = 1;
    for (int i = 0; i < POW10.length; i++) {
      POW10[i] = p; // 10^0 … 10^22 are exact doubles
      p *= 10;
    }
  }

  /** Thrown inside the parser when the file is not plainly the writer's; never leaves. */
  private static final class NotPlain extends Exception {
    private static final long serialVersionUID = 1L;

    NotPlain() {
      super(null, null, false, false);
    }
  }

  private static final NotPlain NOT_PLAIN = new NotPlain();

  private final FileChannel ch;
  private final byte[] buf = new byte[CHUNK];
  private final char[] chars = new char[64];
  private int pos;
  private int limit;
  private boolean eof;

  private RunCsvFast(FileChannel ch) {
    this.ch = ch;
  }

  /**
   * @param csv a run's sample file
   * @return its columns, or {@code null} when the file is not plainly in the writer's format
   * @throws IOException when the file cannot be read
   */
  static RunData read(Path csv) throws IOException {
    try (FileChannel ch = FileChannel.open(csv, StandardOpenOption.READ)) {
      long lines = countLines(ch);
      if (lines - 1 > Integer.MAX_VALUE - 16) {
        return null;
      }
      ch.position(0);
      return new RunCsvFast(ch).parse((int) Math.max(0, lines - 1));
    } catch (NotPlain e) {
      return null;
    }
  }

  /** Lines in the file, counting a last line without "\n". */
  private static long countLines(FileChannel ch) throws IOException {
    ByteBuffer b = ByteBuffer.allocate(CHUNK);
    byte[] a = b.array();
    long lines = 0;
    int last = '\n';
    int got;
    while ((got = ch.read(b.clear())) >= 0) {
      int i = 0;
      for (; i + 8 <= got; i += 8) {
        // eight bytes at a time: each byte equal to LF becomes a zero byte, then one high bit
        long x = b.getLong(i) ^ 0x0A0A0A0A0A0A0A0AL;
        long low7 = (x & 0x7F7F7F7F7F7F7F7FL) + 0x7F7F7F7F7F7F7F7FL;
        lines += Long.bitCount(~(low7 | x | 0x7F7F7F7F7F7F7F7FL));
      }
      for (; i < got; i++) {
        if (a[i] == '\n') {
          lines++;
        }
      }
      if (got > 0) {
        last = a[got - 1];
      }
    }
    return last == '\n' ? lines : lines + 1;
  }

  private boolean fill() throws IOException {
    if (eof) {
      return false;
    }
    int rest = limit - pos;
    System.arraycopy(buf, pos, buf, 0, rest);
    pos = 0;
    limit = rest;
    ByteBuffer b = ByteBuffer.wrap(buf, limit, buf.length - limit);
    while (b.hasRemaining()) {
      if (ch.read(b) < 0) {
        eof = true;
        break;
      }
    }
    limit = b.position();
    return true;
  }

  private RunData parse(int n) throws IOException, NotPlain {
    fill();
    if (limit - pos < HEADER.length) {
      throw NOT_PLAIN;
    }
    for (byte h : HEADER) {
      if (buf[pos++] != h) {
        throw NOT_PLAIN;
      }
    }
    double[] t = new double[n];
    double[] f = new double[n];
    double[] p = null;
    int[] k = new int[n];
    int[] rp = null;
    int[] s = new int[n];
    int i = 0;
    boolean hasPos = false;
    while (true) {
      if (limit - pos < LONGEST_LINE && !eof) {
        fill();
      }
      if (pos >= limit) {
        break;
      }
      if (i >= n) {
        throw NOT_PLAIN; // the file grew since it was counted
      }
      double tv = decimal();
      if (i > 0 && !(tv > t[i - 1])) {
        throw NOT_PLAIN;
      }
      t[i] = tv;
      comma();
      f[i] = decimal();
      comma();
      boolean rowPos = pos < limit && buf[pos] != ',';
      if (i == 0) {
        hasPos = rowPos;
        if (hasPos) {
          p = new double[n];
          rp = new int[n];
        }
      } else if (rowPos != hasPos) {
        throw NOT_PLAIN;
      }
      if (rowPos) {
        p[i] = decimal();
      }
      comma();
      k[i] = integer();
      comma();
      if (rowPos) {
        rp[i] = integer();
      } else if (pos < limit && buf[pos] != ',') {
        throw NOT_PLAIN;
      }
      comma();
      int sv = integer();
      if (sv < 0 || sv > 0xFFFF) {
        throw NOT_PLAIN;
      }
      s[i] = sv;
      if (pos >= limit && !eof) {
        throw NOT_PLAIN; // a line longer than any the writer makes
      }
      if (pos < limit) {
        if (buf[pos] != '\n') {
          throw NOT_PLAIN;
        }
        pos++;
      }
      i++;
    }
    if (i != n) {
      throw NOT_PLAIN; // blank lines, or the file changed since it was counted
    }
    return new RunData(t, f, hasPos ? p : null, k, hasPos ? rp : null, s);
  }

  private void comma() throws NotPlain {
    if (pos >= limit || buf[pos] != ',') {
      throw NOT_PLAIN;
    }
    pos++;
  }

  private static boolean ends(byte c) {
    return c == ',' || c == '\n';
  }

  /**
   * A decimal cell, grammar {@code [-+]?([0-9]+\.?[0-9]*|\.[0-9]+)([eE][-+]?[0-9]+)?}, finite.
   * Up to 18 significant digits are gathered into a long (19 could pass 2^63 and turn the sign:
   * the long fuzz run found 9223372036854775808 read as its negative); when that long and the power of ten
   * are both exact doubles one division or multiplication is correctly rounded (Clinger's fast
   * path), otherwise Jackson's port of the Eisel–Lemire method converts the text.
   */
  private double decimal() throws NotPlain {
    final int start = pos;
    int i = pos;
    boolean neg = false;
    if (i < limit && (buf[i] == '-' || buf[i] == '+')) {
      neg = buf[i] == '-';
      i++;
    }
    long m = 0;
    int sig = 0;
    int exp = 0;
    int digits = 0;
    boolean exact = true;
    int c;
    while (i < limit && (c = buf[i] - '0') >= 0 && c <= 9) {
      if (sig < 18) {
        if (m != 0 || c != 0) {
          m = m * 10 + c;
          sig++;
        }
      } else {
        exact = false;
        exp++;
      }
      digits++;
      i++;
    }
    if (i < limit && buf[i] == '.') {
      i++;
      while (i < limit && (c = buf[i] - '0') >= 0 && c <= 9) {
        if (sig < 18) {
          if (m != 0 || c != 0) {
            m = m * 10 + c;
            sig++;
          }
          exp--;
        } else {
          exact = false;
        }
        digits++;
        i++;
      }
    }
    if (digits == 0) {
      throw NOT_PLAIN;
    }
    if (i < limit && (buf[i] == 'e' || buf[i] == 'E')) {
      i++;
      boolean eneg = false;
      if (i < limit && (buf[i] == '-' || buf[i] == '+')) {
        eneg = buf[i] == '-';
        i++;
      }
      int e = 0;
      int ed = 0;
      while (i < limit && (c = buf[i] - '0') >= 0 && c <= 9) {
        if (e < 100_000) {
          e = e * 10 + c;
        }
        ed++;
        i++;
      }
      if (ed == 0) {
        throw NOT_PLAIN;
      }
      exp += eneg ? -e : e;
    }
    if (i < limit && !ends(buf[i])) {
      throw NOT_PLAIN;
    }
    pos = i;
    double v;
    if (m == 0) {
      v = neg ? -0.0 : 0.0;
    } else if (exact && m < EXACT_MANTISSA && exp >= -22 && exp <= 22) {
      double d = m;
      d = exp >= 0 ? d * POW10[exp] : d / POW10[-exp];
      v = neg ? -d : d;
    } else {
      v = slow(start, i);
    }
    if (!Double.isFinite(v)) {
      throw NOT_PLAIN;
    }
    return v;
  }

  private double slow(int from, int to) {
    int len = to - from;
    if (len > chars.length) {
      return Double.parseDouble(new String(buf, from, len, StandardCharsets.US_ASCII));
    }
    for (int j = 0; j < len; j++) {
      chars[j] = (char) buf[from + j];
    }
    return NumberInput.parseDouble(chars, 0, len, true);
  }

  /** A whole-number cell, grammar {@code [-+]?[0-9]{1,10}}, within 32 bits. */
  private int integer() throws NotPlain {
    int i = pos;
    boolean neg = false;
    if (i < limit && (buf[i] == '-' || buf[i] == '+')) {
      neg = buf[i] == '-';
      i++;
    }
    long x = 0;
    int d = 0;
    int c;
    while (i < limit && (c = buf[i] - '0') >= 0 && c <= 9) {
      x = x * 10 + c;
      d++;
      i++;
    }
    if (d == 0 || d > 10 || (i < limit && !ends(buf[i]))) {
      throw NOT_PLAIN;
    }
    x = neg ? -x : x;
    if (x < Integer.MIN_VALUE || x > Integer.MAX_VALUE) {
      throw NOT_PLAIN;
    }
    pos = i;
    return (int) x;
  }
}
