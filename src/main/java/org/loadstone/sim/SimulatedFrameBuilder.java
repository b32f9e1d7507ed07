package org.loadstone.sim;

import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * Settings of a {@link SimulatedFrame}. Every setting has a default; {@link #build()} checks them
 * once and throws a {@link LoadstoneException} naming the setting, the value and the accepted
 * range.
 */
public final class SimulatedFrameBuilder {
  Scenario scenario = Scenario.PANEL_FOAM;
  long seed = 1;
  double rateHz = 80;
  double crossheadRate_mm_per_s = Double.NaN;
  double handStroke_mm = Double.NaN;
  double frameStiffness_N_per_mm = Presets.FRAME_STIFFNESS_N_PER_MM;
  LoadCell loadCell;
  String cellId = LoadCell.FRAME_CELL_ID;
  double noiseRms_counts = Double.NaN;
  double zeroOffset_counts = Double.NaN;
  double nonLinearity_pctFS = Double.NaN;
  double positionCountsPerMm = 400;
  int firstSequence;
  long clockStart_us;
  double jitter_us;
  double rateError_pct;
  double gravity_m_per_s2 = 9.80665;
  double settling_s = 0.2;
  boolean averaging = true;
  double operatorDelay_s = Double.NaN;
  SimImperfections imperfections = SimImperfections.NONE;

  SimulatedFrameBuilder() {}

  /** @param s the scenario, not null (default {@link Scenario#PANEL_FOAM}) */
  public SimulatedFrameBuilder scenario(Scenario s) {
    this.scenario = Precondition.notNull(s, "scenario");
    return this;
  }

  /** @param s the seed: picks the specimen (scatter), the hand motion, noise and jitter */
  public SimulatedFrameBuilder seed(long s) {
    this.seed = s;
    return this;
  }

  /** @param hz samples/s: 10 or 80 (HX711-class) or 100…50 000 (fast); default 80 */
  public SimulatedFrameBuilder rateHz(double hz) {
    this.rateHz = hz;
    return this;
  }

  /** @param v constant crosshead rate, mm/s, 0 &lt; v ≤ 50 (default: the scenario's) */
  public SimulatedFrameBuilder crossheadRate_mm_per_s(double v) {
    this.crossheadRate_mm_per_s = v;
    this.handStroke_mm = Double.NaN;
    return this;
  }

  /**
   * Drives the crosshead by hand pumping instead of a motor: uneven strokes averaging {@code
   * meanStroke_mm}, pauses and slight back-off between strokes.
   *
   * @param meanStroke_mm mean advance per stroke, mm, 0 &lt; s ≤ 5
   */
  public SimulatedFrameBuilder handPumped(double meanStroke_mm) {
    this.handStroke_mm = meanStroke_mm;
    this.crossheadRate_mm_per_s = Double.NaN;
    return this;
  }

  /**
   * Makes the crosshead wait for the operator: it stays still until {@link
   * SimulatedFrame#operatorStarts()} and moves {@code delay_s} later (the time a person takes from
   * arming a run to starting the press). By default it starts by itself at time zero.
   *
   * @param delay_s delay after the start, s, 0…60
   */
  public SimulatedFrameBuilder waitForOperator(double delay_s) {
    this.operatorDelay_s = delay_s;
    return this;
  }

  /** @param k frame stiffness, N/mm, &gt; 0 (default 8000) */
  public SimulatedFrameBuilder frameStiffness_N_per_mm(double k) {
    this.frameStiffness_N_per_mm = k;
    return this;
  }

  /**
   * @param cell the whole cell (default: {@link LoadCell#frameCell} for the rate, the same in
   *     every scenario)
   */
  public SimulatedFrameBuilder loadCell(LoadCell cell) {
    this.loadCell = Precondition.notNull(cell, "cell");
    return this;
  }

  /**
   * @param id the id the frame reports for its cell (default {@link LoadCell#FRAME_CELL_ID});
   *     letters, digits, '.', '_' and '-'
   */
  public SimulatedFrameBuilder cellId(String id) {
    this.cellId = Precondition.notNull(id, "id");
    return this;
  }

  /**
   * @param i the cell's and amplifier's imperfections: noise, warm-up, drift, creep, spikes
   *     (default {@link SimImperfections#NONE}: converter noise only; {@link
   *     SimImperfections#TYPICAL} for a typical bridge amplifier)
   */
  public SimulatedFrameBuilder imperfections(SimImperfections i) {
    this.imperfections = Precondition.notNull(i, "imperfections");
    return this;
  }

  /** @param noise noise RMS, counts, ≥ 0, replacing the cell's */
  public SimulatedFrameBuilder noiseRms_counts(double noise) {
    this.noiseRms_counts = noise;
    return this;
  }

  /** @param offset zero offset, counts, replacing the cell's */
  public SimulatedFrameBuilder zeroOffset_counts(double offset) {
    this.zeroOffset_counts = offset;
    return this;
  }

  /** @param pct terminal-line non-linearity, % FS, replacing the cell's */
  public SimulatedFrameBuilder nonLinearity_pctFS(double pct) {
    this.nonLinearity_pctFS = pct;
    return this;
  }

  /** @param cpm encoder counts per mm, &gt; 0 (default 400) */
  public SimulatedFrameBuilder positionCountsPerMm(double cpm) {
    this.positionCountsPerMm = cpm;
    return this;
  }

  /** @param seq sequence number of the first sample, 0…65535 (default 0) */
  public SimulatedFrameBuilder firstSequence(int seq) {
    this.firstSequence = seq;
    return this;
  }

  /** @param us device clock at true time 0, µs, 0…4 294 967 295 (default 0) */
  public SimulatedFrameBuilder deviceClockStart_us(long us) {
    this.clockStart_us = us;
    return this;
  }

  /**
   * @param us standard deviation of conversion-time jitter, µs, 0…10 000 (default 0 = none; an
   *     HX711 polled by a microcontroller shows some tens of µs, illustrative)
   */
  public SimulatedFrameBuilder conversionJitter_us(double us) {
    this.jitter_us = us;
    return this;
  }

  /**
   * @param pct how much faster (+) or slower (−) than nominal the converter runs, %, −10…10
   *     (default 0; a converter on its internal oscillator is off by a few %, illustrative)
   */
  public SimulatedFrameBuilder conversionRateError_pct(double pct) {
    this.rateError_pct = pct;
    return this;
  }

  /** @param g gravity for dead weights, m/s², 9.7…9.9 (default standard gravity 9.80665) */
  public SimulatedFrameBuilder gravity_m_per_s2(double g) {
    this.gravity_m_per_s2 = g;
    return this;
  }

  /** @param s settling time constant after a dead-weight change, s, &gt; 0 (default 0.2) */
  public SimulatedFrameBuilder deadWeightSettling_s(double s) {
    this.settling_s = s;
    return this;
  }

  /**
   * @param on whether an HX711-class converter (10 or 80 /s) reports the mean over its conversion
   *     period (default true) or the force at the end of it; fast converters always sample the
   *     instant
   */
  public SimulatedFrameBuilder converterAveraging(boolean on) {
    this.averaging = on;
    return this;
  }

  static void checkRate(double hz) {
    if (!SimulatedFrame.isSupportedRate(hz)) {
      throw new LoadstoneException(
          "simulated frame: rate " + hz + " samples/s is not supported; use 10 or 80 (HX711-class)"
              + " or 100…50000 (fast converter)");
    }
  }

  private static void check(boolean ok, String setting, Object value, String range) {
    if (!ok) {
      throw new LoadstoneException(
          "simulated frame: " + setting + " = " + value + " is invalid; use " + range);
    }
  }

  /**
   * @return the frame
   * @throws LoadstoneException naming the first invalid setting
   */
  public SimulatedFrame build() {
    checkRate(rateHz);
    boolean hand = !Double.isNaN(handStroke_mm);
    if (hand) {
      check(handStroke_mm > 0 && handStroke_mm <= 5, "hand stroke", handStroke_mm, "0 < mm <= 5");
    }
    if (!Double.isNaN(crossheadRate_mm_per_s)) {
      check(crossheadRate_mm_per_s > 0 && crossheadRate_mm_per_s <= 50, "crosshead rate",
          crossheadRate_mm_per_s, "0 < mm/s <= 50");
    }
    check(Double.isFinite(frameStiffness_N_per_mm) && frameStiffness_N_per_mm > 0,
        "frame stiffness", frameStiffness_N_per_mm, "a value > 0 N/mm");
    check(Double.isFinite(positionCountsPerMm) && positionCountsPerMm > 0,
        "position counts per mm", positionCountsPerMm, "a value > 0");
    check(firstSequence >= 0 && firstSequence <= 0xFFFF, "first sequence", firstSequence,
        "0…65535");
    check(clockStart_us >= 0 && clockStart_us <= 0xFFFF_FFFFL, "device clock start",
        clockStart_us, "0…4294967295 µs");
    check(Double.isFinite(jitter_us) && jitter_us >= 0 && jitter_us <= 10_000, "conversion jitter",
        jitter_us, "0…10000 µs");
    check(Double.isFinite(rateError_pct) && Math.abs(rateError_pct) <= 10, "conversion rate error",
        rateError_pct, "-10…10 %");
    check(gravity_m_per_s2 >= 9.7 && gravity_m_per_s2 <= 9.9, "gravity", gravity_m_per_s2,
        "9.7…9.9 m/s²");
    check(Double.isFinite(settling_s) && settling_s > 0, "dead-weight settling", settling_s,
        "a value > 0 s");
    if (hand && scenario == Scenario.DEAD_WEIGHT) {
      throw new LoadstoneException(
          "simulated frame: the dead-weight scenario has no crosshead to pump; drop the hand drive");
    }
    check(cellId.matches("[A-Za-z0-9._-]{1,64}"), "cell id", cellId,
        "1 to 64 letters, digits, '.', '_' or '-'");
    if (!Double.isNaN(operatorDelay_s)) {
      check(operatorDelay_s >= 0 && operatorDelay_s <= 60, "operator delay", operatorDelay_s,
          "0…60 s");
    }
    LoadCell cell = loadCell != null ? loadCell : LoadCell.frameCell(rateHz);
    if (!Double.isNaN(imperfections.noiseRms_counts())) {
      cell = cell.withNoiseRms_counts(imperfections.noiseRms_counts());
    }
    if (!Double.isNaN(noiseRms_counts)) {
      cell = cell.withNoiseRms_counts(noiseRms_counts);
    }
    if (!Double.isNaN(zeroOffset_counts)) {
      cell = cell.withZeroOffset_counts(zeroOffset_counts);
    }
    if (!Double.isNaN(nonLinearity_pctFS)) {
      cell = cell.withNonLinearity_pctFS(nonLinearity_pctFS);
    }
    return new SimulatedFrame(this, cell);
  }
}
