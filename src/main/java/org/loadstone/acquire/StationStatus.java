package org.loadstone.acquire;

import java.util.Locale;
import org.loadstone.archive.FinishCause;

/**
 * What the station is doing, in a few large words a tester reads from across the room, with a
 * tone (a colour family for the display) and a mark (a shape) so that no state is told by colour
 * alone. One mapping for the console's state band and any other face: the link to the device, the
 * freshness of its samples ({@link SampleFreshness}) and the run's phase decide it, in that order
 * — a lost device or a stopped stream is shown over any run state, since every other word would
 * then be a guess.
 */
public final class StationStatus {
  private StationStatus() {}

  /** The link to the device. */
  public enum Link {
    CONNECTING, LIVE, LOST
  }

  /** Where the run is, as the face that drives it knows it. */
  public enum Phase {
    /** no run armed, none stored since the start */
    NONE,
    /** asked for, waiting for the zero (or for a connection, or for recovery) */
    ARMING,
    /** armed: waiting for load */
    ARMED,
    /** recording */
    RECORDING,
    /** the break is declared: recording the tail */
    TAIL,
    /** finished, being stored */
    STORING,
    /** stored, with its finish cause */
    STORED,
    /** stopped before load came on: nothing stored */
    DISARMED,
    /** the run could not be stored (its journal is kept) */
    NOT_STORED
  }

  /** A colour family; the face picks the colours (distinct for colour-blind eyes too). */
  public enum Tone {
    /** nothing happening */
    QUIET,
    /** waiting for something: arming, armed, connecting */
    WAITING,
    /** a run is recording or being stored */
    RUNNING,
    /** a run ended as planned and is stored */
    DONE,
    /** the readings or the run cannot be trusted: device lost, no data, overload, not stored */
    FAULT
  }

  /**
   * What to show.
   *
   * @param words the state in one to three words, upper case, e.g. {@code RECORDING}
   * @param detail one line more, e.g. what the state means or what to do
   * @param tone its colour family
   * @param mark a shape that goes with the tone: ○ quiet, ◆ waiting, ● running, ✓ done, ✕ fault
   * @param noData whether the readings are stale (no recent sample): grey them out
   * @param shownRate_Hz the sample rate to show: 0 while no data arrives
   */
  public record View(String words, String detail, Tone tone, String mark, boolean noData,
      double shownRate_Hz) {}

  /**
   * The device side of the moment.
   *
   * @param link the link
   * @param lostReason why the device was lost, or null
   * @param samples samples received so far
   * @param lastArrival_ns when the last one arrived, on the caller's monotonic clock
   * @param now_ns now, on the same clock
   * @param rate_Hz measured (or stated) sample rate, 0 when unknown
   */
  public record Stream(Link link, String lostReason, long samples, long lastArrival_ns,
      long now_ns, double rate_Hz) {}

  /**
   * The run side of the moment.
   *
   * @param phase the phase
   * @param cause the stored run's finish cause (phase {@code STORED}), else null
   * @param note a word from the run's set-up or its failure (e.g. {@code zeroing…}), or null
   * @param startThreshold_N the force at which an armed run starts
   * @param endWords how the run ends by itself ({@link RunSettings#endWords()}), or null before
   *     its settings are known
   */
  public record Run(Phase phase, FinishCause cause, String note, double startThreshold_N,
      String endWords) {
    /** No run. */
    public static final Run NONE = new Run(Phase.NONE, null, null, 0, null);

    /** A run whose end rule is not known yet (before its settings are made). */
    public Run(Phase phase, FinishCause cause, String note, double startThreshold_N) {
      this(phase, cause, note, startThreshold_N, null);
    }
  }

  /**
   * @param stream the link and the samples
   * @param run the run
   * @return what to show
   */
  public static View of(Stream stream, Run run) {
    boolean stale = SampleFreshness.stale(stream.samples(), stream.lastArrival_ns(),
        stream.now_ns(), stream.rate_Hz());
    double rate = stale ? 0 : stream.rate_Hz();
    if (stream.link() == Link.LOST) {
      return new View("DEVICE LOST", or(stream.lostReason(), "the device stopped answering")
          + (run.phase() == Phase.RECORDING || run.phase() == Phase.TAIL
              ? " · the run is stored up to the loss" : ""), Tone.FAULT, "✕", true, 0);
    }
    if (stream.link() == Link.CONNECTING) {
      return new View("CONNECTING", "opening the device", Tone.WAITING, "◆", true, 0);
    }
    if (stale) {
      String since = stream.samples() <= 0 ? "no sample received yet"
          : String.format(Locale.ROOT, "no sample for %.1f s",
              SampleFreshness.age_s(stream.lastArrival_ns(), stream.now_ns()));
      String during = run.phase() == Phase.RECORDING || run.phase() == Phase.TAIL
          ? " while recording" : run.phase() == Phase.ARMED ? " while armed" : "";
      return new View("NO DATA", since + during
          + ": the readings are old; check the cable and the board", Tone.FAULT, "✕", true, 0);
    }
    View v = ofRun(run);
    return new View(v.words(), v.detail(), v.tone(), v.mark(), false, rate);
  }

  private static View ofRun(Run run) {
    return switch (run.phase()) {
      case NONE -> quiet("NOT ARMED", "arm a run before loading the specimen");
      case DISARMED -> quiet("NOT ARMED", "stopped before load came on: nothing stored");
      case ARMING -> new View("ARMING…", or(run.note(), "arming once the zero is done"),
          Tone.WAITING, "◆", false, 0);
      case ARMED -> new View("ARMED", String.format(Locale.ROOT,
          "waiting for load: the run starts at %s N%s", num(run.startThreshold_N()),
          run.endWords() == null ? "" : "; " + run.endWords()), Tone.WAITING, "◆", false, 0);
      case RECORDING -> running("RECORDING", or(run.endWords(), "the run stops by itself at its end"));
      case TAIL -> running("BREAK", "recording the tail after the break");
      case STORING -> running("STORING…", "writing the run to the archive");
      case NOT_STORED -> fault("NOT STORED", or(run.note(),
          "the run could not be stored; its journal is kept"));
      case STORED -> stored(run.cause());
    };
  }

  private static View stored(FinishCause cause) {
    if (cause == null) {
      return done("STORED", "the run is in the archive");
    }
    return switch (cause) {
      case BREAK -> done("STORED · BREAK", "the specimen broke; the run is in the archive");
      case MANUAL -> done("STORED · STOPPED", "stopped by hand; the run is in the archive");
      case TIME_LIMIT -> done("STORED · TIME LIMIT", "the run reached its longest allowed time");
      case TRAVEL_LIMIT -> done("STORED · TRAVEL LIMIT", "the crush reached its travel limit; "
          + "the run is in the archive");
      case LOW_FORCE -> done("STORED · FORCE LOW", "force stayed low after the crush; the run is"
          + " in the archive");
      case OVERLOAD -> fault("OVERLOAD STOP", "force reached the cell's stop level: unload the "
          + "press and check the cell before the next run");
      case DEVICE_LOST -> fault("DEVICE LOST", "the device stopped during the run; the run is "
          + "stored up to the loss");
      case DEVICE_RESET -> fault("DEVICE RESET", "the device restarted during the run; the run "
          + "is stored up to the restart");
      case DISK_FULL -> fault("DISK FULL", "the journal could not be written; the run holds "
          + "what was kept: free space before the next run");
      case RECOVERED, IMPORTED -> done("STORED", "the run is in the archive");
    };
  }

  private static View quiet(String words, String detail) {
    return new View(words, detail, Tone.QUIET, "○", false, 0);
  }

  private static View running(String words, String detail) {
    return new View(words, detail, Tone.RUNNING, "●", false, 0);
  }

  private static View done(String words, String detail) {
    return new View(words, detail, Tone.DONE, "✓", false, 0);
  }

  private static View fault(String words, String detail) {
    return new View(words, detail, Tone.FAULT, "✕", false, 0);
  }

  private static String or(String s, String otherwise) {
    return s == null || s.isBlank() ? otherwise : s;
  }

  private static String num(double v) {
    return v == Math.rint(v) ? Long.toString((long) v) : String.format(Locale.ROOT, "%.3g", v);
  }
}
