package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.HangGuard;
import org.loadstone.archive.Run;
import org.loadstone.archive.RunReader;
import org.loadstone.calibration.CalibrationStatus;
import org.loadstone.ui.ConsoleConfig;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Setting;
import picocli.CommandLine;

/**
 * One rule for a calibration whose content no longer matches the hash saved in it
 * ({@link CalibrationStatus#refuseChanged}): {@code record}, the console and {@code analyze}
 * refuse it with the same words, naming the file and the fix, and use it only when accepted
 * explicitly, with the warning shown and stored.
 */
class ChangedCalibrationTest {
  private static final String CAL = "shelf-rig-500N-2026-12-02.json";

  @TempDir Path tmp;
  private Path changed;
  private String finding;

  @BeforeEach
  void changedCalibration() throws Exception {
    Path project = Path.of(System.getProperty("loadstone.projectDir", "."), "calibration");
    Path calDir = Files.createDirectories(tmp.resolve("cal").resolve("cells"))
        .getParent();
    Files.copy(project.resolve("cells/shelf-rig-500N.json"),
        calDir.resolve("cells/shelf-rig-500N.json"));
    changed = calDir.resolve(CAL);
    String text = Files.readString(project.resolve(CAL));
    // the sensitivity of the chosen fit edited by hand, 1 % higher: the saved hash no longer
    // matches the content (a changed coefficient changes every force it gives)
    String edited = text.replace("8589.915969860233", "8675.815129558835");
    assertThat(edited).isNotEqualTo(text);
    Files.writeString(changed, edited);
    CalibrationStatus st = CalibrationStatus.check(changed, null, LocalDate.of(2026, 12, 4));
    assertThat(st.state()).isEqualTo(CalibrationStatus.State.HASH_MISMATCH);
    finding = st.warning();
  }

  private RecordCommandTest.Outcome record(String specimen, String... more) {
    String[] base = {"record", "--port", "sim", "--scenario", "brittle", "--rate-hz", "1000",
        "--sim-speed", "8", "--specimen", specimen, "--cal", changed.toString(), "--archive",
        tmp.resolve("runs").toString(), "--json"};
    return RecordCommandTest.run(Stream.concat(Stream.of(base), Stream.of(more))
        .toArray(String[]::new));
  }

  @Test
  @Timeout(HangGuard.TEST_S)
  void recordRefusesItBeforeTheRunAndKeepsItWithItsWarningWhenAccepted() throws Exception {
    var refused = record("c1");
    assertThat(refused.exit()).as(refused.err()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(refused.err()).contains(finding).contains(changed.toString())
        .contains("recalibrate or restore the original file")
        .contains("--accept-changed-calibration");
    try (Stream<Path> s = Files.list(tmp.resolve("runs"))) {
      assertThat(s.filter(p -> p.toString().endsWith(".json"))).as("no run").isEmpty();
    }

    var accepted = record("c2", "--accept-changed-calibration");
    assertThat(accepted.exit()).as(accepted.err()).isZero();
    assertThat(accepted.err()).contains(finding);
    Run run = RunReader.read(Path.of(accepted.json().get("csv_file").asText()));
    assertThat(run.metadata().warnings()).contains(finding);
  }

  @Test
  void theConsoleRefusesItAtItsStartAndUsesItWithItsWarningWhenAccepted() {
    var refused = CliRun.run("", "console", "--port", "sim", "--cal", changed.toString(),
        "--archive", tmp.resolve("runs").toString());
    assertThat(refused.exit()).as(refused.toString())
        .isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(refused.err()).contains(finding).contains("--accept-changed-calibration");

    ConsoleCommand c = new ConsoleCommand();
    new CommandLine(c).parseArgs("--port", "sim", "--cal", changed.toString(), "--archive",
        tmp.resolve("runs").toString());
    assertThatThrownBy(() -> c.config(LocalDate.of(2026, 12, 4)))
        .isInstanceOf(LoadstoneException.class).hasMessageContaining(finding)
        .satisfies(e -> assertThat(((LoadstoneException) e).settings())
            .contains(Setting.CHANGED_CALIBRATION));

    ConsoleCommand ok = new ConsoleCommand();
    new CommandLine(ok).parseArgs("--port", "sim", "--cal", changed.toString(), "--archive",
        tmp.resolve("runs").toString(), "--accept-changed-calibration");
    ConsoleConfig config = ok.config(LocalDate.of(2026, 12, 4));
    assertThat(config.scale().warnings()).contains(finding); // shown and stored with each run
  }

  @Test
  void analyzeRefusesItWithTheSameWords() throws Exception {
    Path arc = Files.createDirectories(tmp.resolve("demo"));
    String run = "20261204T181011.533Z-foam-01";
    for (String ext : new String[] {".csv", ".json"}) {
      Files.copy(Path.of("sample-runs", run + ext), arc.resolve(run + ext));
    }
    CliRun refused = CliRun.run("", "analyze", "--archive", arc.toString(), run, "--cal",
        changed.toString());
    assertThat(refused.exit()).as(refused.toString())
        .isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(refused.err()).contains(finding).contains("--accept-changed-calibration");
  }
}
