package org.loadstone.ui;

import java.nio.file.Path;
import java.util.Map;
import java.util.function.Supplier;
import org.loadstone.acquire.ScaleChoice;
import org.loadstone.device.SimSetup;
import org.loadstone.device.Transport;
import org.loadstone.units.Precondition;

/**
 * What the console connects to and where its runs go.
 *
 * @param deviceLabel how the device is named in the window, e.g. {@code sim · panel-foam}
 * @param connect opens the device link (called again to reconnect)
 * @param scale counts to force, with the warnings a run must carry; null until a calibration is
 *     chosen (the live view then shows counts and runs are refused, see {@code ScalePolicy})
 * @param ratedCapacity_N the load cell's rated capacity as given, or null to take it from the
 *     calibration's cell profile or the simulated cell
 * @param zeroDriftLimit_N the zero check's limit, or null for the default
 * @param simulated the simulated frame, or null for a real device
 * @param archive where runs are stored
 * @param deviceFields extra device fields stored with runs (e.g. the simulator's scenario)
 * @param home Loadstone's settings folder
 * @param secondArchive where runs go when the archive's disk is full (another disk), or null
 */
public record ConsoleConfig(String deviceLabel, Supplier<Transport> connect, ScaleChoice scale,
    Double ratedCapacity_N, Double zeroDriftLimit_N, SimSetup simulated, Path archive,
    Map<String, String> deviceFields, Path home, Path secondArchive) {
  /** Without a second location. */
  public ConsoleConfig(String deviceLabel, Supplier<Transport> connect, ScaleChoice scale,
      Double ratedCapacity_N, Double zeroDriftLimit_N, SimSetup simulated, Path archive,
      Map<String, String> deviceFields, Path home) {
    this(deviceLabel, connect, scale, ratedCapacity_N, zeroDriftLimit_N, simulated, archive,
        deviceFields, home, null);
  }

  /** @return this set-up with runs going to {@code where} when the archive's disk is full */
  public ConsoleConfig withSecondArchive(Path where) {
    return new ConsoleConfig(deviceLabel, connect, scale, ratedCapacity_N, zeroDriftLimit_N,
        simulated, archive, deviceFields, home, where);
  }

  public ConsoleConfig {
    Precondition.notNull(deviceLabel, "deviceLabel");
    Precondition.notNull(connect, "connect");
    Precondition.notNull(archive, "archive");
    deviceFields = Map.copyOf(deviceFields);
    Precondition.notNull(home, "home");
  }
}
