package org.loadstone.report;

import java.time.Instant;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import org.loadstone.archive.Geometry;
import org.loadstone.archive.RunMetadata;
import org.loadstone.calibration.CheckWeightResult;
import org.loadstone.study.Metric;

/**
 * The facts of a run in plain words for a report: what was tested, how, and with which scale.
 * Numbers use the figures' formatter ({@link Metric#format(double, int)}) with four significant
 * digits and trailing zeros dropped; counts are whole numbers; no exponents.
 */
final class RunFacts {
  private RunFacts() {}

  private static final DateTimeFormatter WHEN =
      DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm 'UTC'", Locale.ROOT);

  static List<String[]> rows(RunMetadata md) {
    List<String[]> rows = new ArrayList<>();
    if (md.amendments().any()) {
      rows.add(new String[] {"amendments", amendments(md)});
    }
    add(rows, "specimen", md.specimen());
    add(rows, "group", md.group());
    add(rows, "tags", String.join(", ", md.tags()));
    add(rows, "operator", md.operator());
    add(rows, "started", when(md.startedAt()));
    add(rows, "test", md.testType().wireName());
    add(rows, "geometry", geometry(md.geometry()));
    add(rows, "mass", md.mass_g() == null ? "not weighed" : fact(md.mass_g()) + " g");
    add(rows, "device", device(md.device()));
    add(rows, "sample rate", fact(md.sampleRate_Hz()) + " samples/s"
        + ("device-clock".equals(md.sampleRateSource()) ? " (measured from the device's clock)"
            : ""));
    add(rows, "force scale", md.scale());
    add(rows, "scale coefficients", coefficients(md));
    add(rows, "zero (tare)", String.format(Locale.ROOT, "%d counts",
        Math.round(md.zeroOffset_counts())));
    add(rows, "samples lost / checksum errors", md.dropped() + " / " + md.checksumErrors());
    add(rows, "how it ended", org.loadstone.study.RunEnd.words(md));
    add(rows, "break as recorded", md.breakIndex() == null ? null : "sample " + md.breakIndex()
        + (md.breakTime_s() == null ? "" : " at " + fact(md.breakTime_s()) + " s")
        + (md.peakBeforeBreak_N() == null ? "" : ", peak before " + fact(md.peakBeforeBreak_N())
            + " N")
        + (md.dropAtBreak_pct() == null ? "" : ", drop " + fact(md.dropAtBreak_pct()) + " %"));
    add(rows, "start", md.startThreshold_N() == null ? "by hand"
        : "at " + fact(md.startThreshold_N()) + " N, with " + fact(md.pretrigger_s())
            + " s kept before");
    add(rows, "load off at the end", md.returnToZero_N() == null ? null
        : fact(md.returnToZero_N()) + " N from zero");
    add(rows, "notes", md.notes());
    if (!md.extra().isEmpty()) {
      List<String> parts = new ArrayList<>();
      new TreeMap<>(md.extra()).forEach((k, v) -> parts.add(k + ": " + value(v)));
      add(rows, "other fields", String.join("; ", parts));
    }
    return rows;
  }

  /** @return what was amended, when, by whom and why, in one cell */
  static String amendments(RunMetadata md) {
    List<String> parts = new ArrayList<>();
    parts.add(md.amendments().summary());
    for (org.loadstone.archive.Amendment a : md.amendments().log()) {
      parts.add(when(a.at()) + (a.operator().isEmpty() ? "" : " by " + a.operator()) + ": "
          + a.reason());
    }
    return String.join("; ", parts) + " (values below as amended; the run's files are as "
        + "recorded)";
  }

  /** Heads of the check-weight table. */
  static final String[] CHECK_HEADS = {"checked", "calibration", "check weight (kg)",
      "expected (N)", "indicated (N)", "error (%)", "tolerance (%)", "result"};

  /** The check-weight verification as one table row. */
  static String[] checkRow(CheckWeightResult c) {
    return new String[] {when(c.time()), c.calibrationId(), fact(c.mass_kg()),
        Metric.PEAK.format(c.expected_N()), Metric.PEAK.format(c.indicated_N()),
        String.format(Locale.ROOT, "%+.2f", c.error_pct()),
        String.format(Locale.ROOT, "±%.2f", c.tolerance_pct()), c.pass() ? "passed" : "FAILED"};
  }

  /** @return e.g. "2026-12-02 10:15 UTC" */
  static String when(Instant t) {
    return WHEN.format(t.atOffset(ZoneOffset.UTC));
  }

  /** An ISO-8601 instant as {@link #when(Instant)}; other text as it is. */
  static String when(String iso) {
    try {
      return when(Instant.parse(iso));
    } catch (DateTimeParseException | NullPointerException e) {
      return iso == null ? "-" : iso;
    }
  }

  /** @return four significant digits, trailing zeros dropped: 400, 0.5, 18.36, 0 */
  static String fact(double v) {
    return fact(v, 4);
  }

  /** @return {@code digits} significant digits, trailing zeros dropped */
  static String fact(double v, int digits) {
    String s = Metric.format(v, digits);
    return s.contains(".") ? s.replaceAll("0+$", "").replaceAll("\\.$", "") : s;
  }

  static String geometry(Geometry g) {
    List<String> parts = new ArrayList<>();
    add(parts, "span", g.span_mm(), "mm");
    add(parts, "load span", g.loadSpan_mm(), "mm");
    add(parts, "width", g.width_mm(), "mm");
    add(parts, "depth", g.depth_mm(), "mm");
    add(parts, "facings", g.facing_mm(), "mm");
    add(parts, "core", g.core_mm(), "mm");
    add(parts, "area", g.area_mm2(), "mm²");
    return parts.isEmpty() ? "not measured" : String.join(", ", parts);
  }

  private static String device(Map<String, String> d) {
    if (d.isEmpty()) {
      return null;
    }
    List<String> parts = new ArrayList<>();
    Map<String, String> rest = new TreeMap<>(d);
    String name = rest.remove("name");
    String port = rest.remove("port");
    rest.forEach((k, v) -> parts.add(k + " " + v));
    return (name == null ? "device" : name) + (port == null ? "" : " on " + port)
        + (parts.isEmpty() ? "" : " (" + String.join(", ", parts) + ")");
  }

  private static String coefficients(RunMetadata md) {
    List<Double> c = md.scaleSpec().responseCoefficients();
    StringBuilder terms = new StringBuilder();
    for (int i = 0; i < c.size(); i++) {
      double v = c.get(i);
      String term = fact(Math.abs(v), 6) + (i == 0 ? "" : i == 1 ? " F" : " F^" + i);
      terms.append(i == 0 ? (v < 0 ? "−" : "") + term : (v < 0 ? " − " : " + ") + term);
    }
    String range = md.scaleSpec().validFrom_N() == null && md.scaleSpec().validTo_N() == null ? ""
        : "; calibrated from " + value(md.scaleSpec().validFrom_N()) + " to "
            + value(md.scaleSpec().validTo_N()) + " N";
    return md.scaleSpec().kind() + ": counts = " + terms + " (F in N)" + range;
  }

  private static String value(Object v) {
    return v instanceof Number n ? fact(n.doubleValue()) : v == null ? "-" : String.valueOf(v);
  }

  private static void add(List<String> parts, String name, Double v, String unit) {
    if (v != null) {
      parts.add(name + " " + fact(v) + " " + unit);
    }
  }

  private static void add(List<String[]> rows, String k, String v) {
    rows.add(new String[] {k, v == null || v.isBlank() ? "-" : v});
  }
}
