package org.loadstone.ui;

import javafx.application.Application;

/**
 * Starts the JavaFX console. A separate class from the {@link Application} so the program runs from
 * a plain (non-modular) jar.
 */
public final class ConsoleLauncher {
  private ConsoleLauncher() {}

  /** Opens the console window and returns when it is closed. */
  public static void launch(String[] args) {
    Application.launch(ConsoleApp.class, args);
  }
}
