package org.loadstone.sim;

import org.loadstone.units.LoadstoneException;

/**
 * The simulated load cell and its bridge converter, as ground truth.
 *
 * <p>Output model, in counts, for a true force F (N) with capacity C and sensitivity s:
 *
 * <pre>
 *   counts(F) = offset + s·F + n·s·C·4u(1 − u) + noise,   u = F / C
 * </pre>
 *
 * where n = {@code nonLinearity_pctFS / 100}. The quadratic term is zero at F = 0 and at F = C,
 * so the straight line through the zero and full-scale points (the terminal line) has slope
 * exactly s, and the largest deviation from that line, at u = ½, is n·s·C: the non-linearity is
 * "largest deviation from the straight line through the zero and full-scale points, as a
 * percentage of full-scale output" (the usual load-cell data-sheet definition, common practice).
 * Noise is white Gaussian with standard deviation {@code noiseRms_counts}; the sum is rounded to
 * an integer and held inside the 24-bit converter range [{@link #MIN_COUNTS}, {@link
 * #MAX_COUNTS}].
 *
 * @param capacity_N rated capacity (full scale), &gt; 0
 * @param countsPerN sensitivity, counts per newton, &gt; 0
 * @param zeroOffset_counts output at zero force (bridge imbalance), inside the converter range
 * @param noiseRms_counts noise standard deviation, counts, ≥ 0
 * @param nonLinearity_pctFS terminal-line non-linearity, % of full-scale output, −5…5
 */
public record LoadCell(
    double capacity_N,
    double countsPerN,
    double zeroOffset_counts,
    double noiseRms_counts,
    double nonLinearity_pctFS) {

  /** Lowest code of a 24-bit two's-complement converter (HX711 and the like). */
  public static final int MIN_COUNTS = -8_388_608;
  /** Highest code of a 24-bit two's-complement converter. */
  public static final int MAX_COUNTS = 8_388_607;

  /**
   * Rated capacity of the simulated frame's one load cell, N: the balsa-core shelf panels peak
   * near 720 N, so a 1 kN cell serves every scenario (the over-range one exceeds it on purpose).
   */
  public static final double FRAME_CAPACITY_N = 1000;
  /** The id the simulated frame reports for its cell (the demo workshop's shelf-panel rig). */
  public static final String FRAME_CELL_ID = "shelf-rig-1kN";

  /** Default zero offset of the simulated cell, counts (an arbitrary bridge imbalance). */
  public static final double DEFAULT_ZERO_OFFSET_COUNTS = 18_436;
  /** Default non-linearity, % FS (a typical figure for an inexpensive cell; illustrative). */
  public static final double DEFAULT_NON_LINEARITY_PCT_FS = 0.03;

  /** @throws LoadstoneException naming the parameter and its accepted range */
  public LoadCell {
    check(Double.isFinite(capacity_N) && capacity_N > 0, "capacity_N", capacity_N, "> 0");
    check(Double.isFinite(countsPerN) && countsPerN > 0, "countsPerN", countsPerN, "> 0");
    check(
        Double.isFinite(zeroOffset_counts)
            && zeroOffset_counts >= MIN_COUNTS
            && zeroOffset_counts <= MAX_COUNTS,
        "zeroOffset_counts",
        zeroOffset_counts,
        "within the 24-bit range " + MIN_COUNTS + "…" + MAX_COUNTS);
    check(
        Double.isFinite(noiseRms_counts) && noiseRms_counts >= 0,
        "noiseRms_counts",
        noiseRms_counts,
        ">= 0");
    check(
        Double.isFinite(nonLinearity_pctFS) && Math.abs(nonLinearity_pctFS) <= 5,
        "nonLinearity_pctFS",
        nonLinearity_pctFS,
        "between -5 and 5");
  }

  private static void check(boolean ok, String name, double value, String range) {
    if (!ok) {
      throw new LoadstoneException(
          "simulated load cell: " + name + " = " + value + " is out of range; use a value " + range);
    }
  }

  /**
   * Sensitivity of a strain-gauge cell on an HX711-class converter, counts per newton.
   *
   * <p>The converter's full-scale differential input is ±0.5·AVDD/gain (HX711 data sheet,
   * Avia Semiconductor, "Full-scale differential input range"; from memory). With the bridge
   * excited from AVDD (ratiometric), full input is 0.5·V/gain and a cell of rated output S mV/V
   * gives S·V mV at capacity, so
   *
   * <pre>
   *   counts/N = 2^23 / (0.5·V/gain) × (S·V / 1000) / C = 2^23 · 2·gain·S/1000 / C
   * </pre>
   *
   * For the default 500 N, 2 mV/V, 5 V, gain 128: full input 19.53125 mV, cell output 10 mV,
   * 4 294 967.296 counts at capacity, 8589.934592 counts/N. (Rounding the input range to 20 mV
   * would give 8388.608 counts/N.)
   *
   * @param capacity_N rated capacity, &gt; 0
   * @param ratedOutput_mV_per_V rated output at capacity, mV/V, &gt; 0
   * @param excitation_V bridge excitation = converter AVDD, V, &gt; 0
   * @param gain programmable gain (HX711: 32, 64 or 128), &gt; 0
   * @return counts per newton
   */
  public static double hx711CountsPerN(
      double capacity_N, double ratedOutput_mV_per_V, double excitation_V, int gain) {
    check(Double.isFinite(capacity_N) && capacity_N > 0, "capacity_N", capacity_N, "> 0");
    check(
        Double.isFinite(ratedOutput_mV_per_V) && ratedOutput_mV_per_V > 0,
        "ratedOutput_mV_per_V",
        ratedOutput_mV_per_V,
        "> 0");
    check(Double.isFinite(excitation_V) && excitation_V > 0, "excitation_V", excitation_V, "> 0");
    check(gain > 0, "gain", gain, "> 0");
    double fullInput_V = 0.5 * excitation_V / gain;
    double output_V = ratedOutput_mV_per_V * excitation_V / 1000.0;
    return 8_388_608.0 / fullInput_V * output_V / capacity_N;
  }

  /**
   * Default noise for an HX711-class converter at gain 128, counts RMS: about 50 nV RMS input
   * noise at 10 samples/s and 90 nV at 80 samples/s (HX711 data sheet; from memory), i.e. 21 and
   * 39 counts at 5 V. Other rates scale as the square root of the rate from the 80/s figure
   * (white noise; illustrative for a fast converter).
   *
   * @param rateHz sample rate, &gt; 0
   */
  public static double defaultNoiseRms_counts(double rateHz) {
    double countsPerVolt = 8_388_608.0 / (0.5 * 5.0 / 128);
    if (rateHz <= 10) {
      return 50e-9 * countsPerVolt;
    }
    return 90e-9 * countsPerVolt * StrictMath.sqrt(rateHz / 80.0);
  }

  /**
   * The simulated frame's cell at a rate: {@link #FRAME_CAPACITY_N}, 2 mV/V at 5 V on gain 128,
   * default offset and non-linearity, noise for the rate.
   *
   * @param rateHz sample rate, &gt; 0
   */
  public static LoadCell frameCell(double rateHz) {
    return hx711(FRAME_CAPACITY_N, rateHz);
  }

  /**
   * A cell of another capacity, 2 mV/V at 5 V on gain 128, default offset and non-linearity,
   * noise for the rate.
   *
   * @param capacity_N rated capacity, &gt; 0
   * @param rateHz sample rate, &gt; 0
   */
  public static LoadCell hx711(double capacity_N, double rateHz) {
    return new LoadCell(
        capacity_N,
        hx711CountsPerN(capacity_N, 2.0, 5.0, 128),
        DEFAULT_ZERO_OFFSET_COUNTS,
        defaultNoiseRms_counts(rateHz),
        DEFAULT_NON_LINEARITY_PCT_FS);
  }

  /** @return a copy with another noise level */
  public LoadCell withNoiseRms_counts(double noise) {
    return new LoadCell(capacity_N, countsPerN, zeroOffset_counts, noise, nonLinearity_pctFS);
  }

  /** @return a copy with another zero offset */
  public LoadCell withZeroOffset_counts(double offset) {
    return new LoadCell(capacity_N, countsPerN, offset, noiseRms_counts, nonLinearity_pctFS);
  }

  /** @return a copy with another non-linearity */
  public LoadCell withNonLinearity_pctFS(double pct) {
    return new LoadCell(capacity_N, countsPerN, zeroOffset_counts, noiseRms_counts, pct);
  }

  /** @return counts at full scale above zero, s·C */
  public double fullScaleOutput_counts() {
    return countsPerN * capacity_N;
  }

  /**
   * Noise-free, unrounded, unsaturated output for a force (the model above without noise).
   *
   * @param force_N true force on the cell, N, finite (negative = tension)
   */
  public double idealCounts(double force_N) {
    double u = force_N / capacity_N;
    return zeroOffset_counts
        + countsPerN * force_N
        + nonLinearity_pctFS / 100.0 * countsPerN * capacity_N * 4 * u * (1 - u);
  }
}
