package org.loadstone.ui;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import javafx.geometry.Pos;
import javafx.scene.control.CheckBox;
import javafx.scene.layout.HBox;
import org.loadstone.report.GroupColours;

/**
 * Which of the archive's groups are shown and compared: one box per group in the folder, each
 * with its colour. Every group is ticked at first and when it first appears; two or more ticked
 * are compared, one ticked shows that group's runs alone.
 */
final class GroupPicker {
  private final HBox row = new HBox(10);
  private final Map<String, CheckBox> boxes = new LinkedHashMap<>();
  private final Runnable onChange;
  private GroupColours colours;

  /** @param onChange told on the JavaFX thread when a box is ticked or cleared */
  GroupPicker(Runnable onChange) {
    this.onChange = onChange;
    row.setId("archive-groups-picked");
    row.setAlignment(Pos.CENTER_LEFT);
    row.getStyleClass().add("archive-bar");
  }

  HBox node() {
    return row;
  }

  /**
   * Lists the archive's groups, keeping the ticks of the groups listed before.
   *
   * @param groups every group in the folder, by name
   * @param colours their colours
   */
  void show(List<String> groups, GroupColours colours) {
    this.colours = colours;
    Map<String, Boolean> was = new LinkedHashMap<>();
    boxes.forEach((g, b) -> was.put(g, b.isSelected()));
    boxes.clear();
    row.getChildren().setAll(LivePane.label("groups-caption", "groups compared"));
    for (String g : groups) {
      CheckBox box = new CheckBox(g);
      box.setId("archive-group-" + g);
      box.setSelected(was.getOrDefault(g, true));
      box.setOnAction(e -> onChange.run());
      boxes.put(g, box);
      row.getChildren().add(box);
    }
    repaint();
  }

  /** Draws the colour squares again (after a change of look). */
  void repaint() {
    boxes.forEach((g, box) -> box.setGraphic(colours == null ? null
        : ArchiveTable.swatch(colours.colour(g), row)));
  }

  /** @return the groups ticked, in the archive's order */
  List<String> ticked() {
    List<String> t = new ArrayList<>();
    boxes.forEach((g, b) -> {
      if (b.isSelected()) {
        t.add(g);
      }
    });
    return t;
  }

  /** @return true when every group is ticked (or there is none) */
  boolean all() {
    return boxes.values().stream().allMatch(CheckBox::isSelected);
  }

  /** Ticks exactly these groups (others cleared) and tells the pane once. */
  void pick(List<String> groups) {
    boxes.forEach((g, b) -> b.setSelected(groups.contains(g)));
    onChange.run();
  }

  /** @return the box of a group, or null */
  CheckBox box(String group) {
    return boxes.get(group);
  }
}
