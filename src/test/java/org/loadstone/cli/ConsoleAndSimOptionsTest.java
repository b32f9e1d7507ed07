package org.loadstone.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.time.LocalDate;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.sim.SimImperfections;
import org.loadstone.ui.ConsoleConfig;
import picocli.CommandLine;

/**
 * The console's device options on the simulated frame, and the simulator's imperfection options,
 * read through picocli as the command line reads them.
 */
class ConsoleAndSimOptionsTest {
  private static final Path CAL = Path.of("calibration", "shelf-rig-1kN-2026-12-03.json");

  private static ConsoleCommand parse(String... args) {
    ConsoleCommand c = new ConsoleCommand();
    new CommandLine(c).parseArgs(args);
    return c;
  }

  @Test
  void aCalibrationChosenForTheSimulatedFrameIsUsedByTheConsole(@TempDir Path archive) {
    ConsoleConfig config = parse("--port", "sim", "--cal", CAL.toString(),
        "--archive", archive.toString()).config(LocalDate.of(2026, 12, 4));
    assertNotNull(config.simulated(), "still the simulated frame");
    assertNotNull(config.scale().calibrationId(), "the calibration is the scale, not the "
        + "simulated cell's nominal sensitivity: " + config.scale().description());
    assertTrue(config.scale().calibrationSha256().startsWith("57646b8b"),
        "the calibration shipped in calibration/");
  }

  @Test
  void theConsolesSecondLocationIsTheOneItsRunsGoToWhenTheDiskIsFull(@TempDir Path archive) {
    Path second = archive.resolveSibling(archive.getFileName() + "-second");
    ConsoleConfig config = parse("--port", "sim", "--archive", archive.toString(),
        "--second-archive", second.toString()).config(LocalDate.of(2026, 12, 4));
    assertEquals(second, config.secondArchive(), "the same option as record's");
    assertNull(parse("--port", "sim", "--archive", archive.toString())
        .config(LocalDate.of(2026, 12, 4)).secondArchive());
  }

  @Test
  void withoutACalibrationTheSimulatedFrameUsesItsCellsNominalScale(@TempDir Path archive) {
    ConsoleConfig config = parse("--port", "sim", "--archive", archive.toString())
        .config(LocalDate.of(2026, 12, 4));
    assertNull(config.scale().calibrationId());
    // the simulated cell's nominal sensitivity: 2 mV/V at 5 V into a 24-bit converter at gain
    // 128, 2^23 counts per 20 mV, so 4294.967296 counts/N for a 1 kN cell (the HX711's
    // differential input range at gain 128 is ±20 mV at 5 V, from its data sheet, from memory)
    assertEquals(1.0, config.scale().scale().force_N(4294.967296), 1e-9);
  }

  @Test
  void theSimulatorsImperfectionOptionsDefaultToTheTypicalAmplifier() {
    SimImperfectionOptions o = new SimImperfectionOptions();
    new CommandLine(o).parseArgs();
    assertEquals(SimImperfections.TYPICAL, o.imperfections(),
        "the documented defaults (contributor guide) are the ones the command line applies");
  }
}
