package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.apache.commons.math3.stat.descriptive.DescriptiveStatistics;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.text.PDFTextStripper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.analysis.stats.GroupComparison;
import org.loadstone.analysis.stats.GroupSummary;
import org.loadstone.archive.Amendments;
import org.loadstone.study.ArchiveRuns;
import org.loadstone.study.GroupStudy;
import org.loadstone.study.LeftOut;
import org.loadstone.study.Metric;
import org.loadstone.study.MixedArchive;
import org.loadstone.study.RunSelection;
import org.loadstone.study.StudyResult;

/**
 * {@code amend} and {@code retire} end to end on an archive of real run files: a corrected mass
 * changes the run's per-gram figures in {@code analyze}, {@code compare}, the console's archive
 * figures and the reports, while the run's CSV and JSON stay byte for byte as recorded; a retired
 * run is left out everywhere with its reason.
 */
class AmendCommandTest {
  @TempDir Path dir;

  /** foam-2 of {@link MixedArchive}: peak 468 N, recorded with a mass of 49 g. */
  private static final String FOAM_2 = MixedArchive.countedIds("foam").get(1);
  private static final double PEAK_N = 468;
  private static final double[] FOAM_PEAKS_N = MixedArchive.COUNTED.get("foam");
  private static final double[] FOAM_MASSES_G = {48, 49, 50, 51, 52};

  private static Map<Path, byte[]> runFiles(Path arc) throws Exception {
    Map<Path, byte[]> m = new HashMap<>();
    try (Stream<Path> s = Files.list(arc)) {
      for (Path p : s.filter(p -> p.toString().endsWith(".csv") || p.toString().endsWith(".json"))
          .toList()) {
        m.put(p, Files.readAllBytes(p));
      }
    }
    return m;
  }

  private static String pdfText(Path pdf) throws Exception {
    try (PDDocument d = Loader.loadPDF(pdf.toFile())) {
      return new PDFTextStripper().getText(d).replaceAll("\\s+", " ");
    }
  }

  /** The foam group's mean peak per gram with these masses: Commons Math over peak ÷ mass. */
  private static double foamMeanPerGram(double[] masses_g) {
    DescriptiveStatistics s = new DescriptiveStatistics();
    for (int i = 0; i < FOAM_PEAKS_N.length; i++) {
      s.addValue(FOAM_PEAKS_N[i] / masses_g[i]); // specific strength: force per mass (common practice)
    }
    return s.getMean();
  }

  @Test
  void aCorrectedMassChangesThePerGramFiguresEverywhereAndNotTheRunFiles() throws Exception {
    Path arc = MixedArchive.write(Files.createDirectories(dir.resolve("runs")));
    Map<Path, byte[]> before = runFiles(arc);
    String a = arc.toString();
    JsonNode analyzedBefore = RecordCommandTest.run("analyze", FOAM_2, "--archive", a, "--json")
        .json();
    assertThat(analyzedBefore.get("specific_peak_N_per_g").asDouble())
        .isCloseTo(PEAK_N / 49, within(1e-9));
    ArchiveRuns consoleBefore = ArchiveRuns.rescan(arc, null); // the console had it open
    consoleBefore.analyseAll();

    RecordCommandTest.Outcome amend = RecordCommandTest.run("amend", "foam-2", "--archive", a,
        "--mass-g", "41.2", "--reason", "weighed with the tray by mistake", "--by", "J. Ruiz");
    assertThat(amend.exit()).as(amend.err()).isZero();
    assertThat(amend.out()).contains("amended: mass_g 41.2 (was 49)");

    // analyze: per gram with the corrected mass, and says why
    RecordCommandTest.Outcome an = RecordCommandTest.run("analyze", "foam-2", "--archive", a,
        "--json");
    assertThat(an.exit()).as(an.err()).isZero();
    assertThat(an.json().get("specific_peak_N_per_g").asDouble())
        .isCloseTo(PEAK_N / 41.2, within(1e-9));
    assertThat(an.json().get("peak_N").asDouble()).isEqualTo(PEAK_N);
    assertThat(an.json().get("amended").get(0).asText()).isEqualTo("mass_g 41.2 (was 49)");
    assertThat(an.err()).contains("amended: mass_g 41.2 (was 49)"); // the text, beside the JSON

    // compare: the foam group's mean per gram uses the corrected mass
    double[] corrected = FOAM_MASSES_G.clone();
    corrected[1] = 41.2;
    RecordCommandTest.Outcome cmp = RecordCommandTest.run("compare", "--archive", a,
        "--metric", "specific-peak", "--json");
    assertThat(cmp.exit()).as(cmp.err()).isZero();
    double foamMean = cmp.json().get("groups").get("foam").get("mean").asDouble();
    assertThat(foamMean).isCloseTo(foamMeanPerGram(corrected), within(1e-9))
        .isNotCloseTo(foamMeanPerGram(FOAM_MASSES_G), within(1e-3));

    // the console: the archive pane rescans (keeping analyses of unchanged runs) and compares
    ArchiveRuns console = ArchiveRuns.rescan(arc, consoleBefore);
    console.analyseAll();
    StudyResult r = GroupStudy.compare(console.select(RunSelection.DEFAULT), Metric.SPECIFIC_PEAK,
        GroupComparison.DEFAULT_TARGET_DIFFERENCE);
    GroupSummary foam = r.groups().stream().filter(g -> g.name().equals("foam")).findFirst()
        .orElseThrow();
    assertThat(foam.mean()).isEqualTo(foamMean);

    // the reports: the run report and the group report show the amendment and the new figure
    Path runPdf = dir.resolve("run.pdf");
    assertThat(RecordCommandTest.run("report", "foam-2", "--archive", a, "--out",
        runPdf.toString()).exit()).isZero();
    String runText = pdfText(runPdf);
    assertThat(runText).contains("mass_g 41.2 (was 49)", "weighed with the tray by mistake",
        "J. Ruiz", Metric.SPECIFIC_PEAK.format(PEAK_N / 41.2));
    Path groupPdf = dir.resolve("groups.pdf");
    assertThat(RecordCommandTest.run("report", "--archive", a, "--group", "balsa,board,foam",
        "--out", groupPdf.toString()).exit()).isZero();
    String groupText = pdfText(groupPdf);
    assertThat(groupText).contains("Amended runs", "Run " + FOAM_2 + " (foam-2): amended: "
        + "mass_g 41.2 (was 49)");
    assertThat(groupText).contains("foam 5 " + Metric.SPECIFIC_PEAK.format(foamMean));

    // runs marks it; the run's own files are byte for byte as recorded
    assertThat(RecordCommandTest.run("runs", "--archive", a).out())
        .contains("amended: mass_g 41.2 (was 49)");
    Map<Path, byte[]> after = runFiles(arc);
    assertThat(after.keySet()).isEqualTo(before.keySet());
    before.forEach((p, bytes) -> assertThat(after.get(p)).as(p.toString()).isEqualTo(bytes));
    assertThat(Amendments.file(arc.resolve(FOAM_2 + ".json"))).exists();
  }

  @Test
  void aRetiredRunIsLeftOutWithItsReasonAndCanBeReinstated() throws Exception {
    Path arc = MixedArchive.write(Files.createDirectories(dir.resolve("runs")));
    String a = arc.toString();
    String outlier = MixedArchive.FOAM_OUTLIER;
    RecordCommandTest.Outcome ret = RecordCommandTest.run("retire", outlier, "--archive", a,
        "--reason", "core crushed under the nose before loading");
    assertThat(ret.exit()).as(ret.err()).isZero();

    JsonNode cmp = RecordCommandTest.run("compare", "--archive", a, "--metric", "peak",
        "--include", "manual,time-limit,uncalibrated,imported,overload", "--json").json();
    List<String> reasons = new java.util.ArrayList<>();
    cmp.get("left_out").forEach(l -> reasons.add(l.get("run_id").asText() + " | "
        + l.get("reason").asText()));
    assertThat(reasons).containsExactly(outlier
        + " | retired: core crushed under the nose before loading");
    assertThat(RecordCommandTest.run("runs", "--archive", a).out())
        .contains("retired: core crushed under the nose before loading");

    assertThat(RecordCommandTest.run("retire", outlier, "--archive", a, "--undo", "--reason",
        "the crush was the test's").exit()).isZero();
    StudyResult back = GroupStudy.compare(ArchiveRuns.scan(arc).select(RunSelection.DEFAULT),
        Metric.PEAK, GroupComparison.DEFAULT_TARGET_DIFFERENCE);
    assertThat(back.leftOut()).extracting(LeftOut::runId)
        .containsExactlyElementsOf(MixedArchive.LEFT_OUT.keySet());
  }

  @Test
  void anAmbiguousSpecimenIdIsListedAndNothingIsAmended() throws Exception {
    Path arc = MixedArchive.write(Files.createDirectories(dir.resolve("runs")));
    RecordCommandTest.Outcome r = RecordCommandTest.run("amend", "20261202T100", "--archive",
        arc.toString(), "--mass-g", "40", "--reason", "x");
    assertThat(r.exit()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(r.err()).contains("matches 10 runs", MixedArchive.countedIds("balsa").get(0));
    try (Stream<Path> s = Files.list(arc)) {
      assertThat(s.filter(p -> p.toString().endsWith(Amendments.SUFFIX))).isEmpty();
    }
  }
}
