package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.text.PDFTextStripper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.analysis.stats.GroupComparison;
import org.loadstone.analysis.stats.GroupSummary;
import org.loadstone.report.PdfReport;
import org.loadstone.study.ArchiveRuns;
import org.loadstone.study.GroupStudy;
import org.loadstone.study.LeftOut;
import org.loadstone.study.Metric;
import org.loadstone.study.MixedArchive;
import org.loadstone.study.RunSelection;
import org.loadstone.study.Selection;
import org.loadstone.study.StudyResult;

/**
 * One archive, three faces: {@code compare --json}, the console's archive figures (the service
 * calls the archive pane makes) and the group PDF written by {@code report --group} give the same
 * n, mean, SD, CI, p, outliers and left-out list. The archive holds broken calibrated runs and a
 * manual, a time-limited, an uncalibrated, an imported and an overload run.
 */
class StudyParityTest {
  @TempDir Path dir;

  @Test
  void compareTheConsoleAndTheGroupReportAgree() throws Exception {
    Path arc = MixedArchive.write(java.nio.file.Files.createDirectories(dir.resolve("runs")));
    agree(arc, MixedArchive.COUNTED, List.copyOf(MixedArchive.LEFT_OUT.keySet()));
  }

  /**
   * The same with amended runs: a run moved into another group by an amendment counts there, and
   * a retired run is left out with its reason, in all three faces alike.
   */
  @Test
  void theyAgreeOnAmendedRunsToo() throws Exception {
    Path arc = MixedArchive.writeAmended(java.nio.file.Files.createDirectories(
        dir.resolve("runs")));
    String text = agree(arc, MixedArchive.AMENDED_COUNTED, MixedArchive.AMENDED_LEFT_OUT);
    assertThat(text).contains("Run " + MixedArchive.RETIRED + " (balsa-4): retired: "
        + MixedArchive.RETIRED_REASON);
    assertThat(text).contains("Run " + MixedArchive.REGROUPED + " (board-5): amended: group "
        + "board (was bord)");
  }

  private String agree(Path arc, java.util.Map<String, double[]> counted, List<String> leftOut)
      throws Exception {
    RecordCommandTest.Outcome cmp = RecordCommandTest.run("compare", "--archive", arc.toString(),
        "--metric", "peak", "--json");
    assertThat(cmp.exit()).as(cmp.err()).isZero();
    JsonNode j = cmp.json();

    // the console: ArchivePane rescans, analyses every run, selects by its boxes (none ticked)
    // and compares the shown groups
    ArchiveRuns runs = ArchiveRuns.rescan(arc, null);
    runs.analyseAll();
    Selection sel = runs.select(RunSelection.DEFAULT);
    StudyResult console = GroupStudy.compare(sel, Metric.PEAK,
        GroupComparison.DEFAULT_TARGET_DIFFERENCE);

    Path pdf = dir.resolve("groups.pdf");
    RecordCommandTest.Outcome rep = RecordCommandTest.run("report", "--archive", arc.toString(),
        "--group", "balsa,board,foam", "--out", pdf.toString());
    assertThat(rep.exit()).as(rep.err()).isZero();
    String text;
    try (PDDocument d = Loader.loadPDF(pdf.toFile())) {
      text = new PDFTextStripper().getText(d).replaceAll("\\s+", " ");
    }

    // n, mean, SD, CI: the command line and the console hold the same numbers
    assertThat(j.get("groups").size()).isEqualTo(console.groups().size()).isEqualTo(3);
    for (GroupSummary g : console.groups()) {
      JsonNode n = j.get("groups").get(g.name());
      assertThat(n.get("n").asInt()).as(g.name()).isEqualTo(g.n())
          .isEqualTo(counted.get(g.name()).length);
      // the mean of the peaks that count, from Commons Math
      assertThat(n.get("mean").asDouble()).isCloseTo(org.apache.commons.math3.stat.StatUtils
          .mean(counted.get(g.name())), org.assertj.core.api.Assertions.within(1e-9));
      assertThat(n.get("mean").asDouble()).isEqualTo(g.mean());
      assertThat(n.get("sd").asDouble()).isEqualTo(g.sd().getAsDouble());
      assertThat(n.get("ci95_low").asDouble()).isEqualTo(g.ci95Low().getAsDouble());
      assertThat(n.get("ci95_high").asDouble()).isEqualTo(g.ci95High().getAsDouble());
      // and the report's peak-force table prints the same row, from the command line's values
      Metric m = Metric.PEAK;
      String row = String.join(" ", g.name(), n.get("n").asText(),
          m.format(n.get("mean").asDouble()), m.format(n.get("sd").asDouble()),
          String.format(java.util.Locale.ROOT, "%.1f", n.get("cv_pct").asDouble()),
          m.format(n.get("ci95_low").asDouble()), m.format(n.get("ci95_high").asDouble()));
      assertThat(text).as("report row").contains(row);
    }
    assertThat(j.get("p_value").asDouble()).isEqualTo(console.pValue().getAsDouble());
    assertThat(text).contains("one-way ANOVA")
        .contains(PdfReport.formatP(j.get("p_value").asDouble()));

    // outliers by run
    assertThat(j.get("outliers")).hasSize(1);
    assertThat(j.get("outliers").get(0).get("run_id").asText())
        .isEqualTo(console.outliers().get(0).runId()).isEqualTo(MixedArchive.FOAM_OUTLIER);
    assertThat(text).contains("Possible outlier in group 'foam': run "
        + MixedArchive.FOAM_OUTLIER);

    // the same runs left out, for the same reasons, in all three
    List<String> fromJson = new ArrayList<>();
    j.get("left_out").forEach(l -> fromJson.add(l.get("run_id").asText() + " | "
        + l.get("reason").asText()));
    List<String> fromConsole = console.leftOut().stream()
        .map(l -> l.runId() + " | " + l.reason()).toList();
    assertThat(fromJson).containsExactlyElementsOf(fromConsole);
    assertThat(console.leftOut()).extracting(LeftOut::runId)
        .containsExactlyElementsOf(leftOut);
    for (LeftOut l : console.leftOut()) {
      assertThat(text).as("report lists " + l.runId()).contains("Run " + l.line());
    }
    int n = counted.values().stream().mapToInt(v -> v.length).sum();
    assertThat(text).contains(n + " runs counted, " + leftOut.size() + " left out");
    return text;
  }
}
