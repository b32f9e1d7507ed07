package org.loadstone.cli;

import java.util.concurrent.Callable;
import java.time.LocalDate;
import java.util.Map;
import org.loadstone.acquire.ScaleChoice;
import org.loadstone.acquire.ScalePolicy;
import org.loadstone.acquire.ZeroCheck;
import org.loadstone.ui.DefaultDevice;
import org.loadstone.ui.ConsoleApp;
import org.loadstone.ui.ConsoleConfig;
import org.loadstone.ui.ConsoleLauncher;
import org.loadstone.ui.SafetyNotice;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code loadstone console}: opens the console window on a chosen device. */
@Command(name = "console", description = "Open the console window (the default with no command).")
public final class ConsoleCommand implements Callable<Integer> {
  @Mixin DeviceOptions device;
  @Mixin ArchiveOption archive;

  @Option(names = "--cal", paramLabel = "FILE", description = "Calibration file of the cell (a serial device or the simulated frame).")
  java.nio.file.Path cal;

  @Option(names = "--accept-changed-calibration", description = "Use the --cal calibration even though its content changed since it was saved (refused otherwise; each run stores the warning).")
  boolean acceptChanged;

  @Option(names = "--second-archive", paramLabel = "DIR", description = "Where runs go when the archive's disk is full (best on another disk), as for record; without it a run waits in memory for space.")
  java.nio.file.Path secondArchive;

  @Option(names = "--capacity-n", paramLabel = "N", description = "The load cell's rated capacity (default: from the calibration's cell profile).")
  Double capacity;

  @Option(
      names = "--counts-per-n", paramLabel = "COUNTS-PER-N",
      description = "For a serial device without a calibration yet: nominal sensitivity in "
          + "counts per N, for a rough, uncalibrated force (without it or --cal the live view "
          + "shows counts and runs are refused).")
  Double countsPerN;

  @Option(names = "--zero-drift-n", paramLabel = "N", description = "Warn before a run when the zero moved more than this since the last tare (default: 0.1 %% of rated capacity).")
  Double zeroDriftLimit;

  @Override
  public Integer call() {
    if (zeroDriftLimit != null) {
      new ZeroCheck(zeroDriftLimit); // refused here rather than at the first run
    }
    ConsoleApp.configure(config(LocalDate.now()));
    ConsoleLauncher.launch(new String[0]);
    return 0;
  }

  /**
   * The console's set-up from the options: the scale by the one policy of {@link ScalePolicy}
   * on a serial device and on the simulated frame alike (a calibration made on the simulator's
   * dead weights applies to its specimens).
   */
  ConsoleConfig config(LocalDate today) {
    var sim = device.simulated() ? device.simSetup() : null;
    // no calibration and no nominal sensitivity on a serial device: the live view shows counts,
    // runs are refused
    ScaleChoice scale = ScalePolicy.choose(cal, countsPerN, sim, today, acceptChanged);
    if (sim != null) {
      return DefaultDevice.simulated(sim, scale, capacity, archive.folder(),
          SafetyNotice.defaultHome(), zeroDriftLimit).withSecondArchive(secondArchive);
    }
    return new ConsoleConfig(device.port, device::open, scale, capacity, zeroDriftLimit, null,
        archive.folder(), Map.of(), SafetyNotice.defaultHome()).withSecondArchive(secondArchive);
  }
}
