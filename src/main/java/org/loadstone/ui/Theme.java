package org.loadstone.ui;

import java.awt.Color;

/**
 * The console's two looks: dark for a dim bay, light for a bright one. Each names the stylesheet
 * laid over {@code console.css} (whose own colours are the dark look's) and the colours its
 * charts are drawn in, so controls, tables and charts change together.
 */
enum Theme {
  DARK("dark", null, new Color(0x17, 0x22, 0x26), new Color(0x2e, 0x3d, 0x42),
      new Color(0xc9, 0xd6, 0xd2)),
  LIGHT("light", "/org/loadstone/ui/look-light.css", Color.WHITE, new Color(0xdd, 0xe1, 0xe6),
      new Color(0x2e, 0x34, 0x3b));

  private final String word;
  private final String stylesheet;
  private final Color ground;
  private final Color grid;
  private final Color ink;

  Theme(String word, String stylesheet, Color ground, Color grid, Color ink) {
    this.word = word;
    this.stylesheet = stylesheet;
    this.ground = ground;
    this.grid = grid;
    this.ink = ink;
  }

  /** @return the look's name as the console shows and remembers it */
  String word() {
    return word;
  }

  /** @return the resource laid over {@code console.css}, or null for none */
  String stylesheet() {
    return stylesheet;
  }

  /** @return the charts' background */
  Color ground() {
    return ground;
  }

  /** @return the charts' grid lines */
  Color grid() {
    return grid;
  }

  /** @return the charts' text, axes and marks */
  Color ink() {
    return ink;
  }

  /** @return the look of this name, or the dark look when the name is unknown */
  static Theme parse(String word) {
    for (Theme t : values()) {
      if (t.word.equalsIgnoreCase(word == null ? "" : word.trim())) {
        return t;
      }
    }
    return DARK;
  }

  /**
   * A data colour as drawn on this look's charts: moved toward the ink (white on the dark look,
   * black on the light) until it stands out from the chart's ground by a contrast ratio of at
   * least 3:1, the least WCAG 2.1 asks of graphics (success criterion 1.4.11); a colour that
   * already does is kept. Hues are kept, so colours told apart stay apart.
   *
   * @param c a series colour, not null
   * @return the colour drawn
   */
  Color onGround(Color c) {
    Color toward = this == DARK ? Color.WHITE : Color.BLACK;
    Color shown = c;
    for (int step = 1; step <= 20 && contrast(shown, ground) < 3.0; step++) {
      shown = mix(c, toward, step * 0.05);
    }
    return new Color(shown.getRed(), shown.getGreen(), shown.getBlue(), c.getAlpha());
  }

  /** The WCAG 2.1 contrast ratio of two colours, 1 to 21. */
  static double contrast(Color a, Color b) {
    double la = luminance(a);
    double lb = luminance(b);
    return (Math.max(la, lb) + 0.05) / (Math.min(la, lb) + 0.05);
  }

  /** WCAG 2.1 relative luminance of an sRGB colour (0 black … 1 white). */
  static double luminance(Color c) {
    return 0.2126 * linear(c.getRed()) + 0.7152 * linear(c.getGreen())
        + 0.0722 * linear(c.getBlue());
  }

  private static double linear(int channel) {
    double s = channel / 255.0;
    return s <= 0.03928 ? s / 12.92 : Math.pow((s + 0.055) / 1.055, 2.4);
  }

  private static Color mix(Color c, Color toward, double share) {
    return new Color((int) Math.round(c.getRed() + (toward.getRed() - c.getRed()) * share),
        (int) Math.round(c.getGreen() + (toward.getGreen() - c.getGreen()) * share),
        (int) Math.round(c.getBlue() + (toward.getBlue() - c.getBlue()) * share));
  }
}
