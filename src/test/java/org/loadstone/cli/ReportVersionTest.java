package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.pdmodel.PDDocumentInformation;
import org.apache.pdfbox.text.PDFTextStripper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * One home for the software version: a report's PDF producer, creator and traceability line
 * carry the version the same command's JSON document carries, which is the project's version in
 * the build file (pom.xml).
 */
class ReportVersionTest {
  @TempDir Path tmp;

  /** The project's own version, read from the build file as Maven reads it. */
  private static String pomVersion() throws Exception {
    String pom = Files.readString(Path.of(System.getProperty("loadstone.projectDir", "."),
        "pom.xml"));
    Matcher m = Pattern.compile("<artifactId>loadstone</artifactId>\\s*<version>([^<]+)</version>")
        .matcher(pom);
    assertThat(m.find()).as("the project's version in pom.xml").isTrue();
    return m.group(1);
  }

  private static void checkPdf(Path pdf, String version) throws Exception {
    try (PDDocument d = Loader.loadPDF(pdf.toFile())) {
      PDDocumentInformation info = d.getDocumentInformation();
      assertThat(info.getProducer()).isEqualTo("Loadstone " + version);
      assertThat(info.getCreator()).isEqualTo("Loadstone " + version);
      String text = new PDFTextStripper().getText(d).replaceAll("\\s+", " ");
      assertThat(text).contains("by Loadstone " + version);
    }
  }

  @Test
  void runAndGroupReportsCarryTheVersionOfTheJson() throws Exception {
    String version = pomVersion();
    String arc = CompareCommandTest.SAMPLES.toString();
    Path run = tmp.resolve("run.pdf");
    CliRun r = CliRun.run("", "report", "foam-01", "--archive", arc, "--out", run.toString(),
        "--json");
    assertThat(r.exit()).as(r.toString()).isZero();
    assertThat(r.lastJson().get("version").asText()).isEqualTo(version);
    checkPdf(run, version);

    Path group = tmp.resolve("groups.pdf");
    CliRun g = CliRun.run("", "report", "--group", "foam,balsa", "--archive", arc, "--out",
        group.toString(), "--json");
    assertThat(g.exit()).as(g.toString()).isZero();
    assertThat(g.lastJson().get("version").asText()).isEqualTo(version);
    checkPdf(group, version);
  }
}
