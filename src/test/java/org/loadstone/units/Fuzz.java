package org.loadstone.units;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import java.util.Random;
import java.util.stream.Stream;

/**
 * Damaged copies of valid input, for fuzzing every reader: bit flips, substituted, inserted and
 * deleted bytes, bursts, cut ends, lines repeated, dropped or swapped, and tokens that readers
 * trip on (NaN, 1e400, quotes, separators, line ends, a NUL, byte-order marks, bytes that are not
 * UTF-8, a long cell). Each copy is fixed by its seed, so a failure reported by jqwik with its
 * seed is reproduced exactly.
 *
 * <p>Tries are kept modest for CI; {@code -Dloadstone.fuzz.scale=N} ({@code mvn -P fuzz test}:
 * 50) makes each try test N copies instead of one.
 */
public final class Fuzz {
  private Fuzz() {}

  /** Copies tested per try: 1 normally, more in the long run. */
  public static final int SCALE = Math.max(1, Integer.getInteger("loadstone.fuzz.scale", 1));

  private static final byte[][] TOKENS = tokens();

  private static byte[][] tokens() {
    List<byte[]> t = new ArrayList<>();
    for (String s : List.of("NaN", "Infinity", "-Infinity", "1e400", "-1e400", "1e308", "-0",
        "4.9e-324", "\"", "\"\"", ",", ";", "\t", " ", "\n", "\r\n", "\r", "\u0000", "null",
        "{", "}", "[", "]", ":", "true", "\"x\"", "9223372036854775808", "-2147483649",
        "2147483648", "0x1p3", "+5", "1,5", "e", "-", ".", "é", "µm", "\u2028",
        "x".repeat(300), "9".repeat(400), "#", "//", "/*")) {
      t.add(s.getBytes(StandardCharsets.UTF_8));
    }
    t.add(new byte[] {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF}); // UTF-8 byte-order mark
    t.add(new byte[] {(byte) 0xFF, (byte) 0xFE}); // UTF-16 LE byte-order mark
    t.add(new byte[] {(byte) 0xC3}); // a cut two-byte sequence
    t.add(new byte[] {(byte) 0xE4}); // Latin-1 'ä'
    t.add(new byte[] {(byte) 0xED, (byte) 0xA0, (byte) 0x80}); // a UTF-16 surrogate as UTF-8
    t.add(new byte[] {(byte) 0xF4, (byte) 0x90, (byte) 0x80, (byte) 0x80}); // beyond U+10FFFF
    return t.toArray(byte[][]::new);
  }

  /**
   * A damaged copy of {@code valid}.
   *
   * @param valid a valid input, not modified
   * @param seed fixes the damage
   * @return the copy with 1 to 8 pieces of damage
   */
  public static byte[] mutate(byte[] valid, long seed) {
    Random r = new Random(seed);
    byte[] b = valid.clone();
    int edits = 1 + r.nextInt(r.nextInt(4) == 0 ? 8 : 2);
    for (int e = 0; e < edits; e++) {
      b = once(b, r);
    }
    return b;
  }

  private static byte[] once(byte[] b, Random r) {
    int n = b.length;
    int at = n == 0 ? 0 : r.nextInt(n);
    switch (r.nextInt(11)) {
      case 0: // flip one bit
        if (n > 0) {
          b[at] ^= (byte) (1 << r.nextInt(8));
        }
        return b;
      case 1: // substitute a byte
        if (n > 0) {
          b[at] = (byte) r.nextInt(256);
        }
        return b;
      case 2: // insert random bytes
        return splice(b, at, 0, randomBytes(r, 1 + r.nextInt(4)));
      case 3: // delete bytes
        return splice(b, at, Math.min(n - at, 1 + r.nextInt(4)), new byte[0]);
      case 4: // a burst: a run of bytes replaced by noise
        int len = Math.min(n - at, 1 + r.nextInt(32));
        return splice(b, at, len, randomBytes(r, len));
      case 5: // cut the end off
        return Arrays.copyOf(b, at);
      case 6: // a line repeated
      case 7: // a line dropped
      case 8: // two lines swapped
        return lines(b, r, r.nextInt(3));
      default: // a token a reader may trip on, inserted or replacing a field
        byte[] tok = TOKENS[r.nextInt(TOKENS.length)];
        int cut = r.nextBoolean() ? 0 : fieldLength(b, at);
        return splice(b, at, cut, tok);
    }
  }

  /** @return the length of the field starting at {@code at}: up to a separator or line end */
  private static int fieldLength(byte[] b, int at) {
    int i = at;
    while (i < b.length && b[i] != ',' && b[i] != ';' && b[i] != '\n' && b[i] != '"'
        && b[i] != ':' && b[i] != ' ') {
      i++;
    }
    return i - at;
  }

  private static byte[] lines(byte[] b, Random r, int how) {
    List<byte[]> ls = new ArrayList<>();
    int start = 0;
    for (int i = 0; i < b.length; i++) {
      if (b[i] == '\n') {
        ls.add(Arrays.copyOfRange(b, start, i + 1));
        start = i + 1;
      }
    }
    if (start < b.length) {
      ls.add(Arrays.copyOfRange(b, start, b.length));
    }
    if (ls.isEmpty()) {
      return b;
    }
    int i = r.nextInt(ls.size());
    int j = r.nextInt(ls.size());
    switch (how) {
      case 0 -> ls.add(i, ls.get(i));
      case 1 -> ls.remove(i);
      default -> {
        byte[] x = ls.get(i);
        ls.set(i, ls.get(j));
        ls.set(j, x);
      }
    }
    java.io.ByteArrayOutputStream out = new java.io.ByteArrayOutputStream(b.length + 64);
    ls.forEach(out::writeBytes);
    return out.toByteArray();
  }

  /** @return {@code b} with {@code remove} bytes at {@code at} replaced by {@code insert} */
  public static byte[] splice(byte[] b, int at, int remove, byte[] insert) {
    byte[] out = new byte[b.length - remove + insert.length];
    System.arraycopy(b, 0, out, 0, at);
    System.arraycopy(insert, 0, out, at, insert.length);
    System.arraycopy(b, at + remove, out, at + insert.length, b.length - at - remove);
    return out;
  }

  private static byte[] randomBytes(Random r, int n) {
    byte[] x = new byte[n];
    r.nextBytes(x);
    return x;
  }

  /**
   * Writes {@link #SCALE} damaged copies of {@code valid} to {@code file} in turn, the first
   * fixed by {@code seed}, and checks each.
   */
  public static void eachCopy(byte[] valid, long seed, Path file,
      java.util.function.Consumer<Path> check) {
    for (int k = 0; k < SCALE; k++) {
      check.accept(write(file, mutate(valid, seed + k)));
    }
  }

  /** Something that reads input and may fail. */
  @FunctionalInterface
  public interface Read<T> {
    /** @return what was read */
    T read() throws Exception;
  }

  /**
   * Reads, and requires either a result or the project's own exception with a plain message;
   * anything else (a library exception, an {@code IllegalArgumentException}, an error) is
   * rethrown so that the property fails and jqwik reports the input.
   *
   * @return the result, or null when the input was refused
   */
  public static <T> T readOrRefuse(Read<T> read) {
    try {
      return read.read();
    } catch (LoadstoneException e) {
      plainMessage(e);
      return null;
    } catch (RuntimeException | Error e) {
      throw e;
    } catch (Exception e) {
      throw new AssertionError("a checked exception escaped: " + e, e);
    }
  }

  /** A refusal's message: present, bounded, naming no library class or setting. */
  public static void plainMessage(LoadstoneException e) {
    String m = e.getMessage();
    assertThat(m).as("message of %s", e).isNotBlank();
    assertThat(m.length()).as("length of: %s", m).isLessThan(3000);
    assertThat(m).as("library words in: %s", m).doesNotContain("Exception", "org.apache",
        "com.fasterxml", "java.", "Input length", "Feature", "ALLOW_", "JsonToken",
        "Unexpected character", "CSVRecord", "sqlite", "SQLITE");
  }

  /** @return a fresh folder under the system's temporary folder */
  public static Path tempDir(String name) {
    try {
      return Files.createTempDirectory("loadstone-fuzz-" + name);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  /** Deletes a folder and what it holds. */
  public static void delete(Path dir) {
    if (dir == null || !Files.exists(dir)) {
      return;
    }
    try (Stream<Path> s = Files.walk(dir)) {
      s.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  /** Writes bytes to a file, replacing it (test scratch only). */
  public static Path write(Path file, byte[] bytes) {
    try {
      Files.createDirectories(file.getParent());
      return Files.write(file, bytes);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }
}
