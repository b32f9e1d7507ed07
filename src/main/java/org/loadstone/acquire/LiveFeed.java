package org.loadstone.acquire;

import org.loadstone.protocol.DecoderCounters;
import org.loadstone.units.Precondition;

/**
 * The live view of one device for a display: current force, peak, position, a decimated
 * force–time trace of the last seconds and a decimated force–crosshead curve since it was last
 * restarted, updated each time {@link #poll()} is called (by the GUI's frame timer or a terminal
 * status line). It reads the sample ring through its own cursor, so a slow display loses
 * display points, never recorded samples. One polling thread.
 */
public final class LiveFeed {
  private final DeviceReader reader;
  private final SampleRing.Cursor cursor;
  private DisplayTrace trace;
  /** A trace window asked for, applied at the next poll; NaN for none. */
  private volatile double windowToUse = Double.NaN;
  private double peakTime_s = Double.NaN;
  private final CurveTrace curve = new CurveTrace(2400);
  /** Crosshead position where the curve began, NaN until its first point. */
  private double curveStart_mm = Double.NaN;
  private volatile ForceScale scale;
  private volatile double countsPerMm;
  private double zeroCounts;
  /** A zero taken elsewhere (before a run), applied at the next poll; NaN for none. */
  private volatile double zeroToUse = Double.NaN;
  private volatile long taresDone;
  private int tareRemaining;
  private int tareTotal;
  private double tareSum;
  private double force_N = Double.NaN;
  private double position_mm = Double.NaN;
  private double peak_N = Double.NEGATIVE_INFINITY;
  private double time_s;
  private long firstTimeUs = -1;
  private long lastCounts;
  private boolean zeroKnown;

  /**
   * @param reader the device reader feeding the ring
   * @param scale counts to force
   * @param window_s seconds of trace to keep
   */
  public LiveFeed(DeviceReader reader, ForceScale scale, double window_s) {
    this.reader = Precondition.notNull(reader, "reader");
    this.scale = Precondition.notNull(scale, "scale");
    this.cursor = reader.ring().cursorAtOldest();
    this.trace = new DisplayTrace(window_s, 1200);
  }

  /**
   * Keeps {@code window_s} seconds of trace from the next poll on (the points kept so far are
   * carried over, as far back as the new window reaches). Any thread.
   *
   * @param window_s greater than 0
   */
  public void setTraceWindow(double window_s) {
    Precondition.positive(window_s, "window_s");
    windowToUse = window_s;
  }

  /** @param s the new counts → force scale (e.g. after a calibration is chosen) */
  public void setScale(ForceScale s) {
    scale = Precondition.notNull(s, "scale");
  }

  /** @param v position counts per mm, 0 for none */
  public void setCountsPerMm(double v) {
    countsPerMm = v;
  }

  /**
   * Zeroes the force on the mean of the next {@code samples} samples (host-side tare).
   *
   * @param samples 1 or more
   */
  public void tare(int samples) {
    if (samples < 1) {
      throw new IllegalArgumentException("tare needs at least 1 sample, was " + samples);
    }
    tareRemaining = samples;
    tareTotal = samples;
    tareSum = 0;
  }

  /**
   * Uses a zero taken elsewhere (e.g. the fresh zero before a run) from the next poll on, so the
   * readout and the run agree. Any thread.
   *
   * @param zero_counts the zero, counts
   */
  public void useZero(double zero_counts) {
    zeroToUse = zero_counts;
  }

  /** @return how many of this feed's own tares ({@link #tare}) have finished */
  public long taresDone() {
    return taresDone;
  }

  /** @return whether a tare is still collecting samples */
  public boolean taring() {
    return tareRemaining > 0;
  }

  /** Forgets the peak. */
  public void resetPeak() {
    peak_N = Double.NEGATIVE_INFINITY;
    peakTime_s = Double.NaN;
  }

  /**
   * Starts a new force–crosshead curve (for a new specimen): its travel counts from the crosshead's
   * position at its first sample.
   */
  public void restartCurve() {
    curve.clear();
    curveStart_mm = Double.NaN;
  }

  /** @return the zero offset in counts */
  public double zeroCounts() {
    return zeroCounts;
  }

  /** Takes in everything new and returns what to show. */
  public Snapshot poll() {
    ForceScale sc = scale;
    double cpm = countsPerMm;
    double given = zeroToUse;
    double window = windowToUse;
    if (!Double.isNaN(window)) {
      windowToUse = Double.NaN;
      trace = trace.resized(window);
    }
    if (!Double.isNaN(given)) {
      zeroToUse = Double.NaN;
      zeroCounts = given;
      zeroKnown = true;
    }
    cursor.drain((i, seq, dev, tUs, counts, hasPos, pos) -> {
      if (firstTimeUs < 0) {
        firstTimeUs = tUs;
      }
      lastCounts = counts;
      if (tareRemaining > 0) {
        tareSum += counts;
        if (--tareRemaining == 0) {
          zeroCounts = tareSum / tareTotal;
          peak_N = Double.NEGATIVE_INFINITY;
          peakTime_s = Double.NaN;
          taresDone++;
        }
        if (!zeroKnown) {
          return; // nothing meaningful to show before the first zero
        }
      }
      zeroKnown = true;
      time_s = (tUs - firstTimeUs) / 1e6;
      force_N = sc.force_N(counts - zeroCounts);
      if (force_N > peak_N) {
        peak_N = force_N;
        peakTime_s = time_s;
      }
      position_mm = hasPos && cpm > 0 ? pos / cpm : Double.NaN;
      trace.add(time_s, force_N);
      if (!Double.isNaN(position_mm)) {
        if (Double.isNaN(curveStart_mm)) {
          curveStart_mm = position_mm;
        }
        curve.add(position_mm - curveStart_mm, force_N);
      }
    }, Integer.MAX_VALUE);
    int n = trace.size();
    double[] t = new double[n];
    double[] f = new double[n];
    int m = trace.copyTo(t, f);
    int cn = curve.size();
    double[] cx = new double[cn];
    double[] cy = new double[cn];
    int cm = curve.copyTo(cx, cy);
    return new Snapshot(force_N, peak_N == Double.NEGATIVE_INFINITY ? Double.NaN : peak_N,
        position_mm, time_s, lastCounts, t, f, m, cx, cy, cm, reader.measuredRateHz(),
        reader.samplesAccepted(), reader.counters(), cursor.lost(),
        reader.lostReason().orElse(null), taring(), peakTime_s);
  }

  /**
   * What a display shows at one moment.
   *
   * @param force_N latest force, NaN before the first sample
   * @param peak_N highest force since the last reset, NaN before the first sample
   * @param position_mm latest crosshead position, NaN without a position channel
   * @param time_s time of the latest sample since the stream began
   * @param counts latest raw counts
   * @param traceTime_s decimated trace times (first {@code traceLength} valid)
   * @param traceForce_N decimated trace forces
   * @param traceLength valid points in the trace arrays
   * @param curveTravel_mm decimated force–crosshead curve: crosshead travel since the curve began
   *     (first {@code curveLength} valid; empty without a position channel)
   * @param curveForce_N decimated force–crosshead curve: force
   * @param curveLength valid points in the curve arrays
   * @param rateHz measured sample rate
   * @param samples samples received
   * @param counters decoder counters
   * @param displayLost samples this display skipped because it fell behind (none are lost from
   *     recording)
   * @param deviceLost why the device was lost, or null
   * @param taring whether a tare is in progress
   * @param peakTime_s time of the peak since the stream began, NaN before the first sample
   */
  public record Snapshot(double force_N, double peak_N, double position_mm, double time_s,
      long counts, double[] traceTime_s, double[] traceForce_N, int traceLength,
      double[] curveTravel_mm, double[] curveForce_N, int curveLength, double rateHz,
      long samples, DecoderCounters counters, long displayLost, String deviceLost,
      boolean taring, double peakTime_s) {}
}
