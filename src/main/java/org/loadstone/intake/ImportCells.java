package org.loadstone.intake;

import java.util.List;
import java.util.Locale;
import java.util.regex.Pattern;
import org.loadstone.units.InputException;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Setting;

/**
 * Turns an imported CSV's cells into numbers, with messages naming the file, the line and the
 * column: an empty cell, NaN or infinity, text that is not a number (with a hint when the file
 * seems to use a decimal comma), a count that is not whole.
 *
 * @param file the file's name, for messages
 * @param header the header row, or null when the file has none (columns are then named by number)
 * @param decimalComma whether a comma is the decimal mark
 */
record ImportCells(String file, List<String> header, boolean decimalComma) {
  private static final Pattern NUMBER =
      Pattern.compile("[+-]?(\\d+\\.?\\d*|\\.\\d+)([eE][+-]?\\d+)?");

  /** @return whether the text is a plain decimal number with a point as decimal mark */
  static boolean isNumber(String v) {
    return NUMBER.matcher(v).matches();
  }

  String label(int col) {
    return header == null ? "#" + (col + 1) : InputException.shown(header.get(col).trim());
  }

  double number(String[] row, int col, int line) {
    String where = "File " + file + " line " + line + " column " + label(col);
    if (col >= row.length || row[col].isBlank()) {
      throw new LoadstoneException(where + ": the cell is empty. Fill it or remove the row.");
    }
    String raw = row[col].trim();
    String low = raw.toLowerCase(Locale.ROOT);
    if (low.equals("nan") || low.contains("inf")) {
      throw new LoadstoneException(where + ": the cell holds " + InputException.shown(raw)
          + ", not a measured "
          + "value. Remove or repair that row.");
    }
    String v = decimalComma ? raw.replace(',', '.') : raw;
    if (!isNumber(v)) {
      boolean comma = !decimalComma && raw.matches("[+-]?\\d+,\\d+");
      String hint = comma
          ? " The file seems to use a decimal comma: read it with a decimal comma."
          : " Check the column mapping and the skip count.";
      throw new LoadstoneException(where + ": " + InputException.shown(raw)
          + " is not a number." + hint,
          comma ? new Setting[] {Setting.IMPORT_DECIMAL_COMMA} : new Setting[0]);
    }
    double d = Double.parseDouble(v);
    if (!Double.isFinite(d)) {
      throw new LoadstoneException(where + ": " + InputException.shown(raw) + " is out of the"
          + " range of numbers. Repair the cell or remove the row.");
    }
    return d;
  }

  int integer(String[] row, int col, int line) {
    double v = number(row, col, line);
    if (v != Math.rint(v) || Math.abs(v) > Integer.MAX_VALUE) {
      throw new LoadstoneException("File " + file + " line " + line + " column " + label(col)
          + ": " + InputException.shown(row[col].trim()) + " is not a whole number of counts."
          + " Repair the cell or drop the raw columns.");
    }
    return (int) v;
  }
}
