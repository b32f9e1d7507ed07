package org.loadstone.config;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.cli.LoadstoneCommand;
import org.loadstone.config.UserConfig.Key;

/**
 * The user's defaults: environment over config file over built in, each with its source; the
 * config file found by the XDG base-directory rule ($XDG_CONFIG_HOME, else ~/.config — the
 * freedesktop.org Base Directory Specification). Every test gives its own environment and home.
 */
class UserConfigTest {
  @TempDir Path home;

  private Path writeConfig(Path base, String text) throws Exception {
    Path f = base.resolve("loadstone").resolve("config.properties");
    Files.createDirectories(f.getParent());
    Files.writeString(f, text);
    return f;
  }

  @Test
  void nothingSetGivesTheBuiltInArchiveAndNothingElse() {
    UserConfig c = UserConfig.load(Map.of(), home);
    assertThat(c.file()).isEqualTo(home.resolve(".config/loadstone/config.properties"));
    assertThat(c.value(Key.ARCHIVE)).isEqualTo(home.resolve("loadstone-runs").toString());
    assertThat(c.settings().get(Key.ARCHIVE).source()).isEqualTo("built in");
    assertThat(c.value(Key.PORT)).isNull();
    assertThat(c.problems()).isEmpty();
  }

  @Test
  void theEnvironmentWinsOverTheFileAndEachSaysWhereItCameFrom() throws Exception {
    Path xdg = Files.createDirectories(home.resolve("xdg"));
    Path f = writeConfig(xdg, "# bench in bay 2\nport = /dev/ttyACM0\narchive = ~/panel-runs\n"
        + "calibration = cal/cell-1kN.json\noperator = R. Okafor\ncolour = blue\nno equals\n");
    UserConfig c = UserConfig.load(Map.of("XDG_CONFIG_HOME", xdg.toString(),
        "LOADSTONE_OPERATOR", "J. Ruiz"), home);
    assertThat(c.file()).isEqualTo(f);
    assertThat(c.value(Key.PORT)).isEqualTo("/dev/ttyACM0");
    assertThat(c.settings().get(Key.PORT).source()).isEqualTo("config file " + f + " line 2");
    assertThat(c.value(Key.ARCHIVE)).isEqualTo(home.resolve("panel-runs").toString());
    // a relative path is relative to the config file's folder
    assertThat(c.value(Key.CALIBRATION)).isEqualTo(f.getParent().resolve("cal/cell-1kN.json")
        .toString());
    assertThat(c.value(Key.OPERATOR)).isEqualTo("J. Ruiz");
    assertThat(c.settings().get(Key.OPERATOR).source()).isEqualTo("environment LOADSTONE_OPERATOR");
    assertThat(c.problems()).hasSize(2);
    assertThat(c.problems().get(0)).contains("line 6", "unknown key 'colour'");
    assertThat(c.problems().get(1)).contains("line 7", "not 'key = value'");
  }

  @Test
  void theConfigCommandShowsTheValuesAndTheCommandsUseThem() throws Exception {
    Path f = writeConfig(home.resolve(".config"), "archive = runs-here\noperator = A. Lind\n");
    UserConfig c = UserConfig.load(Map.of(), home);
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code = LoadstoneCommand.run(System.in, new PrintWriter(out), new PrintWriter(err), c,
        "config");
    assertThat(code).as(err.toString()).isZero();
    Path arc = f.getParent().resolve("runs-here");
    assertThat(out.toString()).contains("config file: " + f)
        .containsPattern("archive +" + java.util.regex.Pattern.quote(arc.toString())
            + " +config file .* line 1")
        .contains("A. Lind");

    // 'runs' without --archive reads the configured archive
    Files.createDirectories(arc);
    org.loadstone.study.MixedArchive.write(arc);
    StringWriter runs = new StringWriter();
    assertThat(LoadstoneCommand.run(System.in, new PrintWriter(runs), new PrintWriter(err), c,
        "runs")).as(err.toString()).isZero();
    assertThat(runs.toString()).contains("foam-imported").contains("19 of 19 runs");
    // who amends is the configured operator unless typed
    StringWriter am = new StringWriter();
    assertThat(LoadstoneCommand.run(System.in, new PrintWriter(am), new PrintWriter(err), c,
        "retire", "foam-manual", "--reason", "test")).as(err.toString()).isZero();
    assertThat(Files.readString(org.loadstone.archive.Amendments.file(arc.resolve(
        org.loadstone.study.MixedArchive.LEFT_OUT.keySet().iterator().next() + ".json"))))
        .contains("\"operator\":\"A. Lind\"");
  }

  @Test
  void importedFilesWithoutUnitsTakeTheUsualUnitsAndABadUnitIsNamed() throws Exception {
    writeConfig(home.resolve(".config"), "force-unit = kN\nlength-unit = furlong\n");
    UserConfig c = UserConfig.load(Map.of("LOADSTONE_FORCE_UNIT", "stone"), home);
    assertThat(c.value(Key.FORCE_UNIT)).isEqualTo("kN"); // the bad variable is not used
    assertThat(c.value(Key.LENGTH_UNIT)).isNull();
    assertThat(c.problems()).anySatisfy(p -> assertThat(p).contains("line 2", "furlong"))
        .anySatisfy(p -> assertThat(p).contains("LOADSTONE_FORCE_UNIT", "stone", "not used"));
    // a file whose header states no unit: 0,2 kN read as kN = 200 N (hand-computed)
    Path csv = Files.writeString(home.resolve("other.csv"), "t,F,x\n0,0,0\n1,0.1,0.5\n2,0.2,1\n");
    Path plain = home.resolve("plain.csv");
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code = LoadstoneCommand.run(System.in, new PrintWriter(out), new PrintWriter(err), c,
        "import", csv.toString(), "--map", "time=t,force=F,position=x", "--out",
        plain.toString(), "--json");
    assertThat(code).as(err.toString()).isZero();
    String[] lines = out.toString().trim().split("\n");
    com.fasterxml.jackson.databind.JsonNode j = new com.fasterxml.jackson.databind.ObjectMapper()
        .readTree(lines[lines.length - 1]);
    assertThat(j.get("force_range_N").get(1).asDouble()).isEqualTo(200.0);
  }
}
