package org.loadstone.device;

import java.util.function.Supplier;
import org.loadstone.units.LoadstoneException;

/** Opens the device a user names: {@code sim} for the built-in simulated frame, else a serial port. */
public final class DeviceOpener {
  /** The port name of the built-in simulated frame. */
  public static final String SIM = "sim";

  private DeviceOpener() {}

  /**
   * @param port {@code sim} or a serial port name or path
   * @param serial settings for a serial port
   * @param simulated supplies the simulated device when {@code port} is {@code sim}
   * @throws LoadstoneException when the port cannot be opened, naming it and the likely fix
   */
  public static Transport open(String port, SerialSettings serial, Supplier<Transport> simulated) {
    org.loadstone.units.SlowWork.check("opening the port");
    if (port == null || port.isBlank()) {
      throw new LoadstoneException("no port given: choose the built-in simulated frame or the "
          + "serial port the board is plugged into", org.loadstone.units.Setting.PORT);
    }
    if (port.trim().equalsIgnoreCase(SIM)) {
      return simulated.get();
    }
    return SerialTransport.open(port, serial);
  }
}
