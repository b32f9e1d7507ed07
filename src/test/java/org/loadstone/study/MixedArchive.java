package org.loadstone.study;

import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.loadstone.archive.FinishCause;
import org.loadstone.archive.RunMetadata;
import org.loadstone.archive.RunWriter;
import org.loadstone.archive.ScaleSpec;
import org.loadstone.archive.TestRuns;

/**
 * An archive folder of real run files (written by {@link RunWriter}) that mixes runs that count
 * with runs the default selection leaves out: calibrated breaks in three groups, and in foam and
 * balsa a manual stop, a time-limited run, an uncalibrated (nominal-scale) break, an imported run
 * with a unit mix-up and an overload stop. The left-out runs carry peaks far from their group's,
 * so counting any of them would move the statistics.
 */
public final class MixedArchive {
  private MixedArchive() {}

  /**
   * Peak forces (N) of the runs that count, by group. The last foam value stands out (Grubbs
   * G = 1.79 against the critical 1.715 for n = 5 at the 5 % level).
   */
  public static final Map<String, double[]> COUNTED = new LinkedHashMap<>();

  static {
    COUNTED.put("balsa", new double[] {610, 640, 625, 618});
    COUNTED.put("board", new double[] {380, 395, 372, 388});
    COUNTED.put("foam", new double[] {466, 468, 467, 469, 520});
  }

  /** The left-out runs' ids, in the order written (oldest first), with the kind of each. */
  public static final Map<String, String> LEFT_OUT = new LinkedHashMap<>();

  /** The run id of the counted foam run that stands out. */
  public static final String FOAM_OUTLIER = countedIds("foam").get(4);

  static {
    LEFT_OUT.put(id(20, "foam-manual"), "manual");
    LEFT_OUT.put(id(21, "foam-timed"), "time-limit");
    LEFT_OUT.put(id(22, "foam-nominal"), "uncalibrated");
    LEFT_OUT.put(id(23, "foam-imported"), "imported");
    LEFT_OUT.put(id(24, "balsa-overload"), "overload");
    LEFT_OUT.put(id(25, "balsa-manual-nominal"), "manual");
  }

  /**
   * Writes the archive.
   *
   * @param dir an empty folder
   * @return the folder
   */
  public static Path write(Path dir) {
    int minute = 0;
    for (Map.Entry<String, double[]> g : COUNTED.entrySet()) {
      double[] peaks = g.getValue();
      for (int i = 0; i < peaks.length; i++) {
        String specimen = g.getKey() + "-" + (i + 1);
        write(dir, minute++, specimen, g.getKey(), FinishCause.BREAK, true, peaks[i], 48.0 + i);
      }
    }
    write(dir, 20, "foam-manual", "foam", FinishCause.MANUAL, true, 120, 49.0);
    write(dir, 21, "foam-timed", "foam", FinishCause.TIME_LIMIT, true, 60, 49.0);
    write(dir, 22, "foam-nominal", "foam", FinishCause.BREAK, false, 900, 49.0);
    RunMetadata imported = meta(23, "foam-imported", "foam", FinishCause.IMPORTED, false, null)
        .toBuilder().scale("imported: force read from legacy.csv, no raw counts")
        .scaleSpec(new ScaleSpec("imported", List.of(0.0), null, null)).build();
    RunWriter.write(dir, imported, TestRuns.bend(0.1, 0.66)); // kN read as N: 0.66 "N"
    write(dir, 24, "balsa-overload", "balsa", FinishCause.OVERLOAD, true, 2000, 50.0);
    write(dir, 25, "balsa-manual-nominal", "balsa", FinishCause.MANUAL, false, 90, 50.0);
    return dir;
  }

  /**
   * Peak forces (N) of the runs that count once {@link #writeAmended} has amended the archive:
   * balsa-4 retired, and a board run recorded under a misspelt group moved into board.
   */
  public static final Map<String, double[]> AMENDED_COUNTED = new LinkedHashMap<>();

  /** The left-out runs' ids of the amended archive, oldest first. */
  public static final List<String> AMENDED_LEFT_OUT = new ArrayList<>();

  /** The retired run of the amended archive and the reason given. */
  public static final String RETIRED = id(3, "balsa-4");

  /** Why {@link #RETIRED} was retired. */
  public static final String RETIRED_REASON = "glue line failed before loading";

  /** The run recorded under group 'bord' and amended into 'board'. */
  public static final String REGROUPED = id(26, "board-5");

  static {
    AMENDED_COUNTED.put("balsa", new double[] {610, 640, 625});
    AMENDED_COUNTED.put("board", new double[] {380, 395, 372, 388, 385});
    AMENDED_COUNTED.put("foam", COUNTED.get("foam"));
    AMENDED_LEFT_OUT.add(RETIRED);
    AMENDED_LEFT_OUT.addAll(LEFT_OUT.keySet());
  }

  /**
   * Writes the archive of {@link #write}, then amends it through the amendment log as a user
   * would: a run of board recorded under the misspelt group 'bord' moved into board, and
   * balsa-4 retired.
   *
   * @param dir an empty folder
   * @return the folder
   */
  public static Path writeAmended(Path dir) {
    write(dir);
    write(dir, 26, "board-5", "bord", FinishCause.BREAK, true, 385, 47.0);
    java.time.Instant at = Instant.parse("2026-12-03T08:00:00Z");
    org.loadstone.archive.Amendments.append(dir.resolve(REGROUPED + ".json"),
        new org.loadstone.archive.Amendment(at, "J. Ruiz", "group misspelt at the press",
            Map.of("group", "board"), null, "test"));
    org.loadstone.archive.Amendments.append(dir.resolve(RETIRED + ".json"),
        new org.loadstone.archive.Amendment(at, "J. Ruiz", RETIRED_REASON, Map.of(), true,
            "test"));
    return dir;
  }

  /** @return every run id of the counted runs of a group, oldest first */
  public static List<String> countedIds(String group) {
    List<String> ids = new ArrayList<>();
    int minute = 0;
    for (Map.Entry<String, double[]> g : COUNTED.entrySet()) {
      for (int i = 0; i < g.getValue().length; i++) {
        if (g.getKey().equals(group)) {
          ids.add(id(minute, g.getKey() + "-" + (i + 1)));
        }
        minute++;
      }
    }
    return ids;
  }

  private static void write(Path dir, int minute, String specimen, String group,
      FinishCause cause, boolean calibrated, double peak_N, Double mass_g) {
    RunWriter.write(dir, meta(minute, specimen, group, cause, calibrated, mass_g),
        TestRuns.bend(55 + minute % 7, peak_N));
  }

  private static RunMetadata meta(int minute, String specimen, String group, FinishCause cause,
      boolean calibrated, Double mass_g) {
    RunMetadata.Builder b = TestRuns.meta(specimen, group, TestRuns.panel(), mass_g).toBuilder()
        .runId(id(minute, specimen))
        .startedAt(Instant.parse("2026-12-02T10:00:00Z").plusSeconds(60L * minute))
        .cause(cause);
    if (!calibrated) {
      b.calibrationId(null).calibrationSha256(null)
          .scale("nominal 8590 counts/N (the cell's data sheet)")
          .scaleSpec(ScaleSpec.nominal(8590));
    }
    return b.build();
  }

  private static String id(int minute, String specimen) {
    return String.format("20261202T10%02d00.000Z-%s", minute, specimen);
  }
}
