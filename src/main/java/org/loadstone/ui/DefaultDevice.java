package org.loadstone.ui;

import java.nio.file.Path;
import java.time.LocalDate;
import java.util.Map;
import org.loadstone.acquire.ScaleChoice;
import org.loadstone.acquire.ScalePolicy;
import org.loadstone.archive.ArchiveFolders;
import org.loadstone.device.SimSetup;

/** The console's device when none is chosen: the built-in simulated frame. */
public final class DefaultDevice {
  private DefaultDevice() {}

  static ConsoleConfig simulated() {
    return simulated(SimSetup.DEFAULT, ArchiveFolders.defaultFolder(), SafetyNotice.defaultHome());
  }

  /** The console on a simulated frame with these settings. */
  public static ConsoleConfig simulated(SimSetup setup, Path archive, Path home) {
    return simulated(setup, archive, home, null);
  }

  /**
   * The console on a simulated frame with these settings and a zero check limit (null: the
   * default).
   */
  public static ConsoleConfig simulated(SimSetup setup, Path archive, Path home,
      Double zeroDriftLimit_N) {
    return simulated(setup, ScalePolicy.choose(null, null, setup, LocalDate.now()), null,
        archive, home, zeroDriftLimit_N);
  }

  /**
   * The console on a simulated frame with a chosen scale (a calibration made on its dead
   * weights, say) and rated capacity (null: the scale's).
   */
  public static ConsoleConfig simulated(SimSetup setup, ScaleChoice scale, Double capacity_N,
      Path archive, Path home, Double zeroDriftLimit_N) {
    return new ConsoleConfig("simulated frame · " + setup.scenario() + " · seed " + setup.seed(),
        setup::openTransport, scale, capacity_N, zeroDriftLimit_N, setup, archive,
        Map.of("sim_scenario", setup.scenario(), "sim_seed", Long.toString(setup.seed())), home);
  }
}
