package org.loadstone.cli;

import java.util.concurrent.Callable;
import java.time.LocalDate;
import java.util.Map;
import org.loadstone.acquire.ScaleChoice;
import org.loadstone.ui.DefaultDevice;
import org.loadstone.units.LoadstoneException;
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

  @Option(names = "--cal", paramLabel = "FILE", description = "Calibration file for a serial device.")
  java.nio.file.Path cal;

  @Option(names = "--capacity-N", description = "The load cell's rated capacity (default: from the calibration's cell profile).")
  Double capacity;

  @Option(
      names = "--counts-per-n",
      description = "For a serial device without a calibration yet: nominal sensitivity in "
          + "counts per N used to show force (default: show counts as N ÷ 1).")
  Double countsPerN;

  @Override
  public Integer call() {
    ConsoleConfig config;
    if (device.simulated()) {
      config = DefaultDevice.simulated(device.simSetup(), archive.folder(),
          SafetyNotice.defaultHome());
    } else {
      ScaleChoice scale = cal != null ? ScaleChoice.fromCalibration(cal, LocalDate.now())
          : ScaleChoice.nominal(countsPerN == null ? 1.0 : countsPerN,
              countsPerN == null ? "uncalibrated: counts" : "given", null);
      Double cap = capacity != null ? capacity : scale.ratedCapacity_N();
      if (cap == null) {
        throw new LoadstoneException("the load cell's rated capacity is unknown, and the "
            + "overload stop depends on it: give --capacity-N");
      }
      config = new ConsoleConfig(device.port, device::open, scale, cap, archive.folder(),
          Map.of(), SafetyNotice.defaultHome());
    }
    ConsoleApp.configure(config);
    ConsoleLauncher.launch(new String[0]);
    return 0;
  }
}
