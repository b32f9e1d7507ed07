package org.loadstone;

import org.loadstone.cli.LoadstoneCommand;

/** Entry point: with no arguments the console window opens; otherwise a command runs. */
public final class Main {
  private Main() {}

  public static void main(String[] args) {
    System.exit(LoadstoneCommand.run(args.length == 0 ? new String[] {"console"} : args));
  }
}
