package org.loadstone.intake;

import org.loadstone.archive.FinishCause;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.units.DurationUnit;
import org.loadstone.units.ForceUnit;
import org.loadstone.units.LengthUnit;
import org.loadstone.units.LoadstoneException;

class CsvImportTest {
  @TempDir Path dir;

  private Path file(String name, String text) throws IOException {
    Path p = dir.resolve(name);
    Files.writeString(p, text, StandardCharsets.UTF_8);
    return p;
  }

  @Test
  void decimalCommaSemicolonsKilonewtonsAndMilliseconds() throws IOException {
    // Hand-computed: 250 ms = 0.25 s; 0,125 kN = 125 N; 1,5 kN = 1500 N; 0,2 mm stays 0.2 mm.
    Path p = file("panel-f7.csv", "bench export v2\nspecimen F7\n"
        + "Zeit;Kraft;Weg\n0;0,000;0,00\n100;0,125;0,05\n250;1,5;0,2\n");
    ImportedRun run = CsvImport.read(p, ImportSettings.of(ColumnMap.parse("time=Zeit,force=2,"
        + "position=Weg")).withDecimalComma(true).withSkipLines(2)
        .withForceUnit(ForceUnit.KN).withTimeUnit(DurationUnit.MS));
    assertThat(run.delimiter()).isEqualTo(';');
    assertThat(run.data().time_s()).containsExactly(0.0, 0.1, 0.25);
    assertThat(run.data().force_N()).containsExactly(0.0, 125.0, 1500.0);
    assertThat(run.data().position_mm()).containsExactly(0.0, 0.05, 0.2);
    assertThat(run.data().rawCounts()).containsExactly(0, 0, 0);
    assertThat(run.data().seq()).containsExactly(0, 1, 2);
    assertThat(run.metadata().cause()).isEqualTo(FinishCause.IMPORTED);
    assertThat(run.metadata().specimen()).isEqualTo("panel-f7");
    assertThat(run.notes()).anyMatch(n -> n.contains("No raw data"));
    // mean rate: 2 intervals over 0.25 s = 8 Hz
    assertThat(run.metadata().sampleRate_Hz()).isCloseTo(8.0, within(1e-12));
  }

  @Test
  void unitsFromHeadersTabsAndImperialUnits() throws IOException {
    // 1 lbf = 4.4482216152605 N, 1 in = 25.4 mm exactly (NIST SP 811, appendix B);
    // 0.5 min = 30 s; time shifted to start at 0.
    Path p = file("tab.txt", "Time (min)\tLoad [lbf]\tStroke [in]\n1\t0\t0\n1.5\t10\t0.1\n");
    ImportedRun run = CsvImport.read(p, ImportSettings.of(ColumnMap.parse(
        "time=Time (min),force=Load [lbf],position=3")));
    assertThat(run.delimiter()).isEqualTo('\t');
    assertThat(run.data().time_s()[1]).isCloseTo(30.0, within(1e-12));
    assertThat(run.data().force_N()[1]).isCloseTo(44.482216152605, within(1e-12));
    assertThat(run.data().position_mm()[1]).isCloseTo(2.54, within(1e-12));
    assertThat(run.notes()).anyMatch(n -> n.contains("shifted"));
  }

  @Test
  void plainReadsARunCsvWithAndWithoutPosition() throws IOException {
    Path with = file("r1.csv", "time_s,force_N,position_mm,raw_counts,raw_position,seq\n"
        + "0,1.5,0.0,12,0,7\n0.0125,2.5,0.01,20,4,8\n");
    ImportedRun a = CsvImport.plain(with);
    assertThat(a.data().force_N()).containsExactly(1.5, 2.5);
    assertThat(a.data().position_mm()).containsExactly(0.0, 0.01);
    // a run file's raw columns are kept: raw is truth
    assertThat(a.data().rawCounts()).containsExactly(12, 20);
    assertThat(a.data().rawPosition()).containsExactly(0, 4);
    assertThat(a.data().seq()).containsExactly(7, 8);
    Path without = file("r2.csv", "time_s,force_N,position_mm\n0,1,\n1,2,\n");
    assertThat(CsvImport.plain(without).data().hasPosition()).isFalse();
    Path noColumn = file("r3.csv", "time_s,force_N\n0,1\n1,2\n");
    assertThat(CsvImport.plain(noColumn).data().hasPosition()).isFalse();
  }

  @Test
  void noHeaderRowWhenMappedByNumber() throws IOException {
    Path p = file("bare.csv", "0,5\n0.5,7\n1.0,9\n");
    ImportedRun run = CsvImport.read(p, ImportSettings.of(ColumnMap.parse("time=1,force=2")));
    assertThat(run.data().size()).isEqualTo(3);
    assertThat(run.data().hasPosition()).isFalse();
  }

  @Test
  void unknownUnitInTheHeaderNamesFileLineAndColumn() throws IOException {
    Path p = file("k.csv", "t [s],F [kips]\n0,1\n1,2\n");
    assertThatThrownBy(() -> CsvImport.read(p, ImportSettings.of(ColumnMap.parse(
        "time=1,force=2"))))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("k.csv line 1 column 'F [kips]'")
        .hasMessageContaining("unknown force unit 'kips'")
        .hasMessageContaining("Give the force unit of the file")
        .satisfies(e -> assertThat(((LoadstoneException) e).settings())
            .containsExactly(org.loadstone.units.Setting.IMPORT_FORCE_UNIT));
    assertThatThrownBy(() -> LengthUnit.parse("furlong"))
        .hasMessageContaining("use one of mm, um, cm, m, in");
    assertThatThrownBy(() -> DurationUnit.parse("hours"))
        .hasMessageContaining("use one of s, ms, min");
  }

  @Test
  void missingAndNanCells() throws IOException {
    Path empty = file("e.csv", "time_s,force_N\n0,1\n1,\n2,3\n");
    assertThatThrownBy(() -> CsvImport.plain(empty))
        .hasMessageContaining("e.csv line 3 column 'force_N': the cell is empty");
    Path shortRow = file("s.csv", "time_s,force_N\n0,1\n1\n");
    assertThatThrownBy(() -> CsvImport.plain(shortRow))
        .hasMessageContaining("s.csv line 3 column 'force_N': the cell is empty");
    Path nan = file("n.csv", "time_s,force_N\n0,1\n\n1,NaN\n");
    assertThatThrownBy(() -> CsvImport.plain(nan))
        .hasMessageContaining("n.csv line 4 column 'force_N': the cell holds 'NaN'");
  }

  @Test
  void textThatIsNotANumber() throws IOException {
    Path p = file("x.csv", "time_s,force_N\n0,1\n1,12 N\n");
    assertThatThrownBy(() -> CsvImport.plain(p))
        .hasMessageContaining("x.csv line 3 column 'force_N': '12 N' is not a number");
    Path comma = file("c.csv", "t;F\n0;1,5\n1;2,5\n");
    assertThatThrownBy(() -> CsvImport.read(comma, ImportSettings.of(ColumnMap.parse(
        "time=t,force=F"))))
        .hasMessageContaining("'1,5' is not a number")
        .hasMessageContaining("read it with a decimal comma")
        .satisfies(e -> assertThat(((LoadstoneException) e).settings())
            .containsExactly(org.loadstone.units.Setting.IMPORT_DECIMAL_COMMA));
  }

  @Test
  void timeThatDoesNotIncrease() throws IOException {
    Path p = file("m.csv", "time_s,force_N\n0,1\n0.2,2\n0.1,3\n");
    assertThatThrownBy(() -> CsvImport.plain(p))
        .hasMessageContaining("m.csv line 4 column 'time_s': time 0.1 s does not come after "
            + "0.2 s on line 3");
  }

  @Test
  void lineNumbersCountCrLfAndPreambleLines() throws IOException {
    Path p = file("crlf.csv", "exported 2026-11-30\r\n\r\nt;F\r\n0;1\r\n1;2\r\n1;3\r\n");
    assertThatThrownBy(() -> CsvImport.read(p, ImportSettings.of(ColumnMap.parse("time=t,force=F"))
        .withSkipLines(2).withDelimiter(';')))
        .hasMessageContaining("crlf.csv line 6 column 't': time 1.0 s does not come after 1.0 s "
            + "on line 5");
  }

  @Test
  void aGivenUnitOverridesTheHeaderWithANote() throws IOException {
    Path p = file("u.csv", "t [s],F [kN]\n0,1\n1,2\n");
    ImportedRun r = CsvImport.read(p, ImportSettings.of(ColumnMap.parse("time=1,force=2"))
        .withForceUnit(ForceUnit.N));
    assertThat(r.data().force_N()).containsExactly(1.0, 2.0);
    assertThat(r.notes()).anyMatch(n -> n.contains("header says 'kN'"));
  }

  @Test
  void aSingleRowIsNotARun() throws IOException {
    Path p = file("one.csv", "time_s,force_N\n0,1\n");
    assertThatThrownBy(() -> CsvImport.plain(p))
        .hasMessageContaining("one.csv has 1 data row(s); a run needs at least 2");
  }

  @Test
  void missingColumnAndBadMap() throws IOException {
    Path p = file("h.csv", "Time,Load\n0,1\n1,2\n");
    assertThatThrownBy(() -> CsvImport.read(p, ImportSettings.of(ColumnMap.parse(
        "time=Time,force=Kraft"))))
        .hasMessageContaining("h.csv line 1 has no column named 'Kraft'")
        .hasMessageContaining("[Time, Load]");
    assertThatThrownBy(() -> CsvImport.read(p, ImportSettings.of(ColumnMap.parse(
        "time=1,force=5"))))
        .hasMessageContaining("column number 5 does not exist");
    assertThatThrownBy(() -> ColumnMap.parse("time=Time,load=Load"))
        .hasMessageContaining("'load=Load'");
    assertThatThrownBy(() -> ImportSettings.of(ColumnMap.PLAIN).withDecimalComma(true)
        .withDelimiter(',')).hasMessageContaining("both ','");
  }
}
