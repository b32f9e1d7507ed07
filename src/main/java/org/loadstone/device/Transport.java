package org.loadstone.device;

import java.io.IOException;

/**
 * A byte link to a device: a serial port or the built-in simulated frame. One thread reads; any
 * thread may write commands. Closing is idempotent.
 */
public interface Transport extends AutoCloseable {
  /** @return the port name as the user gave it, e.g. {@code /dev/ttyACM0} or {@code sim} */
  String name();

  /**
   * Reads what has arrived, waiting at most the transport's read timeout.
   *
   * @return bytes read (0 on time-out), or -1 when the device is gone (cable pulled, port closed)
   * @throws IOException on a read failure that is not a disconnection
   */
  int read(byte[] buf, int off, int len) throws IOException;

  /**
   * Sends bytes to the device.
   *
   * @throws IOException when the device is gone or the write fails
   */
  void write(byte[] data) throws IOException;

  /** @return whether the link is still open */
  boolean isOpen();

  /** Closes the link; safe to call more than once. */
  @Override
  void close();
}
