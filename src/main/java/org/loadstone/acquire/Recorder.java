package org.loadstone.acquire;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import org.loadstone.archive.FinishCause;
import org.loadstone.archive.RunMetadata;
import org.loadstone.device.PressOperator;
import org.loadstone.protocol.DecoderCounters;
import org.loadstone.protocol.HostCommand;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * Records one hands-free run: reads the sample ring on its own thread, converts counts to force,
 * drives {@link RunControl}, starts the {@link RunStore} at the start (with the pre-trigger history)
 * and finishes it at the break, overload, time limit, manual stop or loss of the device. Sends
 * {@code HALT} to a motorised frame at every stop. The device reader thread is never blocked.
 * This class keeps the run's lifecycle (thread, arming, start, stop, status, outcome); what is
 * written about the run is {@link RunRecordMeta}'s, and the zero before it {@link Tare}'s.
 */
public final class Recorder implements AutoCloseable {
  /** Told about the run's progress, on the recorder's thread; must return quickly. */
  public interface Listener {
    default void onStarted(RunControl.Started e) {}

    default void onWarning(String text) {}

    default void onBreak(BreakDetector.Break b) {}

    default void onFinished(Result r) {}

    default void onFailed(String why) {}

    /**
     * The wait ended before load came on (stopped while armed, or the device was lost): there is
     * no run.
     *
     * @param why in words
     */
    default void onDisarmed(String why) {}
  }

  /**
   * The outcome of a run.
   *
   * @param stored where it went
   * @param cause why it ended
   * @param peak_N highest force recorded
   * @param samples samples in the run
   * @param dropped samples missing from the device sequence during the run
   * @param checksumErrors checksum errors during the run
   * @param breakDetail the break, or null
   * @param returnToZero_N force at the end of the run relative to the tare, once the load came
   *     off; null when the run ended with load on the cell
   */
  public record Result(RunStore.Stored stored, FinishCause cause, double peak_N, long samples,
      long dropped, long checksumErrors, BreakDetector.Break breakDetail, Double returnToZero_N) {}

  /**
   * What a status line shows.
   *
   * @param travel_mm crosshead travel since the recorder was armed (position counts over the
   *     device's stated counts per mm), NaN without a position channel or before a sample
   */
  public record Status(RunControl.State state, double force_N, double peak_N, double rateHz,
      long samples, double travel_mm) {}

  private final DeviceReader reader;
  private final ForceScale scale;
  private final double zero_counts;
  private final RunControl control;
  private final RunMetadata template;
  private final RunStore store;
  private final Listener listener;
  private final Thread thread;
  private final CountDownLatch done = new CountDownLatch(1);
  private final List<String> warnings = new ArrayList<>();
  private volatile long decideFrom;
  private volatile boolean stopRequested;
  private volatile boolean startRequested;
  private volatile boolean closing;
  private volatile boolean storing;
  private volatile boolean storeCancelled;
  private boolean spaceWarned;
  private boolean resetSeen;
  private volatile Result result;
  private volatile String failure;
  private RunStore.Recording recording;
  private RunControl.Started started;
  private RunRecordMeta record;
  private final ReturnToZero unloaded;
  /** The device's position counts per mm (its identity's {@code cpm}), 0 when unknown. */
  private final double countsPerMm;
  /** Position counts of the first sample read once armed, NaN before. */
  private double armedPosition = Double.NaN;
  private volatile double travel_mm = Double.NaN;

  /**
   * @param reader the running device reader
   * @param scale counts above zero → force
   * @param zero_counts tare
   * @param settings start/stop rules
   * @param template run metadata known before the start (specimen, group, device, calibration…)
   * @param store where the run goes
   * @param listener progress
   */
  public Recorder(DeviceReader reader, ForceScale scale, double zero_counts, RunSettings settings,
      RunMetadata template, RunStore store, Listener listener) {
    this.reader = Precondition.notNull(reader, "reader");
    this.scale = Precondition.notNull(scale, "scale");
    this.zero_counts = zero_counts;
    this.template = Precondition.notNull(template, "template");
    this.countsPerMm = cpm(template.device().get("cpm"));
    this.store = Precondition.notNull(store, "store");
    this.listener = listener == null ? new Listener() {} : listener;
    this.control = new RunControl(settings, template.sampleRate_Hz());
    this.unloaded = new ReturnToZero(
        (int) Math.max(5, Math.round(template.sampleRate_Hz() * ReturnToZero.WINDOW_S)),
        settings.startThreshold_N());
    this.warnings.addAll(template.warnings());
    this.thread = new Thread(this::loop, "loadstone-run-control");
    this.thread.setDaemon(true);
  }

  /**
   * Arms (waits for the start threshold) and starts the recorder's thread. The start is decided
   * on every sample from the one that arrives next, however late the thread gets to them. On the
   * simulated frame the program then stands in for the operator and starts the press ({@link
   * PressOperator}).
   */
  public void arm() {
    arm(reader.ring().written());
  }

  /**
   * Arms from a given sample on: every sample from {@code fromIndex} is offered to the start
   * rule in order, so the first sample at the threshold starts the run even when it arrived
   * before this call (e.g. between the zero and the arming, on a fast device).
   *
   * @param fromIndex first ring index to decide on, e.g. {@link Tare#nextIndex()}; clamped to
   *     the samples still held
   * @throws IllegalStateException when the recorder was already armed or started
   */
  public synchronized void arm(long fromIndex) {
    if (thread.getState() != Thread.State.NEW) {
      throw new IllegalStateException("arm() once, before the run starts");
    }
    store.keepRoom(); // refused here, before the load, when the disk has no room left
    control.arm(); // before the thread starts: the run control is the thread's from then on
    decideFrom = fromIndex;
    thread.start();
    PressOperator.forTransport(reader.transport()).runArmed();
  }

  /**
   * Starts recording at the next sample, whatever the force (manual start), starting the thread
   * if it is not running. Any thread; the request is carried out on the recorder's thread.
   */
  public synchronized void startNow() {
    if (thread.getState() == Thread.State.NEW) {
      store.keepRoom();
    }
    startRequested = true;
    if (thread.getState() == Thread.State.NEW) {
      decideFrom = reader.ring().written();
      thread.start();
      PressOperator.forTransport(reader.transport()).runArmed();
    }
  }

  /**
   * Ends the run with cause {@code manual} (or stops waiting for the start); while the run waits
   * for room on a full disk to be stored, gives up the wait (the failure then says where the
   * samples are).
   */
  public void stop() {
    if (storing) {
      storeCancelled = true;
    }
    stopRequested = true;
  }

  /** @return what a status line shows now; any thread (one snapshot of the run control) */
  public Status status() {
    RunControl.Snapshot s = control.snapshot();
    return new Status(s.state(), s.force_N(),
        s.peak_N() == Double.NEGATIVE_INFINITY ? Double.NaN : s.peak_N(),
        reader.measuredRateHz(), reader.samplesAccepted(), travel_mm);
  }

  private static double cpm(String text) {
    try {
      double v = text == null ? 0 : Double.parseDouble(text.trim());
      return Double.isFinite(v) && v > 0 ? v : 0;
    } catch (NumberFormatException e) {
      return 0;
    }
  }

  /**
   * Waits for the run to end.
   *
   * @return the result, or empty when the wait ended before a run (stopped while armed) or failed
   */
  public java.util.Optional<Result> await(long timeout, TimeUnit unit) throws InterruptedException {
    org.loadstone.units.SlowWork.check("waiting for a run to be stored");
    done.await(timeout, unit);
    return java.util.Optional.ofNullable(result);
  }

  /** @return whether the recorder's thread has ended (with a result, a failure or no run) */
  public boolean ended() {
    return done.getCount() == 0;
  }

  /** @return why the run could not be written, if it could not */
  public java.util.Optional<String> failure() {
    return java.util.Optional.ofNullable(failure);
  }

  /** @return warnings given so far */
  public synchronized List<String> warnings() {
    return List.copyOf(warnings);
  }

  private void loop() {
    SampleRing ring = reader.ring();
    double countsPerMm = reader.identity().map(id -> id.countsPerMm()).orElse(0.0);
    SampleRing.Cursor cursor = ring.cursorAt(decideFrom);
    int[] resetsKnown = {reader.resets()};
    long[] resetAt = {reader.firstResetFrom(decideFrom)};
    try {
      while (control.state() != RunControl.State.FINISHED && !closing) {
        if (startRequested) {
          startRequested = false;
          control.startNow();
        }
        if (stopRequested) {
          control.stopNow();
        }
        int n = cursor.drain((i, seq, dev, tUs, counts, hp, pos) -> {
          if (control.state() == RunControl.State.FINISHED) {
            return;
          }
          if (reader.resets() != resetsKnown[0]) { // rare: look again where the restart is
            resetsKnown[0] = reader.resets();
            resetAt[0] = reader.firstResetFrom(decideFrom);
          }
          if (i >= resetAt[0]) { // the device restarted: nothing from it joins this run
            resetSeen = true;
            RunControl.Finished f = control.deviceReset();
            if (f != null) {
              onEvent(f);
            }
            return;
          }
          double f = scale.force_N(counts - zero_counts);
          if (hp && countsPerMm > 0) {
            if (Double.isNaN(armedPosition)) {
              armedPosition = pos;
            }
            travel_mm = (pos - armedPosition) / countsPerMm;
          }
          if (started != null) {
            unloaded.offer(f);
          }
          control.offer(i, ring.oldestIndex(), tUs / 1e6, f,
              hp && countsPerMm > 0 ? pos / countsPerMm : Double.NaN, this::onEvent);
        }, 4096);
        watchTheDisk();
        if (n == 0) {
          if (reader.lostReason().isPresent() && cursor.available() == 0) {
            RunControl.Finished f = control.deviceLost();
            if (f != null) {
              onEvent(f);
            }
            break;
          }
          if (stopRequested && control.state() != RunControl.State.RECORDING
              && control.state() != RunControl.State.TAIL) {
            break;
          }
          if (stopRequested) {
            // no samples are coming (device silent): finish at the last sample seen
            RunControl.Finished f = control.deviceLost();
            if (f != null) {
              onEvent(new RunControl.Finished(FinishCause.MANUAL, f.lastIndex()));
            }
            break;
          }
          sleep(2);
        }
      }
    } catch (LoadstoneException e) {
      failure = e.getMessage();
      listener.onFailed(e.getMessage());
    } catch (RuntimeException e) {
      failure = "recording failed: " + e;
      listener.onFailed(failure);
    } catch (Error e) {
      // out of memory or worse: end this thread with a reason rather than leave callers waiting
      failure = "recording stopped by " + e + (started == null ? "" : "; the run's samples are"
          + " kept in its journal, which becomes a run at the next start");
      listener.onFailed(failure);
    } finally {
      store.releaseRoom(); // kept for a run that did not begin
      if (result == null && failure == null && started != null && !closing) {
        failure = "the run ended without being stored; its journal, if written, becomes a run at"
            + " the next start";
        listener.onFailed(failure);
      }
      if (result == null && failure == null && started == null) {
        listener.onDisarmed(reader.lostReason().isPresent()
            ? "the device was lost before load came on: no run stored"
            : resetSeen
            ? "the device restarted before load came on: no run stored, and none started on"
                + " the restarted device (its zero is not known)"
            : "disarmed before load came on: no run stored");
      }
      done.countDown();
    }
  }

  /** A journal that could not be written ends the run; a disk running short is warned of. */
  private void watchTheDisk() {
    if (recording == null || control.state() == RunControl.State.FINISHED) {
      return;
    }
    if (recording.diskFault().isPresent()) {
      RunControl.Finished f = control.endedBy(FinishCause.DISK_FULL);
      if (f != null) {
        onEvent(f);
      }
      return;
    }
    String low = spaceWarned ? null : recording.spaceWarning();
    if (low != null) {
      spaceWarned = true;
      synchronized (this) {
        warnings.add(low);
      }
      listener.onWarning(low);
    }
  }

  private void onEvent(RunControl.Event e) {
    if (e instanceof RunControl.Started s) {
      started = s;
      // the sync light (PROTOCOL.md, LIGHT): on now, so a camera sees the run's start; it came
      // on after the newest sample read, within the link's latency (a board without it refuses)
      Double lightAt_s = null;
      if (reader.lostReason().isEmpty() && reader.send(HostCommand.light(true))) {
        lightAt_s = reader.ring().timeUsAt(reader.ring().written() - 1) / 1e6;
      }
      record = new RunRecordMeta(template, zero_counts, control.settings(), s, reader,
          lightAt_s);
      recording = store.begin(record.atStart(warnings()), reader.ring(), s.firstIndex());
      listener.onStarted(s);
    } else if (e instanceof RunControl.OverloadWarning w) {
      String text = String.format(java.util.Locale.ROOT,
          "overload warning: %.1f N is past %.0f %% of the cell's rated capacity (%.0f N)",
          w.force_N(), control.settings().overloadWarnPct(), control.settings().ratedCapacity_N());
      synchronized (this) {
        warnings.add(text);
      }
      listener.onWarning(text);
    } else if (e instanceof RunControl.BreakDeclared b) {
      listener.onBreak(b.detail());
    } else if (e instanceof RunControl.Finished f) {
      finish(f);
    }
  }

  private void finish(RunControl.Finished f) {
    if (reader.identity().map(id -> id.motorised()).orElse(false)
        && reader.lostReason().isEmpty()) {
      reader.send(HostCommand.halt());
    }
    if (started != null && reader.lostReason().isEmpty()) {
      reader.send(HostCommand.light(false));
    }
    if (recording == null) {
      return;
    }
    DecoderCounters now = reader.counters();
    if (f.cause() == FinishCause.DEVICE_RESET) {
      String text = reader.resetReason().orElse("the device restarted")
          + ": the run ends at its last sample before the restart";
      synchronized (this) {
        warnings.add(text);
      }
      listener.onWarning(text);
      // a sequence that started over is no loss: the count as it was before the restart
      long before = reader.droppedBeforeReset(reader.firstResetFrom(decideFrom));
      if (before >= 0) {
        now = new DecoderCounters(now.samples(), now.messages(), now.checksumErrors(),
            now.resyncs(), before, now.unknown(), now.bytes());
      }
    }
    BreakDetector.Break b = control.breakDetail();
    RunRecordMeta.Finished done = record.atFinish(f.cause(), b, unloaded.force_N(), now,
        warnings());
    storing = true;
    RunStore.Stored stored = recording.finish(f.lastIndex(), done.metadata(),
        new RunStore.Waiting() {
          @Override
          public void say(String text) {
            listener.onWarning(text);
          }

          @Override
          public boolean cancelled() {
            return storeCancelled || closing;
          }
        });
    FinishCause cause = stored.cause() != null ? stored.cause() : f.cause();
    result = new Result(stored, cause, control.peak_N(), stored.samples(), done.dropped(),
        done.checksumErrors(), b, done.metadata().returnToZero_N());
    listener.onFinished(result);
  }

  private static void sleep(long ms) {
    try {
      Thread.sleep(ms);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    }
  }

  /** Stops the recorder's thread (the run, if any, is left to the journal's recovery). */
  @Override
  public void close() {
    org.loadstone.units.SlowWork.check("waiting for the run's thread to end");
    closing = true;
    try {
      thread.join(5000);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    }
  }
}
