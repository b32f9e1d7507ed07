package org.loadstone.archive;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.study.RunMetrics;
import org.loadstone.units.LoadstoneException;

/** The fast sample reader against the strict reference reader (Commons CSV + cell checks). */
class RunCsvFastTest {
  static final Path DEMO =
      Path.of(System.getProperty("loadstone.projectDir", "."), "sample-runs");

  @TempDir Path tmp;

  private static List<Path> demoCsvs() throws IOException {
    List<Path> out = new ArrayList<>();
    try (DirectoryStream<Path> ds = Files.newDirectoryStream(DEMO, "*.csv")) {
      ds.forEach(out::add);
    }
    return out;
  }

  @Test
  void everyDemoRunReadsFastAndEqualsTheStrictReader() throws IOException {
    List<Path> csvs = demoCsvs();
    assertThat(csvs).hasSizeGreaterThan(10);
    for (Path csv : csvs) {
      RunData fast = RunCsvFast.read(csv);
      assertThat(fast).as("%s is in the writer's own format", csv).isNotNull();
      RunRoundTripTest.assertSameData(RunReader.readStrict(csv), fast);
    }
  }

  @Test
  void figuresFromTheFastReadEqualThoseFromTheStrictRead() throws IOException {
    List<Path> csvs = new ArrayList<>(demoCsvs());
    RunData bend = TestRuns.bend(180, 420);
    RunWriter.write(tmp, RunFixtures.fullMetadata("bend-pos"), bend);
    RunWriter.write(tmp, RunFixtures.fullMetadata("bend-nopos"), new RunData(bend.time_s(),
        bend.force_N(), null, bend.rawCounts(), null, bend.seq()));
    csvs.add(tmp.resolve("bend-pos.csv"));
    csvs.add(tmp.resolve("bend-nopos.csv"));
    for (Path csv : csvs) {
      RunMetadata m = RunReader.read(csv).metadata();
      Map<String, Object> viaFast = RunMetrics.of(m, RunCsvFast.read(csv)).toJsonMap();
      Map<String, Object> viaStrict = RunMetrics.of(m, RunReader.readStrict(csv)).toJsonMap();
      assertThat(viaFast).as(csv.toString()).isEqualTo(viaStrict);
      assertThat(viaFast.get("peak_N")).as(csv.toString()).isNotNull();
    }
  }

  @Test
  void generatedRunsWithAndWithoutPositionAgreeBitForBit() throws IOException {
    long seed = 17_2026L; // fixed, so a failure replays
    for (int i = 0; i < 10; i++) {
      RunData d = RunFixtures.randomData(seed + i, 3 + i * 5011, i % 2 == 0);
      RunWriter.write(tmp, RunFixtures.fullMetadata("fr-" + i), d);
      Path csv = tmp.resolve("fr-" + i + ".csv");
      RunData fast = RunCsvFast.read(csv);
      assertThat(fast).as("seed %d", seed + i).isNotNull();
      RunRoundTripTest.assertSameData(d, fast);
      RunRoundTripTest.assertSameData(RunReader.readStrict(csv), fast);
    }
  }

  @Test
  void everyKindOfDoubleConvertsAsDoubleParseDoubleDoes() throws IOException {
    // random bit patterns cover subnormals, huge and tiny exponents and 17-digit mantissas;
    // the reference is Double.parseDouble through the strict reader (Java SE API contract)
    SplittableRandom r = new SplittableRandom(42);
    int n = 4_000;
    StringBuilder sb = new StringBuilder(RunCsv.HEADER_TEXT).append('\n');
    double t = 0;
    for (int i = 0; i < n; i++) {
      t += 0.001;
      double f;
      do {
        f = Double.longBitsToDouble(r.nextLong());
      } while (!Double.isFinite(f));
      double p = (r.nextInt(2000) - 1000) / 8.0 + r.nextDouble() * (i % 3);
      sb.append(t).append(',').append(f).append(',').append(p).append(',')
          .append(r.nextInt()).append(',').append(r.nextInt()).append(',')
          .append(i & 0xFFFF).append('\n');
    }
    Path csv = write("bits.csv", sb.toString());
    RunData fast = RunCsvFast.read(csv);
    assertThat(fast).isNotNull();
    RunRoundTripTest.assertSameData(RunReader.readStrict(csv), fast);
  }

  @Test
  void numbersWrittenByHandInOtherShapesAgree() throws IOException {
    // every form the strict grammar allows, plus more digits than a long holds
    String[] forms = {"5.", ".5", "+3", "-0.0", "007.50", "1e5", "1E-300", "-2.5e+3",
        "12345678901234567890123", "0.1000000000000000055511151231257827021181583404541015625",
        "4.9e-324", "1.7976931348623157e308", "9007199254740993", "0.000000000000000000001"};
    StringBuilder sb = new StringBuilder(RunCsv.HEADER_TEXT).append('\n');
    for (int i = 0; i < forms.length; i++) {
      sb.append(i).append(".25,").append(forms[i]).append(",,7,,").append(i).append('\n');
    }
    Path csv = write("forms.csv", sb.toString());
    RunData fast = RunCsvFast.read(csv);
    assertThat(fast).isNotNull();
    assertThat(fast.hasPosition()).isFalse();
    for (int i = 0; i < forms.length; i++) {
      assertThat(fast.force_N()[i]).as(forms[i]).isEqualTo(Double.parseDouble(forms[i]));
    }
    RunRoundTripTest.assertSameData(RunReader.readStrict(csv), fast);
  }

  @Test
  void oneSampleAndNoSamplesReadAlike() throws IOException {
    Path one = write("one.csv", RunCsv.HEADER_TEXT + "\n0.0,1.5,0.25,10,100,3\n");
    RunData fast = RunCsvFast.read(one);
    assertThat(fast.size()).isEqualTo(1);
    RunRoundTripTest.assertSameData(RunReader.readStrict(one), fast);
    Path noEnd = write("noend.csv", RunCsv.HEADER_TEXT + "\n0.0,1.5,,10,,3");
    RunRoundTripTest.assertSameData(RunReader.readStrict(noEnd), RunCsvFast.read(noEnd));
    Path none = write("none.csv", RunCsv.HEADER_TEXT + "\n");
    assertThat(RunCsvFast.read(none).size()).isZero();
    assertThat(RunReader.readStrict(none).size()).isZero();
  }

  @Test
  void otherValidShapesGoToTheStrictReader() throws IOException {
    String body = "0.0,1.5,0.25,10,100,3\n0.5,2.5,0.5,20,200,4\n";
    List<Path> valid = List.of(
        write("crlf.csv", (RunCsv.HEADER_TEXT + "\n" + body).replace("\n", "\r\n")),
        write("quoted.csv", RunCsv.HEADER_TEXT + "\n\"0.0\",1.5,0.25,10,100,3\n"),
        write("blank.csv", RunCsv.HEADER_TEXT + "\n" + body + "\n"),
        write("nopos.csv", "time_s,force_N,raw_counts,seq\n0.0,1.5,10,3\n0.5,2.5,20,4\n"),
        write("spaces.csv", RunCsv.HEADER_TEXT + "\n0.0, 1.5,0.25,10,100,3\n"));
    for (Path p : valid) {
      assertThat(RunCsvFast.read(p)).as(p.toString()).isNull();
      RunData strict = RunReader.readStrict(p);
      RunRoundTripTest.assertSameData(strict, RunReader.readSamples(p));
    }
    assertThat(RunReader.readSamples(valid.get(3)).hasPosition()).isFalse();
  }

  @Test
  void decimalCommaAndOtherFaultsAreRefusedWithTheStrictMessage() throws IOException {
    // a decimal-comma export splits each number into two cells: refused, never misread
    Path comma = write("comma.csv", RunCsv.HEADER_TEXT + "\n0,0;1,5;0,25;10;100;3\n");
    Path commaCells = write("comma2.csv", RunCsv.HEADER_TEXT + "\n0,0,1,5,0,25,10,100,3\n");
    Path backwards = write("back.csv", RunCsv.HEADER_TEXT
        + "\n0.5,1.5,0.25,10,100,3\n0.25,2.5,0.5,20,200,4\n");
    Path mixed = write("mixed.csv", RunCsv.HEADER_TEXT
        + "\n0.0,1.5,0.25,10,100,3\n0.5,2.5,,20,,4\n");
    Path nan = write("nan.csv", RunCsv.HEADER_TEXT + "\n0.0,NaN,0.25,10,100,3\n");
    Path seq = write("seq.csv", RunCsv.HEADER_TEXT + "\n0.0,1.0,0.25,10,100,70000\n");
    Path huge = write("huge.csv", RunCsv.HEADER_TEXT + "\n0.0,1e400,0.25,10,100,3\n");
    for (Path p : List.of(comma, commaCells, backwards, mixed, nan, seq, huge)) {
      assertThat(RunCsvFast.read(p)).as(p.toString()).isNull();
      assertThatThrownBy(() -> RunReader.readSamples(p)).as(p.toString())
          .isInstanceOf(LoadstoneException.class).hasMessageContaining(p.toString() + ", line ");
    }
    assertThatThrownBy(() -> RunReader.readSamples(commaCells))
        .hasMessageContaining("9 cells where the header has 6");
  }

  private Path write(String name, String text) throws IOException {
    Path p = tmp.resolve(name);
    Files.writeString(p, text, StandardCharsets.UTF_8);
    return p;
  }
}
