package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;
import picocli.CommandLine.Model.OptionSpec;

/**
 * One name per idea across the commands: lower-case words with the unit last, one option for the
 * group, the decimal mark, free text and every written file; help texts that show their defaults
 * and fit a narrow terminal; a short hint on a usage error; old spellings still accepted.
 */
class OptionNamesTest {
  @TempDir java.nio.file.Path tmp;

  private static Map<String, CommandLine> commands() {
    CommandLine cl = new CommandLine(new LoadstoneCommand());
    return cl.getSubcommands();
  }

  private static List<OptionSpec> options() {
    List<OptionSpec> all = new ArrayList<>();
    commands().forEach((name, c) -> all.addAll(c.getCommandSpec().options()));
    return all;
  }

  @Test
  void everyLongNameIsLowerCaseWordsJoinedByHyphens() {
    for (OptionSpec o : options()) {
      for (String n : o.names()) {
        if (n.startsWith("--")) {
          assertThat(n).as(n).matches("--[a-z0-9]+(-[a-z0-9]+)*");
        }
      }
    }
  }

  @Test
  void oneNamePerIdea() {
    Set<String> names = new TreeSet<>();
    options().forEach(o -> names.addAll(List.of(o.names())));
    // the spellings the issue found for one idea each are gone from the commands
    assertThat(names).doesNotContain("--groups", "--decimal-comma", "--table-decimal-comma",
        "--note", "--description", "--save", "--seconds", "--max-seconds", "--rate", "--g");
    assertThat(names).contains("--group", "--decimal", "--notes", "--out", "--duration-s");
    // every command that writes a file names it (or its folder) with --out
    for (String c : List.of("simulate", "calibrate", "import", "export", "report", "frame")) {
      assertThat(commands().get(c).getCommandSpec().findOption("--out")).as(c).isNotNull();
    }
    // a date in runs, a file in calibrate: no longer one name for both
    assertThat(commands().get("calibrate").getCommandSpec().findOption("--from")).isNull();
  }

  @Test
  void everyDefaultIsShownByTheHelpText() {
    List<String> silent = new ArrayList<>();
    for (Map.Entry<String, CommandLine> c : commands().entrySet()) {
      for (OptionSpec o : c.getValue().getCommandSpec().options()) {
        String d = o.defaultValue();
        if (d != null && !d.isEmpty() && !o.usageHelp() && !o.versionHelp()
            && !String.join(" ", o.description()).contains("default: " + d)) {
          silent.add(c.getKey() + " " + o.longestName() + " (default " + d + ")");
        }
      }
    }
    assertThat(silent).as("options whose help does not show the default").isEmpty();
  }

  @Test
  void helpFitsSixtyColumns() {
    for (Map.Entry<String, CommandLine> c : commands().entrySet()) {
      c.getValue().setUsageHelpWidth(60);
      for (String line : c.getValue().getUsageMessage().split("\\R")) {
        assertThat(line.length()).as(c.getKey() + ": " + line).isLessThanOrEqualTo(60);
      }
    }
  }

  @Test
  void theTopLevelHelpListsTheExitCodes() {
    CliRun r = CliRun.run("", "--help");
    assertThat(r.exit()).isZero();
    assertThat(r.out()).contains("Exit codes:", " 0 ", " 1 ", " 2 ", " 3 ", " 4 ", " 5 ", "70 ", "130 ");
  }

  @Test
  void aUsageErrorIsAShortHintNotTheWholeHelp() {
    CliRun r = CliRun.run("", "record", "--port", "sim");
    assertThat(r.exit()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(r.out()).isEmpty();
    assertThat(r.err()).contains("--specimen", "see 'loadstone record --help'");
    assertThat(r.err().strip().split("\\R")).hasSizeLessThanOrEqualTo(4);
    CliRun typo = CliRun.run("", "runs", "--specimn", "x");
    assertThat(typo.err()).contains("--specimen").contains("see 'loadstone runs --help'");
    assertThat(typo.err().strip().split("\\R")).hasSizeLessThanOrEqualTo(5);
  }

  @Test
  void oldSpellingsStillWorkWithANote() throws Exception {
    java.nio.file.Path out = tmp.resolve("s.txt");
    // --seconds and --rate of simulate are --duration-s and --rate-hz now
    CliRun r = CliRun.run("", "simulate", "--seconds", "0.5", "--rate", "10", "--unpaced",
        "--out", out.toString(), "--json");
    assertThat(r.exit()).as(r.toString()).isZero();
    assertThat(r.lastJson().get("sample_count").asInt()).isEqualTo(5); // 0.5 s × 10 /s
    assertThat(r.err()).contains("--seconds is now --duration-s", "--rate is now --rate-hz");
    // a name differing only in case needs no alias
    CliRun caps = CliRun.run("", "record", "--capacity-N", "-5", "--specimen", "x", "--archive",
        tmp.toString());
    assertThat(caps.err()).doesNotContain("Unknown option");
  }
}
