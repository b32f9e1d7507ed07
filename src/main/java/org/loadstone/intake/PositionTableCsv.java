package org.loadstone.intake;

import java.io.IOException;
import java.io.Reader;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.loadstone.analysis.position.PositionTable;
import org.loadstone.units.DurationUnit;
import org.loadstone.units.LengthUnit;
import org.loadstone.units.CsvInput;
import org.loadstone.units.InputException;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.TextFiles;

/**
 * Reads a position–time table from elsewhere (a video-tracking program's export, a dial-gauge
 * log): two named (or 1-based numbered) columns, with their units, comma/semicolon/tab delimited,
 * decimal point or comma. Messages name the file, line and column.
 */
public final class PositionTableCsv {
  private PositionTableCsv() {}

  /**
   * @param file the CSV, with a header row
   * @param timeColumn header name or 1-based index of the time column
   * @param positionColumn header name or 1-based index of the position column
   * @param timeUnit unit of the time column
   * @param lengthUnit unit of the position column
   * @param decimalComma whether numbers use a decimal comma
   * @throws LoadstoneException naming the file, line and column of any bad cell
   */
  public static PositionTable read(Path file, String timeColumn, String positionColumn,
      DurationUnit timeUnit, LengthUnit lengthUnit, boolean decimalComma) {
    String text = TextFiles.read(file, "position table");
    String first = text.lines().findFirst().orElse("");
    char delim = first.contains("\t") ? '\t' : first.contains(";") ? ';' : ',';
    if (decimalComma && delim == ',') {
      throw new LoadstoneException("position table " + file + " uses ',' between columns, so "
          + "its numbers cannot use a decimal comma: read it without a decimal comma",
          org.loadstone.units.Setting.TABLE_DECIMAL_COMMA);
    }
    CSVFormat fmt = CSVFormat.DEFAULT.builder().setDelimiter(delim).setHeader()
        .setSkipHeaderRecord(true).setIgnoreEmptyLines(true).setTrim(true).get();
    List<Double> t = new ArrayList<>();
    List<Double> x = new ArrayList<>();
    try (Reader r = new java.io.StringReader(text); CSVParser p = CSVParser.parse(r, fmt)) {
      List<String> header = p.getHeaderNames();
      int ti = column(header, timeColumn, file, "time");
      int xi = column(header, positionColumn, file, "position");
      for (CSVRecord rec : p) {
        long line = rec.getParser().getCurrentLineNumber();
        t.add(timeUnit.toSeconds(number(rec, ti, header, file, line, decimalComma)));
        x.add(lengthUnit.toMm(number(rec, xi, header, file, line, decimalComma)));
      }
    } catch (IOException | IllegalStateException | IllegalArgumentException
        | java.io.UncheckedIOException e) {
      throw CsvInput.translate(e, InputException.in("position table", file),
          "check quotes and the delimiter");
    }
    for (int i = 1; i < t.size(); i++) {
      if (!(t.get(i) > t.get(i - 1))) {
        throw new LoadstoneException("position table " + file + ", data row " + (i + 1)
            + ": time " + t.get(i) + " s does not increase (previous " + t.get(i - 1)
            + " s): sort the table by time and remove repeated rows");
      }
    }
    return new PositionTable(t.stream().mapToDouble(Double::doubleValue).toArray(),
        x.stream().mapToDouble(Double::doubleValue).toArray());
  }

  private static int column(List<String> header, String name, Path file, String what) {
    if (name.matches("[1-9][0-9]{0,8}")) {
      int i = Integer.parseInt(name) - 1;
      if (i < header.size()) {
        return i;
      }
    }
    for (int i = 0; i < header.size(); i++) {
      if (header.get(i).equalsIgnoreCase(name.trim())) {
        return i;
      }
    }
    throw new LoadstoneException("position table " + file + " has no " + what + " column "
        + InputException.shown(name) + ": its columns are "
        + InputException.shown(String.join(", ", header)));
  }

  private static double number(CSVRecord rec, int i, List<String> header, Path file, long line,
      boolean decimalComma) {
    String cell = i < rec.size() ? rec.get(i) : "";
    String s = decimalComma ? cell.replace(',', '.') : cell;
    try {
      double v = Double.parseDouble(s);
      if (Double.isFinite(v)) {
        return v;
      }
    } catch (NumberFormatException ignored) {
      // reported below
    }
    boolean comma = cell.contains(",") && !decimalComma;
    throw new LoadstoneException(String.format(Locale.ROOT,
        "position table %s, line %d, column %s: %s is not a number%s", file, line,
        InputException.shown(header.get(i)), InputException.shown(cell), comma ? " (a table with a decimal comma must be read as one)" : ""),
        comma ? new org.loadstone.units.Setting[] {org.loadstone.units.Setting.TABLE_DECIMAL_COMMA}
            : new org.loadstone.units.Setting[0]);
  }
}
