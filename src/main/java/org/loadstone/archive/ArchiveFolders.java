package org.loadstone.archive;

import java.nio.file.Path;

/** Where runs go when the user does not say. */
public final class ArchiveFolders {
  private ArchiveFolders() {}

  /**
   * @return the user's archive folder: {@code $LOADSTONE_ARCHIVE} when set, else the config
   *     file's {@code archive}, else {@code ~/loadstone-runs} ({@link
   *     org.loadstone.config.UserConfig})
   */
  public static Path defaultFolder() {
    return Path.of(org.loadstone.config.UserConfig.current().value(
        org.loadstone.config.UserConfig.Key.ARCHIVE));
  }
}
