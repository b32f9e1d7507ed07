package org.loadstone.cli;

import java.io.PrintWriter;
import org.loadstone.units.LoadstoneException;
import picocli.CommandLine;
import picocli.CommandLine.Command;

/** The {@code loadstone} command and its subcommands. */
@Command(
    name = "loadstone",
    mixinStandardHelpOptions = true,
    versionProvider = LoadstoneCommand.Version.class,
    description = {
      "Load-frame acquisition and live-test console.",
      "With no command, the console window opens on the built-in simulated frame."
    },
    subcommands = {
      PortsCommand.class,
      MonitorCommand.class,
      SimulateCommand.class,
      ConsoleCommand.class,
      AnalyzeCommand.class,
      ImportCommand.class,
      ExportCommand.class,
      ReportCommand.class,
      CommandLine.HelpCommand.class
    })
public final class LoadstoneCommand implements Runnable {
  /** Exit code for an expected failure the user can fix (bad file, missing port, bad entry). */
  public static final int EXIT_USER_ERROR = 2;
  /** Exit code when the device was lost during a command. */
  public static final int EXIT_DEVICE_LOST = 3;
  /** Exit code for an unexpected internal failure. */
  public static final int EXIT_INTERNAL = 70;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public void run() {
    spec.commandLine().usage(spec.commandLine().getOut());
  }

  /** Runs a command line and returns its exit code. */
  public static int run(String... args) {
    CommandLine cl = new CommandLine(new LoadstoneCommand());
    cl.setExecutionExceptionHandler(
        (ex, commandLine, parseResult) -> {
          PrintWriter err = commandLine.getErr();
          if (ex instanceof LoadstoneException) {
            err.println("loadstone: " + ex.getMessage());
            err.flush();
            return EXIT_USER_ERROR;
          }
          err.println("loadstone: internal error: " + ex);
          ex.printStackTrace(err);
          err.println("This is a bug in Loadstone; please report it with the lines above.");
          err.flush();
          return EXIT_INTERNAL;
        });
    return cl.execute(args);
  }

  /** Reports the version from the jar manifest. */
  public static final class Version implements CommandLine.IVersionProvider {
    @Override
    public String[] getVersion() {
      return new String[] {"loadstone " + softwareVersion()};
    }
  }

  /** @return the software version from the jar manifest, or {@code dev} when run from classes */
  public static String softwareVersion() {
    String v = LoadstoneCommand.class.getPackage().getImplementationVersion();
    return v == null ? "dev" : v;
  }
}
