package org.loadstone.sim;

/** Test helper: runs a frame into a block for a span of true time. */
final class SimRuns {
  private SimRuns() {}

  /** Fills a fresh block with every sample up to {@code duration_s} of true time. */
  static SampleBlock run(SimulatedFrame frame, double rateHz, double duration_s) {
    int n = (int) Math.ceil(rateHz * duration_s);
    SampleBlock block = new SampleBlock(n);
    frame.fill(block, n);
    return block;
  }

  static int indexOfTime(SampleBlock b, double time_s) {
    for (int i = 0; i < b.size(); i++) {
      if (b.time_s(i) >= time_s) {
        return i;
      }
    }
    return b.size() - 1;
  }

  /** Least-squares slope of y on x over samples whose force lies in [lo, hi) before index end. */
  static double slope(double[] x, double[] y) {
    double mx = 0;
    double my = 0;
    for (int i = 0; i < x.length; i++) {
      mx += x[i];
      my += y[i];
    }
    mx /= x.length;
    my /= y.length;
    double sxy = 0;
    double sxx = 0;
    for (int i = 0; i < x.length; i++) {
      sxy += (x[i] - mx) * (y[i] - my);
      sxx += (x[i] - mx) * (x[i] - mx);
    }
    return sxy / sxx;
  }
}
