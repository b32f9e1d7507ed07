package org.loadstone.ui;

import java.util.List;
import java.util.Locale;
import java.util.function.Consumer;
import javafx.collections.FXCollections;
import javafx.geometry.Pos;
import javafx.scene.Node;
import javafx.scene.control.ComboBox;
import javafx.scene.control.Label;
import javafx.scene.layout.HBox;
import org.loadstone.acquire.CapacityGauge;
import org.loadstone.acquire.LiveFeed;
import org.loadstone.units.ForceUnit;

/**
 * The large readout: force in the display unit (chosen beside it: N, kN, lbf, kgf), the capacity
 * bar, peak, crosshead position and raw counts; greyed while no data arrives. Only what is shown
 * changes with the unit: the feed, the runs and their files stay in N.
 */
final class Readout {
  private final Label caption = LivePane.label("force-caption", "FORCE");
  private final ComboBox<ForceUnit> unit = new ComboBox<>(
      FXCollections.observableArrayList(ForceUnit.values()));
  private final Label force = LivePane.label("force-value", "—");
  private final Label peak = LivePane.label("peak-value", "peak —");
  private final Label position = LivePane.label("position-value", "crosshead —");
  private final Label raw = LivePane.label("raw-value", "raw —");
  private final CapacityBar capacity = new CapacityBar();

  Readout() {
    unit.setId("unit-choice");
    unit.setValue(ForceUnit.N);
    unit.setConverter(Choices.named(ForceUnit::symbol, ForceUnit::parse));
    unit.setFocusTraversable(false); // the one-key commands keep the keyboard
  }

  /** @return the caption with the unit choice, force, capacity bar, peak, position, raw */
  List<Node> nodes() {
    HBox head = new HBox(10, caption, unit);
    head.setAlignment(Pos.CENTER_LEFT);
    return List.of(head, force, capacity.node(), peak, position, raw);
  }

  /** @return the unit forces are shown in */
  ForceUnit unit() {
    return unit.getValue();
  }

  /** Shows forces in {@code u} (as if chosen). */
  void setUnit(ForceUnit u) {
    unit.setValue(u);
  }

  /** @param listener told each unit chosen, on the JavaFX thread */
  void onUnit(Consumer<ForceUnit> listener) {
    unit.valueProperty().addListener((o, was, now) -> {
      if (now != null) {
        listener.accept(now);
      }
    });
  }

  CapacityBar capacity() {
    return capacity;
  }

  /**
   * Shows one display frame.
   *
   * @param s the feed's snapshot
   * @param gauge the force against the cell's capacity
   * @param noData whether samples stopped arriving (the figures are greyed)
   */
  void show(LiveFeed.Snapshot s, CapacityGauge gauge, boolean noData) {
    capacity.show(gauge);
    for (Label l : new Label[] {force, peak, position, raw}) {
      if (noData != l.getStyleClass().contains("stale")) {
        if (noData) {
          l.getStyleClass().add("stale");
        } else {
          l.getStyleClass().remove("stale");
        }
      }
    }
    ForceUnit u = unit();
    force.setText(Double.isNaN(s.force_N()) ? "—" : fmt(u.fromNewtons(s.force_N())));
    peak.setText("peak " + (Double.isNaN(s.peak_N()) ? "—"
        : fmt(u.fromNewtons(s.peak_N())) + " " + u.symbol()));
    position.setText("crosshead " + (Double.isNaN(s.position_mm()) ? "—"
        : String.format(Locale.ROOT, "%.3f mm", s.position_mm())));
    raw.setText("raw " + s.counts() + " counts" + (s.taring() ? "  · zeroing…" : ""));
  }

  /** A readout number: three or four figures, whatever the unit. */
  static String fmt(double v) {
    double a = Math.abs(v);
    return String.format(Locale.ROOT,
        a >= 1000 ? "%.0f" : a >= 100 ? "%.1f" : a >= 1 || a == 0 ? "%.2f" : "%.3f", v);
  }
}
