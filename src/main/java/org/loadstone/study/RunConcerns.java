package org.loadstone.study;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.loadstone.archive.RunMetadata;
import org.loadstone.calibration.CalibrationStatus;
import org.loadstone.calibration.CheckWeightResult;
import org.loadstone.units.Precondition;

/**
 * What must be said about a run before anyone reads its figures: the one rule behind the warning
 * banner of the reports (and any other face that marks doubtful runs). A run raises a concern when
 * the last check-weight verification of its calibration failed, its calibration had expired or
 * did not match, its force came from a nominal scale or another program's file, it did not end in
 * a break, its record was amended or it was retired, or it carries any other warning stored
 * with it.
 */
public final class RunConcerns {
  private RunConcerns() {}

  private static final ObjectMapper JSON = new ObjectMapper().configure(
      com.fasterxml.jackson.databind.DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES, false);

  /** Kinds of concern, the gravest first. */
  public enum Kind {
    /** the last check-weight verification of the run's calibration failed */
    CHECK_FAILED("check weight failed"),
    /** the calibration file did not match its stored hash or the setup's */
    CALIBRATION_MISMATCH("calibration does not match"),
    /** the calibration had expired when the run was recorded */
    CALIBRATION_EXPIRED("calibration expired"),
    /** force from a nominal data-sheet scale */
    UNCALIBRATED("uncalibrated"),
    /** from another program's file */
    IMPORTED("imported"),
    /** ended otherwise than in a break (manual stop, time limit, overload, device lost…) */
    NOT_A_BREAK("no break"),
    /** the run's metadata was corrected after it was stored, or the run was retired */
    AMENDED("amended"),
    /** another warning given before or during the run */
    WARNING("warning");

    private final String words;

    Kind(String words) {
      this.words = words;
    }

    /** @return a short name for a banner, e.g. "check weight failed" */
    public String words() {
      return words;
    }
  }

  /**
   * One concern about one run.
   *
   * @param kind what kind
   * @param runId the run
   * @param specimen its specimen id
   * @param text what is wrong and what to do, in a sentence
   */
  public record Concern(Kind kind, String runId, String specimen, String text) {}

  /**
   * The concerns about a run, gravest first.
   *
   * @param md the run's metadata, not null
   * @return the concerns; empty for a broken, calibrated run with a passed check and no warning
   */
  public static List<Concern> of(RunMetadata md) {
    Precondition.notNull(md, "metadata");
    List<Concern> out = new ArrayList<>();
    Optional<CheckWeightResult> check = lastCheck(md);
    check.filter(c -> !c.pass()).ifPresent(c -> out.add(concern(md, Kind.CHECK_FAILED,
        String.format(Locale.ROOT, "the last check-weight verification of calibration %s (%s) "
            + "read %+.2f %% against a tolerance of %.2f %%: recalibrate before trusting these "
            + "forces", c.calibrationId(), readable(c.time()), c.error_pct(),
            c.tolerance_pct()))));
    boolean uncalibrated = false;
    for (LeftOut.Kind k : RunSelection.kindsOf(md)) {
      switch (k) {
        case UNCALIBRATED -> {
          uncalibrated = true;
          out.add(concern(md, Kind.UNCALIBRATED, "no calibration: force from a nominal scale"
              + (md.scale().isBlank() ? "" : " (" + md.scale() + ")") + ", a rough estimate"));
        }
        case IMPORTED -> out.add(concern(md, Kind.IMPORTED, k.meaning()));
        default -> out.add(concern(md, Kind.NOT_A_BREAK, k.meaning()));
      }
    }
    for (String w : md.warnings()) {
      Optional<CalibrationStatus.State> st = CalibrationStatus.stateOf(w);
      if (st.isPresent()) {
        out.add(concern(md, st.get() == CalibrationStatus.State.EXPIRED
            ? Kind.CALIBRATION_EXPIRED : Kind.CALIBRATION_MISMATCH, w));
      } else if (!(uncalibrated && w.startsWith("no calibration"))
          && !(check.isPresent() && !check.get().pass() && w.contains("FAILED"))) {
        out.add(concern(md, Kind.WARNING, w)); // the two above say it already, with figures
      }
    }
    if (md.amendments().any()) {
      out.add(concern(md, Kind.AMENDED, md.amendments().summary() + " (figures use the amended "
          + "values; the run's files are as recorded)"));
    }
    out.sort(java.util.Comparator.comparing(Concern::kind));
    return List.copyOf(out);
  }

  /**
   * The concerns of many runs by kind, for a group report's banner.
   *
   * @param runs the runs' metadata, not null
   * @return kind → the concerns of that kind, gravest kind first
   */
  public static Map<Kind, List<Concern>> byKind(List<RunMetadata> runs) {
    Map<Kind, List<Concern>> all = new java.util.TreeMap<>();
    for (RunMetadata md : runs) {
      for (Concern c : of(md)) {
        all.computeIfAbsent(c.kind(), k -> new ArrayList<>()).add(c);
      }
    }
    return new LinkedHashMap<>(all);
  }

  /**
   * The last check-weight verification of the run's calibration, as stored with the run.
   *
   * @param md the run's metadata, not null
   * @return the verification; empty when none was stored or it cannot be read
   */
  public static Optional<CheckWeightResult> lastCheck(RunMetadata md) {
    Precondition.notNull(md, "metadata");
    if (md.checkWeight() == null || !(md.checkWeight().get("pass") instanceof Boolean)) {
      return Optional.empty();
    }
    try {
      return Optional.of(JSON.convertValue(md.checkWeight(), CheckWeightResult.class));
    } catch (IllegalArgumentException e) {
      return Optional.empty(); // a damaged record: the run facts show it as stored
    }
  }

  /** An ISO-8601 instant as "2026-12-01 07:45 UTC"; other text as it is. */
  private static String readable(String iso) {
    try {
      return java.time.format.DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm 'UTC'", Locale.ROOT)
          .format(java.time.Instant.parse(iso).atOffset(java.time.ZoneOffset.UTC));
    } catch (java.time.format.DateTimeParseException | NullPointerException e) {
      return String.valueOf(iso);
    }
  }

  private static Concern concern(RunMetadata md, Kind kind, String text) {
    return new Concern(kind, md.runId(), md.specimen(), text);
  }
}
