package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.text.PDFTextStripper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The run commands through the archive: import into it, resolve by id, group reports. */
class ArchiveCommandsTest {
  @TempDir Path tmp;

  @Test
  void importedRunIsStoredAndAnalysedById() throws Exception {
    // F = 50 N/mm · x, sampled every 0.1 s at 0.1 mm per step, then a break: energy to peak is
    // ½·k·x² = ½ · 50 · 4² = 400 N·mm = 0.4 J (the work of a linear spring)
    StringBuilder csv = new StringBuilder("t;Kraft;Weg\n");
    for (int i = 0; i <= 40; i++) {
      csv.append(String.format(java.util.Locale.ROOT, "%d,%d;%s;%s%n", i / 10, i % 10,
          String.valueOf(50 * i * 0.1).replace('.', ','), String.valueOf(i * 0.1).replace('.', ',')));
    }
    csv.append("4,1;10;4,1\n4,2;5;4,2\n");
    Path src = Files.writeString(tmp.resolve("other-program.csv"), csv.toString());
    Path arc = tmp.resolve("archive");
    RecordCommandTest.Outcome imp = RecordCommandTest.run("import", src.toString(), "--map",
        "time=t,force=Kraft,position=Weg", "--decimal", ",", "--specimen", "legacy-7",
        "--group", "old", "--archive", arc.toString(), "--json");
    assertThat(imp.exit()).as(imp.err()).isZero();
    assertThat(imp.json().get("sample_count").asInt()).isEqualTo(43);
    RecordCommandTest.Outcome list = RecordCommandTest.run("runs", "--archive", arc.toString(),
        "--cause", "imported", "--json");
    String id = list.json().get("runs").get(0).get("run_id").asText();
    assertThat(id).contains("legacy-7");
    RecordCommandTest.Outcome an = RecordCommandTest.run("analyze", id.substring(0, 20),
        "--archive", arc.toString(), "--json");
    assertThat(an.exit()).as(an.err()).isZero();
    assertThat(an.json().get("peak_N").asDouble()).isEqualTo(200.0);
    assertThat(an.json().get("energy_to_peak_J").asDouble())
        .isCloseTo(0.4, org.assertj.core.data.Offset.offset(1e-9));
    assertThat(an.json().get("stiffness_N_per_mm").asDouble())
        .isCloseTo(50.0, org.assertj.core.data.Offset.offset(1e-6));
  }

  @Test
  void groupReportFromTheDemoArchive() throws Exception {
    Path pdf = tmp.resolve("groups.pdf");
    RecordCommandTest.Outcome r = RecordCommandTest.run("report", "--archive",
        CompareCommandTest.SAMPLES.toString(), "--group", "foam,balsa", "--include", "uncalibrated",
        "--out", pdf.toString());
    assertThat(r.exit()).as(r.err()).isZero();
    try (PDDocument d = Loader.loadPDF(pdf.toFile())) {
      String text = new PDFTextStripper().getText(d);
      assertThat(text).contains("foam").contains("balsa").contains("eye protection");
    }
    RecordCommandTest.Outcome again = RecordCommandTest.run("report", "--archive",
        CompareCommandTest.SAMPLES.toString(), "--group", "foam,balsa", "--include", "uncalibrated",
        "--out", pdf.toString());
    assertThat(again.exit()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    Path png = tmp.resolve("overlay.png");
    RecordCommandTest.Outcome p = RecordCommandTest.run("report", "--archive",
        CompareCommandTest.SAMPLES.toString(), "--group", "board", "--include", "uncalibrated",
        "--png", png.toString(),
        "--png-size", "900x600");
    assertThat(p.exit()).as(p.err()).isZero();
    java.awt.image.BufferedImage img = javax.imageio.ImageIO.read(png.toFile());
    assertThat(img.getWidth()).isEqualTo(900);
    assertThat(img.getHeight()).isEqualTo(600);
    RecordCommandTest.Outcome none = RecordCommandTest.run("analyze", "nosuchrun", "--archive",
        CompareCommandTest.SAMPLES.toString());
    assertThat(none.err()).contains("no run 'nosuchrun'");
  }
}
