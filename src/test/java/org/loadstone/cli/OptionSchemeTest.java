package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import picocli.CommandLine;
import picocli.CommandLine.Model.ArgSpec;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Model.OptionSpec;
import picocli.CommandLine.Model.PositionalParamSpec;

/**
 * Every option and parameter of every command follows the one scheme of the contributor guide
 * ("Options and placeholders"), so the help texts cannot drift apart again:
 *
 * <ul>
 *   <li>a long name is lower-case words joined by hyphens, a unit, when there is one, last and
 *       nowhere else ({@code --max-duration-s}, not {@code --s-max});
 *   <li>every value has a placeholder of its own (never picocli's {@code <fieldName>}): upper-case
 *       words joined by hyphens, a file's usual extension allowed in lower case ({@code
 *       FILE.pdf}), several values separated by commas ({@code X,Y});
 *   <li>a value with a unit in the option's name takes that unit as its placeholder ({@code
 *       --span-mm=MM}, {@code --rate-hz=HZ}; a rate "per something" names what is counted,
 *       {@code SPIKES-PER-MIN}; several values name which, {@code LOW-PCT,HIGH-PCT}); a value
 *       without a unit never takes a unit's name ({@code N} is the newton, not "a number");
 *   <li>a description is a sentence (capital first, full stop last) and states a default as
 *       {@code (default: …)}.
 * </ul>
 */
class OptionSchemeTest {
  /**
   * The units option names end with, compound ones included; the longest that ends a name is its
   * unit. SI symbols in lower case (common practice for case-insensitive command lines), plus the
   * trade's counts and per cent (pct), per cent of full scale (pct-fs) and pixels (px).
   */
  private static final List<String> UNITS = List.of("n", "kn", "mm", "m", "s", "ms", "min", "hz",
      "g", "kg", "pct", "deg", "mm2", "px", "counts", "days", "pct-fs", "n-per-mm",
      "mm-per-min", "counts-per-s", "counts-per-n", "kg-per-m3", "m-per-s2", "per-min");

  /** Single words that are units: none of them may stand before a name's last part. */
  private static final Set<String> UNIT_WORDS = Set.of("n", "kn", "mm", "m", "s", "ms", "min",
      "hz", "g", "kg", "pct", "deg", "mm2", "px", "counts", "days");

  private static final String WORD = "[A-Z][A-Z0-9]*(-[A-Z0-9]+)*(\\.[a-z0-9]+)?";
  private static final Pattern PLACEHOLDER = Pattern.compile(WORD + "(," + WORD + ")*");

  /** One option or parameter with the command it belongs to. */
  private record Arg(String command, ArgSpec spec) {
    String name() {
      return spec instanceof OptionSpec o ? o.longestName()
          : "parameter " + ((PositionalParamSpec) spec).index();
    }

    @Override
    public String toString() {
      return command + " " + name() + "=" + spec.paramLabel();
    }
  }

  private static List<Arg> args() {
    List<Arg> all = new ArrayList<>();
    walk(new CommandLine(new LoadstoneCommand()), "loadstone", all);
    return all;
  }

  private static void walk(CommandLine cl, String path, List<Arg> into) {
    CommandSpec spec = cl.getCommandSpec();
    for (OptionSpec o : spec.options()) {
      if (!o.usageHelp() && !o.versionHelp() && !o.hidden()) {
        into.add(new Arg(path, o));
      }
    }
    for (PositionalParamSpec p : spec.positionalParameters()) {
      if (!p.hidden()) {
        into.add(new Arg(path, p));
      }
    }
    for (Map.Entry<String, CommandLine> c : cl.getSubcommands().entrySet()) {
      if (!c.getValue().getCommandSpec().helpCommand()) {
        walk(c.getValue(), path + " " + c.getKey(), into);
      }
    }
  }

  /** @return the unit a long option name ends with, or null */
  static String unitOf(String longName) {
    String n = longName.substring(2);
    return UNITS.stream().filter(u -> n.equals(u) || n.endsWith("-" + u))
        .max(Comparator.comparingInt(String::length)).orElse(null);
  }

  /** @return whether an option takes a value (a flag does not) */
  private static boolean takesValue(ArgSpec a) {
    return a.isPositional() || a.arity().max() > 0;
  }

  @Test
  void theWalkSeesEveryCommand() {
    // a sanity check of the walk itself: it must not pass by finding nothing
    List<Arg> all = args();
    assertThat(all.stream().map(Arg::command).distinct())
        .contains("loadstone record", "loadstone calibrate", "loadstone runs",
            "loadstone compare", "loadstone report", "loadstone track", "loadstone import");
    assertThat(all).hasSizeGreaterThan(200);
  }

  @Test
  void unitsComeLastAndNowhereElse() {
    List<String> wrong = new ArrayList<>();
    for (Arg a : args()) {
      if (!(a.spec() instanceof OptionSpec o)) {
        continue;
      }
      for (String name : o.names()) {
        if (!name.startsWith("--")) {
          continue;
        }
        assertThat(name).as(a.toString()).matches("--[a-z0-9]+(-[a-z0-9]+)*");
        String unit = unitOf(name);
        String before = unit == null ? name.substring(2)
            : name.substring(2, name.length() - unit.length());
        for (String part : before.split("-")) {
          if (UNIT_WORDS.contains(part)) {
            wrong.add(a + ": unit '" + part + "' before the end of the name");
          }
        }
      }
    }
    assertThat(wrong).isEmpty();
  }

  @Test
  void everyValueHasAPlaceholderInTheOneStyle() {
    List<String> wrong = new ArrayList<>();
    for (Arg a : args()) {
      if (!takesValue(a.spec())) {
        continue;
      }
      String label = a.spec().paramLabel();
      if (!PLACEHOLDER.matcher(label).matches()) {
        wrong.add(a + ": placeholder not in the style (upper-case words, e.g. FILE, MM, X,Y)");
        continue;
      }
      String unit = a.spec() instanceof OptionSpec o ? unitOf(o.longestName()) : null;
      String upper = unit == null ? null : unit.toUpperCase(Locale.ROOT);
      if (unit != null && !java.util.Arrays.stream(label.split(","))
          .allMatch(part -> part.equals(upper) || part.endsWith("-" + upper)
              && (unit.startsWith("per-") || label.contains(",")))) {
        wrong.add(a + ": a value in " + unit + " takes " + upper + " as its placeholder");
      }
      if (unit == null && UNIT_WORDS.contains(label.toLowerCase(Locale.ROOT))) {
        wrong.add(a + ": no unit in the name, yet the placeholder is the unit " + label);
      }
    }
    assertThat(wrong).isEmpty();
  }

  @Test
  void descriptionsAreSentencesThatStateDefaultsOneWay() {
    List<String> wrong = new ArrayList<>();
    for (Arg a : args()) {
      String d = String.join(" ", a.spec().description()).strip();
      if (d.isEmpty()) {
        wrong.add(a + ": no description");
        continue;
      }
      if (!Character.isUpperCase(d.codePointAt(0)) && !d.startsWith("'")) {
        wrong.add(a + ": description does not start with a capital: " + d);
      }
      if (!d.endsWith(".")) {
        wrong.add(a + ": description does not end with a full stop: " + d);
      }
      if (d.contains("Default:") || d.contains("default =") || d.contains("[default")
          || d.contains("defaults to")) {
        wrong.add(a + ": a default is written '(default: …)': " + d);
      }
    }
    assertThat(wrong).isEmpty();
  }

  @Test
  void commandDescriptionsAreWholeParagraphsForPicocliToWrap() {
    // a paragraph broken by hand at 80 columns breaks mid-list on a narrower or wider terminal:
    // each line of a command's description must be a whole paragraph (ending as a sentence does)
    List<String> broken = new ArrayList<>();
    walkCommands(new CommandLine(new LoadstoneCommand()), "loadstone", broken);
    assertThat(broken).isEmpty();
  }

  private static void walkCommands(CommandLine cl, String path, List<String> broken) {
    for (String line : cl.getCommandSpec().usageMessage().description()) {
      String l = line.strip();
      if (!l.isEmpty() && !l.matches("(?s).*[.?!:)]")) {
        broken.add(path + ": a description line that is not a whole paragraph: " + l);
      }
    }
    for (Map.Entry<String, CommandLine> c : cl.getSubcommands().entrySet()) {
      if (!c.getValue().getCommandSpec().helpCommand()) {
        walkCommands(c.getValue(), path + " " + c.getKey(), broken);
      }
    }
  }
}
