package org.loadstone.report;

import java.io.BufferedWriter;
import java.io.OutputStreamWriter;
import java.math.BigDecimal;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import org.loadstone.archive.RunData;
import org.loadstone.files.FilePublisher;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * Writes a run's samples as CSV for spreadsheets, with a chosen delimiter and decimal mark, e.g.
 * {@code ;} with {@code ,} for comma-decimal locales. Columns: {@code time_s, force_N,
 * position_mm, raw_counts, raw_position, seq}; position cells are empty when the run has none.
 * Numbers are written in full (the shortest text that reads back as the same double), never in
 * exponent form.
 */
public final class CsvExport {
  private CsvExport() {}

  /** Column heads, in order. */
  public static final String[] COLUMNS =
      {"time_s", "force_N", "position_mm", "raw_counts", "raw_position", "seq"};

  /**
   * Writes the CSV through a temporary file.
   *
   * @param data the run, not null
   * @param file target; must not exist
   * @param delimiter field delimiter: {@code ,}, {@code ;} or tab
   * @param decimalMark {@code .} or {@code ,}; must differ from the delimiter
   * @throws LoadstoneException when the marks are refused, the file exists or writing fails
   */
  public static void write(RunData data, Path file, char delimiter, char decimalMark) {
    org.loadstone.units.SlowWork.check("writing an export");
    Precondition.notNull(data, "data");
    Precondition.notNull(file, "file");
    if (delimiter != ',' && delimiter != ';' && delimiter != '\t') {
      throw new LoadstoneException("CSV delimiter '" + delimiter + "' is not offered; use ',', ';' "
          + "or tab.");
    }
    if (decimalMark != '.' && decimalMark != ',') {
      throw new LoadstoneException("Decimal mark '" + decimalMark + "' is not offered; use '.' or "
          + "','.");
    }
    if (delimiter == decimalMark) {
      throw new LoadstoneException("CSV delimiter and decimal mark are both '" + delimiter
          + "', so numbers could not be told apart; use ';' with ',' or ',' with '.'.");
    }
    String d = String.valueOf(delimiter);
    FilePublisher.publish(file, "CSV file", out -> {
      BufferedWriter w = new BufferedWriter(new OutputStreamWriter(out, StandardCharsets.UTF_8));
      w.write(String.join(d, COLUMNS));
      w.write("\r\n");
      StringBuilder line = new StringBuilder();
      double[] t = data.time_s();
      double[] f = data.force_N();
      double[] x = data.position_mm();
      for (int i = 0; i < data.size(); i++) {
        line.setLength(0);
        line.append(num(t[i], decimalMark)).append(d).append(num(f[i], decimalMark)).append(d);
        if (x != null) {
          line.append(num(x[i], decimalMark));
        }
        line.append(d).append(data.rawCounts()[i]).append(d);
        if (data.rawPosition() != null) {
          line.append(data.rawPosition()[i]);
        }
        line.append(d).append(data.seq()[i]).append("\r\n");
        w.append(line);
      }
      w.flush();
    });
  }

  private static String num(double v, char mark) {
    if (!Double.isFinite(v)) {
      throw new LoadstoneException("Run value " + v + " cannot be exported; a run holds only "
          + "finite numbers. Re-derive the run from its raw counts.");
    }
    String s = BigDecimal.valueOf(v).toPlainString();
    return mark == '.' ? s : s.replace('.', mark);
  }
}
