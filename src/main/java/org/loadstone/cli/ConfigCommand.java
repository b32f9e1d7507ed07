package org.loadstone.cli;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.loadstone.config.UserConfig;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code loadstone config}: the user's defaults in effect and where each comes from. */
@Command(
    name = "config",
    description = {
      "Show the defaults in effect and where each comes from.",
      "",
      "Archive, port, calibration, operator, and the force and length units of imported "
          + "files whose header states none: an option typed wins, then the environment "
          + "(LOADSTONE_ARCHIVE, _PORT, _CALIBRATION, _OPERATOR, _FORCE_UNIT, _LENGTH_UNIT), "
          + "then the config file ($LOADSTONE_CONFIG, else "
          + "$XDG_CONFIG_HOME/loadstone/config.properties, else "
          + "~/.config/loadstone/config.properties: 'key = value' lines), then what is built in."
    })
public final class ConfigCommand implements Callable<Integer> {
  @Option(names = "--json", description = "Write the settings as one JSON document on standard output (schema loadstone-config); the text goes to standard error.")
  boolean json;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public Integer call() throws Exception {
    UserConfig c = ConfigDefaults.of(spec);
    PrintWriter out = JsonDocument.human(spec, json);
    PrintWriter err = spec.commandLine().getErr();
    if (json) {
      Map<String, Object> j = new LinkedHashMap<>();
      j.put("config_file", c.file().toString());
      j.put("config_file_exists", Files.isRegularFile(c.file()));
      List<Map<String, Object>> rows = c.list().stream().map(s -> {
        Map<String, Object> r = new LinkedHashMap<>();
        r.put("key", s.key().word());
        r.put("value", s.value());
        r.put("source", s.source());
        r.put("environment_variable", s.key().variable());
        return r;
      }).toList();
      j.put("settings", rows);
      j.put("problems", c.problems());
      JsonDocument.write(spec.commandLine().getOut(), JsonDocument.Kind.CONFIG, j);
    }
    {
      out.println("config file: " + c.file() + (Files.isRegularFile(c.file()) ? ""
          : " (none; create it with lines such as 'port = /dev/ttyACM0')"));
      for (UserConfig.Setting s : c.list()) {
        out.printf(Locale.ROOT, "  %-12s %-40s %s%n", s.key().word(),
            s.value() == null ? "-" : s.value(), s.source());
      }
    }
    for (String p : c.problems()) {
      err.println("warning: " + p);
    }
    out.flush();
    err.flush();
    return 0;
  }
}
