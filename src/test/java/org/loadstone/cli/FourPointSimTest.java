package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.HangGuard;
import org.loadstone.archive.Run;
import org.loadstone.archive.RunReader;
import org.loadstone.archive.TestType;
import org.loadstone.cli.RecordCommandTest.Outcome;
import org.loadstone.device.SimSetup;
import org.loadstone.sim.SolidBeam;
import org.loadstone.study.RunMetrics;

/**
 * Four-point bending end to end: the simulator's bar on two loading noses at a third of its span,
 * recorded with {@code record --test four-point}; the modulus from the crosshead (which follows
 * the noses) is the bar's own, and the stress at the peak its strength.
 */
class FourPointSimTest {
  @TempDir Path tmp;

  @Test
  @Timeout(HangGuard.TEST_S)
  void theFourPointModulusFromTheCrossheadIsTheBarsModulus() throws Exception {
    Outcome r = RecordCommandTest.run("record", "--port", "sim", "--scenario", "four-point",
        "--seed", "5", "--rate-hz", "1000", "--sim-speed", "8", "--specimen", "bar-4p",
        "--test", "four-point", "--archive", tmp.toString(), "--json");
    assertThat(r.exit()).as(r.err()).isZero();
    JsonNode j = r.json();
    assertThat(j.get("cause").asText()).isEqualTo("break");
    Run run = RunReader.read(Path.of(j.get("csv_file").asText()));
    assertThat(run.metadata().testType()).isEqualTo(TestType.FOUR_POINT_BEND);
    SolidBeam bar = new SimSetup("four-point", 5, 1000, false, 8).buildFrame().truth()
        .specimen().beam();
    // the simulated specimen's sizes are filled in, the load span among them
    assertThat(run.metadata().geometry().loadSpan_mm()).isEqualTo(bar.loadSpan_mm());
    assertThat(run.metadata().geometry().span_mm()).isEqualTo(bar.span_mm());
    RunMetrics m = RunMetrics.of(run.metadata(), run.data());
    // E from the slope at the loading noses, m·a²(3L − 4a)/(bd³) (Roark's two symmetric loads;
    // from memory): the bar's modulus, less the frame's 8000 N/mm in series (about 0.6 %) and the
    // fit's noise, so within 2 %
    assertThat(m.flexuralModulus_MPa().getAsDouble())
        .isCloseTo(bar.modulus_MPa(), within(0.02 * bar.modulus_MPa()));
    // stress at the peak 3P(L − Ls)/(2bd²) (ASTM D6272, from memory) is the bar's strength, up
    // to the noise on the peak
    assertThat(m.flexuralStressAtPeak_MPa().getAsDouble())
        .isCloseTo(bar.flexuralStrength_MPa(), within(0.01 * bar.flexuralStrength_MPa()));

    // read as if a mid-span gauge had measured it, the same slope overstates E by 15 % at a
    // load span of L/3: (3L² − 4a²)/(4a(3L − 4a)) = 23/20 (beam theory, hand computation)
    Outcome mid = RecordCommandTest.run("analyze", j.get("run_id").asText(), "--archive",
        tmp.toString(), "--position-measures", "mid-span-gauge", "--json");
    assertThat(mid.exit()).as(mid.err()).isZero();
    assertThat(mid.json().get("flexural_modulus_MPa").asDouble()
        / m.flexuralModulus_MPa().getAsDouble()).isCloseTo(23.0 / 20, within(1e-6));
  }
}
