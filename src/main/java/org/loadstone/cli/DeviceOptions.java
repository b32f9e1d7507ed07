package org.loadstone.cli;

import org.loadstone.device.DeviceOpener;
import org.loadstone.device.SimSetup;
import org.loadstone.device.SerialSettings;
import org.loadstone.device.Transport;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** Options that choose and open a device, shared by the commands that talk to one. */
public final class DeviceOptions {
  /** What is on the simulated frame unless --scenario says otherwise (calibrate, verify: dead-weight). */
  static final String DEFAULT_SCENARIO = "panel-foam";

  @Option(
      names = "--port",
      defaultValue = "sim",
      paramLabel = "PORT",
      description = "Serial port name or path, or 'sim' for the built-in simulated frame "
          + "(default: ${DEFAULT-VALUE}). 'loadstone ports' lists them.")
  String port;

  @Option(names = "--baud", paramLabel = "BPS", defaultValue = "115200", description = "Serial speed (default: ${DEFAULT-VALUE}).")
  int baud;

  @Option(
      names = "--reset-wait-ms", paramLabel = "MS",
      defaultValue = "0",
      description = "Wait this long after opening, for boards that reset on open (try "
          + "2000; default: ${DEFAULT-VALUE}).")
  int resetWaitMs;

  @Option(
      names = "--scenario", paramLabel = "NAME",
      description = "Simulator: what is on the simulated frame (default: " + DEFAULT_SCENARIO
          + "; dead-weight for calibrate and verify); 'loadstone simulate --help' lists them.")
  String scenario;

  @Option(names = "--seed", paramLabel = "SEED", defaultValue = "1", description = "Simulator: random seed (default: ${DEFAULT-VALUE}).")
  long seed;

  @Option(
      names = "--rate-hz", paramLabel = "HZ",
      defaultValue = "80",
      description = "Simulator: samples per second: 10 or 80 (bridge amplifier) or 100…50000 "
          + "(fast converter) (default: ${DEFAULT-VALUE}).")
  double rateHz;

  @Option(names = "--hand", description = "Simulator: a hand-operated press (uneven strokes, pauses) instead of a constant crosshead rate.")
  boolean hand;

  @Option(
      names = "--sim-speed", paramLabel = "FACTOR",
      defaultValue = "1",
      description = "Simulator: run the simulated clock this many times faster than real time (default: ${DEFAULT-VALUE}).")
  double simSpeed;

  @Option(
      names = "--sim-start-delay-s", paramLabel = "S",
      defaultValue = "1",
      description = "Simulator: the press waits for the run to be armed, then starts loading "
          + "this many simulated seconds later (default: ${DEFAULT-VALUE}).")
  double simStartDelay_s;

  @Mixin SimImperfectionOptions imperfections;

  /** @return the simulated scenario: the one given, else {@link #DEFAULT_SCENARIO} */
  public String scenario() {
    return scenario != null ? scenario : DEFAULT_SCENARIO;
  }

  /** @return whether the chosen port is the simulated frame */
  public boolean simulated() {
    return DeviceOpener.SIM.equalsIgnoreCase(port.trim());
  }

  /** @return the simulator settings these options describe */
  public SimSetup simSetup() {
    return new SimSetup(scenario(), seed, rateHz, hand, simSpeed, simStartDelay_s,
        imperfections.imperfections());
  }

  /** Opens the device. */
  public Transport open() {
    SerialSettings serial =
        SerialSettings.builder().baud(baud).resetWaitMs(resetWaitMs).build();
    return DeviceOpener.open(port, serial, () -> simSetup().openTransport());
  }
}
