package org.loadstone.units;

import java.nio.file.Path;

/**
 * Bad input from a file or an entry: carries where (the thing read, its file, the line and the
 * field) apart from what is wrong and the fix, and composes them into one message of the form
 * {@code <thing> <file>, line <n>, field '<f>': <problem>: <fix>}. Cells quoted in a message go
 * through {@link #shown(String)}, so a huge or multi-line cell never floods the terminal.
 */
public final class InputException extends LoadstoneException {
  private static final long serialVersionUID = 1L;
  /** Characters of a cell shown in a message before it is cut with "…". */
  public static final int SHOWN_CHARS = 40;

  private static final java.util.regex.Pattern PREDICATE =
      java.util.regex.Pattern.compile("(is|are|does|must|has|holds|cannot) ");
  private final String source;
  private final long line;
  private final String field;
  private final String problem;
  private final String fix;

  private InputException(Where w, String problem, String fix, Throwable cause) {
    super(compose(w, problem, fix), cause);
    this.source = w.source;
    this.line = w.line;
    this.field = w.field;
    this.problem = problem;
    this.fix = fix;
  }

  /**
   * @param what the kind of thing read ("run file", "calibration file"), not null
   * @param file the file, or null when the input is not a file
   * @return the place, to be narrowed to a line and field
   */
  public static Where in(String what, Path file) {
    Precondition.notNull(what, "what");
    return new Where(file == null ? what : what + " " + file, 0, null);
  }

  /** @return where the input came from, e.g. {@code "run file /a/b.csv"} */
  public String source() {
    return source;
  }

  /** @return the 1-based line, or 0 when not tied to a line */
  public long line() {
    return line;
  }

  /** @return the field or column, or null */
  public String field() {
    return field;
  }

  /** @return what is wrong */
  public String problem() {
    return problem;
  }

  /** @return what would fix it, or null */
  public String fix() {
    return fix;
  }

  /**
   * A cell or entry as shown in a message: quoted, line breaks and other control characters
   * written as {@code \n}, {@code \t}, {@code \u0000}, and cut after {@value #SHOWN_CHARS}
   * characters with "…".
   */
  public static String shown(String cell) {
    if (cell == null) {
      return "(nothing)";
    }
    StringBuilder sb = new StringBuilder("'");
    int n = Math.min(cell.length(), SHOWN_CHARS);
    for (int i = 0; i < n; i++) {
      char c = cell.charAt(i);
      switch (c) {
        case '\n' -> sb.append("\\n");
        case '\r' -> sb.append("\\r");
        case '\t' -> sb.append("\\t");
        default -> {
          if (Character.isISOControl(c) || c == '\uFEFF') {
            sb.append(String.format("\\u%04x", (int) c));
          } else {
            sb.append(c);
          }
        }
      }
    }
    if (cell.length() > SHOWN_CHARS) {
      sb.append("…' (").append(cell.length()).append(" characters)");
    } else {
      sb.append('\'');
    }
    return sb.toString();
  }

  private static String compose(Where w, String problem, String fix) {
    StringBuilder sb = new StringBuilder(w.source);
    if (w.line > 0) {
      sb.append(", line ").append(w.line);
    }
    if (w.label != null) {
      sb.append(", ").append(w.label);
    }
    // "…, field 'x' is missing" reads on; "…, line 3: a quote is never closed" needs the colon
    sb.append(PREDICATE.matcher(problem).lookingAt() ? " " : ": ").append(problem);
    if (fix != null && !fix.isEmpty()) {
      sb.append(": ").append(fix);
    }
    return sb.toString();
  }

  /** Where in the input: the thing and file, optionally a line and a field. */
  public static final class Where {
    private static final java.util.regex.Pattern PREDICATE =
      java.util.regex.Pattern.compile("(is|are|does|must|has|holds|cannot) ");
  private final String source;
    private final long line;
    private final String field;
    private final String label;

    private Where(String source, long line, String field) {
      this(source, line, field, field == null ? null : "field '" + field + "'");
    }

    private Where(String source, long line, String field, String label) {
      this.source = source;
      this.line = line;
      this.field = field;
      this.label = label;
    }

    /** @return whether a line is set */
    public boolean hasLine() {
      return line > 0;
    }

    /** @param line 1-based line; 0 for none */
    public Where line(long line) {
      return new Where(source, Math.max(0, line), field, label);
    }

    /** @param field the field name (of a JSON object), or null */
    public Where field(String field) {
      return new Where(source, line, field);
    }

    /**
     * @param oneBased the column's place, from 1
     * @param name the column's name from the header
     */
    public Where column(int oneBased, String name) {
      return new Where(source, line, name, "column " + oneBased + " (" + name + ")");
    }

    /**
     * @param problem what is wrong, not null
     * @param fix what would fix it, or null
     */
    public InputException fault(String problem, String fix) {
      return new InputException(this, Precondition.notNull(problem, "problem"), fix, null);
    }

    /** As {@link #fault(String, String)}, keeping the underlying failure for the log. */
    public InputException fault(String problem, String fix, Throwable cause) {
      return new InputException(this, Precondition.notNull(problem, "problem"), fix, cause);
    }
  }
}
