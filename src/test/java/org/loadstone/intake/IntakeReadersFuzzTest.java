package org.loadstone.intake;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.Size;
import net.jqwik.api.lifecycle.AfterContainer;
import net.jqwik.api.lifecycle.BeforeContainer;
import org.loadstone.analysis.position.PositionTable;
import org.loadstone.units.DurationUnit;
import org.loadstone.units.ForceUnit;
import org.loadstone.units.Fuzz;
import org.loadstone.units.LengthUnit;

/**
 * Fuzzing of the readers of data from elsewhere, the CSV import and the position table, with
 * damaged copies of files in the shapes labs send (a spreadsheet export with a decimal comma,
 * semicolons, kN and ms under two title lines; a tab-separated file stating its units; a plain
 * comma file; a video-tracking table) and random bytes: a run or table whose every number is
 * finite and whose time runs forward, or the project's own exception with a plain message.
 */
class IntakeReadersFuzzTest {
  private static Path dir;

  /** A file and the settings it is read with. */
  private record Shape(byte[] text, ImportSettings settings) {}

  private static final Shape[] IMPORTS = {
    new Shape(utf8("bench export v2\nspecimen F7\nZeit;Kraft;Weg\n0;0,000;0,00\n100;0,125;0,05\n"
        + "250;1,5;0,2\n400;2,25;0,31\n550;1,1;0,4\n"),
        ImportSettings.of(ColumnMap.parse("time=Zeit,force=2,position=Weg"))
            .withDecimalComma(true).withSkipLines(2).withForceUnit(ForceUnit.KN)
            .withTimeUnit(DurationUnit.MS)),
    new Shape(utf8("Time (min)\tLoad [lbf]\tStroke [in]\n1\t0\t0\n1.5\t10\t0.1\n2\t22.5\t0.2\n"
        + "2.5\t3\t0.25\n"),
        ImportSettings.of(ColumnMap.parse("time=Time (min),force=Load [lbf],position=3"))),
    new Shape(utf8("time_s,force_N,position_mm\n0,0.1,0\n0.1,5.2,0.01\n0.2,9.8,0.02\n"
        + "0.3,14.1,0.03\n0.4,2.0,0.04\n"), ImportSettings.of(ColumnMap.PLAIN)
            .withForceUnit(ForceUnit.N).withLengthUnit(LengthUnit.MM)
            .withTimeUnit(DurationUnit.S))};

  private static final byte[] TABLE = utf8("frame_time_s,crosshead_mm\n0.000,0.00\n0.033,0.02\n"
      + "0.067,0.05\n0.100,0.07\n0.133,0.10\n0.167,0.12\n0.200,0.15\n");

  @BeforeContainer
  static void corpus() {
    dir = Fuzz.tempDir("intake");
  }

  @AfterContainer
  static void clean() {
    Fuzz.delete(dir);
  }

  private static byte[] utf8(String s) {
    return s.getBytes(StandardCharsets.UTF_8);
  }

  @Property(tries = 200, seed = "140621")
  void importGivesAFiniteForwardRunOrARefusal(@ForAll long seed,
      @ForAll @IntRange(min = 0, max = 2) int shape) {
    Shape s = IMPORTS[shape];
    Fuzz.eachCopy(s.text(), seed, dir.resolve("import.csv"), f -> {
      ImportedRun run = Fuzz.readOrRefuse(() -> CsvImport.read(f, s.settings()));
      if (run != null) {
        double[] t = run.data().time_s();
        for (int i = 0; i < t.length; i++) {
          assertThat(t[i]).isFinite();
          assertThat(run.data().force_N()[i]).isFinite();
          if (i > 0) {
            assertThat(t[i]).isGreaterThanOrEqualTo(t[i - 1]);
          }
        }
      }
      Fuzz.readOrRefuse(() -> CsvImport.plain(f));
    });
  }

  @Property(tries = 200, seed = "140622")
  void positionTableGivesFiniteRowsOrARefusal(@ForAll long seed, @ForAll boolean byName) {
    Fuzz.eachCopy(TABLE, seed, dir.resolve("table.csv"), f -> {
      PositionTable t = Fuzz.readOrRefuse(() -> PositionTableCsv.read(f,
          byName ? "frame_time_s" : "1", byName ? "crosshead_mm" : "2", DurationUnit.S,
          LengthUnit.MM, false));
      if (t != null) {
        assertThat(java.util.Arrays.stream(t.time_s()).allMatch(Double::isFinite)).isTrue();
        assertThat(java.util.Arrays.stream(t.position_mm()).allMatch(Double::isFinite)).isTrue();
      }
    });
  }

  @Property(tries = 60, seed = "140623")
  void randomBytesAreRefusedByEveryIntakeReader(@ForAll @Size(max = 600) byte[] noise,
      @ForAll boolean decimalComma) {
    Path f = Fuzz.write(dir.resolve("noise.csv"), noise);
    Fuzz.readOrRefuse(() -> CsvImport.plain(f));
    Fuzz.readOrRefuse(() -> CsvImport.read(f, IMPORTS[0].settings()));
    Fuzz.readOrRefuse(() -> PositionTableCsv.read(f, "1", "2", DurationUnit.S, LengthUnit.MM,
        decimalComma));
  }
}
