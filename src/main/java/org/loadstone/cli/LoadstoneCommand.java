package org.loadstone.cli;

import java.io.InputStream;
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
      "With no command, the console window opens on the built-in simulated frame.",
      "With --json a command writes one JSON document on standard output and its text on "
          + "standard error."
    },
    exitCodeListHeading = "%nExit codes:%n",
    exitCodeList = {
      "  0:done",
      "  1:verify: the check failed; calibrate, verify: stopped by the operator, nothing saved",
      "  2:bad usage or input: the message names the fault and the fix",
      "  3:the device was lost or restarted (record stores the run recorded until then)",
      "  4:monitor: no samples came (a silent port, or bytes that are not samples)",
      "  5:record: the archive's disk filled during the run (the run is stored up to then)",
      " 70:internal error (a bug; please report it)",
      "130:record: stopped by Ctrl-C (the run recorded until then is stored and printed)"
    },
    subcommands = {
      PortsCommand.class,
      MonitorCommand.class,
      SimulateCommand.class,
      ConsoleCommand.class,
      RecordCommand.class,
      CalibrateCommand.class,
      VerifyCommand.class,
      RunsCommand.class,
      CompareCommand.class,
      AnalyzeCommand.class,
      AmendCommand.class,
      RetireCommand.class,
      ImportCommand.class,
      ExportCommand.class,
      ReportCommand.class,
      FrameCommand.class,
      TrackCommand.class,
      ConfigCommand.class,
      picocli.AutoComplete.GenerateCompletion.class,
      CommandLine.HelpCommand.class
    })
public final class LoadstoneCommand implements Runnable {
  /** Exit code for an expected failure the user can fix (bad file, missing port, bad entry). */
  public static final int EXIT_USER_ERROR = 2;
  /**
   * Exit code when the device was lost or restarted during a command ({@code record}: while
   * zeroing, armed or recording; a run recorded until then is stored, its cause saying which).
   */
  public static final int EXIT_DEVICE_LOST = 3;
  /**
   * Exit code when a device sent no samples at all ({@code monitor}: a silent port, or bytes
   * that are not samples).
   */
  public static final int EXIT_NO_DATA = 4;
  /**
   * Exit code of {@code record} when the archive's disk filled during the run: the run is stored
   * up to the last sample received, with cause {@code disk-full}; the message says what was kept.
   */
  public static final int EXIT_DISK_FULL = 5;
  /** Exit code for an unexpected internal failure. */
  public static final int EXIT_INTERNAL = 70;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public void run() {
    spec.commandLine().usage(spec.commandLine().getOut());
  }

  /** Runs a command line on the process's standard streams and returns its exit code. */
  public static int run(String... args) {
    return run(System.in, null, null, args);
  }

  /**
   * Runs a command line with its output and messages going to the given writers (null: the
   * process's standard streams) and returns its exit code.
   */
  public static int run(PrintWriter out, PrintWriter err, String... args) {
    return run(System.in, out, err, args);
  }

  /**
   * Runs a command line with the given standard input, output and error (for tests and for
   * embedding) and returns its exit code.
   *
   * @param in answers for the commands that ask questions; not null
   * @param stdout standard output, or null for the process's
   * @param stderr standard error, or null for the process's
   */
  public static int run(InputStream in, PrintWriter stdout, PrintWriter stderr, String... args) {
    return run(in, stdout, stderr, org.loadstone.config.UserConfig.current(), args);
  }

  /**
   * As {@link #run(InputStream, PrintWriter, PrintWriter, String...)} with the user's defaults
   * given (tests give their own instead of the process's environment and home).
   */
  public static int run(InputStream in, PrintWriter stdout, PrintWriter stderr,
      org.loadstone.config.UserConfig config, String... args) {
    CommandLine cl = new CommandLine(new LoadstoneCommand(), CommandInput.factory(in));
    cl.setDefaultValueProvider(new ConfigDefaults(config));
    cl.getSubcommands().get("generate-completion").getCommandSpec().usageMessage().hidden(true);
    for (CommandLine sub : cl.getSubcommands().values()) {
      if (!(sub.getCommand() instanceof CommandLine.HelpCommand)) {
        sub.getCommandSpec().mixinStandardHelpOptions(true);
      }
    }
    // lower-case option names, matched without regard to case (--capacity-N still works)
    cl.setOptionsCaseInsensitive(true);
    cl.setUsageHelpAutoWidth(true);
    OptionRules.install(cl);
    if (stdout != null) {
      cl.setOut(stdout);
    }
    if (stderr != null) {
      cl.setErr(stderr);
    }
    cl.setParameterExceptionHandler(LoadstoneCommand::usageHint);
    args = OptionAliases.rewrite(args, cl.getSubcommands().keySet(), cl.getErr());
    cl.setExecutionExceptionHandler(
        (ex, commandLine, parseResult) -> {
          PrintWriter w = commandLine.getErr();
          if (ex instanceof LoadstoneException le) {
            w.println("loadstone: " + CliHints.withHow(le, commandLine));
            w.flush();
            return le instanceof org.loadstone.acquire.DeviceLostException ? EXIT_DEVICE_LOST
                : EXIT_USER_ERROR;
          }
          w.println("loadstone: internal error: " + ex);
          ex.printStackTrace(w);
          w.println("This is a bug in Loadstone; please report it with the lines above.");
          w.flush();
          return EXIT_INTERNAL;
        });
    try {
      return cl.execute(args);
    } catch (OutOfMemoryError e) {
      // an Error passes picocli's handler; the heap is short, so say it plainly and end
      PrintWriter w = cl.getErr();
      w.println("loadstone: ran out of memory (" + e.getMessage() + ") with the "
          + Runtime.getRuntime().maxMemory() / (1 << 20) + " MiB of heap this program was "
          + "given: start it with more, e.g. java -Xmx1g -jar loadstone.jar …; a run being "
          + "recorded stays in the archive's .journal folder and is stored by the next record "
          + "or console start");
      w.flush();
      return EXIT_INTERNAL;
    }
  }

  /**
   * A usage error: the fault, the command's synopsis and where the full help is, instead of the
   * whole help text.
   */
  private static int usageHint(CommandLine.ParameterException ex, String[] args) {
    CommandLine cmd = ex.getCommandLine();
    PrintWriter err = cmd.getErr();
    err.println("loadstone: " + ex.getMessage());
    CommandLine.UnmatchedArgumentException.printSuggestions(ex, err);
    cmd.getCommandSpec().usageMessage().abbreviateSynopsis(true);
    String synopsis = cmd.getHelp().synopsis(0).strip();
    err.println("usage: " + synopsis.replaceAll("\\s+", " "));
    err.println("see '" + cmd.getCommandSpec().qualifiedName() + " --help'");
    err.flush();
    return EXIT_USER_ERROR;
  }

  /** Reports the version from the jar manifest. */
  public static final class Version implements CommandLine.IVersionProvider {
    @Override
    public String[] getVersion() {
      return new String[] {"loadstone " + softwareVersion()};
    }
  }

  /** @return the software version ({@link org.loadstone.units.SoftwareVersion}, its one home) */
  public static String softwareVersion() {
    return org.loadstone.units.SoftwareVersion.get();
  }
}
