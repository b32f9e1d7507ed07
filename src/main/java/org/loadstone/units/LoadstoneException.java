package org.loadstone.units;

/**
 * An expected failure that a user can act on: a bad file, a missing port, an
 * entry out of range. The message names the thing, the fault and the fix; it is
 * shown to the user as it is, without a stack trace.
 *
 * <p>Caller mistakes (a null argument, an index out of range) are
 * {@link IllegalArgumentException}s instead.
 */
public class LoadstoneException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  /** @param message what failed, where, and what to do about it */
  public LoadstoneException(String message) {
    super(message);
  }

  /**
   * @param message what failed, where, and what to do about it
   * @param cause the underlying failure, kept for the log
   */
  public LoadstoneException(String message, Throwable cause) {
    super(message, cause);
  }
}
