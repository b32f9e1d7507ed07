package org.loadstone.sim;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.loadstone.units.LoadstoneException;

class LoadCellTest {

  @Test
  void hx711SensitivityFollowsTheDataSheetInputRange() {
    // HX711 data sheet (Avia Semiconductor): full-scale differential input ±0.5·AVDD/gain
    // (from memory). 5 V, gain 128: ±19.53125 mV ↔ ±2^23 codes. A 2 mV/V cell at 5 V gives 10 mV
    // at 500 N: 2^23 × 10/19.53125 = 4 294 967.296 counts, / 500 N = 8589.934592 counts/N
    // (worked by hand).
    assertThat(LoadCell.hx711CountsPerN(500, 2, 5, 128)).isCloseTo(8589.934592, within(1e-9));
    assertThat(LoadCell.hx711(500, 80).fullScaleOutput_counts())
        .isCloseTo(4_294_967.296, within(1e-6));
    // ratiometric: the excitation voltage cancels
    assertThat(LoadCell.hx711CountsPerN(500, 2, 3.3, 128)).isCloseTo(8589.934592, within(1e-9));
  }

  @Test
  void nonLinearityIsTheLargestDeviationFromTheTerminalLine() {
    LoadCell cell = new LoadCell(500, 8589.934592, 1234, 0, 0.05);
    double zero = cell.idealCounts(0);
    double full = cell.idealCounts(500);
    double worst = 0;
    for (int i = 0; i <= 1000; i++) {
      double f = 500.0 * i / 1000;
      // terminal line through the zero and full-scale points (load-cell data-sheet definition of
      // non-linearity, common practice)
      double line = zero + (full - zero) * f / 500;
      worst = Math.max(worst, Math.abs(cell.idealCounts(f) - line));
    }
    assertThat(100 * worst / (full - zero)).isCloseTo(0.05, within(1e-9));
    assertThat((full - zero) / 500).isCloseTo(cell.countsPerN(), within(1e-9));
  }

  @Test
  void badSettingsAreRefusedWithTheNameOfTheSetting() {
    assertThatThrownBy(() -> new LoadCell(0, 1, 0, 0, 0))
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("capacity_N");
    assertThatThrownBy(() -> new LoadCell(500, 1, 9e6, 0, 0))
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("zeroOffset_counts");
    assertThatThrownBy(() -> new LoadCell(500, 1, 0, -1, 0))
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("noiseRms_counts");
  }

  @Test
  void converterSaturatesAtThe24BitLimitsAndSaysSo() {
    SimulatedFrame f = SimulatedFrame.builder().scenario(Scenario.OVER_RANGE).rateHz(1000).seed(1)
        .build();
    SampleBlock b = SimRuns.run(f, 1000, 8);
    int top = 0;
    for (int i = 0; i < b.size(); i++) {
      assertThat(b.loadCounts(i)).isBetween(LoadCell.MIN_COUNTS, LoadCell.MAX_COUNTS);
      if (b.saturated(i)) {
        assertThat(b.loadCounts(i)).isEqualTo(LoadCell.MAX_COUNTS);
        top++;
      } else {
        assertThat(b.loadCounts(i)).isLessThan(LoadCell.MAX_COUNTS);
      }
    }
    assertThat(top).isGreaterThan(1000);
    assertThat(f.truth().saturatedSamples()).isEqualTo(top);
    // the true force is well past the cell's capacity, not clipped
    assertThat(f.truth().peakForce_N()).isGreaterThan(2 * f.truth().loadCell().capacity_N());
  }

  @Test
  void converterSaturatesAtTheNegativeLimitToo() {
    SimulatedFrame f = SimulatedFrame.builder().scenario(Scenario.DEAD_WEIGHT).rateHz(80)
        .zeroOffset_counts(LoadCell.MIN_COUNTS + 20).noiseRms_counts(40).seed(3).build();
    SampleBlock b = SimRuns.run(f, 80, 20);
    int low = 0;
    for (int i = 0; i < b.size(); i++) {
      if (b.saturated(i)) {
        assertThat(b.loadCounts(i)).isEqualTo(LoadCell.MIN_COUNTS);
        low++;
      }
    }
    // offset is half a sigma above the limit: about 31 % of samples fall below it
    assertThat(low).isBetween(300, 700);
  }
}
