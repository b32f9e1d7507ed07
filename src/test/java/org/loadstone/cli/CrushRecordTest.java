package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.HangGuard;
import org.loadstone.archive.FinishCause;
import org.loadstone.archive.Run;
import org.loadstone.archive.RunReader;
import org.loadstone.archive.TestType;
import org.loadstone.cli.RecordCommandTest.Outcome;

/**
 * A crush run end to end: the simulator's crush scenario recorded by {@code record --test
 * crush}, which goes on through the saw-tooth to its travel limit; the stored run holds the whole
 * stroke, and its figures are checked against a hand computation over the stored samples.
 */
class CrushRecordTest {
  @TempDir Path tmp;

  @Test
  @Timeout(HangGuard.TEST_S)
  void theSimulatedCrushIsStoredToItsTravelLimitAndReadByItsMeanCrushForce() throws Exception {
    Outcome r = RecordCommandTest.run("record", "--port", "sim", "--scenario", "crush",
        "--seed", "3", "--rate-hz", "1000", "--sim-speed", "8", "--specimen", "tube-01",
        "--group", "tubes", "--test", "crush", "--travel-limit-mm", "4", "--archive",
        tmp.toString(), "--json");
    assertThat(r.exit()).as(r.err()).isZero();
    assertThat(r.err()).contains("the crush goes on through the load drops and ends at 4 mm of "
        + "travel");
    JsonNode j = r.json();
    assertThat(j.get("cause").asText()).isEqualTo("travel-limit");
    Run run = RunReader.read(Path.of(j.get("csv_file").asText()));
    assertThat(run.metadata().testType()).isEqualTo(TestType.CRUSH);
    assertThat(run.metadata().cause()).isEqualTo(FinishCause.TRAVEL_LIMIT);
    assertThat(run.metadata().extra().get("crush_end")).isEqualTo("at 4 mm of travel, or when "
        + "force stays below 5 % of the peak for 1 s, at the time limit or by hand");
    double[] x = run.data().position_mm();
    double[] f = run.data().force_N();
    int n = f.length;
    // the whole stroke is stored: at least the 4 mm of travel from the start of recording
    // (plus the pre-trigger history), not the first tooth of the 40 % drop rule
    double travel = x[n - 1] - x[0];
    assertThat(travel).isGreaterThanOrEqualTo(4.0);
    int peak = 0;
    for (int i = 1; i < n; i++) {
      peak = f[i] > f[peak] ? i : peak;
    }
    int teeth = 0; // falls of 20 % or more from a local high, each followed by a rise again
    double high = f[0];
    boolean falling = false;
    for (int i = 1; i < n; i++) {
      if (!falling && f[i] < 0.8 * high) {
        teeth++;
        falling = true;
        high = f[i];
      } else if (falling && f[i] > high * 1.25) {
        falling = false;
        high = f[i];
      }
      high = falling ? Math.min(high, f[i]) : Math.max(high, f[i]);
    }
    assertThat(teeth).as("load drops recorded through").isGreaterThanOrEqualTo(3);

    // by hand over the same samples: energy = trapezoids of force over forward displacement
    // from the first sample to the end of the stroke; mean crush force = energy / stroke;
    // crush-force efficiency = mean / peak (crashworthiness practice, from memory)
    double area = 0;
    double maxX = 0;
    for (int i = 1; i < n; i++) {
      if (x[i] > x[i - 1]) {
        double lo = Math.max(x[i - 1] - x[0], 0);
        double hi = x[i] - x[0];
        if (hi > lo) {
          double s = (f[i] - f[i - 1]) / (x[i] - x[i - 1]);
          double flo = f[i - 1] + s * (lo - (x[i - 1] - x[0]));
          area += 0.5 * (flo + f[i]) * (hi - lo);
        }
      }
      maxX = Math.max(maxX, x[i] - x[0]);
    }
    double mean = area / maxX;
    JsonNode an = j.get("analysis"); // the stored run's figures, as analyze gives them
    assertThat(an.get("crush_from_mm").asDouble()).isZero();
    assertThat(an.get("crush_to_mm").asDouble()).isCloseTo(maxX, within(1e-9));
    assertThat(an.get("mean_crush_force_N").asDouble()).isCloseTo(mean, within(1e-9 * mean));
    assertThat(an.get("crush_force_efficiency").asDouble())
        .isCloseTo(mean / f[peak], within(1e-9));
    assertThat(an.get("crush_energy_J").asDouble())
        .isCloseTo(area / 1000, within(1e-12 + 1e-9 * area));
    // the simulated specimen's mass is filled in: energy per gram
    double mass = run.metadata().mass_g();
    assertThat(an.get("specific_crush_energy_J_per_g").asDouble())
        .isCloseTo(area / 1000 / mass, within(1e-9));
    // a saw-tooth around 85 % of the first collapse (the scenario's teeth, sim.Presets): the mean
    // lies well below the peak, and well above the floor of the teeth
    assertThat(mean / f[peak]).isBetween(0.45, 0.95);
    assertThat(r.out()).doesNotContain("not analysed");
    // no break on a crush run, though its teeth fall past the 40 % drop rule: the figures say it
    // ended by its own rule, in record's summary and in analyze's document and text
    assertThat(an.get("break_index").isNull()).isTrue();
    // the simulated crosshead's encoder counts along the whole stroke: no jump in it
    assertThat(an.get("notes").toString()).doesNotContain("The position jumps");
    assertThat(an.get("energy_to_break_J").isNull()).isTrue();
    assertThat(r.err()).contains(": travel-limit: the crush ended by its own rule, at its travel "
        + "limit (at 4 mm of travel").doesNotContain("to break");

    // analyze reads the same run over a chosen stroke, and refuses a stroke longer than the run
    String id = j.get("run_id").asText();
    Outcome a = RecordCommandTest.run("analyze", id, "--archive", tmp.toString(),
        "--crush-from-mm", "1", "--json");
    assertThat(a.exit()).as(a.err()).isZero();
    assertThat(a.json().get("crush_from_mm").asDouble()).isEqualTo(1.0);
    assertThat(a.json().get("cause").asText()).isEqualTo("travel-limit");
    assertThat(a.json().get("how_it_ended").asText())
        .startsWith("travel-limit: the crush ended by its own rule");
    assertThat(a.json().get("mean_crush_force_N").isNumber()).isTrue();
    assertThat(a.json().get("crush_force_efficiency").isNumber()).isTrue();
    Outcome text = RecordCommandTest.run("analyze", id, "--archive", tmp.toString());
    assertThat(text.out()).containsPattern("how it ended +travel-limit: the crush ended by its "
        + "own rule").containsPattern("mean crush force +[0-9.]+ N")
        .containsPattern("crush-force efficiency +0\\.[0-9]+").containsPattern("break sample +- ");
    assertThat(a.json().get("analysis_settings").get("crush_stroke").asText())
        .isEqualTo("1.000 mm to the end of the stroke");
    Outcome tooLong = RecordCommandTest.run("analyze", id, "--archive", tmp.toString(),
        "--crush-to-mm", "40");
    assertThat(tooLong.exit()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(tooLong.err()).contains("crush stroke 0.000 to 40.00 mm for the mean crush force")
        .contains("run is shorter than the stroke");
  }

  @Test
  void crushLimitsOnABreakTestAreRefusedBeforeTheDeviceOpens() {
    Outcome r = RecordCommandTest.run("record", "--port", "sim", "--scenario", "crush",
        "--specimen", "x", "--test", "three-point", "--travel-limit-mm", "4", "--archive",
        tmp.toString());
    assertThat(r.exit()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(r.err()).contains("a travel limit or low-force end is for crush runs")
        .contains("--travel-limit-mm");
    Outcome bad = RecordCommandTest.run("record", "--port", "sim", "--scenario", "crush",
        "--specimen", "x", "--test", "crush", "--low-force-pct", "150", "--archive",
        tmp.toString());
    assertThat(bad.exit()).isEqualTo(LoadstoneCommand.EXIT_USER_ERROR);
    assertThat(bad.err()).contains("low-force level").contains("--low-force-pct");
  }
}
