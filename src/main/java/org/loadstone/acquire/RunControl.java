package org.loadstone.acquire;

import org.loadstone.archive.FinishCause;
import org.loadstone.units.Precondition;

/**
 * The run state machine: idle → armed → recording → finished. Pure and single-threaded: the
 * caller feeds every sample (ring index, time, force) in order and acts on the returned events.
 * Auto start at the start threshold keeps a pre-trigger history; the break detector declares the
 * break and a post-break tail is recorded; overload stops at once; a time limit, a manual stop and
 * loss of the device finish the run with their own cause. A crush run ({@link
 * RunSettings#crushEnd()}) has no break: it goes on through the load drops until its travel
 * limit or its low-force rule ({@link CrushEnd}), the time limit, an overload or a stop.
 *
 * <p>Threads: one thread owns a run control (the recorder's; the caller before it starts that
 * thread) and is the only one to call its mutating methods. Other threads — the console's FX
 * thread, the command line's status loop — read {@link #snapshot()} (or the getters, which read
 * it): one immutable value in a volatile field, replaced as a whole after every change, so a
 * reader sees state, peak and force of the same moment and never a half-made change.
 */
public final class RunControl {
  /** The states. */
  public enum State {
    IDLE, ARMED, RECORDING, TAIL, FINISHED;

    /**
     * Whether a run holds the zero and the peak in this state: armed or recording, the run's
     * figures are measured from them, so zeroing or forgetting the peak must wait for its end.
     */
    public boolean holdsZero() {
      return this == ARMED || this == RECORDING || this == TAIL;
    }
  }

  /** What happened on a sample. */
  public sealed interface Event
      permits Started, OverloadWarning, BreakDeclared, Finished {}

  /**
   * Recording started.
   *
   * @param firstIndex first sample of the run (pre-trigger included)
   * @param triggerIndex the sample that crossed the threshold (or the manual start)
   * @param triggerTime_s its time
   * @param manual whether the operator started it
   */
  public record Started(long firstIndex, long triggerIndex, double triggerTime_s, boolean manual)
      implements Event {}

  /** Force passed the overload warning level (once per run). */
  public record OverloadWarning(long index, double force_N, double warn_N) implements Event {}

  /** The break was declared. */
  public record BreakDeclared(BreakDetector.Break detail) implements Event {}

  /**
   * The run ended.
   *
   * @param cause why
   * @param lastIndex last sample of the run (inclusive)
   */
  public record Finished(FinishCause cause, long lastIndex) implements Event {}

  /**
   * The run control as one moment, for any thread.
   *
   * @param state the state
   * @param peak_N highest force since recording started, or −∞
   * @param force_N force of the last sample offered, or NaN before the first
   * @param firstIndex first sample index of the run, or −1 before it starts
   * @param finished the finish, or null until finished
   * @param breakDetail the declared break, or null
   */
  public record Snapshot(State state, double peak_N, double force_N, long firstIndex,
      Finished finished, BreakDetector.Break breakDetail) {}

  private final RunSettings settings;
  private final long pretriggerSamples;
  private State state = State.IDLE;
  private BreakDetector detector;
  private long firstIndex = -1;
  private long lastSeen = -1;
  private double startTime_s;
  private double tailUntil_s;
  private double travelFrom_mm = Double.NaN;
  private double lowSince_s = Double.NaN;
  private boolean warned;
  private boolean manualStartPending;
  private FinishCause pendingStop;
  private Finished finished;
  private double peak_N = Double.NEGATIVE_INFINITY;
  private double force_N = Double.NaN;
  private double position_mm = Double.NaN;
  private volatile Snapshot snapshot = new Snapshot(State.IDLE, peak_N, force_N, -1, null, null);

  /**
   * @param settings thresholds and limits
   * @param sampleRate_Hz nominal rate, to size the pre-trigger history in samples
   */
  public RunControl(RunSettings settings, double sampleRate_Hz) {
    this.settings = Precondition.notNull(settings, "settings");
    Precondition.positive(sampleRate_Hz, "sampleRate_Hz");
    this.pretriggerSamples = Math.round(settings.pretrigger_s() * sampleRate_Hz);
  }

  /** @return the run control as of its last change; any thread */
  public Snapshot snapshot() {
    return snapshot;
  }

  /** Publishes the owner's fields as one value (the only write other threads can see). */
  private void publish() {
    snapshot = new Snapshot(state, peak_N, force_N, firstIndex, finished,
        detector == null ? null : detector.result());
  }

  /** @return the current state; any thread */
  public State state() {
    return snapshot.state();
  }

  /** @return the settings */
  public RunSettings settings() {
    return settings;
  }

  /** @return highest force since recording started, or −∞; any thread */
  public double peak_N() {
    return snapshot.peak_N();
  }

  /** @return the first sample index of the run, or −1 before it starts; any thread */
  public long firstIndex() {
    return snapshot.firstIndex();
  }

  /** @return the finish, once finished; any thread */
  public Finished finished() {
    return snapshot.finished();
  }

  /** @return the declared break, or null; any thread */
  public BreakDetector.Break breakDetail() {
    return snapshot.breakDetail();
  }

  /** Waits for the start threshold. Allowed from idle only. */
  public void arm() {
    if (state != State.IDLE) {
      throw new IllegalStateException("arm() in state " + state);
    }
    state = State.ARMED;
    publish();
  }

  /** Starts recording at the next sample, whatever the force. */
  public void startNow() {
    if (state == State.IDLE || state == State.ARMED) {
      manualStartPending = true;
    }
  }

  /** Stops at the next sample with cause {@code manual} (or ends the wait when not recording). */
  public void stopNow() {
    requestStop(FinishCause.MANUAL);
  }

  /**
   * The device is gone: the run finishes with cause {@code device-lost} at the last sample seen.
   *
   * @return the finish event when a run was recording, else null
   */
  public Finished deviceLost() {
    return endedBy(FinishCause.DEVICE_LOST);
  }

  /**
   * The device restarted: the run finishes with cause {@code device-reset} at the last sample
   * offered (the one before the restart); a wait for the start ends without a run.
   *
   * @return the finish event when a run was recording, else null
   */
  public Finished deviceReset() {
    return endedBy(FinishCause.DEVICE_RESET);
  }

  /**
   * Ends the run now for {@code cause} at the last sample offered; a wait for the start ends.
   *
   * @return the finish event when a run was recording, else null
   */
  public Finished endedBy(FinishCause cause) {
    if (state == State.RECORDING || state == State.TAIL) {
      return finish(cause, lastSeen);
    }
    state = State.FINISHED;
    publish();
    return null;
  }

  private void requestStop(FinishCause c) {
    if (state == State.RECORDING || state == State.TAIL) {
      pendingStop = c;
    } else if (state != State.FINISHED) {
      state = State.FINISHED;
      publish();
    }
  }

  /**
   * Takes one sample.
   *
   * @param index ring index, increasing by one per sample
   * @param oldestHeld oldest index still available (limits the pre-trigger history)
   * @param time_s time of the sample
   * @param force_N force of the sample
   * @param sink receives the events this sample causes, in order
   */
  public void offer(long index, long oldestHeld, double time_s, double force_N,
      java.util.function.Consumer<Event> sink) {
    offer(index, oldestHeld, time_s, force_N, Double.NaN, sink);
  }

  /**
   * Takes one sample with the crosshead's position (for a crush run's travel limit).
   *
   * @param index ring index, increasing by one per sample
   * @param oldestHeld oldest index still available (limits the pre-trigger history)
   * @param time_s time of the sample
   * @param force_N force of the sample
   * @param position_mm crosshead position, mm; NaN when the sample has none
   * @param sink receives the events this sample causes, in order
   */
  public void offer(long index, long oldestHeld, double time_s, double force_N,
      double position_mm, java.util.function.Consumer<Event> sink) {
    lastSeen = index;
    this.force_N = force_N;
    this.position_mm = position_mm;
    try {
      take(index, oldestHeld, time_s, force_N, sink);
    } finally {
      publish();
    }
  }

  private void take(long index, long oldestHeld, double time_s, double force_N,
      java.util.function.Consumer<Event> sink) {
    switch (state) {
      case IDLE, FINISHED -> {
        if (manualStartPending) {
          start(index, oldestHeld, time_s, true, sink);
          recording(index, time_s, force_N, sink);
        }
      }
      case ARMED -> {
        if (manualStartPending || force_N >= settings.startThreshold_N()) {
          start(index, oldestHeld, time_s, manualStartPending, sink);
          recording(index, time_s, force_N, sink);
        }
      }
      case RECORDING, TAIL -> recording(index, time_s, force_N, sink);
      default -> throw new IllegalStateException(state.toString());
    }
  }

  private void start(long index, long oldestHeld, double time_s, boolean manual,
      java.util.function.Consumer<Event> sink) {
    manualStartPending = false;
    firstIndex = Math.max(oldestHeld, index - pretriggerSamples);
    startTime_s = time_s;
    detector = new BreakDetector(settings);
    state = State.RECORDING;
    sink.accept(new Started(firstIndex, index, time_s, manual));
  }

  private void recording(long index, double time_s, double force_N,
      java.util.function.Consumer<Event> sink) {
    if (force_N > peak_N) {
      peak_N = force_N;
    }
    if (pendingStop != null) {
      sink.accept(finish(pendingStop, index));
      return;
    }
    if (force_N >= settings.overloadStop_N()) {
      sink.accept(finish(FinishCause.OVERLOAD, index));
      return;
    }
    if (!warned && force_N >= settings.overloadWarn_N()) {
      warned = true;
      sink.accept(new OverloadWarning(index, force_N, settings.overloadWarn_N()));
    }
    if (settings.crushEnd() != null) {
      FinishCause crushed = crushEnded(time_s, force_N);
      if (crushed != null) {
        sink.accept(finish(crushed, index));
        return;
      }
    } else if (state == State.RECORDING) {
      BreakDetector.Break b = detector.offer(index, time_s, force_N);
      if (b != null) {
        state = State.TAIL;
        tailUntil_s = time_s + settings.postBreak_s();
        sink.accept(new BreakDeclared(b));
      }
    }
    if (state == State.TAIL && time_s >= tailUntil_s) {
      sink.accept(finish(FinishCause.BREAK, index));
      return;
    }
    if (settings.maxSeconds() > 0 && time_s - startTime_s >= settings.maxSeconds()) {
      sink.accept(finish(FinishCause.TIME_LIMIT, index));
    }
  }

  /** A crush run's own ends: its travel limit, then force held below its share of the peak. */
  private FinishCause crushEnded(double time_s, double force_N) {
    CrushEnd c = settings.crushEnd();
    if (Double.isNaN(travelFrom_mm)) {
      travelFrom_mm = position_mm; // the first position recorded, NaN until one comes
    }
    if (c.travelLimit_mm() > 0
        && Math.abs(position_mm - travelFrom_mm) >= c.travelLimit_mm()) {
      return FinishCause.TRAVEL_LIMIT;
    }
    boolean low = c.lowForceFraction() > 0 && peak_N >= settings.armingLevel_N()
        && force_N < c.lowForceFraction() * peak_N;
    if (!low) {
      lowSince_s = Double.NaN;
      return null;
    }
    if (Double.isNaN(lowSince_s)) {
      lowSince_s = time_s;
    }
    return time_s - lowSince_s >= c.lowForce_s() ? FinishCause.LOW_FORCE : null;
  }

  private Finished finish(FinishCause cause, long lastIndex) {
    state = State.FINISHED;
    pendingStop = null;
    finished = new Finished(cause, lastIndex);
    publish();
    return finished;
  }
}
