package org.loadstone;

/**
 * The deadlines of the tests' waits. A wait in a test ends when the thing it waits for happens
 * (a run stored, a label changed, a count reached); its deadline only guards against a hang, so
 * it is set far beyond what a busy two-core build machine needs, never as the check itself.
 */
public final class HangGuard {
  private HangGuard() {}

  /** Seconds any one wait may take before the test is declared hung. */
  public static final long S = 300;

  /** The same in milliseconds, for the waits that take them. */
  public static final long MS = S * 1000;

  /** Seconds a whole test that waits for a simulated run may take (a few waits in a row). */
  public static final long TEST_S = 3 * S;
}
