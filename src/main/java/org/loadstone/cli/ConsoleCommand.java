package org.loadstone.cli;

import java.util.concurrent.Callable;
import org.loadstone.acquire.ForceScale;
import org.loadstone.device.SimSetup;
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

  @Option(
      names = "--counts-per-n",
      description = "For a serial device without a calibration yet: nominal sensitivity in "
          + "counts per N used to show force (default: show counts as N ÷ 1).")
  Double countsPerN;

  @Override
  public Integer call() {
    ConsoleConfig config;
    if (device.simulated()) {
      SimSetup s = device.simSetup();
      config = new ConsoleConfig("simulated frame · " + s.scenario() + " · seed " + s.seed(),
          s::openTransport,
          ForceScale.linear(s.nominalCountsPerN(), "simulated cell, nominal sensitivity"),
          SafetyNotice.defaultHome());
    } else {
      double k = countsPerN == null ? 1.0 : countsPerN;
      config = new ConsoleConfig(device.port, device::open,
          ForceScale.linear(k, countsPerN == null ? "uncalibrated: counts" : "nominal"),
          SafetyNotice.defaultHome());
    }
    ConsoleApp.configure(config);
    ConsoleLauncher.launch(new String[0]);
    return 0;
  }
}
