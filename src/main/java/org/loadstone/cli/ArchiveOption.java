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
    return archive != null ? archive : org.loadstone.archive.ArchiveFolders.defaultFolder();
  }
}
