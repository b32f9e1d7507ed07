package org.loadstone.ui;

import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;
import javafx.beans.binding.Bindings;
import javafx.beans.property.IntegerProperty;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.SimpleIntegerProperty;
import javafx.beans.property.SimpleObjectProperty;
import javafx.geometry.Pos;
import javafx.scene.Node;
import javafx.scene.Parent;
import javafx.scene.Scene;
import javafx.scene.control.Button;
import javafx.scene.control.Label;
import javafx.scene.layout.HBox;
import javafx.scene.layout.StackPane;

/**
 * The console's look: dark or light ({@link Theme}) and the text size, laid over every control,
 * table and chart of a window, and remembered in the console's home folder for the next start.
 * The big force readout also follows the window's size. On the JavaFX thread.
 */
final class Look {
  static final String FILE = "console-look.jsonl";
  /** Text sizes offered, in per cent of the console's base of 13 px. */
  static final int SMALLEST_PCT = 80;
  static final int LARGEST_PCT = 200;
  static final int STEP_PCT = 10;
  /** The readout's size in a 1280×800 window at 100 %, in px. */
  static final double READOUT_PX = 88;

  private final ObjectProperty<Theme> theme = new SimpleObjectProperty<>(Theme.DARK);
  private final IntegerProperty sizePct = new SimpleIntegerProperty(100);
  private final FormMemory memory;

  /** A look remembered in {@code home} (or the dark look at 100 % when none is). */
  Look(Path home) {
    memory = home == null ? null : new FormMemory(home, FILE);
    if (memory != null) {
      Map<String, String> last = memory.last();
      theme.set(Theme.parse(last.get("theme")));
      sizePct.set(clamp(parse(last.get("text_size_pct"))));
    }
  }

  ObjectProperty<Theme> theme() {
    return theme;
  }

  IntegerProperty sizePct() {
    return sizePct;
  }

  /** @return the text size as a factor, 1 for 100 % */
  double scale() {
    return sizePct.get() / 100.0;
  }

  /** Sets the text size, held to 80–200 %. */
  void size(int pct) {
    sizePct.set(clamp(pct));
  }

  /**
   * Lays the look over a window and keeps it there: stylesheets, the base text size, every chart
   * (charts added later are caught after the next layout), the readout's size; a change is
   * remembered.
   */
  void install(Scene scene) {
    Runnable apply = () -> {
      scene.getStylesheets().setAll(
          Look.class.getResource("/org/loadstone/ui/console.css").toExternalForm());
      String extra = theme.get().stylesheet();
      if (extra != null) {
        scene.getStylesheets().add(Look.class.getResource(extra).toExternalForm());
      }
      Parent root = scene.getRoot();
      root.getStyleClass().removeIf(c -> c.startsWith("look-"));
      root.getStyleClass().add("look-" + theme.get().word());
      root.setStyle(String.format(Locale.ROOT, "-fx-font-size: %.1fpx;", 13 * scale()));
      ChartLook.applyAll(root, theme.get(), scale());
    };
    apply.run();
    theme.addListener((o, a, b) -> {
      apply.run();
      remember();
    });
    sizePct.addListener((o, a, b) -> {
      apply.run();
      remember();
    });
    scene.addPostLayoutPulseListener(() -> ChartLook.applyAll(scene.getRoot(), theme.get(),
        scale()));
    Node readout = scene.lookup("#force-value");
    if (readout != null) {
      readout.styleProperty().bind(Bindings.createStringBinding(() -> String.format(Locale.ROOT,
          "-fx-font-size: %.0fpx;", readoutPx(scene.getWidth(), scene.getHeight(), scale())),
          scene.widthProperty(), scene.heightProperty(), sizePct));
    }
  }

  /**
   * @param n a node in a window
   * @return the look laid over its window, or null when none is (a window without a look draws
   *     its charts in the colours they were built with)
   */
  static Theme themeOf(Node n) {
    Scene s = n.getScene();
    if (s == null || s.getRoot() == null) {
      return null;
    }
    for (Theme t : Theme.values()) {
      if (s.getRoot().getStyleClass().contains("look-" + t.word())) {
        return t;
      }
    }
    return null;
  }

  /**
   * The readout's size: {@link #READOUT_PX} at 1280×800 and 100 %, in proportion to the window's
   * smaller side ratio and to the text size, never under 36 px.
   */
  static double readoutPx(double width, double height, double scale) {
    double byWindow = Math.min(width / 1280, height / 800);
    return Math.max(36, READOUT_PX * byWindow * scale);
  }

  /**
   * The window's content with the look's controls in the top right corner, over the row of tabs
   * (so they take no height from the workspaces).
   */
  Parent withControls(Parent content) {
    Button theme = new Button();
    theme.setId("look-theme");
    theme.textProperty().bind(Bindings.createStringBinding(
        () -> this.theme.get() == Theme.DARK ? "light look" : "dark look", this.theme));
    theme.setOnAction(e -> this.theme.set(this.theme.get() == Theme.DARK ? Theme.LIGHT
        : Theme.DARK));
    Button smaller = new Button("A−");
    smaller.setId("look-smaller");
    smaller.setOnAction(e -> size(sizePct.get() - STEP_PCT));
    Button larger = new Button("A+");
    larger.setId("look-larger");
    larger.setOnAction(e -> size(sizePct.get() + STEP_PCT));
    Label size = new Label();
    size.setId("look-size");
    size.textProperty().bind(Bindings.createStringBinding(() -> "text " + sizePct.get() + " %",
        sizePct));
    for (Button b : new Button[] {theme, smaller, larger}) {
      b.setFocusTraversable(false); // the one-key commands keep the focus
    }
    HBox bar = new HBox(6, size, smaller, larger, theme);
    bar.getStyleClass().add("look-bar");
    bar.setAlignment(Pos.TOP_RIGHT);
    bar.setPickOnBounds(false);
    bar.setMaxSize(HBox.USE_PREF_SIZE, HBox.USE_PREF_SIZE);
    StackPane.setAlignment(bar, Pos.TOP_RIGHT);
    StackPane stack = new StackPane(content, bar);
    stack.getStyleClass().add("look-root");
    return stack;
  }

  private void remember() {
    if (memory != null) {
      memory.remember(Map.of("theme", theme.get().word(),
          "text_size_pct", Integer.toString(sizePct.get())));
    }
  }

  private static int clamp(int pct) {
    int stepped = Math.round(pct / (float) STEP_PCT) * STEP_PCT;
    return Math.max(SMALLEST_PCT, Math.min(LARGEST_PCT, stepped));
  }

  private static int parse(String text) {
    try {
      return text == null ? 100 : Integer.parseInt(text.trim());
    } catch (NumberFormatException e) {
      return 100;
    }
  }
}
