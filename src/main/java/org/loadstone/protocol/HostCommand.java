package org.loadstone.protocol;

import java.nio.charset.StandardCharsets;
import java.util.Locale;
import org.loadstone.units.Precondition;

/**
 * A command from host to device (PROTOCOL.md, "Commands"). Always sent as a text line with a CRC,
 * whatever encoding the device streams in.
 *
 * @param verb one of {@link Verb}
 * @param argument the argument ({@code RATE 80}, {@code PING k7}, {@code MODE binary}), or empty
 */
public record HostCommand(Verb verb, String argument) {
  /** The command words. */
  public enum Verb {
    WHO(false), START(false), STOP(false), RATE(true), PING(true), HALT(false), MODE(true),
    LIGHT(true);

    private final boolean takesArgument;

    Verb(boolean takesArgument) {
      this.takesArgument = takesArgument;
    }

    /** @return whether the command needs an argument */
    public boolean takesArgument() {
      return takesArgument;
    }
  }

  public HostCommand {
    Precondition.notNull(verb, "verb");
    Precondition.notNull(argument, "argument");
    if (verb.takesArgument() == argument.isEmpty()) {
      throw new IllegalArgumentException(
          verb + (verb.takesArgument() ? " needs an argument" : " takes no argument"));
    }
    if (!argument.isEmpty() && !argument.matches("[!-~]{1,16}")) {
      throw new IllegalArgumentException("argument must be 1…16 printable characters: " + argument);
    }
  }

  /** @return {@code WHO} */
  public static HostCommand who() {
    return new HostCommand(Verb.WHO, "");
  }

  /** @return {@code START} */
  public static HostCommand start() {
    return new HostCommand(Verb.START, "");
  }

  /** @return {@code STOP} */
  public static HostCommand stop() {
    return new HostCommand(Verb.STOP, "");
  }

  /** @return {@code HALT} */
  public static HostCommand halt() {
    return new HostCommand(Verb.HALT, "");
  }

  /**
   * @param on true to light the sync light (the camera's shared instant), false to darken it
   * @return {@code LIGHT on} or {@code LIGHT off}
   */
  public static HostCommand light(boolean on) {
    return new HostCommand(Verb.LIGHT, on ? "on" : "off");
  }

  /** @param hz sample rate in Hz, greater than zero */
  public static HostCommand rate(int hz) {
    if (hz <= 0) {
      throw new IllegalArgumentException("rate must be > 0 Hz, was " + hz);
    }
    return new HostCommand(Verb.RATE, Integer.toString(hz));
  }

  /** @param token 1…8 printable characters echoed back */
  public static HostCommand ping(String token) {
    return new HostCommand(Verb.PING, token);
  }

  /** @param encoding the encoding the device should switch to */
  public static HostCommand mode(Encoding encoding) {
    return new HostCommand(Verb.MODE, encoding.wireName());
  }

  /** @return the text body, e.g. {@code RATE 80} */
  public String body() {
    return argument.isEmpty() ? verb.name() : verb.name() + " " + argument;
  }

  /** @return the line as sent: body, space, {@code ~}, CRC in 4 hex digits, LF */
  public byte[] toWire() {
    return new WireEncoder(Encoding.TEXT).body(body());
  }

  /**
   * The device side's reading of one command line (without its line end). A line typed by hand
   * without {@code ~crc} is accepted.
   */
  public sealed interface Parsed permits Parsed.Accepted, Parsed.Rejected {
    /** A command to carry out. */
    record Accepted(HostCommand command) implements Parsed {}

    /**
     * A command to refuse with {@code N word reason}.
     *
     * @param word the command word as received (or {@code ?})
     * @param reason {@code checksum}, {@code bad-command} or {@code bad-arg}
     */
    record Rejected(String word, String reason) implements Parsed {}
  }

  /**
   * Parses a command line as a device does.
   *
   * @param line the line without CR/LF
   * @return accepted or rejected with the refusal reason; never null
   */
  public static Parsed parse(String line) {
    String body = line;
    int tilde = line.lastIndexOf(" ~");
    if (tilde >= 0 && line.length() - tilde == 6) {
      body = line.substring(0, tilde);
      int crc;
      try {
        crc = Integer.parseInt(line.substring(tilde + 2), 16);
      } catch (NumberFormatException e) {
        return new Parsed.Rejected(firstWord(body), "checksum");
      }
      byte[] b = body.getBytes(StandardCharsets.US_ASCII);
      if (Crc16.compute(b, 0, b.length) != crc) {
        return new Parsed.Rejected(firstWord(body), "checksum");
      }
    }
    String[] f = body.trim().split(" +");
    String word = f[0].toUpperCase(Locale.ROOT);
    Verb verb;
    try {
      verb = Verb.valueOf(word);
    } catch (IllegalArgumentException e) {
      return new Parsed.Rejected(word.isEmpty() ? "?" : word, "bad-command");
    }
    if (f.length != (verb.takesArgument() ? 2 : 1)) {
      return new Parsed.Rejected(word, "bad-arg");
    }
    String arg = f.length == 2 ? f[1] : "";
    if (verb == Verb.RATE && !arg.matches("[1-9][0-9]{0,5}")) {
      return new Parsed.Rejected(word, "bad-arg");
    }
    if (verb == Verb.MODE && !(arg.equals("text") || arg.equals("binary"))) {
      return new Parsed.Rejected(word, "bad-arg");
    }
    if (verb == Verb.PING && !arg.matches("[!-~]{1,8}")) {
      return new Parsed.Rejected(word, "bad-arg");
    }
    return new Parsed.Accepted(new HostCommand(verb, arg));
  }

  private static String firstWord(String body) {
    String w = body.trim().split(" +")[0];
    return w.isEmpty() ? "?" : w.toUpperCase(Locale.ROOT);
  }
}
