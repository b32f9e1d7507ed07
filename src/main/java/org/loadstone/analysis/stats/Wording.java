package org.loadstone.analysis.stats;

import java.util.List;
import java.util.Locale;

/** Plain sentences for comparison results. */
final class Wording {
  private Wording() {}

  static String twoGroups(String metric, List<GroupSummary> g, double p, double alpha) {
    GroupSummary hi = g.get(0).mean() >= g.get(1).mean() ? g.get(0) : g.get(1);
    GroupSummary lo = hi == g.get(0) ? g.get(1) : g.get(0);
    String rel = relative(hi.mean(), lo.mean());
    if (p < alpha) {
      return String.format(
          Locale.ROOT,
          "%s: %s is %s higher than %s; the difference is larger than the scatter (%s).",
          capital(metric), hi.name(), rel, lo.name(), p(p));
    }
    return String.format(
        Locale.ROOT,
        "%s: %s and %s differ by %s, within the scatter (%s); the data do not show a real "
            + "difference.",
        capital(metric), hi.name(), lo.name(), rel, p(p));
  }

  static String manyGroups(String metric, List<GroupSummary> g, double p, double alpha) {
    GroupSummary hi = g.get(0);
    GroupSummary lo = g.get(0);
    for (GroupSummary s : g) {
      hi = s.mean() > hi.mean() ? s : hi;
      lo = s.mean() < lo.mean() ? s : lo;
    }
    String rel = relative(hi.mean(), lo.mean());
    if (p < alpha) {
      return String.format(
          Locale.ROOT,
          "%s differs between the %d groups: %s is highest, %s above %s, the lowest; the "
              + "differences are larger than the scatter (%s).",
          capital(metric), g.size(), hi.name(), rel, lo.name(), p(p));
    }
    return String.format(
        Locale.ROOT,
        "%s of the %d groups spans %s from %s to %s, within the scatter (%s); the data do not "
            + "show a real difference.",
        capital(metric), g.size(), rel, lo.name(), hi.name(), p(p));
  }

  /** "23 %" relative to the lower mean, or "a difference of 4.2" when the lower mean is ≤ 0. */
  private static String relative(double hi, double lo) {
    if (lo > 0) {
      double pct = 100 * (hi - lo) / lo;
      return String.format(Locale.ROOT, pct < 10 ? "%.1f %%" : "%.0f %%", pct);
    }
    return String.format(Locale.ROOT, "%.3g (absolute)", hi - lo);
  }

  static String p(double p) {
    if (p < 0.001) {
      return "p < 0.001";
    }
    return String.format(Locale.ROOT, "p = %s", new java.math.BigDecimal(p)
        .round(new java.math.MathContext(p < 0.01 ? 1 : 2)).toPlainString());
  }

  private static String capital(String s) {
    return Character.toUpperCase(s.charAt(0)) + s.substring(1);
  }
}
