package org.loadstone.archive;

import java.io.IOException;
import java.io.Reader;
import java.io.UncheckedIOException;
import java.io.OutputStream;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.regex.Pattern;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.loadstone.units.CsvInput;
import org.loadstone.units.InputException;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.TextFiles;

/**
 * The sample file: RFC 4180 CSV with the header {@value #HEADER_TEXT} and "\n" line ends.
 *
 * <p>Numbers are written with {@link Double#toString(double)}: locale-independent, and the
 * shortest decimal that reads back as the very same double (Java SE {@code Double.toString}
 * contract), so a stored run re-reads bit for bit; raw counts and seq are plain integers.
 * Position cells are empty when the device has no position channel.
 */
final class RunCsv {
  static final List<String> HEADER =
      List.of("time_s", "force_N", "position_mm", "raw_counts", "raw_position", "seq");
  static final String HEADER_TEXT = "time_s,force_N,position_mm,raw_counts,raw_position,seq";
  private static final Pattern DECIMAL =
      Pattern.compile("[-+]?(?:[0-9]+\\.?[0-9]*|\\.[0-9]+)(?:[eE][-+]?[0-9]+)?");
  private static final Pattern INTEGER = Pattern.compile("[-+]?[0-9]{1,10}");
  private static final CSVFormat READ = CSVFormat.DEFAULT.builder().setHeader()
      .setSkipHeaderRecord(true).setIgnoreEmptyLines(false).get();

  private RunCsv() {}

  static void write(RunData d, OutputStream out, String runId) throws IOException {
    LineWriter w = new LineWriter(out, runId);
    boolean pos = d.hasPosition();
    for (int i = 0; i < d.size(); i++) {
      w.line(d.time_s()[i], d.force_N()[i], pos, pos ? d.position_mm()[i] : 0,
          d.rawCounts()[i], pos ? d.rawPosition()[i] : 0, d.seq()[i]);
    }
    w.flush();
  }

  /** Checks what a reader would refuse, before anything is written. */
  static void check(RunData d, String runId) {
    for (int i = 0; i < d.size(); i++) {
      checkSample(i, d.time_s()[i], i > 0 ? d.time_s()[i - 1] : Double.NaN, d.force_N()[i],
          d.hasPosition(), d.hasPosition() ? d.position_mm()[i] : 0, d.seq()[i], runId);
    }
  }

  private static void checkSample(int i, double t, double prevT, double f, boolean pos, double p,
      int s, String runId) {
    finite(t, "time_s", i, runId);
    finite(f, "force_N", i, runId);
    if (pos) {
      finite(p, "position_mm", i, runId);
    }
    if (i > 0 && !(t > prevT)) {
      throw new LoadstoneException("run " + runId + ": time_s of sample " + i + " (" + t
          + " s) is not after the previous sample's (" + prevT + " s): the run was not stored;"
          + " rebuild the samples from the journal");
    }
    if (s < 0 || s > 0xFFFF) {
      throw new IllegalArgumentException("seq of sample " + i + " must be 0…65535, was " + s);
    }
  }

  /**
   * Writes the sample file line by line, the header first, checking each sample as {@link
   * #check} does; numbers as {@link Double#toString(double)} and {@link Integer#toString(int)},
   * empty position cells without a position channel. No cell ever needs quotes, so the lines
   * are the RFC 4180 lines Commons CSV would print. Holds one buffer, whatever the run's length.
   */
  static final class LineWriter {
    private final OutputStream out;
    private final String runId;
    private final byte[] buf = new byte[1 << 16];
    private final StringBuilder sb = new StringBuilder(160);
    private int used;
    private int i;
    private double prevT = Double.NaN;

    LineWriter(OutputStream out, String runId) throws IOException {
      this.out = out;
      this.runId = runId;
      sb.append(HEADER_TEXT).append('\n');
      put();
    }

    /** Appends one sample; position values are ignored when {@code pos} is false. */
    void line(double t, double f, boolean pos, double p, int k, int rp, int s) throws IOException {
      checkSample(i, t, prevT, f, pos, p, s, runId);
      sb.setLength(0);
      sb.append(Double.toString(t)).append(',').append(Double.toString(f)).append(',');
      if (pos) {
        sb.append(Double.toString(p));
      }
      sb.append(',').append(k).append(',');
      if (pos) {
        sb.append(rp);
      }
      sb.append(',').append(s).append('\n');
      put();
      prevT = t;
      i++;
    }

    private void put() throws IOException {
      int n = sb.length();
      if (used + n > buf.length) {
        out.write(buf, 0, used);
        used = 0;
      }
      for (int j = 0; j < n; j++) {
        buf[used++] = (byte) sb.charAt(j); // ASCII only: digits, signs, '.', 'E', ','
      }
    }

    /** Writes what is buffered. */
    void flush() throws IOException {
      out.write(buf, 0, used);
      used = 0;
      out.flush();
    }
  }

  private static void finite(double v, String col, int i, String runId) {
    if (!Double.isFinite(v)) {
      throw new LoadstoneException("run " + runId + ": " + col + " of sample " + i + " is " + v
          + ": the run was not stored; check the scale (calibration) that produced it");
    }
  }

  static RunData read(Reader in, Path file) {
    try (CSVParser parser = CSVParser.builder().setReader(in).setFormat(READ).get()) {
      Map<String, Integer> cols = parser.getHeaderMap();
      for (String need : List.of("time_s", "force_N", "raw_counts", "seq")) {
        if (!cols.containsKey(need)) {
          throw new LoadstoneException("run file " + file + ", line 1: column '" + need
              + "' is missing (header is " + InputException.shown(String.join(",", parser.getHeaderNames())) + "): the file must start"
              + " with " + HEADER_TEXT + "; restore it from a backup if it was damaged");
        }
      }
      boolean posCols = cols.containsKey("position_mm") && cols.containsKey("raw_position");
      Columns c = new Columns();
      Boolean hasPos = null;
      double prevT = Double.NaN;
      for (CSVRecord r : parser) {
        // empty lines are records too (ignoreEmptyLines off), so record numbers stay line numbers
        long line = r.getRecordNumber() + 1;
        if (r.size() == 1 && r.get(0).isEmpty() && cols.size() > 1) {
          continue;
        }
        if (!r.isConsistent()) {
          throw new LoadstoneException("run file " + file + ", line " + line + ": " + r.size()
              + " cells where the header has " + cols.size() + " (column " + (r.size() + 1)
              + " missing or extra cells): every line needs a cell for every column, empty"
              + " position cells included; a line cut short means the file was damaged or"
              + " copied in part: restore it from a backup");
        }
        Cell at = new Cell(file, line, cols, r);
        double t = at.decimal("time_s");
        if (c.n > 0 && !(t > prevT)) {
          throw at.bad("time_s", "time " + t + " s is not after the previous line's " + prevT
              + " s: samples must be in time order; restore the file from its journal or backup");
        }
        prevT = t;
        double f = at.decimal("force_N");
        int k = at.integer("raw_counts");
        int s = at.integer("seq");
        if (s < 0 || s > 0xFFFF) {
          throw at.bad("seq", "seq must be 0…65535, was " + s);
        }
        boolean rowPos = posCols && !r.get("position_mm").isEmpty();
        if (hasPos == null) {
          hasPos = rowPos;
        } else if (hasPos != rowPos) {
          throw at.bad("position_mm", "position is " + (rowPos ? "present" : "empty")
              + " here but " + (hasPos ? "present" : "empty") + " on earlier lines: a run has"
              + " position on every line or on none");
        }
        double p = 0;
        int rp = 0;
        if (rowPos) {
          p = at.decimal("position_mm");
          rp = at.integer("raw_position");
        } else if (posCols && !r.get("raw_position").isEmpty()) {
          throw at.bad("position_mm", "empty while raw_position is not: fill both or neither");
        }
        c.add(t, f, p, k, rp, s);
      }
      return c.toData(hasPos != null && hasPos);
    } catch (IOException e) {
      throw TextFiles.unreadable(file, "run file", e);
    } catch (UncheckedIOException | IllegalStateException | IllegalArgumentException e) {
      throw CsvInput.translate(e, InputException.in("run file", file),
          "correct the file or restore it from a backup");
    }
  }

  /** One line's cells, parsed with messages that name file, line and column. */
  private record Cell(Path file, long line, Map<String, Integer> cols, CSVRecord r) {
    LoadstoneException bad(String col, String what) {
      return InputException.in("run file", file).line(line).column(cols.get(col) + 1, col)
          .fault(what, null);
    }

    double decimal(String col) {
      String v = r.get(col).trim();
      if (v.isEmpty()) {
        throw bad(col, "the cell is empty: every sample needs a " + col + " value");
      }
      if (!DECIMAL.matcher(v).matches()) {
        throw bad(col, InputException.shown(v) + " is not a number (NaN and infinity are refused): correct"
            + " the cell or restore the file");
      }
      double d = Double.parseDouble(v);
      if (!Double.isFinite(d)) {
        throw bad(col, InputException.shown(v) + " is out of range: correct the cell");
      }
      return d;
    }

    int integer(String col) {
      String v = r.get(col).trim();
      if (v.isEmpty()) {
        throw bad(col, "the cell is empty: every sample needs a " + col + " value");
      }
      if (!INTEGER.matcher(v).matches()) {
        throw bad(col, InputException.shown(v) + " is not a whole number: raw values are integers as the"
            + " device sent them");
      }
      long x = Long.parseLong(v);
      if (x < Integer.MIN_VALUE || x > Integer.MAX_VALUE) {
        throw bad(col, InputException.shown(v) + " is outside the 32-bit range of raw values");
      }
      return (int) x;
    }
  }

  /** Growable columns. */
  private static final class Columns {
    double[] t = new double[1024];
    double[] f = new double[1024];
    double[] p = new double[1024];
    int[] k = new int[1024];
    int[] rp = new int[1024];
    int[] s = new int[1024];
    int n;

    void add(double tv, double fv, double pv, int kv, int rpv, int sv) {
      if (n == t.length) {
        int m = n * 2;
        t = Arrays.copyOf(t, m);
        f = Arrays.copyOf(f, m);
        p = Arrays.copyOf(p, m);
        k = Arrays.copyOf(k, m);
        rp = Arrays.copyOf(rp, m);
        s = Arrays.copyOf(s, m);
      }
      t[n] = tv;
      f[n] = fv;
      p[n] = pv;
      k[n] = kv;
      rp[n] = rpv;
      s[n] = sv;
      n++;
    }

    RunData toData(boolean pos) {
      return new RunData(Arrays.copyOf(t, n), Arrays.copyOf(f, n),
          pos ? Arrays.copyOf(p, n) : null, Arrays.copyOf(k, n), pos ? Arrays.copyOf(rp, n) : null,
          Arrays.copyOf(s, n));
    }
  }
}
