package org.loadstone.units;

import java.util.ArrayList;
import java.util.List;
import java.util.function.Consumer;

/**
 * Work that may take long (opening a port, waiting for a thread to end, reading or analysing a
 * run, writing a report, building a chart from a run) announces itself here, so that a thread that
 * must stay responsive — the console's window thread — can be guarded: work announced on a guarded
 * thread is recorded and reported, whatever the machine's speed. This is how the console proves it
 * never does slow work on its window thread without measuring time, which a busy machine would
 * make unreliable.
 *
 * <p>Costs one volatile read when nothing is guarded.
 */
public final class SlowWork {
  private static volatile Thread guarded;
  private static volatile Consumer<String> reporter = what -> { };
  private static final List<String> seen = new ArrayList<>();

  private SlowWork() {}

  /**
   * Announces slow work on the calling thread.
   *
   * @param what the work in words, e.g. "opening the port"
   */
  public static void check(String what) {
    Thread g = guarded;
    if (g != null && g == Thread.currentThread()) {
      synchronized (seen) {
        seen.add(what);
      }
      reporter.accept(what);
    }
  }

  /**
   * Guards a thread: slow work announced on it from now on is recorded and passed to {@code
   * report}.
   *
   * @param thread the thread to keep responsive
   * @param report told what ran on it (on that thread), e.g. to log it
   */
  public static void guard(Thread thread, Consumer<String> report) {
    Precondition.notNull(thread, "thread");
    Precondition.notNull(report, "report");
    reporter = report;
    guarded = thread;
  }

  /** Ends the guard. */
  public static void unguard() {
    guarded = null;
    reporter = what -> { };
  }

  /** @return the slow work seen on the guarded thread since the last {@link #clearSeen()} */
  public static List<String> seen() {
    synchronized (seen) {
      return List.copyOf(seen);
    }
  }

  /** Forgets what was seen. */
  public static void clearSeen() {
    synchronized (seen) {
      seen.clear();
    }
  }
}
