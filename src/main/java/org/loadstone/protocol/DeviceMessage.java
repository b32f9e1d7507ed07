package org.loadstone.protocol;

import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * A non-sample record from the device: identity, status, error, acknowledgement or refusal. Each
 * has a text body (tag and fields, without checksum) that is its exact wire form.
 */
public sealed interface DeviceMessage
    permits DeviceMessage.Identity,
        DeviceMessage.Status,
        DeviceMessage.DeviceError,
        DeviceMessage.Ack,
        DeviceMessage.Refusal {

  /** @return the text body as sent, e.g. {@code A START} */
  String body();

  /**
   * Parses a text body.
   *
   * @param body tag and fields separated by single spaces, printable ASCII
   * @return the message, or empty when the tag is known but the fields are malformed, or the tag is
   *     not a message tag
   */
  static Optional<DeviceMessage> parse(String body) {
    String[] f = body.split(" ", -1);
    for (String s : f) {
      if (s.isEmpty()) {
        return Optional.empty();
      }
    }
    switch (f[0]) {
      case "I":
        return Identity.parseFields(Arrays.asList(f).subList(1, f.length)).map(x -> x);
      case "T":
        return f.length >= 2 ? Optional.of(new Status(f[1], tail(body, 2))) : Optional.empty();
      case "E":
        return f.length >= 2 ? Optional.of(new DeviceError(f[1], tail(body, 2))) : Optional.empty();
      case "A":
        return f.length >= 2 ? Optional.of(new Ack(f[1], tail(body, 2))) : Optional.empty();
      case "N":
        return f.length >= 3
            ? Optional.of(new Refusal(f[1], f[2], tail(body, 3)))
            : Optional.empty();
      default:
        return Optional.empty();
    }
  }

  /** @return the fields after the first {@code n}, joined by spaces; empty when there are none */
  private static String tail(String body, int n) {
    int at = 0;
    for (int i = 0; i < n; i++) {
      at = body.indexOf(' ', at);
      if (at < 0) {
        return "";
      }
      at++;
    }
    return body.substring(at);
  }

  /** Whether {@code tag} is one of the message tags this version knows. */
  static boolean isKnownTag(String tag) {
    return List.of("I", "T", "E", "A", "N", "S").contains(tag);
  }

  /**
   * The device's identity record.
   *
   * @param fields all {@code key=value} pairs in the order sent
   */
  record Identity(Map<String, String> fields) implements DeviceMessage {
    /** The protocol version this host speaks. */
    public static final int SUPPORTED_PROTOCOL = 1;

    public Identity {
      fields = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(fields));
    }

    static Optional<Identity> parseFields(List<String> pairs) {
      Map<String, String> m = new LinkedHashMap<>();
      for (String p : pairs) {
        int eq = p.indexOf('=');
        if (eq <= 0) {
          return Optional.empty();
        }
        m.put(p.substring(0, eq), p.substring(eq + 1));
      }
      if (!m.containsKey("proto")) {
        return Optional.empty();
      }
      return Optional.of(new Identity(m));
    }

    /** @return the protocol version, or -1 when it is not a whole number */
    public int protocol() {
      return intField("proto", -1);
    }

    /** @return whether this host can decode the device's samples */
    public boolean supported() {
      return protocol() == SUPPORTED_PROTOCOL;
    }

    /** @return firmware version text, or {@code ?} */
    public String firmware() {
      return fields.getOrDefault("fw", "?");
    }

    /** @return converter kind, or {@code ?} */
    public String adc() {
      return fields.getOrDefault("adc", "?");
    }

    /** @return nominal sample rate in Hz, or 0 when not given */
    public double rateHz() {
      return doubleField("rate", 0);
    }

    /** @return number of channels: 1 (load) or 2 (load and position) */
    public int channels() {
      return intField("ch", 1);
    }

    /** @return position counts per mm of crosshead travel, or 0 when not given */
    public double countsPerMm() {
      return doubleField("cpm", 0);
    }

    /** @return whether the device drives the crosshead and obeys {@code HALT} */
    public boolean motorised() {
      return "1".equals(fields.get("motor"));
    }

    /** @return the id of the load cell the device reports ({@code cell}), or null */
    public String cellId() {
      return fields.get("cell");
    }

    /** @return the cell's rated capacity in N ({@code cap}), or NaN when not given */
    public double cellCapacity_N() {
      return doubleField("cap", Double.NaN);
    }

    /** @return the cell's data-sheet sensitivity in counts per N ({@code cpn}), or NaN */
    public double cellCountsPerN() {
      return doubleField("cpn", Double.NaN);
    }

    /** @return free device name, or {@code device} */
    public String name() {
      return fields.getOrDefault("name", "device");
    }

    private int intField(String key, int dflt) {
      try {
        return Integer.parseInt(fields.getOrDefault(key, Integer.toString(dflt)));
      } catch (NumberFormatException e) {
        return dflt;
      }
    }

    private double doubleField(String key, double dflt) {
      try {
        double v = Double.parseDouble(fields.getOrDefault(key, Double.toString(dflt)));
        return Double.isFinite(v) ? v : dflt;
      } catch (NumberFormatException e) {
        return dflt;
      }
    }

    @Override
    public String body() {
      StringBuilder sb = new StringBuilder("I");
      fields.forEach((k, v) -> sb.append(' ').append(k).append('=').append(v));
      return sb.toString();
    }
  }

  /** A status report, e.g. {@code T streaming}. */
  record Status(String code, String text) implements DeviceMessage {
    @Override
    public String body() {
      return "T " + code + (text.isEmpty() ? "" : " " + text);
    }
  }

  /** An error report, e.g. {@code E adc-timeout}. */
  record DeviceError(String code, String text) implements DeviceMessage {
    @Override
    public String body() {
      return "E " + code + (text.isEmpty() ? "" : " " + text);
    }
  }

  /** A command acknowledgement, e.g. {@code A RATE 80}. */
  record Ack(String command, String detail) implements DeviceMessage {
    @Override
    public String body() {
      return "A " + command + (detail.isEmpty() ? "" : " " + detail);
    }
  }

  /** A refused command, e.g. {@code N RATE unsupported}. */
  record Refusal(String command, String reason, String text) implements DeviceMessage {
    @Override
    public String body() {
      return "N " + command + " " + reason + (text.isEmpty() ? "" : " " + text);
    }
  }
}
