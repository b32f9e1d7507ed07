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

  /** The settings whose change would fix this, for the caller to say how to change them. */
  private final java.util.List<Setting> settings;

  /** @param message what failed, where, and what to do about it */
  public LoadstoneException(String message) {
    super(message);
    settings = java.util.List.of();
  }

  /**
   * @param message what failed, where, and what to do about it, in the domain's words
   * @param fixedBy the settings the message asks to change; the command line names its options
   *     for them and the console its fields
   */
  public LoadstoneException(String message, Setting... fixedBy) {
    super(message);
    settings = java.util.List.of(fixedBy);
  }

  /**
   * @param message what failed, where, and what to do about it
   * @param cause the underlying failure, kept for the log
   */
  public LoadstoneException(String message, Throwable cause) {
    super(message, cause);
    settings = java.util.List.of();
  }

  /**
   * @param message what failed, where, and what to do about it, in the domain's words
   * @param cause the underlying failure, kept for the log
   * @param fixedBy the settings the message asks to change
   */
  public LoadstoneException(String message, Throwable cause, Setting... fixedBy) {
    super(message, cause);
    settings = java.util.List.of(fixedBy);
  }

  /** @return the settings whose change would fix this (may be empty) */
  public java.util.List<Setting> settings() {
    return settings;
  }
}
