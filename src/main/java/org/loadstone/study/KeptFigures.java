package org.loadstone.study;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.io.InputStream;
import java.lang.reflect.Constructor;
import java.lang.reflect.ParameterizedType;
import java.lang.reflect.RecordComponent;
import java.lang.reflect.Type;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.TreeMap;
import java.util.jar.JarEntry;
import java.util.jar.JarFile;
import java.util.stream.Stream;
import org.loadstone.analysis.AnalysisSettings;
import org.loadstone.analysis.Curve;
import org.loadstone.analysis.RunResult;
import org.loadstone.archive.RunMetadata;

/**
 * The figures of one run as the archive index keeps them ({@link
 * org.loadstone.archive.FigureCache}): everything {@link RunMetrics} holds but the samples and
 * the metadata, as JSON text, or the reason the run could not be analysed.
 *
 * <p>What keeps them valid: the index hands figures back only while the run's files hash as
 * they did; the {@linkplain #settingsKey settings key} holds the analysis settings and a
 * fingerprint of the code that computes figures (the class files of {@code analysis}, {@code
 * archive} and {@code study}), so any change to that code computes them anew; and the text holds
 * a hash of the metadata the figures were computed from, so a run whose metadata as listed
 * changed without its files changing (an amendment kept beside the run) is analysed again.
 * Values round-trip exactly (doubles as their shortest decimal, which reads back to the same
 * bits).
 */
final class KeptFigures {
  /** What analysing one run gave: its metrics, or why it could not be analysed. */
  record Analysed(RunMetadata metadata, RunMetrics metrics, String failure) {}

  private static final ObjectMapper JSON = new ObjectMapper();
  private static final JsonNodeFactory NODES = JsonNodeFactory.instance;
  private static final String CODE = codeFingerprint();

  private KeptFigures() {}

  /** @return the key figures computed with {@code settings} by this code are kept under */
  static String settingsKey(AnalysisSettings settings) {
    return "figures/1 code " + CODE + " " + settings;
  }

  /** @return the figures as text for the index, null when they cannot be kept */
  static String text(Analysed a) {
    ObjectNode o = NODES.objectNode();
    o.put("metadata", sha256(stable(a.metadata())));
    try {
      if (a.metrics() == null) {
        o.put("failure", a.failure());
      } else {
        RunMetrics m = a.metrics();
        o.put("samples", m.curve().size());
        o.put("position", m.curve().hasPosition());
        for (RecordComponent c : RunMetrics.class.getRecordComponents()) {
          if (c.getType() != RunMetadata.class && c.getType() != Curve.class) {
            o.set(c.getName(), write(c.getAccessor().invoke(m), c.getGenericType()));
          }
        }
      }
      return JSON.writeValueAsString(o);
    } catch (ReflectiveOperationException | IOException | IllegalStateException e) {
      return null; // not keepable: computed again next time
    }
  }

  /**
   * Reads kept figures back.
   *
   * @param text as {@link #text} wrote it
   * @param metadata the run's metadata as listed now
   * @param samples reads the run's samples when they are asked for
   * @return the analysis, or null when the text does not belong to this metadata or cannot be
   *     read (the run is then analysed again)
   */
  static Analysed read(String text, RunMetadata metadata,
      java.util.function.Supplier<Curve> samples) {
    try {
      JsonNode o = JSON.readTree(text);
      if (!sha256(stable(metadata)).equals(o.path("metadata").asText())) {
        return null;
      }
      if (o.has("failure")) {
        return new Analysed(metadata, null, o.get("failure").asText());
      }
      RecordComponent[] cs = RunMetrics.class.getRecordComponents();
      Object[] args = new Object[cs.length];
      for (int i = 0; i < cs.length; i++) {
        if (cs[i].getType() == RunMetadata.class) {
          args[i] = metadata;
        } else if (cs[i].getType() == Curve.class) {
          args[i] = Curve.deferred(o.get("samples").intValue(), o.get("position").booleanValue(),
              samples);
        } else {
          args[i] = read(o.get(cs[i].getName()), cs[i].getGenericType());
        }
      }
      return new Analysed(metadata, canonical(RunMetrics.class).newInstance(args), null);
    } catch (IOException | ReflectiveOperationException | RuntimeException e) {
      return null;
    }
  }

  /**
   * Keeps {@code m}'s figures but not its samples: a curve read again from the run when asked.
   */
  static RunMetrics withoutSamples(RunMetrics m, java.util.function.Supplier<Curve> samples) {
    return withSamples(m, Curve.deferred(m.curve().size(), m.curve().hasPosition(), samples));
  }

  /** @return {@code m} with another curve of the same samples */
  static RunMetrics withSamples(RunMetrics m, Curve curve) {
    RecordComponent[] cs = RunMetrics.class.getRecordComponents();
    Object[] args = new Object[cs.length];
    try {
      for (int i = 0; i < cs.length; i++) {
        args[i] = cs[i].getType() == Curve.class ? curve : cs[i].getAccessor().invoke(m);
      }
      return canonical(RunMetrics.class).newInstance(args);
    } catch (ReflectiveOperationException e) {
      throw new IllegalStateException("RunMetrics is a record", e);
    }
  }

  private static JsonNode write(Object v, Type t) throws ReflectiveOperationException {
    if (v == null) {
      return NODES.nullNode();
    }
    if (v instanceof Double d) {
      return Double.isFinite(d) ? NODES.numberNode(d) : NODES.textNode(d.toString());
    }
    if (v instanceof Integer n) {
      return NODES.numberNode(n);
    }
    if (v instanceof Long n) {
      return NODES.numberNode(n);
    }
    if (v instanceof Boolean b) {
      return NODES.booleanNode(b);
    }
    if (v instanceof String s) {
      return NODES.textNode(s);
    }
    if (v instanceof Enum<?> e) {
      return NODES.textNode(e.name());
    }
    if (v instanceof OptionalDouble o) {
      return o.isPresent() ? write(o.getAsDouble(), double.class) : NODES.nullNode();
    }
    if (v instanceof Optional<?> o) {
      return o.isPresent() ? write(o.get(), argument(t)) : NODES.nullNode();
    }
    if (v instanceof List<?> list) {
      ArrayNode a = NODES.arrayNode();
      for (Object x : list) {
        a.add(write(x, argument(t)));
      }
      return a;
    }
    if (v instanceof Record r) {
      ObjectNode o = NODES.objectNode();
      for (RecordComponent c : r.getClass().getRecordComponents()) {
        o.set(c.getName(), write(c.getAccessor().invoke(r), c.getGenericType()));
      }
      return o;
    }
    throw new IllegalStateException("no text form for " + v.getClass());
  }

  private static Object read(JsonNode n, Type t) throws ReflectiveOperationException {
    Class<?> raw = t instanceof ParameterizedType p ? (Class<?>) p.getRawType() : (Class<?>) t;
    if (raw == OptionalDouble.class) {
      return n == null || n.isNull() ? OptionalDouble.empty()
          : OptionalDouble.of((double) read(n, double.class));
    }
    if (raw == Optional.class) {
      return n == null || n.isNull() ? Optional.empty() : Optional.of(read(n, argument(t)));
    }
    if (n == null) {
      throw new IllegalStateException("missing value");
    }
    if (n.isNull()) {
      if (raw.isPrimitive()) {
        throw new IllegalStateException("null for a " + raw);
      }
      return null;
    }
    if (raw == double.class || raw == Double.class) {
      return n.isTextual() ? Double.parseDouble(n.asText()) : n.doubleValue();
    }
    if (raw == int.class || raw == Integer.class) {
      return n.intValue();
    }
    if (raw == long.class || raw == Long.class) {
      return n.longValue();
    }
    if (raw == boolean.class || raw == Boolean.class) {
      return n.booleanValue();
    }
    if (raw == String.class) {
      return n.asText();
    }
    if (raw.isEnum()) {
      for (Object c : raw.getEnumConstants()) {
        if (((Enum<?>) c).name().equals(n.asText())) {
          return c;
        }
      }
      throw new IllegalStateException("no " + raw.getSimpleName() + " " + n.asText());
    }
    if (raw == List.class) {
      List<Object> list = new ArrayList<>();
      for (JsonNode x : n) {
        list.add(read(x, argument(t)));
      }
      return list;
    }
    if (raw.isRecord()) {
      RecordComponent[] cs = raw.getRecordComponents();
      Object[] args = new Object[cs.length];
      for (int i = 0; i < cs.length; i++) {
        args[i] = read(n.get(cs[i].getName()), cs[i].getGenericType());
      }
      return canonical(raw).newInstance(args);
    }
    throw new IllegalStateException("no text form for " + raw);
  }

  private static Type argument(Type t) {
    return ((ParameterizedType) t).getActualTypeArguments()[0];
  }

  private static <T> Constructor<T> canonical(Class<T> record) throws NoSuchMethodException {
    Class<?>[] types = Stream.of(record.getRecordComponents()).map(RecordComponent::getType)
        .toArray(Class<?>[]::new);
    return record.getDeclaredConstructor(types);
  }

  /**
   * A value as text that is the same in every run of the program: records by component, maps
   * by key order (the iteration order of {@code Map.of} and {@code Map.copyOf} changes from one
   * JVM to the next), lists in their order, anything else as its {@code toString}.
   */
  static String stable(Object v) {
    StringBuilder b = new StringBuilder();
    stable(v, b);
    return b.toString();
  }

  private static void stable(Object v, StringBuilder b) {
    if (v instanceof Record r) {
      b.append(r.getClass().getSimpleName()).append('[');
      for (RecordComponent c : r.getClass().getRecordComponents()) {
        b.append(c.getName()).append('=');
        try {
          stable(c.getAccessor().invoke(r), b);
        } catch (ReflectiveOperationException e) {
          throw new IllegalStateException("a record's accessor is public", e);
        }
        b.append(", ");
      }
      b.append(']');
    } else if (v instanceof Map<?, ?> m) {
      Map<String, Object> sorted = new TreeMap<>();
      m.forEach((k, x) -> sorted.put(String.valueOf(k), x));
      b.append('{');
      sorted.forEach((k, x) -> {
        b.append(k).append('=');
        stable(x, b);
        b.append(", ");
      });
      b.append('}');
    } else if (v instanceof java.util.Collection<?> c) {
      b.append('[');
      for (Object x : c) {
        stable(x, b);
        b.append(", ");
      }
      b.append(']');
    } else {
      b.append(v);
    }
  }

  private static String sha256(String text) {
    return HexFormat.of().formatHex(digest().digest(text.getBytes(StandardCharsets.UTF_8)));
  }

  private static MessageDigest digest() {
    try {
      return MessageDigest.getInstance("SHA-256");
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("every Java has SHA-256", e);
    }
  }

  /**
   * A hash of the class files that compute a run's figures, so that figures kept by another
   * build of Loadstone are not taken for this one's. When the classes cannot be found (an
   * unusual class loader), a key no other run of the program shares: nothing kept is reused.
   */
  private static String codeFingerprint() {
    List<String> packages = List.of("org/loadstone/analysis/", "org/loadstone/archive/",
        "org/loadstone/study/");
    Map<String, byte[]> classes = new TreeMap<>();
    try {
      Path from = Path.of(RunResult.class.getProtectionDomain().getCodeSource().getLocation()
          .toURI());
      if (Files.isDirectory(from)) {
        for (String p : packages) {
          try (Stream<Path> s = Files.walk(from.resolve(p))) {
            for (Path f : s.filter(Files::isRegularFile).toList()) {
              classes.put(from.relativize(f).toString().replace('\\', '/'),
                  Files.readAllBytes(f));
            }
          }
        }
      } else {
        try (JarFile jar = new JarFile(from.toFile())) {
          for (JarEntry e : jar.stream().toList()) {
            if (!e.isDirectory() && packages.stream().anyMatch(e.getName()::startsWith)) {
              try (InputStream in = jar.getInputStream(e)) {
                classes.put(e.getName(), in.readAllBytes());
              }
            }
          }
        }
      }
    } catch (IOException | URISyntaxException | RuntimeException e) {
      return "unknown-" + System.nanoTime();
    }
    if (classes.isEmpty()) {
      return "unknown-" + System.nanoTime();
    }
    MessageDigest md = digest();
    classes.forEach((name, bytes) -> {
      md.update(name.getBytes(StandardCharsets.UTF_8));
      md.update(bytes);
    });
    return HexFormat.of().formatHex(md.digest()).substring(0, 16);
  }
}
