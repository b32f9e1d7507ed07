package org.loadstone.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.loadstone.archive.StoredRun;
import java.util.concurrent.Callable;
import org.loadstone.intake.ColumnMap;
import org.loadstone.intake.CsvImport;
import org.loadstone.intake.ImportSettings;
import org.loadstone.intake.ImportedRun;
import org.loadstone.archive.RunData;
import org.loadstone.report.CsvExport;
import org.loadstone.units.DurationUnit;
import org.loadstone.units.ForceUnit;
import org.loadstone.units.LengthUnit;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code loadstone import}: reads a force–time or force–displacement CSV from elsewhere. */
@Command(
    name = "import",
    description = {
      "Read a force-time or force-displacement CSV from other software.",
      "Shows what was parsed and stores the run: in the archive when one is connected, or "
          + "with --out as a plain CSV."
    })
public final class ImportCommand implements Callable<Integer> {
  @picocli.CommandLine.Mixin ArchiveOption archive;

  @Parameters(paramLabel = "FILE", description = "The CSV to import.")
  Path file;

  @Option(names = "--map", required = true, paramLabel = "MAP",
      description = "Columns by header name or 1-based number: time, force and, if there is one, position (e.g. time=Time [s],force=Load,position=3).")
  String map;

  @Option(names = "--force-unit", paramLabel = "UNIT", description = "Force unit of the file: N, kN, lbf or kgf (default: from the header, else the config's force-unit, else N).")
  String forceUnit;

  @Option(names = "--length-unit", paramLabel = "UNIT", description = "Length unit of the file: mm, um, cm, m or in (default: from the header, else the config's length-unit, else mm).")
  String lengthUnit;

  @Option(names = "--time-unit", paramLabel = "UNIT", description = "Time unit of the file: s, ms or min (default: from the header, else s).")
  String timeUnit;

  @Option(names = "--decimal", defaultValue = ".", paramLabel = "MARK", description = "Decimal mark of the numbers: '.' or ',' (default: ${DEFAULT-VALUE}).")
  String decimal;

  @Option(names = "--delimiter", paramLabel = "MARK", description = "Field delimiter: ',', ';' or tab (default: detect).")
  String delimiter;

  @Option(names = "--skip-lines", paramLabel = "COUNT", defaultValue = "0", description = "Lines before the header row (default: ${DEFAULT-VALUE}).")
  int skipLines;

  @picocli.CommandLine.Mixin SpecimenOptions specimen;

  @Option(names = "--out", paramLabel = "FILE.csv", description = "Write the run as a plain CSV here instead of storing it in the archive.")
  Path out;

  @Option(names = "--json", description = "Write what was read and where it went as one JSON document on standard output (schema loadstone-import); the text goes to standard error.")
  boolean json;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public Integer call() throws Exception {
    ImportSettings s = ImportSettings.of(ColumnMap.parse(map))
        .withDecimalComma(decimalMark(decimal, "--decimal") == ',').withSkipLines(skipLines)
        .withDelimiter(delimiter == null ? null : ExportCommand.mark(delimiter, "--delimiter"));
    org.loadstone.config.UserConfig config = ConfigDefaults.of(spec);
    String usualForce = config.value(org.loadstone.config.UserConfig.Key.FORCE_UNIT);
    String usualLength = config.value(org.loadstone.config.UserConfig.Key.LENGTH_UNIT);
    s = s.withUsualUnits(usualForce == null ? null : ForceUnit.parse(usualForce),
        usualLength == null ? null : LengthUnit.parse(usualLength));
    if (forceUnit != null) {
      s = s.withForceUnit(ForceUnit.parse(forceUnit));
    }
    if (lengthUnit != null) {
      s = s.withLengthUnit(LengthUnit.parse(lengthUnit));
    }
    if (timeUnit != null) {
      s = s.withTimeUnit(DurationUnit.parse(timeUnit));
    }
    ImportedRun read = CsvImport.read(file, s);
    ImportedRun run = new ImportedRun(org.loadstone.archive.Amendments.withValues(
        read.metadata(), specimen.given()), read.data(), read.delimiter(), read.columns(),
        read.notes());
    RunData d = run.data();
    List<String> warnings = org.loadstone.intake.Plausibility.warnings(run.metadata(), d);
    warnings.forEach(w -> spec.commandLine().getErr().println("warning: " + w));
    spec.commandLine().getErr().flush();
    PrintWriter o = JsonDocument.human(spec, json);
    o.printf(Locale.ROOT, "%s: %d rows, delimiter %s%n", file, d.size(),
        run.delimiter() == '\t' ? "tab" : "'" + run.delimiter() + "'");
    run.columns().forEach(c -> o.println("  " + c));
    double[] t = range(d.time_s());
    double[] f = range(d.force_N());
    o.println("  time " + num(t[0]) + " to " + num(t[1]) + " s, force " + num(f[0]) + " to "
        + num(f[1]) + " N");
    double[] x = d.hasPosition() ? range(d.position_mm()) : null;
    if (x != null) {
      o.println("  position " + num(x[0]) + " to " + num(x[1]) + " mm");
    }
    run.notes().forEach(n -> o.println("note: " + n));
    Map<String, Object> where;
    if (out != null) {
      CsvExport.write(d, out, ',', '.');
      o.println("written to " + out);
      where = new LinkedHashMap<>();
      where.put("run_id", null);
      where.put("csv_file", out.toString());
      where.put("sidecar_file", null);
    } else {
      StoredRun sr = CliWiring.store(run, archive.folder());
      String id = sr.csv().getFileName().toString().replaceFirst("\\.csv$", "");
      o.println("stored in the archive as " + id);
      where = JsonViews.stored(id, sr.csv(), sr.json());
    }
    if (json) {
      Map<String, Object> m = new LinkedHashMap<>(where);
      m.put("source_file", file.toString());
      m.put("sample_count", d.size());
      m.put("delimiter", String.valueOf(run.delimiter()));
      m.put("columns", run.columns());
      m.put("time_range_s", List.of(t[0], t[1]));
      m.put("force_range_N", List.of(f[0], f[1]));
      m.put("position_range_mm", x == null ? null : List.of(x[0], x[1]));
      m.put("notes", run.notes());
      m.put("warnings", warnings);
      JsonDocument.write(spec.commandLine().getOut(), JsonDocument.Kind.IMPORT, m);
    }
    o.flush();
    return 0;
  }

  /** @return the decimal mark given, '.' or ',' */
  static char decimalMark(String text, String option) {
    char c = ExportCommand.mark(text, option);
    if (c != '.' && c != ',') {
      throw new org.loadstone.units.LoadstoneException(option + " '" + text + "' is not a "
          + "decimal mark: give '.' or ','");
    }
    return c;
  }

  private static String num(double v) {
    return new java.math.BigDecimal(v).round(new java.math.MathContext(6)).stripTrailingZeros()
        .toPlainString();
  }

  private static double[] range(double[] v) {
    return new double[] {Arrays.stream(v).min().orElseThrow(), Arrays.stream(v).max().orElseThrow()};
  }
}
