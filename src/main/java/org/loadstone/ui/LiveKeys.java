package org.loadstone.ui;

import java.util.Map;
import java.util.function.BooleanSupplier;
import javafx.scene.Scene;
import javafx.scene.control.TextInputControl;
import javafx.scene.input.KeyCode;
import javafx.scene.input.KeyEvent;

/**
 * The live window's one-key commands: each key's action while the live view is the one shown
 * and the keyboard is not in a text field; Esc stops from anywhere, even while typing.
 */
final class LiveKeys {
  private LiveKeys() {}

  /**
   * @param scene the window's scene
   * @param active whether the live view is the one shown
   * @param actions the action of each key
   * @param stop what Esc does
   */
  static void install(Scene scene, BooleanSupplier active, Map<KeyCode, Runnable> actions,
      Runnable stop) {
    scene.addEventHandler(KeyEvent.KEY_PRESSED, e -> {
      if (e.getCode() == KeyCode.ESCAPE) {
        stop.run(); // stop is one key from anywhere, even while typing in a field
        return;
      }
      if (!active.getAsBoolean() || e.getTarget() instanceof TextInputControl) {
        return; // typing a specimen id, or looking at the archive: not a shortcut
      }
      Runnable a = actions.get(e.getCode());
      if (a != null) {
        a.run();
      }
    });
  }
}
