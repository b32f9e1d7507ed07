package org.loadstone.ui;

import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.function.Supplier;
import javafx.collections.FXCollections;
import javafx.scene.Parent;
import javafx.scene.control.ComboBox;
import javafx.scene.control.Label;
import javafx.scene.control.TextField;
import javafx.scene.control.TitledPane;
import javafx.scene.layout.GridPane;
import org.loadstone.acquire.CrushEnd;
import org.loadstone.acquire.RunPreset;
import org.loadstone.acquire.RunSettings;
import org.loadstone.archive.TestType;
import org.loadstone.units.ForceUnit;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Setting;

/**
 * The run settings in a folded section: start force, break drop, tail, time limit and, for a
 * crush, its end rule; filled from the test type's preset ({@link RunPreset}, the core's one home
 * of them) and checked as typed, the fault shown under the field it concerns. The start force is
 * typed in the display unit; everything is kept and passed on in N. Thin: the ranges are {@link
 * RunSettings}' and {@link CrushEnd}'s own checks.
 */
final class RunSettingsFields {
  private final ComboBox<TestType> preset = new ComboBox<>(
      FXCollections.observableArrayList(TestType.values()));
  private final Entry start = new Entry("start-field", "start force", Setting.START_THRESHOLD);
  private final Entry drop = new Entry("drop-field", "break drop", Setting.BREAK_DROP);
  private final Entry tail = new Entry("tail-field", "tail", Setting.TAIL);
  private final Entry limit = new Entry("time-limit-field", "time limit", Setting.TIME_LIMIT);
  private final Entry travel = new Entry("travel-limit-field", "travel limit",
      Setting.TRAVEL_LIMIT);
  private final Entry lowPct = new Entry("low-force-field", "low force", Setting.LOW_FORCE_LEVEL);
  private final Entry lowS = new Entry("low-force-time-field", "low for", Setting.LOW_FORCE_TIME);
  private final Entry[] entries = {start, drop, tail, limit, travel, lowPct, lowS};
  private final Label startUnit = new Label();
  private final TitledPane pane;
  private final Supplier<TestType> test;
  private ForceUnit unit = ForceUnit.N;
  /** Filling the fields from a preset or the memory: no check per keystroke meanwhile. */
  private boolean filling;

  /** @param test the run's test type as the form has it */
  RunSettingsFields(Supplier<TestType> test) {
    this.test = test;
    preset.setId("preset-choice");
    preset.setConverter(Choices.named(TestType::wireName, TestType::parse));
    preset.setOnAction(e -> {
      if (preset.getValue() != null) {
        apply(RunPreset.of(preset.getValue()));
      }
    });
    GridPane g = new GridPane();
    g.setHgap(8);
    g.setVgap(4);
    g.getStyleClass().add("run-settings-grid");
    g.addRow(0, new Label("preset"), preset);
    GridPane.setColumnSpan(preset, 2);
    int row = 1;
    row = start.place(g, row, startUnit);
    row = drop.place(g, row, new Label("% of peak"));
    row = tail.place(g, row, new Label("s after break"));
    row = limit.place(g, row, new Label("s (0: none)"));
    row = travel.place(g, row, new Label("mm (0: none)"));
    row = lowPct.place(g, row, new Label("% of peak"));
    lowS.place(g, row, new Label("s"));
    for (Entry e : entries) {
      e.field.textProperty().addListener((o, was, now) -> {
        if (!filling) {
          check();
        }
      });
    }
    pane = new TitledPane("Run settings", g);
    pane.setId("run-settings-pane");
    pane.setExpanded(false);
    setUnit(ForceUnit.N);
    preset.setValue(test.get());
    apply(RunPreset.of(test.get()));
  }

  Parent node() {
    return pane;
  }

  /** The test type changed: its preset's values in the fields, and its end rule's fields. */
  void testChanged(TestType t) {
    if (t == preset.getValue()) {
      apply(RunPreset.of(t)); // chosen already: no change to act on
    } else {
      preset.setValue(t); // applies it
    }
  }

  /** Fills the fields from a preset (in the display unit). */
  void apply(RunPreset p) {
    filling = true;
    start.set(unit.fromNewtons(p.startThreshold_N()));
    drop.set(p.breakDropPct());
    tail.set(p.postBreak_s());
    limit.set(p.maxSeconds());
    CrushEnd c = p.crushEnd() != null ? p.crushEnd() : CrushEnd.DEFAULTS;
    travel.set(c.travelLimit_mm());
    lowPct.set(100 * c.lowForceFraction());
    lowS.set(c.lowForce_s());
    filling = false;
    check();
  }

  /** The display unit changed: the start force is shown in it (the value in N unchanged). */
  void setUnit(ForceUnit u) {
    Double start_N = start.valueOrNull(unit);
    unit = u;
    startUnit.setText(u.symbol());
    if (start_N != null) {
      filling = true;
      start.set(u.fromNewtons(start_N));
      filling = false;
    }
  }

  /**
   * The run settings from the fields, for the run's test type.
   *
   * @return a builder with the fields' values (its rated capacity is the run set-up's)
   * @throws LoadstoneException naming the field and the fix; also shown under the field
   */
  RunSettings.Builder builder() {
    clearFaults();
    boolean crush = test.get() == TestType.CRUSH;
    // each field on its own first, so every bad field shows its fault, not only the first
    LoadstoneException first = null;
    for (Entry e : entries) {
      if (crush || !e.crushOnly) {
        try {
          alone(e);
        } catch (LoadstoneException bad) {
          e.fault(bad.getMessage());
          first = first == null ? bad : first;
        }
      }
    }
    if (first != null) {
      pane.setExpanded(true);
      throw first;
    }
    try {
      RunSettings.Builder b = RunSettings.builder()
          .startThreshold_N(unit.toNewtons(start.number()))
          .breakDropPct(drop.number()).postBreak_s(tail.number()).maxSeconds(limit.number());
      if (crush) {
        b.crushEnd(new CrushEnd(travel.number(), lowPct.number() / 100, lowS.number()));
      }
      // together, as the run will check them (its capacity is set and checked at arming)
      b.ratedCapacity_N(Double.MAX_VALUE).build();
      return b;
    } catch (LoadstoneException e) {
      show(e);
      throw e;
    }
  }

  /** Checks one field's value with the others at their defaults: its own range only. */
  private void alone(Entry e) {
    double v = e.number();
    RunSettings.Builder b = RunSettings.builder().ratedCapacity_N(Double.MAX_VALUE);
    CrushEnd d = CrushEnd.DEFAULTS;
    switch (e.setting) {
      case START_THRESHOLD -> b.startThreshold_N(unit.toNewtons(v)).build();
      case BREAK_DROP -> b.breakDropPct(v).build();
      case TAIL -> b.postBreak_s(v).build();
      case TIME_LIMIT -> b.maxSeconds(v).build();
      case TRAVEL_LIMIT -> new CrushEnd(v, d.lowForceFraction(), d.lowForce_s());
      case LOW_FORCE_LEVEL -> new CrushEnd(d.travelLimit_mm(), v / 100, d.lowForce_s());
      case LOW_FORCE_TIME -> new CrushEnd(d.travelLimit_mm(), d.lowForceFraction(), v);
      default -> throw new IllegalStateException("no field for " + e.setting);
    }
  }

  /** Checks the fields as typed; a fault is shown under its field. */
  private void check() {
    boolean crush = test.get() == TestType.CRUSH;
    for (Entry e : new Entry[] {travel, lowPct, lowS}) {
      e.show(crush);
    }
    try {
      builder();
    } catch (LoadstoneException shown) {
      // under its field
    }
  }

  /**
   * Shows a failure under the fields of the settings it names (e.g. the start threshold refused
   * at arming against the cell's capacity).
   *
   * @return whether a field of this section was concerned
   */
  boolean show(LoadstoneException e) {
    boolean any = false;
    for (Entry x : entries) {
      if (e.settings().contains(x.setting)) {
        x.fault(e.getMessage());
        pane.setExpanded(true);
        any = true;
      }
    }
    return any;
  }

  private void clearFaults() {
    for (Entry e : entries) {
      e.fault(null);
    }
  }

  /** @return the fields, in N, seconds and per cent, for the form's memory */
  Map<String, String> values() {
    Map<String, String> m = new LinkedHashMap<>();
    Double start_N = start.valueOrNull(unit);
    m.put("start_N", start_N == null ? start.field.getText().trim() : fmt(start_N));
    m.put("drop_pct", drop.field.getText().trim());
    m.put("tail_s", tail.field.getText().trim());
    m.put("time_limit_s", limit.field.getText().trim());
    m.put("travel_limit_mm", travel.field.getText().trim());
    m.put("low_force_pct", lowPct.field.getText().trim());
    m.put("low_force_s", lowS.field.getText().trim());
    return m;
  }

  /** Fills the fields from the form's memory (missing entries keep the preset's values). */
  void restore(Map<String, String> values) {
    filling = true;
    String s = values.get("start_N");
    if (s != null) {
      try {
        start.set(unit.fromNewtons(Double.parseDouble(s)));
      } catch (NumberFormatException bad) {
        start.field.setText(s);
      }
    }
    restore(values, "drop_pct", drop);
    restore(values, "tail_s", tail);
    restore(values, "time_limit_s", limit);
    restore(values, "travel_limit_mm", travel);
    restore(values, "low_force_pct", lowPct);
    restore(values, "low_force_s", lowS);
    filling = false;
    check();
  }

  private static void restore(Map<String, String> values, String key, Entry e) {
    String v = values.get(key);
    if (v != null) {
      e.field.setText(v);
    }
  }

  static String fmt(double v) {
    return String.format(Locale.ROOT, "%.6g", v).replaceAll("\\.?0+($|e)", "$1");
  }

  /** One setting: its field, its label and the line under it for a fault. */
  private static final class Entry {
    final TextField field = new TextField();
    final Label name;
    final Label fault = new Label();
    final Setting setting;
    /** Only a crush run has this setting. */
    final boolean crushOnly;
    private Label unitLabel;

    Entry(String id, String name, Setting setting) {
      this.setting = setting;
      this.crushOnly = setting == Setting.TRAVEL_LIMIT || setting == Setting.LOW_FORCE_LEVEL
          || setting == Setting.LOW_FORCE_TIME;
      this.name = new Label(name);
      this.name.setMinWidth(Label.USE_PREF_SIZE);
      field.setId(id);
      field.setPrefColumnCount(6);
      fault.setId(id.replace("-field", "-fault"));
      fault.getStyleClass().add("field-fault");
      fault.setWrapText(true);
      fault.setMaxWidth(320);
      fault(null);
    }

    int place(GridPane g, int row, Label unit) {
      unitLabel = unit;
      g.addRow(row, name, field, unit);
      g.add(fault, 0, row + 1, 3, 1);
      return row + 2;
    }

    void set(double v) {
      field.setText(fmt(v));
    }

    void show(boolean on) {
      for (javafx.scene.Node n : new javafx.scene.Node[] {name, field, unitLabel}) {
        n.setVisible(on);
        n.setManaged(on);
      }
      if (!on) {
        fault(null);
      }
    }

    void fault(String why) {
      fault.setText(why == null ? "" : why);
      fault.setVisible(why != null);
      fault.setManaged(why != null);
      if (why == null) {
        field.getStyleClass().remove("field-bad");
      } else if (!field.getStyleClass().contains("field-bad")) {
        field.getStyleClass().add("field-bad");
      }
    }

    /** @return the value in N when this field holds a force in {@code unit}, else null */
    Double valueOrNull(ForceUnit unit) {
      try {
        return unit.toNewtons(number());
      } catch (LoadstoneException e) {
        return null;
      }
    }

    /** @throws LoadstoneException naming the field and what to type */
    double number() {
      String t = field.getText().trim().replace(',', '.');
      try {
        double v = Double.parseDouble(t);
        if (Double.isFinite(v)) {
          return v;
        }
      } catch (NumberFormatException e) {
        // said below
      }
      throw new LoadstoneException("the " + setting.label() + " '" + field.getText().trim()
          + "' is not a number: type one such as " + example(), setting);
    }

    private String example() {
      return switch (setting) {
        case START_THRESHOLD -> "5";
        case BREAK_DROP -> "40";
        case TIME_LIMIT -> "600 (or 0 for none)";
        case TRAVEL_LIMIT -> "12 (or 0 for none)";
        case LOW_FORCE_LEVEL -> "5";
        default -> "0.5";
      };
    }
  }
}
