package org.loadstone.ui;

import java.util.logging.Level;
import java.util.logging.Logger;
import javafx.application.Application;
import org.loadstone.units.LoadstoneException;

/**
 * Starts the JavaFX console. A separate class from the {@link Application} so the program runs from
 * a plain (non-modular) jar.
 */
public final class ConsoleLauncher {
  /**
   * JavaFX warns on every start that it was loaded from a plain jar, which is how Loadstone ships
   * and is harmless; held here so the setting is not lost with the logger.
   */
  private static final Logger JAVAFX_LOG = Logger.getLogger("javafx");

  private ConsoleLauncher() {}

  /**
   * Opens the console window and returns when it is closed.
   *
   * @throws LoadstoneException when there is no display to open a window on, with what to do
   */
  public static void launch(String[] args) {
    JAVAFX_LOG.setLevel(Level.SEVERE);
    try {
      Application.launch(ConsoleApp.class, args);
    } catch (UnsupportedOperationException e) {
      throw new LoadstoneException(noDisplay(e.getMessage()), e);
    }
  }

  /** The message for a window system JavaFX could not start on ({@code why} is its reason). */
  static String noDisplay(String why) {
    return "the console window cannot open (" + why + "). It needs a desktop session: on Linux "
        + "an X11 or Wayland display and GTK 3 (Debian and Ubuntu package libgtk-3-0); over SSH, "
        + "connect with 'ssh -X'. Every other command works without a display, for example "
        + "'loadstone monitor --port sim' or 'loadstone record --port sim --specimen S1'.";
  }
}
