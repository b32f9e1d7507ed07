package org.loadstone.ui;

import javafx.geometry.Pos;
import javafx.scene.Parent;
import javafx.scene.control.Label;
import javafx.scene.layout.Pane;
import javafx.scene.layout.Region;
import javafx.scene.layout.StackPane;
import javafx.scene.layout.VBox;
import org.loadstone.acquire.CapacityGauge;

/**
 * How much of the load cell's rated capacity the force uses: a bar with a tick at the overload
 * warning level, coloured by level ({@code .level-…} in the style sheet), and the figure in words
 * beneath. Thin: the fraction and level are {@link CapacityGauge}'s.
 */
final class CapacityBar {
  private static final String[] LEVELS = {"level-unknown", "level-normal", "level-warning",
      "level-over"};

  private final Region fill = new Region();
  private final Region warnTick = new Region();
  private final Pane track = new Pane(fill, warnTick);
  private final Label text = LivePane.label("capacity-text", "rated capacity unknown");
  private final VBox root;
  private double fraction;
  private double warn = 0.8;

  CapacityBar() {
    track.setId("capacity-bar");
    track.getStyleClass().add("capacity-track");
    track.setMinHeight(14);
    track.setPrefHeight(14);
    fill.getStyleClass().add("capacity-fill");
    warnTick.getStyleClass().add("capacity-warn-tick");
    StackPane holder = new StackPane(track);
    holder.setAlignment(Pos.CENTER_LEFT);
    root = new VBox(2, holder, text);
    root.getStyleClass().add("capacity");
    track.widthProperty().addListener((o, a, b) -> place());
    track.heightProperty().addListener((o, a, b) -> place());
  }

  Parent node() {
    return root;
  }

  void show(CapacityGauge g) {
    fraction = g.barFraction();
    warn = g.warnFraction();
    text.setText(g.words());
    String level = LEVELS[g.level().ordinal()];
    if (!fill.getStyleClass().contains(level)) {
      fill.getStyleClass().removeAll(LEVELS);
      fill.getStyleClass().add(level);
      text.getStyleClass().removeAll(LEVELS);
      text.getStyleClass().add(level);
    }
    place();
  }

  private void place() {
    double w = track.getWidth();
    double h = track.getHeight();
    fill.resizeRelocate(0, 0, w * fraction, h);
    warnTick.resizeRelocate(Math.round(w * Math.min(1, warn)) - 1, 0, 2, h);
  }

  /** The bar's fill width ÷ the track's, for tests. */
  double shownFraction() {
    return track.getWidth() <= 0 ? 0 : fill.getWidth() / track.getWidth();
  }
}
