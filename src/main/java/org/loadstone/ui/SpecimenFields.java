package org.loadstone.ui;

import javafx.collections.FXCollections;
import javafx.scene.Parent;
import javafx.scene.control.ComboBox;
import javafx.scene.control.Label;
import javafx.scene.control.TextField;
import javafx.scene.control.TitledPane;
import javafx.scene.layout.GridPane;
import org.loadstone.archive.Geometry;
import org.loadstone.archive.TestType;
import org.loadstone.units.LoadstoneException;

/**
 * The test and the specimen's measurements, for the flexural, sandwich and compression figures:
 * folded away until wanted, and kept from one specimen to the next (a batch of panels is cut to
 * one size). Every field may stay empty; a figure that needs a missing measurement is left out
 * with a note saying which.
 */
final class SpecimenFields {
  private final ComboBox<TestType> test = new ComboBox<>(
      FXCollections.observableArrayList(TestType.values()));
  private final TextField span = field("span-field");
  private final TextField loadSpan = field("load-span-field");
  private final TextField width = field("width-field");
  private final TextField depth = field("depth-field");
  private final TextField facing = field("facing-field");
  private final TextField core = field("core-field");
  private final TextField area = field("area-field");
  private final TitledPane pane;

  SpecimenFields() {
    test.setId("test-type");
    test.setValue(TestType.THREE_POINT_BEND);
    test.setConverter(Choices.named(TestType::wireName, TestType::parse));
    GridPane g = new GridPane();
    g.setHgap(8);
    g.setVgap(6);
    test.setPrefWidth(140);
    g.add(label("test"), 0, 0);
    g.add(test, 1, 0, 3, 1);
    g.addRow(1, label("span"), span, label("load span"), loadSpan);
    g.addRow(2, label("width"), width, label("depth"), depth);
    g.addRow(3, label("facing"), facing, label("core"), core);
    g.addRow(4, label("area mm²"), area);
    g.getStyleClass().add("specimen-grid");
    pane = new TitledPane("Test and specimen size (mm)", g);
    pane.setId("specimen-pane");
    pane.setExpanded(false);
  }

  private static Label label(String text) {
    Label l = new Label(text);
    l.setMinWidth(Label.USE_PREF_SIZE);
    return l;
  }

  private static TextField field(String id) {
    TextField f = new TextField();
    f.setId(id);
    f.setPrefColumnCount(5);
    return f;
  }

  Parent node() {
    return pane;
  }

  private java.util.Map<String, TextField> sizes() {
    java.util.Map<String, TextField> m = new java.util.LinkedHashMap<>();
    m.put("span_mm", span);
    m.put("load_span_mm", loadSpan);
    m.put("width_mm", width);
    m.put("depth_mm", depth);
    m.put("facing_mm", facing);
    m.put("core_mm", core);
    m.put("area_mm2", area);
    return m;
  }

  /** @return the test type and the sizes as typed, for the form's memory */
  java.util.Map<String, String> values() {
    java.util.Map<String, String> m = new java.util.LinkedHashMap<>();
    m.put("test_type", testType().wireName());
    sizes().forEach((k, f) -> m.put(k, f.getText().trim()));
    return m;
  }

  /** Fills the test type and sizes from the form's memory (unknown or bad entries skipped). */
  void restore(java.util.Map<String, String> values) {
    String t = values.get("test_type");
    if (t != null) {
      try {
        test.setValue(TestType.parse(t));
      } catch (LoadstoneException | IllegalArgumentException unknown) {
        // a type this version does not know: keep the default
      }
    }
    sizes().forEach((k, f) -> {
      String v = values.get(k);
      if (v != null) {
        f.setText(v);
      }
    });
    if (sizes().values().stream().anyMatch(f -> !f.getText().isBlank())) {
      pane.setExpanded(true); // sizes carried over: show them, so they are seen before a run
    }
  }

  /** @param listener told each new test type chosen, on the JavaFX thread */
  void onTestChange(java.util.function.Consumer<TestType> listener) {
    test.valueProperty().addListener((o, was, now) -> {
      if (now != null) {
        listener.accept(now);
      }
    });
  }

  TestType testType() {
    return test.getValue() == null ? TestType.THREE_POINT_BEND : test.getValue();
  }

  /**
   * @return the measurements typed in
   * @throws LoadstoneException naming the field and what to type when one is not a size in mm
   */
  Geometry geometry() {
    return new Geometry(number(span, "span", "mm"), number(loadSpan, "load span", "mm"),
        number(width, "width", "mm"), number(depth, "depth", "mm"),
        number(facing, "facing thickness", "mm"), number(core, "core thickness", "mm"),
        number(area, "cross-section area", "mm²"));
  }

  /**
   * The positive number in a field (a decimal comma is taken too), or null when it is empty.
   *
   * @throws LoadstoneException naming the field, what was typed and what to type
   */
  static Double number(TextField f, String what, String unit) {
    String t = f.getText().trim().replace(',', '.');
    if (t.isEmpty()) {
      return null;
    }
    try {
      double v = Double.parseDouble(t);
      if (v > 0 && Double.isFinite(v)) {
        return v;
      }
    } catch (NumberFormatException e) {
      // reported below
    }
    throw new LoadstoneException(what + " '" + f.getText().trim() + "' is not a positive number of "
        + unit + ": type one such as 38.5, or leave it empty");
  }
}
