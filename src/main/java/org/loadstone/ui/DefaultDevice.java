package org.loadstone.ui;

import java.nio.file.Path;
import java.util.Map;
import org.loadstone.acquire.ScaleChoice;
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
    var cell = setup.cell();
    double capacity = cell.capacity_N();
    return new ConsoleConfig("simulated frame · " + setup.scenario() + " · seed " + setup.seed(),
        setup::openTransport,
        ScaleChoice.nominal(cell.countsPerN(), "simulated cell's nominal", capacity),
        capacity, archive, Map.of("sim_scenario", setup.scenario(),
            "sim_seed", Long.toString(setup.seed())), home);
  }
}
