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

}
