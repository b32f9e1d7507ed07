package org.loadstone.intake;

import java.util.List;
import java.util.function.Function;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.loadstone.units.InputException;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Setting;

/**
 * How an imported CSV is laid out: its delimiter, which column holds time, force and position
 * (by name or number), whether the first line is a header, and the units a header states
 * ("force [kN]"). Refusals name the file, the line and the fix; reading the cells of the rows is
 * {@link ImportCells}'.
 */
final class ImportColumns {
  private ImportColumns() {}

  private static final Pattern UNIT_IN_HEADER =
      Pattern.compile("[\\[(]\\s*([^\\])]+?)\\s*[\\])]\\s*$");

  static char delimiter(String body, boolean decimalComma, String name, int line) {
    int end = body.indexOf('\n');
    String first = end < 0 ? body : body.substring(0, end);
    char best = 0;
    long bestCount = 0;
    for (char d : new char[] {';', '\t', ','}) {
      if (d == ',' && decimalComma) {
        continue;
      }
      long count = first.chars().filter(ch -> ch == d).count();
      if (count > bestCount) {
        best = d;
        bestCount = count;
      }
    }
    if (best == 0) {
      throw new LoadstoneException("File " + name + " line " + line + ": no comma, semicolon or "
          + "tab found, so the columns cannot be told apart. Give the file's column delimiter "
          + "or check the skip count.", Setting.IMPORT_DELIMITER);
    }
    return best;
  }

  static boolean isIndex(String ref) {
    return !ref.isEmpty() && ref.chars().allMatch(Character::isDigit);
  }

  static int column(String ref, List<String> header, String name, int line,
      boolean optional) {
    if (isIndex(ref)) {
      // more digits than any file has columns: refused below as a column that does not exist
      int k = ref.length() > 9 ? Integer.MAX_VALUE : Integer.parseInt(ref);
      if (k < 1 || k > header.size()) {
        throw new LoadstoneException("File " + name + " line " + line + " has " + header.size()
            + " column(s); column number " + ref + " does not exist. Columns count from 1.");
      }
      return k - 1;
    }
    for (int i = 0; i < header.size(); i++) {
      if (header.get(i).trim().equalsIgnoreCase(ref)) {
        return i;
      }
    }
    if (optional) {
      return -1;
    }
    throw new LoadstoneException("File " + name + " line " + line + " has no column named '" + ref
        + "'; its columns are " + header + ". Map by one of these names or by number.");
  }

  static boolean numeric(List<String> header, int i, boolean decimalComma) {
    String v = header.get(i).trim();
    return ImportCells.isNumber(decimalComma ? v.replace(',', '.') : v);
  }

  static boolean allBlank(List<String[]> rows, int col) {
    for (String[] r : rows) {
      if (col < r.length && !r[col].isBlank()) {
        return false;
      }
    }
    return true;
  }

  static <U> U unit(U given, List<String> header, int col, String role, U fallback,
      Function<String, U> parse, Function<U, String> symbol,
      String file, int line, List<String> notes, Setting option) {
    String fromHeader = null;
    if (header != null) {
      Matcher m = UNIT_IN_HEADER.matcher(header.get(col).trim());
      if (m.find()) {
        fromHeader = m.group(1);
      }
    }
    if (given != null) {
      if (fromHeader != null && !fromHeader.equalsIgnoreCase(symbol.apply(given))) {
        notes.add("The " + role + " header says '" + fromHeader + "' but the unit "
            + symbol.apply(given) + " was given; the given unit is used.");
      }
      return given;
    }
    if (fromHeader != null) {
      try {
        return parse.apply(fromHeader);
      } catch (LoadstoneException e) {
        throw new LoadstoneException("File " + file + " line " + line + " column "
            + InputException.shown(header.get(col).trim()) + ": " + e.getMessage() + ". Give the "
            + role + " unit of the file.", e, option);
      }
    }
    notes.add("No " + role + " unit given or in the header: " + symbol.apply(fallback)
        + " assumed.");
    return fallback;
  }
}
