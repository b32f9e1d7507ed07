package org.loadstone.units;

import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Turns a CSV parser's failure into an {@link InputException} in plain words (the line when the
 * parser knows it, what is wrong, the fix), so no parser class names or internal wording reach
 * the user. A failure that already is an {@link InputException} (a file that is not UTF-8) is
 * returned as it is.
 */
public final class CsvInput {
  private static final Pattern LINE = Pattern.compile("(?:startline|line:?)\\s*(\\d+)");

  private CsvInput() {}

  /**
   * @param e what the parser threw (while reading the header or a record)
   * @param where the file
   * @param fix what to do, for faults with no better fix of their own
   */
  public static InputException translate(Exception e, InputException.Where where, String fix) {
    for (Throwable c = e; c != null; c = c.getCause() == c ? null : c.getCause()) {
      if (c instanceof InputException ie) {
        return ie;
      }
    }
    StringBuilder all = new StringBuilder();
    for (Throwable c = e; c != null; c = c.getCause() == c ? null : c.getCause()) {
      all.append(' ').append(c.getMessage());
    }
    String m = all.toString();
    Matcher lm = LINE.matcher(m);
    InputException.Where w = lm.find() ? where.line(Long.parseLong(lm.group(1))) : where;
    if (m.contains("EOF reached before encapsulated token finished")) {
      return w.fault("a quoted cell is never closed (a double quote is missing)",
          "close the quote; a quote inside a quoted cell is written twice (\"\")", e);
    }
    if (m.contains("Invalid character between encapsulated token and delimiter")) {
      return w.fault("text follows the closing quote of a cell",
          "put the whole cell inside the quotes, or remove the quotes", e);
    }
    if (m.contains("duplicate name")) {
      return w.line(1).fault("the header names a column twice",
          "give every column its own name", e);
    }
    if (m.contains("header name is missing") || m.contains("empty")) {
      return w.line(1).fault("the header has a column without a name",
          "name every column or remove the extra delimiter", e);
    }
    return w.fault("is not a readable CSV file", fix, e);
  }
}
