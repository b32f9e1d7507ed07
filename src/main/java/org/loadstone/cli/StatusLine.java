package org.loadstone.cli;

import java.util.Locale;

/**
 * The one-line status of {@code record} on a terminal: state, elapsed time, force, travel,
 * peak and rate, in the longest form that fits the terminal's width, so it never wraps.
 */
final class StatusLine {
  /** Width assumed when the terminal does not say ({@code COLUMNS} unset). */
  static final int DEFAULT_WIDTH = 80;

  private StatusLine() {}

  /** @return the terminal's width from {@code COLUMNS}, else {@value #DEFAULT_WIDTH} */
  static int width(String columns) {
    try {
      int w = columns == null ? DEFAULT_WIDTH : Integer.parseInt(columns.trim());
      return w >= 20 ? w : DEFAULT_WIDTH;
    } catch (NumberFormatException e) {
      return DEFAULT_WIDTH;
    }
  }

  /**
   * @param state the run's state in words, e.g. {@code recording}
   * @param elapsed_s time since recording started, NaN before
   * @param force_N current force
   * @param travel_mm crosshead travel since arming, NaN without a position channel
   * @param peak_N peak so far, NaN before any
   * @param rateHz samples per second
   * @param width the terminal's width in characters
   * @return the line, at most {@code width - 1} characters (the cursor's column stays free)
   */
  static String format(String state, double elapsed_s, double force_N, double travel_mm,
      double peak_N, double rateHz, int width) {
    String t = Double.isNaN(elapsed_s) ? "-:--" : clock(elapsed_s);
    double pk = Double.isNaN(peak_N) ? 0 : peak_N;
    boolean x = !Double.isNaN(travel_mm);
    String[] forms = {
      String.format(Locale.ROOT, "%-9s %s  force %9.2f N  travel %s  peak %9.2f N  %7.1f "
          + "samples/s", state, t, force_N, x ? String.format(Locale.ROOT, "%7.3f mm", travel_mm)
          : "     - mm", pk, rateHz),
      String.format(Locale.ROOT, "%-9s %s  force %.2f N  travel %s  peak %.2f N", state, t,
          force_N, x ? String.format(Locale.ROOT, "%.3f mm", travel_mm) : "-", pk),
      String.format(Locale.ROOT, "%s %s F %.1f N x %s mm pk %.1f N", state, t, force_N,
          x ? String.format(Locale.ROOT, "%.2f", travel_mm) : "-", pk),
      String.format(Locale.ROOT, "%.3s %s %.0f/%.0f N", state, t, force_N, pk)
    };
    for (String f : forms) {
      if (f.length() <= width - 1) {
        return f;
      }
    }
    return forms[forms.length - 1].substring(0, Math.max(0, width - 1));
  }

  private static String clock(double s) {
    long tenths = Math.round(s * 10);
    return String.format(Locale.ROOT, "%d:%02d.%d", tenths / 600, (tenths / 10) % 60, tenths % 10);
  }
}
