package org.loadstone.ui;

import java.nio.file.Path;
import java.util.function.Supplier;
import org.loadstone.acquire.ForceScale;
import org.loadstone.device.Transport;
import org.loadstone.units.Precondition;

/**
 * What the console connects to.
 *
 * @param deviceLabel how the device is named in the window, e.g. {@code sim · panel-foam}
 * @param connect opens the device link (called again to reconnect)
 * @param scale counts to force until a calibration is chosen
 * @param home Loadstone's settings folder
 */
public record ConsoleConfig(String deviceLabel, Supplier<Transport> connect, ForceScale scale,
    Path home) {
  public ConsoleConfig {
    Precondition.notNull(deviceLabel, "deviceLabel");
    Precondition.notNull(connect, "connect");
    Precondition.notNull(scale, "scale");
    Precondition.notNull(home, "home");
  }
}
