package org.loadstone.device;

import com.fazecast.jSerialComm.SerialPort;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.loadstone.units.LoadstoneException;

/** A serial port through jSerialComm. */
public final class SerialTransport implements Transport {
  private final String name;
  private final SerialPort port;
  private volatile boolean open;

  private SerialTransport(String name, SerialPort port) {
    this.name = name;
    this.port = port;
    this.open = true;
  }

  /**
   * Opens a serial port by system name ({@code COM3}, {@code ttyUSB0}) or path ({@code
   * /dev/ttyACM0}, a pseudo-terminal link).
   *
   * @throws LoadstoneException naming the port and the likely fix when it is missing, busy or
   *     forbidden
   */
  public static SerialTransport open(String portName, SerialSettings settings) {
    String name = portName.trim();
    if (name.isEmpty()) {
      throw new LoadstoneException("no serial port given: name the port the board is plugged "
          + "into, or choose the built-in simulated frame", org.loadstone.units.Setting.PORT);
    }
    checkPathBeforeOpening(name);
    SerialPort p;
    try {
      p = SerialPort.getCommPort(name);
    } catch (RuntimeException e) {
      throw notFound(name);
    }
    p.setComPortParameters(settings.baud(), 8, SerialPort.ONE_STOP_BIT, SerialPort.NO_PARITY);
    p.setFlowControl(SerialPort.FLOW_CONTROL_DISABLED);
    p.setComPortTimeouts(
        SerialPort.TIMEOUT_READ_SEMI_BLOCKING | SerialPort.TIMEOUT_WRITE_BLOCKING,
        settings.readTimeoutMs(),
        1000);
    if (!p.openPort(0)) {
      throw openFailure(name, p.getLastErrorCode());
    }
    if (settings.resetWaitMs() > 0) {
      try {
        Thread.sleep(settings.resetWaitMs());
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
      }
      p.flushIOBuffers();
    }
    return new SerialTransport(name, p);
  }

  private static void checkPathBeforeOpening(String name) {
    Path path;
    try {
      path = Path.of(name);
    } catch (java.nio.file.InvalidPathException e) {
      throw notFound(name);
    }
    if (!name.startsWith("/")) {
      // a bare name (COM3, ttyUSB0) is the port library's to resolve; only a file or folder
      // given by a relative path is caught here
      if (Files.isRegularFile(path) || Files.isDirectory(path)) {
        throw notAPort(name, Files.isDirectory(path));
      }
      return;
    }
    if (!Files.exists(path)) {
      throw notFound(name);
    }
    if (Files.isRegularFile(path) || Files.isDirectory(path)) {
      throw notAPort(name, Files.isDirectory(path));
    }
    if (!Files.isReadable(path) || !Files.isWritable(path)) {
      throw forbidden(name);
    }
  }

  static LoadstoneException notFound(String name) {
    return new LoadstoneException("serial port " + name + " not found: check that the board is "
        + "plugged in and powered, then choose one of the serial ports present",
        org.loadstone.units.Setting.PORT);
  }

  static LoadstoneException notAPort(String name, boolean folder) {
    return new LoadstoneException(name + " is " + (folder ? "a folder" : "an ordinary file")
        + ", not a serial port: choose the device the board appears as (on Linux /dev/ttyACM0 "
        + "or /dev/ttyUSB0, on Windows COM3), or the built-in simulated frame",
        org.loadstone.units.Setting.PORT);
  }

  static LoadstoneException forbidden(String name) {
    return new LoadstoneException("permission denied for serial port " + name + ": on Linux add "
        + "your user to the dialout group (sudo usermod -aG dialout $USER), then log out and back in");
  }

  static LoadstoneException openFailure(String name, int errno) {
    switch (errno) {
      case 2:
        return notFound(name);
      case 13:
        return forbidden(name);
      case 25:
        return new LoadstoneException(name + " is not a serial port (the system says it is not a "
            + "terminal device): choose the device the board appears as, or the built-in "
            + "simulated frame", org.loadstone.units.Setting.PORT);
      case 16:
        return new LoadstoneException("serial port " + name + " is busy: another program (a serial "
            + "monitor, another Loadstone) has it open; close that program and try again");
      default:
        return new LoadstoneException("could not open serial port " + name + " (system error "
            + errno + "): check the cable, unplug and replug the board, and check that the port "
            + "is still present", org.loadstone.units.Setting.PORT);
    }
  }

  @Override
  public String name() {
    return name;
  }

  @Override
  public int read(byte[] buf, int off, int len) throws IOException {
    if (!open) {
      return -1;
    }
    if (off != 0) {
      byte[] tmp = new byte[len];
      int n = read(tmp, 0, len);
      if (n > 0) {
        System.arraycopy(tmp, 0, buf, off, n);
      }
      return n;
    }
    int n = port.readBytes(buf, len);
    if (n < 0 || (n == 0 && vanished())) {
      open = false;
      return -1;
    }
    return n;
  }

  private boolean vanished() {
    if (!port.isOpen()) {
      return true;
    }
    return name.startsWith("/") && !Files.exists(Path.of(name));
  }

  @Override
  public void write(byte[] data) throws IOException {
    if (!open) {
      throw new IOException("serial port " + name + " is closed");
    }
    int n = port.writeBytes(data, data.length);
    if (n != data.length) {
      throw new IOException("serial port " + name + " accepted " + n + " of " + data.length
          + " bytes; the device may have been unplugged");
    }
  }

  @Override
  public boolean isOpen() {
    return open;
  }

  @Override
  public void close() {
    if (open) {
      open = false;
    }
    port.closePort();
  }
}
