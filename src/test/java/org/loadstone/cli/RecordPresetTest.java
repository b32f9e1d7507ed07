package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.loadstone.acquire.RunPreset;
import org.loadstone.archive.TestType;
import picocli.CommandLine;

/** The console's bending preset and {@code record} without options start and stop a run alike. */
class RecordPresetTest {
  @Test
  void bendingPresetIsRecordsDefaults() {
    // the command line's defaults, read from its option specs: the console's bending preset
    // and 'record' without options start and stop a run alike
    CommandLine.Model.CommandSpec record = new CommandLine(new LoadstoneCommand())
        .getSubcommands().get("record").getCommandSpec();
    for (TestType bend : new TestType[] {TestType.THREE_POINT_BEND, TestType.FOUR_POINT_BEND}) {
      RunPreset p = RunPreset.of(bend);
      assertThat(p.startThreshold_N()).isEqualTo(
          Double.parseDouble(record.findOption("--start-at-n").defaultValue()));
      assertThat(p.breakDropPct()).isEqualTo(
          Double.parseDouble(record.findOption("--stop-drop-pct").defaultValue()));
      assertThat(p.postBreak_s()).isEqualTo(
          Double.parseDouble(record.findOption("--tail-s").defaultValue()));
    }
  }


  /** The settings {@code record} would run with, from its command line. */
  private static org.loadstone.acquire.RunSettings settings(TestType type, String... args) {
    CommandLine cl = new CommandLine(new LoadstoneCommand());
    java.util.List<String> line = new java.util.ArrayList<>(java.util.List.of("record", "--port",
        "sim", "--specimen", "P-01", "--test", type.wireName()));
    line.addAll(java.util.List.of(args));
    CommandLine.ParseResult parsed = cl.parseArgs(line.toArray(String[]::new));
    RecordCommand record = (RecordCommand) parsed.subcommand().commandSpec().userObject();
    return record.settings(type).ratedCapacity_N(500).build();
  }

  @Test
  void recordWithPresetStartsFromTheTestTypesPresetAndGivenOptionsWin() {
    RunPreset compression = RunPreset.of(TestType.COMPRESSION);
    var s = settings(TestType.COMPRESSION, "--preset");
    assertThat(s.breakDropPct()).isEqualTo(compression.breakDropPct());
    assertThat(s.maxSeconds()).isEqualTo(compression.maxSeconds());
    // an option given wins over the preset; the others stay the preset's
    s = settings(TestType.COMPRESSION, "--preset", "--stop-drop-pct", "45");
    assertThat(s.breakDropPct()).isEqualTo(45.0);
    assertThat(s.maxSeconds()).isEqualTo(compression.maxSeconds());
    // without --preset: the defaults shown in the help, as before (no time limit)
    s = settings(TestType.COMPRESSION);
    assertThat(s.breakDropPct()).isEqualTo(40.0);
    assertThat(s.maxSeconds()).isEqualTo(0.0);
    // a crush preset brings its end rule; a crush option changes only its own part
    var crush = settings(TestType.CRUSH, "--preset", "--travel-limit-mm", "12");
    assertThat(crush.crushEnd().travelLimit_mm()).isEqualTo(12.0);
    assertThat(crush.crushEnd().lowForceFraction())
        .isEqualTo(RunPreset.of(TestType.CRUSH).crushEnd().lowForceFraction());
    assertThat(crush.maxSeconds()).isEqualTo(RunPreset.of(TestType.CRUSH).maxSeconds());
  }
}
