package org.loadstone.ui;

import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import javafx.application.Platform;

/**
 * A watchdog on the JavaFX thread: every 2 ms it hands the thread an empty task and notes how
 * long the task waited, so the longest wait in a phase is the longest time the window could not
 * answer (a stall). It measures; it asserts nothing (a figure for the contributor guide, never a
 * test threshold). Beside each longest wait it notes the CPU time the JavaFX thread itself used
 * meanwhile (a wait with little CPU is the thread not getting a core on a busy machine, a wait
 * with as much CPU as wall time is work done on it) and, for waits over 100 ms, the frame of
 * ours it was in most often.
 */
final class FxPulse implements AutoCloseable {
  /**
   * By phase: the longest wait (ns), the number of pulses, the JavaFX thread's CPU time during
   * the longest wait (ns), the most CPU time it used during any one wait (ns).
   */
  private final Map<String, long[]> phases = new LinkedHashMap<>();
  /** By phase: where the JavaFX thread was seen during long waits, and how often. */
  private final Map<String, Map<String, Integer>> seen = new LinkedHashMap<>();
  private final java.lang.management.ThreadMXBean mx =
      java.lang.management.ManagementFactory.getThreadMXBean();
  private volatile Thread fxThread;
  private volatile String phase = "start";
  private volatile boolean running = true;
  private final Thread thread;

  FxPulse() {
    thread = new Thread(this::beat, "fx pulse");
    thread.setDaemon(true);
    thread.start();
  }

  /** Starts counting waits under another name. */
  void phase(String name) {
    phase = name;
  }

  private void beat() {
    Platform.runLater(() -> fxThread = Thread.currentThread());
    while (running) {
      CountDownLatch ran = new CountDownLatch(1);
      String in = phase;
      Thread fx = fxThread;
      long cpu0 = fx == null ? 0 : mx.getThreadCpuTime(fx.getId());
      long t0 = System.nanoTime();
      Platform.runLater(ran::countDown);
      try {
        while (!ran.await(100, TimeUnit.MILLISECONDS)) {
          if (fx != null) {
            where(in, fx.getStackTrace());
          }
          if (!running) {
            return;
          }
        }
        long wait = System.nanoTime() - t0;
        long cpu = fx == null ? 0 : mx.getThreadCpuTime(fx.getId()) - cpu0;
        note(in, wait, cpu);
        Thread.sleep(2);
      } catch (InterruptedException e) {
        return;
      }
    }
  }

  private synchronized void note(String in, long wait_ns, long cpu_ns) {
    long[] p = phases.computeIfAbsent(in, k -> new long[4]);
    if (wait_ns > p[0]) {
      p[0] = wait_ns;
      p[2] = cpu_ns;
    }
    p[1]++;
    p[3] = Math.max(p[3], cpu_ns);
  }

  /** Notes the first frame of ours (else the top frame) of the JavaFX thread's stack. */
  private synchronized void where(String in, StackTraceElement[] stack) {
    String at = stack.length == 0 ? "(idle)" : stack[0].getClassName() + "."
        + stack[0].getMethodName();
    for (StackTraceElement e : stack) {
      if (e.getClassName().startsWith("org.loadstone")) {
        at = e.getClassName().replace("org.loadstone.", "") + "." + e.getMethodName();
        break;
      }
    }
    seen.computeIfAbsent(in, k -> new LinkedHashMap<>()).merge(at, 1, Integer::sum);
  }

  /** @return one line per phase: the longest wait in ms and the pulses counted */
  synchronized String table() {
    StringBuilder b = new StringBuilder("| phase | longest FX-thread wait, ms | FX-thread CPU "
        + "in it, ms | most FX CPU in one wait, ms | pulses | where it was (samples) |\n"
        + "|---|---|---|---|---|---|\n");
    phases.forEach((name, p) -> {
      StringBuilder w = new StringBuilder();
      seen.getOrDefault(name, Map.of()).entrySet().stream()
          .sorted((x, y) -> y.getValue() - x.getValue()).limit(3)
          .forEach(e -> w.append(w.length() == 0 ? "" : ", ").append(e.getKey()).append(" ")
              .append(e.getValue()));
      b.append(String.format(Locale.ROOT, "| %s | %.0f | %.0f | %.0f | %d | %s |%n", name,
          p[0] / 1e6, p[2] / 1e6, p[3] / 1e6, p[1], w));
    });
    return b.toString();
  }

  @Override
  public void close() {
    running = false;
    thread.interrupt();
  }
}
