package org.loadstone.calibration;

import java.io.IOException;
import java.io.Reader;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.loadstone.units.CsvInput;
import org.loadstone.units.InputException;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;
import org.loadstone.units.TextFiles;

/**
 * Reads calibration points typed or collected offline.
 *
 * <p>Format: comma-separated, a header line, decimal point. The first column is the load,
 * {@code mass_g} (grams; turned into force with the given {@link ForceFromMass}) or
 * {@code force_N}. Then {@code counts} (mean raw counts). Optional columns: {@code direction}
 * ({@code up} or {@code down}, default up), {@code series} (1, 2, …, default 1),
 * {@code counts_sd} (default 0) and {@code samples} (default 1). Lines starting with {@code #}
 * are comments.
 */
public final class PointsCsv {
  private static final Set<String> OPTIONAL = Set.of("direction", "series", "counts_sd", "samples");

  private PointsCsv() {}

  /**
   * @param file the CSV file
   * @param model turns mass into force (used for {@code mass_g} files)
   * @return the points in file order
   * @throws LoadstoneException naming the file, line and column when the file cannot be read,
   *     a column is unknown or missing, a value is not a number or negative, or a load repeats
   *     within a series and direction
   */
  public static List<CalibrationPoint> read(Path file, ForceFromMass model) {
    Precondition.notNull(file, "file");
    Precondition.notNull(model, "model");
    try (Reader r = TextFiles.open(file, "points file")) {
      return read(r, file.toString(), model);
    } catch (IOException e) {
      throw TextFiles.unreadable(file, "points file", e);
    }
  }

  /** As {@link #read(Path, ForceFromMass)}, from a reader; {@code name} is used in messages. */
  public static List<CalibrationPoint> read(Reader reader, String name, ForceFromMass model)
      throws IOException {
    CSVFormat fmt = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true)
        .setCommentMarker('#').setIgnoreSurroundingSpaces(true).setIgnoreEmptyLines(true)
        .get();
    try (CSVParser p = CSVParser.parse(reader, fmt)) {
      List<String> header = p.getHeaderNames();
      if (header.isEmpty()) {
        throw new LoadstoneException("points file " + name + " is empty: the first line must be"
            + " a header such as 'mass_g,counts,direction,series'");
      }
      String loadCol = header.get(0).toLowerCase(Locale.ROOT);
      boolean mass = loadCol.equals("mass_g");
      if (!mass && !loadCol.equals("force_N".toLowerCase(Locale.ROOT))) {
        throw new LoadstoneException("points file " + name + ": the first column is '"
            + InputException.shown(header.get(0)) + ": it must be 'mass_g' or 'force_N'");
      }
      if (header.size() < 2 || !header.get(1).equalsIgnoreCase("counts")) {
        throw new LoadstoneException("points file " + name + ": the second column must be"
            + " 'counts'");
      }
      for (String h : header.subList(2, header.size())) {
        if (!OPTIONAL.contains(h.toLowerCase(Locale.ROOT))) {
          throw new LoadstoneException("points file " + name + ": unknown column " + InputException.shown(h)
              + ": allowed after the load and counts are direction, series, counts_sd,"
              + " samples");
        }
      }
      List<CalibrationPoint> out = new ArrayList<>();
      Set<String> seen = new HashSet<>();
      for (CSVRecord rec : p) {
        long line = p.getCurrentLineNumber();
        if (rec.size() != header.size()) {
          throw new LoadstoneException("points file " + name + " line " + line + ": "
              + rec.size() + " values for " + header.size() + " columns: give one value per"
              + " column");
        }
        double load = number(rec, 0, header, name, line);
        double counts = number(rec, 1, header, name, line);
        Direction dir = Direction.UP;
        int series = 1;
        double sd = 0;
        int samples = 1;
        for (int c = 2; c < header.size(); c++) {
          String h = header.get(c).toLowerCase(Locale.ROOT);
          try {
            switch (h) {
              case "direction" -> dir = Direction.parse(rec.get(c));
              case "series" -> series = Integer.parseInt(rec.get(c));
              case "counts_sd" -> sd = number(rec, c, header, name, line);
              default -> samples = Integer.parseInt(rec.get(c));
            }
          } catch (NumberFormatException | LoadstoneException e) {
            throw new LoadstoneException("points file " + name + " line " + line + " column '"
                + header.get(c) + "': " + InputException.shown(rec.get(c)) + " is not valid: "
                + (e instanceof LoadstoneException ? e.getMessage() : "write a whole number"));
          }
        }
        double force;
        Double mass_kg = null;
        if (mass) {
          mass_kg = load / 1000.0;
          force = model.force_N(mass_kg);
        } else {
          force = load;
        }
        if (!seen.add(series + "/" + dir + "/" + load)) {
          throw new LoadstoneException("points file " + name + " line " + line + ": load "
              + InputException.shown(rec.get(0)) + " appears twice in series " + series + ", direction "
              + dir.label() + ": keep one reading per load, or give the repeat its own series");
        }
        try {
          out.add(new CalibrationPoint(force, mass_kg, dir, series, counts, sd, samples));
        } catch (LoadstoneException e) {
          throw new LoadstoneException("points file " + name + " line " + line + ": "
              + e.getMessage());
        }
      }
      return out;
    } catch (IllegalArgumentException | IllegalStateException | java.io.UncheckedIOException e) {
      throw CsvInput.translate(e, InputException.in("points file " + name, null),
          "correct the file; its format is described in calibration/README.md");
    }
  }

  /**
   * Writes points in the format {@link #read} takes: {@code mass_g} when every point has a mass,
   * else {@code force_N}; then counts, direction, series, counts_sd, samples.
   *
   * @param points the points, not null
   * @param comment text for a leading {@code #} line, or null for none
   * @return the CSV text, lines ending in a newline
   */
  public static String format(List<CalibrationPoint> points, String comment) {
    Precondition.notNull(points, "points");
    boolean mass = points.stream().allMatch(p -> p.mass_kg() != null);
    StringBuilder sb = new StringBuilder();
    if (comment != null) {
      for (String line : comment.split("\\R")) {
        sb.append("# ").append(line).append('\n');
      }
    }
    sb.append(mass ? "mass_g" : "force_N").append(",counts,direction,series,counts_sd,samples\n");
    for (CalibrationPoint p : points) {
      double load = mass ? p.mass_kg() * 1000 : p.force_N();
      sb.append(Double.toString(load)).append(',').append(Double.toString(p.counts_mean()))
          .append(',').append(p.direction().label()).append(',').append(p.series()).append(',')
          .append(Double.toString(p.counts_sd())).append(',').append(p.samples()).append('\n');
    }
    return sb.toString();
  }

  /** The largest reading a converter gives, counts (a signed 32-bit value). */
  private static final double COUNTS_LIMIT = 2147483648.0;
  /** The largest load or SD accepted, g or N (a thousand tonnes). */
  private static final double LOAD_LIMIT = 1e9;

  private static double number(CSVRecord rec, int c, List<String> header, String name, long line) {
    String t = rec.get(c);
    double v;
    try {
      v = Double.parseDouble(t);
    } catch (NumberFormatException e) {
      throw new LoadstoneException("points file " + name + " line " + line + " column '"
          + header.get(c) + "': " + InputException.shown(t) + " is not a number: use digits with a decimal point"
          + " (e.g. 1250.5), no unit and no thousands separator");
    }
    if (!Double.isFinite(v)) {
      throw new LoadstoneException("points file " + name + " line " + line + " column '"
          + header.get(c) + "': " + InputException.shown(t)
          + " is out of range: counts and loads are finite numbers");
    }
    if (Math.abs(v) > (c == 1 ? COUNTS_LIMIT : LOAD_LIMIT)) {
      throw new LoadstoneException("points file " + name + " line " + line + " column '"
          + header.get(c) + "': " + InputException.shown(t) + " is out of range: "
          + (c == 1 ? "a reading is at most ±2147483648 counts (a 32-bit converter)"
              : "loads and SDs are at most 1e9 (g or N)") + "; correct the cell");
    }
    if (c != 1 && v < 0) {
      throw new LoadstoneException("points file " + name + " line " + line + " column '"
          + header.get(c) + "': " + InputException.shown(t) + " is negative: loads and SDs are zero or more (put"
          + " compression and tension in separate calibrations)");
    }
    return v;
  }
}
