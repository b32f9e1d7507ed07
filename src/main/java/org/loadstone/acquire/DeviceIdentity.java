package org.loadstone.acquire;

import java.util.Optional;
import org.loadstone.protocol.DeviceMessage;
import org.loadstone.units.LoadstoneException;

/** The one wait for a device to say who it is, with one time-out, for every command and the console. */
public final class DeviceIdentity {
  /** How long a device has to send its identity after it is asked. */
  public static final long WAIT_MS = 5000;

  private DeviceIdentity() {}

  /**
   * Waits up to {@link #WAIT_MS} for the device's identity.
   *
   * @param reader a started reader (it asks for the identity when it starts)
   * @return the identity, or empty when the device sent none in time (a run then measures the
   *     rate from the device's clock, see {@link SampleRate})
   * @throws LoadstoneException when the device is lost while waiting or speaks another protocol
   *     version
   */
  public static Optional<DeviceMessage.Identity> await(DeviceReader reader) {
    long until = System.nanoTime() + WAIT_MS * 1_000_000;
    while (reader.identity().isEmpty() && reader.lostReason().isEmpty()
        && System.nanoTime() < until) {
      pause();
    }
    reader.lostReason().ifPresent(why -> {
      throw new DeviceLostException(why);
    });
    reader.unsupportedVersion().ifPresent(why -> {
      throw new LoadstoneException(why);
    });
    return reader.identity();
  }

  /** A short pause between looks at the reader's state. */
  static void pause() {
    try {
      Thread.sleep(10);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new LoadstoneException("interrupted while waiting for the device");
    }
  }
}
