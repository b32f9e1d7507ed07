package org.loadstone.calibration;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.loadstone.files.FileExistsException;
import org.loadstone.files.FilePublisher;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * The calibration facade the CLI and the GUI call. Stateless; all methods are static and
 * thread-safe.
 */
public final class CalibrationService {
  /** Label carried by every standards-style figure. */
  public static final String STANDARDS_NOTE = "computed in the style of ASTM E74 and ISO 7500-1"
      + " — not a substitute for an accredited calibration";

  private CalibrationService() {}

  /**
   * Fits every curve the points allow, recommends one, and computes the metrics.
   *
   * <p>Counts are taken relative to the ascending zero point of their series. Each series must
   * have one; loads must not repeat within a series and direction. The curves are fitted to the
   * ascending readings of every series (at least three distinct loads: zero and two more); the
   * descending readings give the hysteresis, the reversibility and the zero return.
   *
   * @param points calibration points, not null, not empty
   * @param settings force model, full scale and chosen fit; not null
   * @return the report; never null
   * @throws LoadstoneException on missing zero points, duplicate loads, too few points, or when
   *     the chosen fit cannot be made (rank deficient or not monotonic over the range)
   */
  public static CalibrationReport fitFromPoints(
      List<CalibrationPoint> points, CalibrationSettings settings) {
    Precondition.notNull(points, "points");
    Precondition.notNull(settings, "settings");
    List<CalibrationPoint> pts = CurveFitting.sorted(points);
    Set<String> seen = new HashSet<>();
    for (CalibrationPoint p : pts) {
      if (!seen.add(p.series() + "/" + p.direction() + "/" + p.force_N())) {
        throw new LoadstoneException(String.format(
            "load %s N appears twice in series %d, direction %s: keep one reading per load, or"
                + " give the repeat its own series number", p.force_N(), p.series(),
            p.direction().label()));
      }
    }
    long distinct = CurveFitting.distinctLoads(pts);
    if (distinct < 3) {
      throw new LoadstoneException("fewer points than the fit needs: " + distinct + " distinct"
          + " ascending load(s) given, a straight-line calibration needs at least 3 (zero and two"
          + " loads, read going up); add points across the range");
    }
    Map<Integer, Double> zero = CurveFitting.zeroCounts(pts);
    double[] net = new double[pts.size()];
    for (int i = 0; i < net.length; i++) {
      net[i] = pts.get(i).counts_mean() - zero.get(pts.get(i).series());
    }
    double maxForce = pts.stream().mapToDouble(CalibrationPoint::force_N).max().orElseThrow();
    double fs = settings.fullScale_N() != null ? settings.fullScale_N() : maxForce;

    Map<FitKind, FitResult> fits = new EnumMap<>(FitKind.class);
    List<String> notes = new ArrayList<>();
    for (FitKind kind : FitKind.values()) {
      if (distinct < kind.parameters() + 1L) {
        notes.add(kind.label() + " not fitted: needs at least " + (kind.parameters() + 1)
            + " distinct ascending loads, there are " + distinct);
        continue;
      }
      try {
        fits.put(kind, CurveFitting.fit(kind, pts, net, fs));
      } catch (LoadstoneException e) {
        notes.add(kind.label() + " left out: " + e.getMessage());
      }
    }
    if (!fits.containsKey(FitKind.LINEAR)) {
      throw new LoadstoneException("no straight-line fit could be made from these points: "
          + String.join("; ", notes));
    }
    LinearityMetrics lin = CurveFitting.linearity(pts, net, fs);
    FitRecommendation rec = FitChoice.recommend(fits);
    FitKind chosen = settings.chosenFit() != null ? settings.chosenFit() : rec.kind();
    FitResult chosenFit = fits.get(chosen);
    if (chosenFit == null) {
      throw new LoadstoneException("the chosen fit " + chosen.label() + " could not be made: "
          + notes.stream().filter(n -> n.startsWith(chosen.label() + " ")).findFirst()
              .orElse("not fitted") + "; choose another fit or leave the choice to the"
              + " recommendation (" + rec.kind().label() + ")");
    }
    AstmE74Result astm = null;
    if (chosenFit.degreesOfFreedom() > 0) {
      astm = AstmE74Result.of(chosenFit, maxForce);
    } else {
      notes.add("ASTM E74 style figures not assessed: the " + chosen.label() + " fit leaves no"
          + " degree of freedom in the ascending readings; add ascending loads");
    }
    Iso7500Result iso = Iso7500Style.evaluate(chosenFit, lin.sensitivity_counts_per_N(), fs);
    return new CalibrationReport(pts, zero, settings, fs, maxForce,
        new ArrayList<>(fits.values()), rec, chosen, lin, astm, iso, notes);
  }

  /**
   * Reads a points CSV (see {@link PointsCsv}) and fits it.
   *
   * @throws LoadstoneException naming the file, line and column of bad input
   */
  public static CalibrationReport fitFromCsv(Path csv, CalibrationSettings settings) {
    Precondition.notNull(settings, "settings");
    return fitFromPoints(PointsCsv.read(csv, settings.forceModel()), settings);
  }

  /**
   * The short summary of the adopted fit, as an ordered map ready for JSON. Keys: {@code fit},
   * {@code degree}, {@code coefficients} (net counts as a polynomial in N, lowest order first),
   * {@code sensitivity_counts_per_N}, {@code residual_sd_N}, {@code nonlinearity_pct_fs},
   * {@code hysteresis_pct_fs} and {@code repeatability_pct_fs} (null when not assessed),
   * {@code full_scale_N}, {@code astm_sd_N} (standard deviation of the ascending readings about
   * their curve), {@code llf_N}, {@code class_a_lower_limit_N}, {@code class_aa_lower_limit_N}
   * (these four null when not assessed), {@code iso7500_class}, {@code gravity_correction_relative}
   * ((g − 9.80665)/9.80665), {@code buoyancy_correction_relative} (F/(m·g) − 1 for a conventional mass m, see
   * {@link ForceFromMass}), {@code note}.
   */
  public static Map<String, Object> summary(CalibrationReport report) {
    Precondition.notNull(report, "report");
    FitResult f = report.chosenFit();
    Map<String, Object> m = new LinkedHashMap<>();
    m.put("fit", f.kind().label());
    m.put("degree", f.kind().degree());
    m.put("coefficients", f.countsOfForce().coefficientList());
    m.put("sensitivity_counts_per_N", report.linearity().sensitivity_counts_per_N());
    m.put("residual_sd_N", f.residualSd_N());
    m.put("nonlinearity_pct_fs", report.linearity().nonlinearity_pct_fs());
    m.put("hysteresis_pct_fs", report.linearity().hysteresis_pct_fs());
    m.put("repeatability_pct_fs", report.linearity().repeatability_pct_fs());
    m.put("full_scale_N", report.fullScale_N());
    AstmE74Result astm = report.astm();
    m.put("astm_sd_N", astm == null ? null : astm.residualSd_N());
    m.put("llf_N", astm == null ? null : astm.llf_N());
    m.put("class_a_lower_limit_N", astm == null ? null : astm.classALowerLimit_N());
    m.put("class_aa_lower_limit_N", astm == null ? null : astm.classAALowerLimit_N());
    m.put("iso7500_class", report.iso().systemClass());
    ForceFromMass.Corrections c = report.settings().forceModel().corrections(1.0);
    m.put("gravity_correction_relative", c.gravityRelative());
    m.put("buoyancy_correction_relative", c.buoyancyRelative());
    m.put("note", STANDARDS_NOTE);
    return m;
  }

  /** @return {@link #summary} as indented JSON text */
  public static String summaryJson(CalibrationReport report) {
    try {
      return new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT)
          .writeValueAsString(summary(report));
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("summary cannot be written as JSON", e);
    }
  }

  /**
   * Builds the calibration document of {@code report} and saves it as {@code <dir>/<id>.json};
   * never overwrites.
   *
   * @return the saved document (with its content hash); its file is
   *     {@link CalibrationFiles#fileFor}(dir, id)
   * @throws LoadstoneException on invalid metadata, an existing file (with a free id suggested),
   *     or a write failure
   */
  public static CalibrationDocument save(Path dir, CalibrationReport report, String id,
      java.time.LocalDate date, String operator, String cellId, java.time.LocalDate validUntil,
      String description) {
    CalibrationDocument d =
        CalibrationDocument.of(report, id, date, operator, cellId, validUntil, description);
    CalibrationFiles.saveCalibration(dir, d);
    return d;
  }

  /** @return {@code base} when no calibration has that id in {@code dir}, else base-2, base-3, … */
  public static String unusedId(Path dir, String base) {
    return java.nio.file.Files.exists(CalibrationFiles.fileFor(dir, base))
        || java.nio.file.Files.exists(dir.resolve(base + ".points.csv"))
        ? CalibrationFiles.freeId(dir, base) : base;
  }

  /**
   * Saves the points of a calibration beside it, as {@code <id>.points.csv} ({@link
   * PointsCsv#format}), never over another file.
   *
   * @return the file written
   * @throws LoadstoneException when the file exists (suggesting a free id) or cannot be written
   */
  public static Path savePoints(Path dir, String id, List<CalibrationPoint> points,
      String comment) {
    Path f = dir.resolve(id + ".points.csv");
    try {
      return FilePublisher.publish(f, "points file",
          PointsCsv.format(points, comment).getBytes(java.nio.charset.StandardCharsets.UTF_8));
    } catch (FileExistsException e) {
      throw new LoadstoneException("points file " + f + " exists and is never overwritten:"
          + " save under another calibration id, e.g. '" + CalibrationFiles.freeId(dir, id)
          + "'");
    }
  }

  /** @return the plain-text fit table of {@link FitTable#format} */
  public static String fitTable(CalibrationReport report) {
    return FitTable.format(report);
  }
}
