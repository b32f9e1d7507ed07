package org.loadstone.ui;

import org.loadstone.acquire.ForceScale;
import org.loadstone.device.SimSetup;

/** The console's device when none is chosen: the built-in simulated frame. */
final class DefaultDevice {
  private DefaultDevice() {}

  static ConsoleConfig simulated() {
    return simulated(SimSetup.DEFAULT);
  }

  static ConsoleConfig simulated(SimSetup setup) {
    return new ConsoleConfig("simulated frame · " + setup.scenario() + " · seed " + setup.seed(),
        setup::openTransport,
        ForceScale.linear(setup.nominalCountsPerN(), "simulated cell, nominal sensitivity"),
        SafetyNotice.defaultHome());
  }
}
