package org.loadstone.calibration;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import org.junit.jupiter.api.Test;

/** A calibration checked against the cell a device reports, before a run. */
class CellMatchTest {
  /** HX711 at gain 128, 5 V, 2 mV/V (data sheet, from memory): 2^23·2·128·0.002/C counts/N. */
  private static final double CPN_500 = 8589.934592;
  private static final double CPN_1000 = 4294.967296;

  private static CellMatch.CalibratedCell cal(String cell, double cpn, double capacity) {
    return new CellMatch.CalibratedCell("cal-1", cell, "SN-7", cpn, capacity);
  }

  @Test
  void theSameCellPassesSilently() {
    List<String> w = CellMatch.check(cal("rig-1kN", CPN_1000 * 1.004, 1000),
        new CellMatch.ConnectedCell("rig-1kN", 1000, CPN_1000));
    assertThat(w).isEmpty();
  }

  @Test
  void aCalibrationOfTheHalfSizeCellIsCaughtByIdSensitivityAndCapacity() {
    // the 500 N cell has twice the counts per N of the 1 kN cell: forces would come out half
    List<String> w = CellMatch.check(cal("rig-500N", CPN_500, 500),
        new CellMatch.ConnectedCell("rig-1kN", 1000, CPN_1000));
    assertThat(w).hasSize(3);
    assertThat(w.get(0)).contains("made for load cell rig-500N")
        .contains("reports cell rig-1kN");
    assertThat(w.get(1)).contains("8589.93 counts/N").contains("+100 %")
        .contains("4294.97 counts/N");
    assertThat(w.get(2)).contains("rated 500 N").contains("rated 1000 N");
  }

  @Test
  void theCellsSerialNumberIsAcceptedAsItsId() {
    assertThat(CellMatch.check(cal("rig-1kN", CPN_1000, 1000),
        new CellMatch.ConnectedCell("SN-7", Double.NaN, Double.NaN))).isEmpty();
  }

  @Test
  void sensitivityWithinTheTenPercentTolerancePasses() {
    // inexpensive cells: rated output within about ±10 % of nominal (common practice)
    assertThat(CellMatch.check(cal("c", CPN_1000 * 1.09, 1000),
        new CellMatch.ConnectedCell(null, Double.NaN, CPN_1000))).isEmpty();
    assertThat(CellMatch.check(cal("c", CPN_1000 * 0.89, 1000),
        new CellMatch.ConnectedCell(null, Double.NaN, CPN_1000))).hasSize(1);
  }

  @Test
  void aDeviceThatSaysNothingAboutItsCellGivesNoWarning() {
    CellMatch.ConnectedCell unknown = new CellMatch.ConnectedCell(null, Double.NaN, Double.NaN);
    assertThat(unknown.known()).isFalse();
    assertThat(CellMatch.check(cal("c", CPN_500, 500), unknown)).isEmpty();
  }
}
