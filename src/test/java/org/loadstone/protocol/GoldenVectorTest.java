package org.loadstone.protocol;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Walks firmware-protocol/vectors/*.vec (format in that folder's README) through the Java decoder.
 * The firmware's host-compiled C suite walks the same files.
 */
class GoldenVectorTest {
  static Path vectorsDir() {
    return Path.of(System.getProperty("loadstone.projectDir", "."), "firmware-protocol", "vectors");
  }

  static Stream<Path> vectors() throws IOException {
    List<Path> files = new ArrayList<>();
    try (Stream<Path> s = Files.list(vectorsDir())) {
      s.filter(p -> p.toString().endsWith(".vec")).sorted().forEach(files::add);
    }
    assertThat(files).as("golden vectors present").hasSizeGreaterThanOrEqualTo(16);
    return files.stream();
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("vectors")
  void decodesAsSpecified(Path file) throws IOException {
    Vector v = Vector.read(file);
    CollectingListener out = new CollectingListener();
    StreamDecoder d = new StreamDecoder(out, v.start);
    int i = 0;
    int k = 0;
    while (i < v.input.length) {
      int n = v.chunks.isEmpty() ? v.input.length : v.chunks.get(k++ % v.chunks.size());
      n = Math.min(n, v.input.length - i);
      d.feed(v.input, i, n);
      i += n;
    }
    List<String> got = new ArrayList<>();
    for (Object o : out.all) {
      if (o instanceof RawSample s) {
        got.add("sample " + s.seq() + " " + s.deviceUs() + " " + s.counts() + " "
            + (s.hasPosition() ? Integer.toString(s.positionCounts()) : "-"));
      } else {
        got.add("message " + ((DeviceMessage) o).body());
      }
    }
    assertThat(got).as(file.getFileName().toString()).containsExactlyElementsOf(v.expected);
    DecoderCounters c = d.counters();
    Map<String, Long> actual = new LinkedHashMap<>();
    actual.put("samples", c.samples());
    actual.put("messages", c.messages());
    actual.put("checksum_errors", c.checksumErrors());
    actual.put("resyncs", c.resyncs());
    actual.put("dropped", c.dropped());
    actual.put("unknown", c.unknown());
    for (Map.Entry<String, Long> e : v.counters.entrySet()) {
      assertThat(actual.get(e.getKey()))
          .as(file.getFileName() + " counter " + e.getKey())
          .isEqualTo(e.getValue());
    }
  }

  /** One parsed vector file. */
  static final class Vector {
    Encoding start;
    List<Integer> chunks = new ArrayList<>();
    byte[] input;
    List<String> expected = new ArrayList<>();
    Map<String, Long> counters = new LinkedHashMap<>();

    static Vector read(Path file) throws IOException {
      Vector v = new Vector();
      ByteArrayOutputStream in = new ByteArrayOutputStream();
      int lineNo = 0;
      for (String line : Files.readAllLines(file, StandardCharsets.UTF_8)) {
        lineNo++;
        if (line.isBlank() || line.startsWith("#")) {
          continue;
        }
        String where = file.getFileName() + ":" + lineNo;
        if (line.startsWith("mode ")) {
          String m = line.substring(5).trim();
          v.start = m.equals("auto") ? null : Encoding.parse(m);
        } else if (line.startsWith("chunks ")) {
          for (String t : line.substring(7).trim().split("\\s+")) {
            v.chunks.add(Integer.parseInt(t));
          }
        } else if (line.startsWith("in hex")) {
          for (String t : line.substring(6).trim().split("\\s+")) {
            if (!t.isEmpty()) {
              in.write(Integer.parseInt(t, 16));
            }
          }
        } else if (line.startsWith("in text ")) {
          in.writeBytes(unescape(line.substring(8), where));
        } else if (line.startsWith("out ")) {
          v.expected.add(line.substring(4));
        } else if (line.startsWith("counters")) {
          for (String t : line.substring(8).trim().split("\\s+")) {
            String[] kv = t.split("=");
            v.counters.put(kv[0], Long.parseLong(kv[1]));
          }
        } else {
          throw new IllegalStateException(where + ": unknown directive: " + line);
        }
      }
      v.input = in.toByteArray();
      return v;
    }

    static byte[] unescape(String s, String where) {
      ByteArrayOutputStream b = new ByteArrayOutputStream();
      for (int i = 0; i < s.length(); i++) {
        char c = s.charAt(i);
        if (c != '\\') {
          b.write(c);
          continue;
        }
        char n = s.charAt(++i);
        switch (n) {
          case 'n' -> b.write('\n');
          case 'r' -> b.write('\r');
          case '\\' -> b.write('\\');
          case 'x' -> {
            b.write(Integer.parseInt(s.substring(i + 1, i + 3), 16));
            i += 2;
          }
          default -> throw new IllegalStateException(where + ": bad escape \\" + n);
        }
      }
      return b.toByteArray();
    }
  }
}
