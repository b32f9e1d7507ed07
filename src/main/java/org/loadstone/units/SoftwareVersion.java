package org.loadstone.units;

import java.io.IOException;
import java.io.InputStream;
import java.util.Properties;

/**
 * The software's version: the one home every face reads it from (command output, run metadata,
 * imported runs, reports, the console). The build writes the project version into {@code
 * version.properties} beside this class (Maven resource filtering), so classes run from the build
 * folder (tests) know it as the jar does.
 */
public final class SoftwareVersion {
  private static final String VERSION = load();

  private SoftwareVersion() {}

  /** @return the version, e.g. {@code 0.1.0-SNAPSHOT}; {@code dev} when the build did not fill it */
  public static String get() {
    return VERSION;
  }

  private static String load() {
    try (InputStream in = SoftwareVersion.class.getResourceAsStream("version.properties")) {
      if (in != null) {
        Properties p = new Properties();
        p.load(in);
        String v = p.getProperty("version", "").trim();
        if (!v.isEmpty() && !v.startsWith("${")) {
          return v;
        }
      }
    } catch (IOException e) {
      // fall through to the manifest
    }
    String v = SoftwareVersion.class.getPackage().getImplementationVersion();
    return v == null ? "dev" : v;
  }
}
