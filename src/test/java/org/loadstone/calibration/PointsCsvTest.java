package org.loadstone.calibration;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.io.StringReader;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.loadstone.units.LoadstoneException;

class PointsCsvTest {
  static List<CalibrationPoint> read(String text) throws Exception {
    return PointsCsv.read(new StringReader(text), "pts.csv", ForceFromMass.standard());
  }

  @Test
  void readsMassesAndForcesWithOptionalColumns() throws Exception {
    List<CalibrationPoint> p = read("# a comment\nmass_g,counts,direction,series,counts_sd,samples\n"
        + "0,81234,up,1,3.5,50\n2500,291800.5,up,1,4.1,50\n2500,291900,down,1,4.0,50\n");
    assertThat(p).hasSize(3);
    // 2.5 kg: 24.51294750625 N (worked example in ForceFromMassTest)
    assertThat(p.get(1).force_N()).isCloseTo(24.51294750625, within(1e-11));
    assertThat(p.get(1).mass_kg()).isEqualTo(2.5);
    assertThat(p.get(2).direction()).isEqualTo(Direction.DOWN);
    assertThat(p.get(1).counts_sd()).isEqualTo(4.1);
    assertThat(p.get(1).samples()).isEqualTo(50);
    List<CalibrationPoint> f = read("force_N,counts\n0,10\n100.5,1015\n");
    assertThat(f.get(1).force_N()).isEqualTo(100.5);
    assertThat(f.get(1).mass_kg()).isNull();
    assertThat(f.get(1).series()).isEqualTo(1);
  }

  @Test
  void clearMessagesForBadFiles() {
    assertThatThrownBy(() -> read("mass_g,counts\n0,1\n1,5x\n"))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("pts.csv line 3 column 'counts': '5x' is not a number");
    assertThatThrownBy(() -> read("mass_g,counts\n0,1\n-500,5\n"))
        .hasMessageContaining("line 3 column 'mass_g'").hasMessageContaining("negative");
    assertThatThrownBy(() -> read("mass_g,counts,series\n0,1,1\n500,5,1\n500,6,1\n"))
        .hasMessageContaining("line 4").hasMessageContaining("appears twice in series 1");
    assertThatThrownBy(() -> read("mass_g,counts,temp_C\n0,1,20\n"))
        .hasMessageContaining("unknown column 'temp_C'");
    assertThatThrownBy(() -> read("weight,counts\n0,1\n"))
        .hasMessageContaining("'mass_g' or 'force_N'");
    assertThatThrownBy(() -> read("mass_g,counts,direction\n0,1,sideways\n"))
        .hasMessageContaining("column 'direction'").hasMessageContaining("'up'");
    assertThatThrownBy(() -> read("mass_g,counts\n0,1\n1,5,7\n"))
        .hasMessageContaining("line 3").hasMessageContaining("3 values for 2 columns");
  }

  @Test
  void tooFewPointsForAFitIsReportedByTheService() throws Exception {
    List<CalibrationPoint> p = read("mass_g,counts\n0,1\n1000,8500\n");
    assertThatThrownBy(() -> CalibrationService.fitFromPoints(p, CalibrationSettings.defaults()))
        .hasMessageContaining("fewer points than the fit needs");
  }
}
