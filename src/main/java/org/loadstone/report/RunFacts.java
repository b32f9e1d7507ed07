package org.loadstone.report;

import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import org.loadstone.archive.RunMetadata;

/** The metadata rows of a run report: every stored fact in plain words. */
final class RunFacts {
  private RunFacts() {}

  static List<String[]> rows(RunMetadata md) {
    List<String[]> rows = new ArrayList<>();
    if (md.amendments().any()) {
      rows.add(new String[] {"amendments", amendments(md)});
    }
    add(rows, "specimen", md.specimen());
    add(rows, "group", md.group());
    add(rows, "tags", String.join(", ", md.tags()));
    add(rows, "operator", md.operator());
    add(rows, "started", DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm:ss 'UTC'", Locale.ROOT)
        .format(md.startedAt().atOffset(ZoneOffset.UTC)));
    add(rows, "test type", md.testType().wireName());
    add(rows, "geometry", PdfReport.geometry(md.geometry()));
    add(rows, "mass (g)", md.mass_g() == null ? null : PdfReport.num(md.mass_g()));
    List<String> dev = new ArrayList<>();
    new TreeMap<>(md.device()).forEach((k, v) -> dev.add(k + " " + v));
    add(rows, "device", String.join(", ", dev));
    add(rows, "sample rate (Hz)", PdfReport.num(md.sampleRate_Hz()));
    add(rows, "calibration id", md.calibrationId() == null ? "none (nominal sensitivity)"
        : md.calibrationId());
    add(rows, "calibration SHA-256", md.calibrationSha256());
    add(rows, "scale", md.scale());
    add(rows, "scale (machine)", md.scaleSpec().kind() + ", response coefficients "
        + md.scaleSpec().responseCoefficients()
        + (md.scaleSpec().validFrom_N() != null || md.scaleSpec().validTo_N() != null
            ? ", valid " + md.scaleSpec().validFrom_N() + " to " + md.scaleSpec().validTo_N()
                + " N" : ""));
    add(rows, "zero offset (counts)", PdfReport.num(md.zeroOffset_counts()));
    add(rows, "dropped samples", Long.toString(md.dropped()));
    add(rows, "checksum errors", Long.toString(md.checksumErrors()));
    add(rows, "finish cause", md.cause().wireName());
    add(rows, "break (recorded)", md.breakIndex() == null ? null : "sample " + md.breakIndex()
        + (md.breakTime_s() == null ? "" : " at " + PdfReport.num(md.breakTime_s()) + " s")
        + (md.peakBeforeBreak_N() == null ? "" : ", peak before " + PdfReport.num(
            md.peakBeforeBreak_N()) + " N")
        + (md.dropAtBreak_pct() == null ? "" : ", drop " + PdfReport.num(md.dropAtBreak_pct())
            + " %"));
    add(rows, "pre-trigger (s)", PdfReport.num(md.pretrigger_s()));
    add(rows, "start threshold (N)", md.startThreshold_N() == null ? "manual start"
        : PdfReport.num(md.startThreshold_N()));
    if (md.checkWeight() != null && !md.checkWeight().isEmpty()) {
      add(rows, "check weight", flat(md.checkWeight()));
    }
    add(rows, "warnings", String.join("; ", md.warnings()));
    add(rows, "notes", md.notes());
    if (!md.extra().isEmpty()) {
      add(rows, "other fields", flat(md.extra()));
    }
    return rows;
  }

  /** @return what was amended, when, by whom and why, in one cell */
  static String amendments(RunMetadata md) {
    List<String> parts = new ArrayList<>();
    parts.add(md.amendments().summary());
    DateTimeFormatter day = DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm 'UTC'", Locale.ROOT);
    for (org.loadstone.archive.Amendment a : md.amendments().log()) {
      parts.add(day.format(a.at().atOffset(ZoneOffset.UTC))
          + (a.operator().isEmpty() ? "" : " by " + a.operator()) + ": " + a.reason());
    }
    return String.join("; ", parts) + " (values below as amended; the run's files are as "
        + "recorded)";
  }

  private static String flat(Map<String, Object> m) {
    List<String> parts = new ArrayList<>();
    new TreeMap<>(m).forEach((k, v) -> parts.add(k + " " + v));
    return String.join(", ", parts);
  }

  private static void add(List<String[]> rows, String k, String v) {
    rows.add(new String[] {k, v == null || v.isBlank() ? "-" : v});
  }
}
