package org.loadstone.archive;

import java.nio.file.Path;

/** Where runs go when the user does not say. */
public final class ArchiveFolders {
  private ArchiveFolders() {}

  /** @return {@code $LOADSTONE_ARCHIVE} when set, else {@code ~/loadstone-runs} */
  public static Path defaultFolder() {
    String env = System.getenv("LOADSTONE_ARCHIVE");
    if (env != null && !env.isBlank()) {
      return Path.of(env);
    }
    return Path.of(System.getProperty("user.home"), "loadstone-runs");
  }
}
