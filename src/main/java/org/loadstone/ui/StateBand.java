package org.loadstone.ui;

import javafx.geometry.Pos;
import javafx.scene.Node;
import javafx.scene.Parent;
import javafx.scene.control.Label;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.Region;
import javafx.scene.layout.VBox;
import org.loadstone.acquire.CapacityGauge;
import org.loadstone.acquire.StationStatus;

/**
 * The band across the live window: the station's state in large words with a mark and a colour
 * per tone, one line of detail, the over-range flag, and the arm and stop buttons, so the state
 * and the two actions stay in view at any window size. Thin: the words, tone and mark come from
 * {@link StationStatus}, the flag from {@link CapacityGauge}; the colours are in the style sheet
 * ({@code .tone-…}).
 */
final class StateBand {
  static final String[] TONES = toneClasses();

  private final HBox root;
  private final Label mark = LivePane.label("state-mark", "○");
  private final Label words = LivePane.label("run-state", "CONNECTING");
  private final Label detail = LivePane.label("state-detail", "");
  private final Label overRange = LivePane.label("over-range-flag", "⚠ OVER RANGE");

  /** @param actions the arm and stop buttons */
  StateBand(Node actions) {
    detail.setWrapText(false);
    detail.setMinWidth(0);
    words.setMinWidth(Region.USE_PREF_SIZE);
    mark.setMinWidth(Region.USE_PREF_SIZE);
    VBox text = new VBox(0, words, detail);
    text.setMinWidth(0);
    HBox.setHgrow(text, Priority.ALWAYS);
    overRange.setMinWidth(Region.USE_PREF_SIZE);
    showFlag(false);
    root = new HBox(14, mark, text, overRange, actions);
    root.setId("state-band");
    root.getStyleClass().add("state-band");
    root.setAlignment(Pos.CENTER_LEFT);
    show(new StationStatus.View("CONNECTING", "opening the device", StationStatus.Tone.WAITING,
        "◆", true, 0));
  }

  private static String[] toneClasses() {
    StationStatus.Tone[] t = StationStatus.Tone.values();
    String[] c = new String[t.length];
    for (int i = 0; i < t.length; i++) {
      c[i] = toneClass(t[i]);
    }
    return c;
  }

  /** @return the style class of a tone, e.g. {@code tone-fault} */
  static String toneClass(StationStatus.Tone t) {
    return "tone-" + t.name().toLowerCase(java.util.Locale.ROOT);
  }

  Parent node() {
    return root;
  }

  /** Shows a state; the classes change only when the tone does (no style pass per frame). */
  void show(StationStatus.View v) {
    words.setText(v.words());
    detail.setText(v.detail());
    mark.setText(v.mark());
    String tone = toneClass(v.tone());
    if (!root.getStyleClass().contains(tone)) {
      root.getStyleClass().removeAll(TONES);
      root.getStyleClass().add(tone);
    }
  }

  /** Shows or hides the over-range flag. */
  void flag(CapacityGauge g) {
    showFlag(g.overRange());
    overRange.setText(g.saturated() ? "⚠ SATURATED" : "⚠ OVER RANGE");
  }

  private void showFlag(boolean on) {
    overRange.setVisible(on);
    overRange.setManaged(on);
  }

  /** The tone shown, e.g. {@code FAULT}. */
  StationStatus.Tone tone() {
    for (StationStatus.Tone t : StationStatus.Tone.values()) {
      if (root.getStyleClass().contains(toneClass(t))) {
        return t;
      }
    }
    throw new IllegalStateException("no tone shown");
  }
}
