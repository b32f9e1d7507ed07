package org.loadstone.cli;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.loadstone.device.SerialSettings;
import org.loadstone.units.InputException;
import picocli.CommandLine;
import picocli.CommandLine.Model.OptionSpec;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.ParseResult;

/**
 * The one place where the numbers typed on a command line are checked before any command runs,
 * for every command alike:
 *
 * <ul>
 *   <li>every decimal option is a finite number: {@code NaN}, {@code Infinity} and values past
 *       the range of numbers ({@code 1e400}) are refused while the line is parsed;
 *   <li>the options in {@link #RANGES} lie in their range (limits owned by a core type are taken
 *       from it, e.g. {@link SerialSettings#MIN_BAUD}).
 * </ul>
 *
 * <p>A refused value ends the command with picocli's exit code for bad input (2) and a message
 * naming the option, the value and what to give instead; nothing has been opened or written
 * yet. Options whose rule belongs to the domain (a run's thresholds, the zero's sample count, a
 * calibration's loads) are checked by the core, whose message names the setting.
 */
final class OptionRules {
  private OptionRules() {}

  /**
   * A range an option's value must lie in.
   *
   * @param min the lowest value
   * @param minOpen whether {@code min} itself is refused
   * @param max the highest value allowed
   * @param what the value in words with its unit, e.g. "a serial speed in baud"
   */
  record Range(double min, boolean minOpen, double max, String what) {
    boolean holds(double v) {
      return (minOpen ? v > min : v >= min) && v <= max;
    }

    String words() {
      return (minOpen ? "above " + num(min) : "from " + num(min)) + " to " + num(max);
    }
  }

  private static final double WEEK_S = 7 * 24 * 3600;

  /** Ranges by option name; {@code "command --option"} for a rule of one command only. */
  static final Map<String, Range> RANGES = Map.ofEntries(
      Map.entry("--baud", new Range(SerialSettings.MIN_BAUD, false, SerialSettings.MAX_BAUD,
          "the board's serial speed in baud (115200 for the reference firmware)")),
      Map.entry("--reset-wait-ms", new Range(0, false, SerialSettings.MAX_RESET_WAIT_MS,
          "the wait after opening the port in ms (2000 suits most boards that reset)")),
      Map.entry("--duration-s", new Range(0, true, WEEK_S,
          "a duration in seconds, at most a week")));

  /** Makes every command of {@code cl} follow these rules. */
  static void install(CommandLine cl) {
    CommandLine.ITypeConverter<Double> finite = OptionRules::finite;
    cl.registerConverter(Double.class, finite);
    cl.registerConverter(double.class, finite);
    CommandLine.IExecutionStrategy run = new CommandLine.RunLast();
    cl.setExecutionStrategy(pr -> {
      check(pr);
      return run.execute(pr);
    });
  }

  /**
   * A decimal number as typed, refused unless finite.
   *
   * @throws CommandLine.TypeConversionException naming the text and what to give
   */
  static Double finite(String text) {
    double v;
    try {
      v = Double.parseDouble(text.trim());
    } catch (NumberFormatException e) {
      throw new CommandLine.TypeConversionException(InputException.shown(text)
          + " is not a number: give a decimal number such as 12.5 (a point, not a comma)");
    }
    if (!Double.isFinite(v)) {
      throw new CommandLine.TypeConversionException(InputException.shown(text)
          + " is not a finite number: give an ordinary decimal number such as 12.5");
    }
    return v;
  }

  /**
   * Checks every option given on the line, in the command and its subcommands, against
   * {@link #RANGES}.
   *
   * @throws ParameterException naming the first option out of range
   */
  static void check(ParseResult pr) {
    for (ParseResult p = pr; p != null; p = p.subcommand()) {
      String command = p.commandSpec().name();
      for (OptionSpec o : p.matchedOptions()) {
        Range r = rangeOf(command, o);
        Object value = o.getValue();
        if (r != null && value instanceof Number n && !r.holds(n.doubleValue())) {
          throw new ParameterException(p.commandSpec().commandLine(), String.format(Locale.ROOT,
              "Invalid value for option '%s': %s is out of range: give %s, %s", o.longestName(),
              num(n.doubleValue()), r.what(), r.words()));
        }
      }
    }
  }

  private static Range rangeOf(String command, OptionSpec o) {
    for (String name : o.names()) {
      Range r = RANGES.get(command + " " + name);
      if (r == null) {
        r = RANGES.get(name);
      }
      if (r != null) {
        return r;
      }
    }
    return null;
  }

  /** @return the options of {@code cl}'s commands that have a range, for the tests */
  static List<String> rangedOptions(CommandLine cl) {
    List<String> out = new ArrayList<>();
    for (CommandLine sub : cl.getSubcommands().values()) {
      for (OptionSpec o : sub.getCommandSpec().options()) {
        if (rangeOf(sub.getCommandName(), o) != null) {
          out.add(sub.getCommandName() + " " + o.longestName());
        }
      }
    }
    return out;
  }

  private static String num(double v) {
    return v == Math.rint(v) && Math.abs(v) < 1e15 ? String.valueOf((long) v)
        : String.valueOf(v);
  }
}
