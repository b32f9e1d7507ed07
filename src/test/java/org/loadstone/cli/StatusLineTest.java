package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

/** The record status line fits the terminal: 160 and 60 columns, and narrower. */
class StatusLineTest {
  @Test
  void theLongestFormThatFitsIsChosenAndNothingWraps() {
    String wide = StatusLine.format("recording", 72.44, 123.456, 2.5, 234.567, 80, 160);
    assertThat(wide).isEqualTo("recording 1:12.4  force    123.46 N  travel   2.500 mm  peak    "
        + "234.57 N     80.0 samples/s");
    String sixty = StatusLine.format("recording", 72.44, 123.456, 2.5, 234.567, 80, 60);
    assertThat(sixty).isEqualTo("recording 1:12.4 F 123.5 N x 2.50 mm pk 234.6 N");
    for (int w = 20; w <= 200; w++) {
      assertThat(StatusLine.format("recording", 3599.9, -12345.678, 1234.5678, 99999.9, 50000,
          w)).as("width " + w).hasSizeLessThan(w);
    }
    assertThat(StatusLine.format("armed", Double.NaN, 0.01, Double.NaN, Double.NaN, 80, 60))
        .startsWith("armed     -:--");
    assertThat(StatusLine.width("60")).isEqualTo(60);
    assertThat(StatusLine.width(null)).isEqualTo(StatusLine.DEFAULT_WIDTH);
    assertThat(StatusLine.width("wide")).isEqualTo(StatusLine.DEFAULT_WIDTH);
  }
}
