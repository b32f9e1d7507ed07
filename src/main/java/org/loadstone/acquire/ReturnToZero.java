package org.loadstone.acquire;

/**
 * The return to zero at the end of a run: the mean force of the run's last samples, relative to
 * the tare, when all of them lie within the start threshold of zero (the load has come off: a
 * specimen that broke clean, or the crosshead backed off within the tail). When the run ends with
 * load still on the cell (a stop by hand, a time limit, an overload, a break that leaves the
 * specimen carrying load) there is none. Fed every force of the run in order, one thread.
 */
final class ReturnToZero {
  /** The return to zero averages this long of samples at the end of the run. */
  static final double WINDOW_S = 0.1;

  private final double[] last;
  private final double band_N;
  private int next;
  private long inBand;

  /**
   * @param samples samples averaged, 1 or more
   * @param band_N forces within ±this of zero count as unloaded, N, positive
   */
  ReturnToZero(int samples, double band_N) {
    if (samples < 1 || !(band_N > 0)) {
      throw new IllegalArgumentException("samples " + samples + ", band " + band_N);
    }
    last = new double[samples];
    this.band_N = band_N;
  }

  /** @param force_N the next force of the run */
  void offer(double force_N) {
    if (Math.abs(force_N) < band_N) {
      last[next] = force_N;
      next = (next + 1) % last.length;
      inBand++;
    } else {
      inBand = 0;
    }
  }

  /** @return the mean of the last samples when they were all unloaded, else null */
  Double force_N() {
    if (inBand < last.length) {
      return null;
    }
    double sum = 0;
    for (double f : last) {
      sum += f;
    }
    return sum / last.length;
  }
}
