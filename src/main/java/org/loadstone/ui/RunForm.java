package org.loadstone.ui;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import javafx.scene.Node;
import javafx.scene.control.TextField;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import org.loadstone.acquire.RunTemplate;
import org.loadstone.archive.SpecimenIds;
import org.loadstone.units.LoadstoneException;

/**
 * The run form: specimen id, group, mass, test type and sizes. The id must be typed (never made
 * up), counts on after each stored run (P-07 → P-08), and the whole form is remembered in the
 * console's home folder so a restarted console carries on with the batch.
 */
final class RunForm {
  private final TextField specimen = RunPanel.field("specimen-field", "specimen id");
  private final TextField group = RunPanel.field("group-field", "group (e.g. balsa)");
  private final TextField mass = RunPanel.field("mass-field", "mass (g)");
  private final SpecimenFields sizes = new SpecimenFields();
  private final RunSettingsFields settings = new RunSettingsFields(sizes::testType);
  private final FormMemory memory;
  /** The unit forces are shown in, remembered with the form. */
  private org.loadstone.units.ForceUnit unit = org.loadstone.units.ForceUnit.N;
  /** The unit remembered from the last session. */
  private org.loadstone.units.ForceUnit remembered = org.loadstone.units.ForceUnit.N;
  private static final java.util.concurrent.Executor WRITER =
      java.util.concurrent.Executors.newSingleThreadExecutor(r -> {
        Thread t = new Thread(r, "form memory");
        t.setDaemon(true);
        return t;
      });

  RunForm(java.nio.file.Path home, Runnable onEnter) {
    memory = new FormMemory(home);
    sizes.onTestChange(settings::testChanged); // a new test type: its preset
    for (TextField f : new TextField[] {specimen, group, mass}) {
      f.setOnAction(e -> onEnter.run()); // Enter after typing the specimen arms the run
    }
    restore();
  }

  /** @return the form's rows: id, group and mass, the folded sizes and run settings */
  List<Node> nodes() {
    HBox idLine = new HBox(8, group, mass);
    HBox.setHgrow(group, Priority.ALWAYS);
    mass.setPrefWidth(110);
    return List.of(specimen, idLine, sizes.node(), settings.node());
  }

  /** Whether no specimen id is typed: then no run can be armed. */
  boolean idMissing() {
    return specimen.getText().isBlank();
  }

  /** Puts the cursor in the id field. */
  void focusId() {
    specimen.requestFocus();
  }

  /**
   * The run's template from the form, checked: refused with what to type when the mass or a
   * size is not a number.
   *
   * @throws LoadstoneException naming the field and the fix
   */
  RunTemplate template() {
    Double mass_g = SpecimenFields.number(mass, "mass", "grams");
    return new RunTemplate(specimen.getText().trim(), group.getText().trim(), List.of(), "", "",
        mass_g, sizes.geometry(), sizes.testType());
  }

  /**
   * The run settings from their fields, for the test type chosen.
   *
   * @throws LoadstoneException naming the field and the fix (also shown under the field)
   */
  org.loadstone.acquire.RunSettings.Builder settings() {
    return settings.builder();
  }

  /** Forces are shown in {@code u} from now on (the start force's field too). */
  void setUnit(org.loadstone.units.ForceUnit u) {
    boolean chosen = u != unit && u != remembered; // not the start-up's own
    unit = u;
    remembered = u;
    settings.setUnit(u);
    if (chosen) {
      remember();
    }
  }

  /** @return the unit forces were shown in when the form was last remembered (N at first) */
  org.loadstone.units.ForceUnit rememberedUnit() {
    return remembered;
  }

  /** The run settings' section, e.g. to show a refusal under its field. */
  RunSettingsFields runSettings() {
    return settings;
  }

  /** @return the form as typed, field name to text (as remembered) */
  Map<String, String> values() {
    Map<String, String> m = new LinkedHashMap<>();
    m.put("specimen", specimen.getText().trim());
    m.put("group", group.getText().trim());
    m.put("mass_g", mass.getText().trim());
    m.putAll(sizes.values());
    m.putAll(settings.values());
    m.put("force_unit", unit.symbol());
    return m;
  }

  /**
   * Remembers the form as it is, written off the JavaFX thread in the order asked; not
   * remembered only means typing it again after a restart.
   */
  void remember() {
    Map<String, String> v = values();
    WRITER.execute(() -> memory.remember(v));
  }

  /**
   * After a stored run of {@code tested}: the next specimen's id in the field, unless the
   * operator has typed another meanwhile; and remembered.
   */
  void advance(String tested) {
    if (tested == null || tested.isBlank()) {
      return;
    }
    if (specimen.getText().trim().equals(tested.trim())) {
      specimen.setText(SpecimenIds.next(tested));
    }
    remember();
  }

  private void restore() {
    Map<String, String> last = memory.last();
    specimen.setText(last.getOrDefault("specimen", ""));
    group.setText(last.getOrDefault("group", ""));
    mass.setText(last.getOrDefault("mass_g", ""));
    try {
      remembered = org.loadstone.units.ForceUnit.parse(last.getOrDefault("force_unit", "N"));
    } catch (LoadstoneException unknown) {
      remembered = org.loadstone.units.ForceUnit.N;
    }
    sizes.restore(last); // a remembered test type applies its preset first…
    settings.restore(last); // …then the settings as they were last used
  }
}
