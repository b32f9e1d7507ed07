package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.archive.ArchiveIndex;
import org.loadstone.archive.RunMetadata;

/**
 * {@code import} keeps what describes the specimen (mass, geometry, group, tags, operator) and
 * warns when a magnitude is implausible for a bench test (a unit read wrong), without refusing.
 */
class ImportSpecimenTest {
  @TempDir Path dir;

  private Path csv(double forceScale) throws Exception {
    StringBuilder s = new StringBuilder("t,force,travel\n");
    for (int i = 0; i <= 40; i++) { // a 40 N/mm panel to 400 N at 0.25 mm steps (hand-built)
      s.append(i * 0.5).append(',').append(40 * 0.25 * i * forceScale).append(',')
          .append(0.25 * i).append('\n');
    }
    return Files.writeString(dir.resolve("legacy-" + forceScale + ".csv"), s);
  }

  @Test
  void specimenValuesAreStoredWithTheRun() throws Exception {
    Path arc = dir.resolve("arc");
    RecordCommandTest.Outcome r = RecordCommandTest.run("import", csv(1).toString(), "--map",
        "time=t,force=force,position=travel", "--archive", arc.toString(), "--specimen", "oak-3",
        "--group", "oak", "--tag", "legacy", "--tag", "2019", "--operator", "T. Berg",
        "--mass-g", "182.5", "--span-mm", "300", "--width-mm", "50", "--depth-mm", "20",
        "--json");
    assertThat(r.exit()).as(r.err()).isZero();
    assertThat(r.err()).doesNotContain("warning");
    RunMetadata m = ArchiveIndex.scan(arc).find("oak-3").metadata();
    assertThat(m.group()).isEqualTo("oak");
    assertThat(m.tags()).containsExactly("legacy", "2019");
    assertThat(m.operator()).isEqualTo("T. Berg");
    assertThat(m.mass_g()).isEqualTo(182.5);
    assertThat(m.geometry().span_mm()).isEqualTo(300.0);
    assertThat(m.geometry().depth_mm()).isEqualTo(20.0);
    assertThat(m.amendments().any()).isFalse();
  }

  @Test
  void kilonewtonsReadAsNewtonsAndAMassInKilogramsAreWarnedAbout() throws Exception {
    Path arc = dir.resolve("arc");
    RecordCommandTest.Outcome r = RecordCommandTest.run("import", csv(0.001).toString(),
        "--map", "time=t,force=force,position=travel", "--archive", arc.toString(),
        "--specimen", "oak-4", "--mass-g", "0.0002", "--json");
    assertThat(r.exit()).as(r.err()).isZero(); // warned, still stored
    assertThat(r.err()).contains("warning: the peak force is 0.4000 N, too small",
        "kN", "warning: the specimen mass 0.0002000 g is implausible");
    assertThat(r.json().get("warnings")).hasSize(2);
    assertThat(ArchiveIndex.scan(arc).entries()).hasSize(1);
  }
}
