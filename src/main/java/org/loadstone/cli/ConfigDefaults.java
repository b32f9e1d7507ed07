package org.loadstone.cli;

import java.util.Set;
import org.loadstone.config.UserConfig;
import org.loadstone.config.UserConfig.Key;
import picocli.CommandLine;
import picocli.CommandLine.Model.ArgSpec;
import picocli.CommandLine.Model.OptionSpec;

/**
 * Gives the options the user's defaults ({@link UserConfig}) when they are not typed: {@code
 * --archive} everywhere, {@code --port}, the calibration of the commands that record with it,
 * and the operator of those that ask who. Anything typed wins.
 */
final class ConfigDefaults implements CommandLine.IDefaultValueProvider {
  /** Commands whose {@code --cal} is the calibration to record or check with. */
  private static final Set<String> RECORDING = Set.of("record", "console", "verify");
  /** Commands whose {@code --operator} or {@code --by} is the person at the press. */
  private static final Set<String> WHO = Set.of("record", "calibrate", "amend", "retire");

  private final UserConfig config;

  ConfigDefaults(UserConfig config) {
    this.config = config;
  }

  /** @return the defaults these options take */
  UserConfig config() {
    return config;
  }

  @Override
  public String defaultValue(ArgSpec arg) {
    if (!(arg instanceof OptionSpec o) || arg.command() == null) {
      return null;
    }
    String command = arg.command().name();
    Key key = switch (o.longestName()) {
      case "--archive" -> Key.ARCHIVE;
      case "--port" -> Key.PORT;
      case "--cal" -> RECORDING.contains(command) ? Key.CALIBRATION : null;
      case "--operator" -> command.equals("amend") ? null : WHO.contains(command)
          ? Key.OPERATOR : null;
      case "--by" -> WHO.contains(command) ? Key.OPERATOR : null;
      default -> null;
    };
    return key == null ? null : config.value(key);
  }
}
