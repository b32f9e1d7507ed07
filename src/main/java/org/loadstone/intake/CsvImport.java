package org.loadstone.intake;

import org.loadstone.archive.FinishCause;
import org.loadstone.archive.Geometry;
import org.loadstone.archive.RunData;
import org.loadstone.archive.RunMetadata;
import org.loadstone.archive.ScaleSpec;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Iterator;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.loadstone.units.DurationUnit;
import org.loadstone.units.ForceUnit;
import org.loadstone.units.LengthUnit;
import org.loadstone.units.CsvInput;
import org.loadstone.units.InputException;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Setting;
import org.loadstone.units.Precondition;
import org.loadstone.units.TextFiles;

/**
 * Reads force–time or force–displacement CSV files written elsewhere into {@link RunData}.
 *
 * <p>Every refusal is a {@link LoadstoneException} naming the file, the line (1-based, counted
 * in the whole file) and the column, with the fix: unknown unit, empty or NaN cell, text that is
 * not a number, time that does not increase, fewer than 2 data rows, missing column. This class
 * reads the rows into a run; the layout (delimiter, columns, units) is {@link ImportColumns}',
 * the cells {@link ImportCells}'.
 */
public final class CsvImport {
  private CsvImport() {}

  /**
   * Reads a CSV with columns {@code time_s, force_N} and optionally {@code position_mm} (other
   * columns are ignored), as written for every Loadstone run and by {@code CsvExport} with the
   * default marks. The delimiter is detected; numbers use a decimal point, or either mark when
   * the delimiter is ';' or tab (as {@code CsvExport} writes for spreadsheets). A position column
   * with only empty cells means the run has no position.
   *
   * @param file the CSV, not null
   * @return the run with partial metadata
   * @throws LoadstoneException when the file cannot be read or a value is refused
   */
  public static ImportedRun plain(Path file) {
    ImportSettings s = ImportSettings.of(ColumnMap.PLAIN).withForceUnit(ForceUnit.N)
        .withLengthUnit(LengthUnit.MM).withTimeUnit(DurationUnit.S);
    return read(file, s, true);
  }

  /**
   * Reads a foreign CSV.
   *
   * @param file the CSV, not null
   * @param settings column map, units, delimiter, decimal mark, lines to skip; not null
   * @return the run in seconds, newtons and millimetres, time shifted to start at 0
   * @throws LoadstoneException when the file cannot be read or a value is refused
   */
  public static ImportedRun read(Path file, ImportSettings settings) {
    return read(file, settings, false);
  }

  private static ImportedRun read(Path file, ImportSettings s, boolean plain) {
    Precondition.notNull(file, "file");
    Precondition.notNull(s, "settings");
    String name = file.getFileName().toString();
    String text = readText(file);
    int[] lineStarts = lineStarts(text);
    if (s.skipLines() >= lineStarts.length) {
      throw new LoadstoneException("File " + name + " has " + lineStarts.length + " line(s) but "
          + s.skipLines() + " are to be skipped before the header; lower the skip count.");
    }
    int bodyStart = lineStarts[s.skipLines()];
    String body = text.substring(bodyStart);
    char delim = s.delimiter() != null ? s.delimiter()
        : ImportColumns.delimiter(body, s.decimalComma(), name, s.skipLines() + 1);
    // a plain file separated by ';' or tab may use either decimal mark (a spreadsheet export)
    boolean decimalComma = s.decimalComma() || (plain && delim != ',');
    List<String> notes = new ArrayList<>();
    CSVFormat fmt = CSVFormat.DEFAULT.builder().setDelimiter(delim).setIgnoreEmptyLines(true)
        .setTrim(true).build();
    List<String[]> rows = new ArrayList<>();
    List<Integer> rowLines = new ArrayList<>();
    List<String> header;
    int headerLine;
    try (CSVParser p = CSVParser.parse(body, fmt)) {
      Iterator<CSVRecord> it = p.iterator();
      if (!it.hasNext()) {
        throw new LoadstoneException("File " + name + " has no rows after line " + s.skipLines()
            + "; check the skip count and that the file is a CSV.");
      }
      CSVRecord h = it.next();
      headerLine = lineOf(text, lineStarts, bodyStart + (int) h.getCharacterPosition());
      header = h.toList();
      while (it.hasNext()) {
        CSVRecord r = it.next();
        rows.add(r.toList().toArray(new String[0]));
        rowLines.add(lineOf(text, lineStarts, bodyStart + (int) r.getCharacterPosition()));
      }
    } catch (IOException | UncheckedIOException | IllegalStateException
        | IllegalArgumentException e) {
      throw CsvInput.translate(e, InputException.in("import file", file),
          "check quotes and the delimiter");
    }
    int ti = ImportColumns.column(s.columns().time(), header, name, headerLine, false);
    int fi = ImportColumns.column(s.columns().force(), header, name, headerLine, false);
    int pi = s.columns().position() == null ? -1
        : ImportColumns.column(s.columns().position(), header, name, headerLine, plain);
    if (ImportColumns.isIndex(s.columns().time()) && ImportColumns.isIndex(s.columns().force())
        && ImportColumns.numeric(header, ti, decimalComma)
        && ImportColumns.numeric(header, fi, decimalComma)) {
      rows.add(0, header.toArray(new String[0])); // no header row: the first line is data
      rowLines.add(0, headerLine);
      header = null;
      notes.add("No header row: the first line was read as data.");
    }
    if (pi >= 0 && plain && ImportColumns.allBlank(rows, pi)) {
      pi = -1;
      notes.add("The position column is empty: the run has no position.");
    }
    if (rows.size() < 2) {
      throw new LoadstoneException("File " + name + " has " + rows.size() + " data row(s); a run "
          + "needs at least 2. Check the skip count and that the whole file was saved.");
    }
    DurationUnit tu = ImportColumns.unit(s.timeUnit(), header, ti, "time", DurationUnit.S,
        DurationUnit::parse, DurationUnit::symbol, name, headerLine, notes,
        Setting.IMPORT_TIME_UNIT);
    ForceUnit fu = ImportColumns.unit(s.forceUnit(), header, fi, "force",
        s.usualForceUnit() != null ? s.usualForceUnit() : ForceUnit.N,
        ForceUnit::parse, ForceUnit::symbol, name, headerLine, notes, Setting.IMPORT_FORCE_UNIT);
    LengthUnit lu = pi < 0 ? null : ImportColumns.unit(s.lengthUnit(), header, pi, "position",
        s.usualLengthUnit() != null ? s.usualLengthUnit() : LengthUnit.MM, LengthUnit::parse,
        LengthUnit::symbol, name, headerLine, notes,
        Setting.IMPORT_LENGTH_UNIT);

    int n = rows.size();
    double[] t = new double[n];
    double[] f = new double[n];
    double[] x = pi < 0 ? null : new double[n];
    ImportCells c = new ImportCells(name, header, decimalComma);
    for (int i = 0; i < n; i++) {
      String[] row = rows.get(i);
      int line = rowLines.get(i);
      t[i] = tu.toSeconds(c.number(row, ti, line));
      f[i] = fu.toNewtons(c.number(row, fi, line));
      if (x != null) {
        x[i] = lu.toMm(c.number(row, pi, line));
      }
      if (i > 0 && !(t[i] > t[i - 1])) {
        throw new LoadstoneException(String.format(Locale.ROOT,
            "File %s line %d column %s: time %s s does not come after %s s on line %d. Time must "
                + "strictly increase; remove repeated or out-of-order rows, or map the right "
                + "column as time.", name, line, c.label(ti), t[i], t[i - 1], rowLines.get(i - 1)));
      }
    }
    double t0 = t[0];
    if (t0 != 0) {
      for (int i = 0; i < n; i++) {
        t[i] -= t0;
      }
      notes.add(String.format(Locale.ROOT, "Time shifted by %.6g s to start at 0.", -t0));
    }
    RunData data = plain && header != null
        ? withRaw(t, f, x, rows, rowLines, header, c, notes)
        : null;
    if (data == null) {
      notes.add("No raw data: raw counts are 0 and seq is the row index.");
      int[] seq = new int[n];
      Arrays.setAll(seq, i -> i);
      data = new RunData(t, f, x, new int[n], x == null ? null : new int[n], seq);
    }
    List<String> cols = new ArrayList<>();
    cols.add(describe("time", c.label(ti), ti, tu.symbol()));
    cols.add(describe("force", c.label(fi), fi, fu.symbol()));
    if (pi >= 0) {
      cols.add(describe("position", c.label(pi), pi, lu.symbol()));
    }
    boolean raw = notes.stream().anyMatch(x2 -> x2.startsWith("Raw counts"));
    return new ImportedRun(metadata(file, name, data, cols, raw), data, delim, cols, notes);
  }

  /** A run CSV's own raw columns, kept when present (raw is truth); null when absent. */
  private static RunData withRaw(double[] t, double[] f, double[] x, List<String[]> rows,
      List<Integer> lines, List<String> header, ImportCells c, List<String> notes) {
    int rc = ImportColumns.column("raw_counts", header, "", 0, true);
    int sq = ImportColumns.column("seq", header, "", 0, true);
    int rp = x == null ? -1 : ImportColumns.column("raw_position", header, "", 0, true);
    if (rc < 0 || sq < 0 || (x != null && rp < 0)) {
      return null;
    }
    int n = rows.size();
    int[] raw = new int[n];
    int[] seq = new int[n];
    int[] rawPos = x == null ? null : new int[n];
    for (int i = 0; i < n; i++) {
      raw[i] = c.integer(rows.get(i), rc, lines.get(i));
      seq[i] = c.integer(rows.get(i), sq, lines.get(i));
      if (rawPos != null) {
        rawPos[i] = c.integer(rows.get(i), rp, lines.get(i));
      }
    }
    notes.add("Raw counts and sequence numbers read from the file.");
    return new RunData(t, f, x, raw, rawPos, seq);
  }

  private static String describe(String role, String label, int index, String unit) {
    return role + ": " + label + " (column " + (index + 1) + ") in " + unit;
  }

  private static RunMetadata metadata(Path file, String name, RunData d, List<String> cols,
      boolean raw) {
    String stem = name.contains(".") ? name.substring(0, name.lastIndexOf('.')) : name;
    Instant started;
    try {
      started = Files.getLastModifiedTime(file).toInstant();
    } catch (IOException e) {
      started = Instant.EPOCH;
    }
    double span = d.time_s()[d.size() - 1] - d.time_s()[0];
    double rate = (d.size() - 1) / span;
    String version = org.loadstone.units.SoftwareVersion.get();
    return RunMetadata.builder()
        .runId("import-" + stem.replaceAll("[^A-Za-z0-9._-]", "_"))
        .startedAt(started)
        .specimen(stem)
        .group("")
        .tags(List.of("imported"))
        .operator("")
        .notes("Imported from " + name + ".")
        .geometry(Geometry.NONE)
        .device(Map.of("source", name))
        .sampleRate_Hz(rate)
        .scale("imported: force read from " + name + (raw ? "" : ", no raw counts"))
        .scaleSpec(new ScaleSpec("imported", List.of(0.0), null, null))
        .zeroOffset_counts(0)
        .dropped(0)
        .checksumErrors(0)
        .cause(FinishCause.IMPORTED)
        .pretrigger_s(0)
        .warnings(raw ? List.of() : List.of("No raw data: raw counts are 0."))
        .softwareVersion(version == null ? "dev" : version)
        .extra(Map.of("import_columns", String.join("; ", cols)))
        .build();
  }

  private static String readText(Path file) {
    return TextFiles.read(file, "import file");
  }

  private static int[] lineStarts(String text) {
    List<Integer> starts = new ArrayList<>();
    starts.add(0);
    for (int i = 0; i < text.length(); i++) {
      char ch = text.charAt(i);
      if (ch == '\n' || (ch == '\r' && (i + 1 >= text.length() || text.charAt(i + 1) != '\n'))) {
        if (i + 1 < text.length()) {
          starts.add(i + 1);
        }
      }
    }
    return starts.stream().mapToInt(Integer::intValue).toArray();
  }

  /** @return the 1-based line holding a character offset */
  private static int lineOf(String text, int[] starts, int offset) {
    // the parser reports where it started looking, before any empty lines it skipped
    while (offset < text.length() && (text.charAt(offset) == '\n' || text.charAt(offset) == '\r')) {
      offset++;
    }
    int k = Arrays.binarySearch(starts, offset);
    return (k >= 0 ? k : -k - 2) + 1;
  }
}
