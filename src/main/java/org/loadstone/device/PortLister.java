package org.loadstone.device;

import com.fazecast.jSerialComm.SerialPort;
import java.util.ArrayList;
import java.util.List;

/** Lists the serial ports the system reports, plus the built-in simulated frame. */
public final class PortLister {
  private PortLister() {}

  /**
   * One port.
   *
   * @param name what to pass to {@code --port}
   * @param description the system's description of the device
   */
  public record PortInfo(String name, String description) {}

  /** @return the simulated frame first, then every system serial port; never null */
  public static List<PortInfo> list() {
    List<PortInfo> out = new ArrayList<>();
    out.add(new PortInfo(DeviceOpener.SIM, "built-in simulated load frame"));
    for (SerialPort p : SerialPort.getCommPorts()) {
      String path = p.getSystemPortPath();
      String desc = p.getPortDescription();
      String loc = p.getPortLocation();
      out.add(new PortInfo(path == null || path.isEmpty() ? p.getSystemPortName() : path,
          (desc == null ? "" : desc) + (loc == null || loc.isEmpty() ? "" : " @ " + loc)));
    }
    return out;
  }
}
