package org.loadstone.units;

import java.io.IOException;
import java.io.InputStream;
import java.io.Reader;
import java.io.StringWriter;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;

/**
 * The one way Loadstone reads a text file, so every reader treats encodings alike: UTF-8, with
 * or without a byte-order mark (the mark is skipped); anything else (UTF-16, Windows-1252,
 * ISO-8859-1, binary data) is refused with an {@link InputException} naming the file, the line
 * and byte of the first bad byte, the encoding it looks like, and the fix (save as UTF-8).
 */
public final class TextFiles {
  private static final String FIX = "save the file as UTF-8 text (in a spreadsheet: 'CSV UTF-8')";

  private TextFiles() {}

  /**
   * @param file the file, not null
   * @param what the kind of file for messages ("run file", "points file"), not null
   * @return the whole text, without a leading byte-order mark
   * @throws InputException when the file is missing, a folder, unreadable or not UTF-8
   */
  public static String read(Path file, String what) {
    try (Reader r = open(file, what)) {
      StringWriter w = new StringWriter();
      r.transferTo(w);
      return w.toString();
    } catch (IOException e) {
      throw unreadable(file, what, e);
    }
  }

  /**
   * Opens a file for streaming. Reading throws {@link InputException} (unchecked) at the first
   * byte that is not UTF-8, naming its line.
   *
   * @throws InputException when the file is missing, a folder or unreadable
   */
  public static Reader open(Path file, String what) {
    Precondition.notNull(file, "file");
    Precondition.notNull(what, "what");
    if (Files.isDirectory(file)) {
      throw InputException.in(what, file).fault("is a folder, not a file", "give the file's path");
    }
    try {
      return new Utf8Reader(Files.newInputStream(file), file, what);
    } catch (IOException e) {
      throw unreadable(file, what, e);
    }
  }

  /** @return the I/O failure {@code e} on {@code file} as a message a user can act on */
  public static InputException unreadable(Path file, String what, IOException e) {
    InputException.Where w = InputException.in(what, file);
    if (e instanceof NoSuchFileException) {
      return w.fault("does not exist", "check the path", e);
    }
    if (e instanceof AccessDeniedException) {
      return w.fault("cannot be read: permission denied", "check the file's permissions", e);
    }
    String why = e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
    return w.fault("cannot be read (" + why + ")", "check the path, the disk and permissions", e);
  }

  /** A strict UTF-8 reader that skips a leading byte-order mark and counts lines. */
  private static final class Utf8Reader extends Reader {
    private final InputStream in;
    private final Path file;
    private final String what;
    private final CharsetDecoder decoder = StandardCharsets.UTF_8.newDecoder()
        .onMalformedInput(CodingErrorAction.REPORT)
        .onUnmappableCharacter(CodingErrorAction.REPORT);
    private final ByteBuffer bytes = ByteBuffer.allocate(1 << 16);
    private long bytesBefore; // bytes of the file before bytes' start
    private long line = 1;
    private boolean eof;
    private boolean started;
    private boolean flushed;
    private InputException pending;

    Utf8Reader(InputStream in, Path file, String what) {
      this.in = in;
      this.file = file;
      this.what = what;
      bytes.flip();
    }

    @Override
    public int read(char[] cbuf, int off, int len) throws IOException {
      if (pending != null) {
        throw pending;
      }
      if (len == 0) {
        return 0;
      }
      if (flushed) {
        return -1; // the end was reached; a decoder must not be used after its flush
      }
      CharBuffer out = CharBuffer.wrap(cbuf, off, len);
      int badAt = -1;
      while (out.position() == off) {
        if (!eof && bytes.remaining() < 4) {
          fill();
        }
        if (!started) {
          started = true;
          if (skipMarks()) {
            throw pending;
          }
        }
        CoderResult cr = decoder.decode(bytes, out, eof);
        if (cr.isError()) {
          badAt = bytes.position();
          break;
        }
        if (eof && !bytes.hasRemaining()) {
          if (!flushed) {
            decoder.flush(out);
            flushed = true;
          }
          break;
        }
        if (cr.isUnderflow() && !eof) {
          fill();
        }
      }
      int n = out.position() - off;
      for (int i = off; i < off + n; i++) {
        if (cbuf[i] == '\n') {
          line++;
        }
      }
      if (badAt >= 0) {
        pending = notUtf8(badAt);
      }
      if (n == 0) {
        if (pending != null) {
          throw pending;
        }
        return -1;
      }
      return n;
    }

    private void fill() throws IOException {
      bytesBefore += bytes.position();
      bytes.compact();
      int got = in.read(bytes.array(), bytes.position(), bytes.remaining());
      if (got < 0) {
        eof = true;
      } else {
        bytes.position(bytes.position() + got);
      }
      bytes.flip();
    }

    /** @return true when the text is refused by its mark */
    private boolean skipMarks() {
      int b0 = bytes.remaining() > 0 ? bytes.get(0) & 0xFF : -1;
      int b1 = bytes.remaining() > 1 ? bytes.get(1) & 0xFF : -1;
      int b2 = bytes.remaining() > 2 ? bytes.get(2) & 0xFF : -1;
      if (b0 == 0xEF && b1 == 0xBB && b2 == 0xBF) {
        bytes.position(3);
      } else if ((b0 == 0xFE && b1 == 0xFF) || (b0 == 0xFF && b1 == 0xFE)) {
        pending = InputException.in(what, file).fault(
            "is UTF-16 text (it starts with a UTF-16 byte-order mark), not UTF-8", FIX);
        return true;
      }
      return false;
    }

    private InputException notUtf8(int at) {
      int b = bytes.get(at) & 0xFF;
      String guess = b >= 0x80 ? "Windows-1252 or ISO-8859-1 (Latin-1)" : "another encoding";
      return InputException.in(what, file).line(line).fault(String.format(
          "is not UTF-8 text: byte %d (0x%02X) is not valid UTF-8; the file looks like %s",
          bytesBefore + at + 1, b, guess), FIX);
    }

    @Override
    public void close() throws IOException {
      in.close();
    }
  }
}
