package org.loadstone.ui;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.awt.Color;
import org.junit.jupiter.api.Test;
import org.loadstone.report.RunCurves;

/** The looks' colour rules against the WCAG 2.1 contrast formula's published values. */
class ThemeTest {
  @Test
  void contrastIsTheWcagRatio() {
    // WCAG 2.1, "contrast ratio": black on white is 21:1, a colour on itself 1:1
    assertThat(Theme.contrast(Color.BLACK, Color.WHITE)).isCloseTo(21.0, within(1e-9));
    assertThat(Theme.contrast(Color.GRAY, Color.GRAY)).isCloseTo(1.0, within(1e-12));
    // #777777 on white: 4.48:1, the grey commonly quoted as just under AA (from memory)
    assertThat(Theme.contrast(new Color(0x77, 0x77, 0x77), Color.WHITE))
        .isCloseTo(4.48, within(0.01));
  }

  @Test
  void everyRunColourStandsOutOnBothLooksAndStaysItsOwn() {
    for (Theme t : Theme.values()) {
      java.util.Set<Color> shown = new java.util.HashSet<>();
      for (Color c : RunCurves.PALETTE) {
        Color s = t.onGround(c);
        // WCAG 2.1 success criterion 1.4.11: graphics at least 3:1 against what is next to them
        assertThat(Theme.contrast(s, t.ground())).as("%s on %s", c, t).isGreaterThanOrEqualTo(3.0);
        shown.add(s);
        if (Theme.contrast(c, t.ground()) >= 3.0) {
          assertThat(s).isEqualTo(c); // a colour that stands out already is kept
        }
      }
      assertThat(shown).hasSameSizeAs(RunCurves.PALETTE);
    }
  }

  @Test
  void theReadoutFollowsTheWindow() {
    // in proportion to the window's smaller side ratio and to the text size
    double full = Look.readoutPx(1280, 800, 1.0);
    assertThat(Look.readoutPx(1920, 1200, 1.0) / full).isCloseTo(1.5, within(1e-12));
    assertThat(Look.readoutPx(1920, 800, 1.0)).isEqualTo(full); // the height holds it
    assertThat(Look.readoutPx(1280, 800, 1.5) / full).isCloseTo(1.5, within(1e-12));
  }
}
