package org.loadstone.cli;

import java.nio.file.Path;
import picocli.CommandLine.Option;

/** The {@code --archive DIR} option shared by the commands that read or write runs. */
public final class ArchiveOption {
  @Option(
      names = "--archive",
      paramLabel = "DIR",
      description = "Run archive folder (default: $LOADSTONE_ARCHIVE, else ~/loadstone-runs).")
  Path archive;

  /** @return the archive folder to use */
  public Path folder() {
    if (archive != null) {
      return archive;
    }
    String env = System.getenv("LOADSTONE_ARCHIVE");
    if (env != null && !env.isBlank()) {
      return Path.of(env);
    }
    return Path.of(System.getProperty("user.home"), "loadstone-runs");
  }
}
