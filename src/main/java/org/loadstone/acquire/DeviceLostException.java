package org.loadstone.acquire;

import org.loadstone.units.LoadstoneException;

/**
 * The device went away (or restarted) while a command needed it. The message says how and what
 * was kept; the command line ends with its own exit code for it.
 */
public class DeviceLostException extends LoadstoneException {
  private static final long serialVersionUID = 1L;

  /** @param message what happened and what was kept, for the user */
  public DeviceLostException(String message) {
    super(message);
  }
}
