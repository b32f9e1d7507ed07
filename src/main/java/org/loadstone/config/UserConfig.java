package org.loadstone.config;

import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;
import org.loadstone.units.TextFiles;

/**
 * The user's own defaults, so that the archive, the port, the calibration and the operator need
 * not be typed for every run: each from its environment variable, else from the
 * config file, else built in. What is typed for one command always wins over these.
 *
 * <p>The config file is {@code $LOADSTONE_CONFIG} when set, else {@code
 * $XDG_CONFIG_HOME/loadstone/config.properties}, else {@code ~/.config/loadstone/config.properties}:
 * {@code key = value} lines, {@code #} comments. A path value starting with {@code ~/} is in the
 * home folder; a relative one is relative to the config file's folder.
 *
 * @param file the config file looked for (it may not exist), not null
 * @param settings every {@link Key} with its effective value and where it came from, not null
 * @param problems lines of the config file that were not used, naming the file, line and fix
 */
public record UserConfig(Path file, Map<Key, Setting> settings, List<String> problems) {

  /** What can be set. */
  public enum Key {
    /** the archive folder */
    ARCHIVE("archive", "LOADSTONE_ARCHIVE", true),
    /** the serial port (or {@code sim}) */
    PORT("port", "LOADSTONE_PORT", false),
    /** the calibration file used to record */
    CALIBRATION("calibration", "LOADSTONE_CALIBRATION", true),
    /** who runs the tests */
    OPERATOR("operator", "LOADSTONE_OPERATOR", false);

    private final String word;
    private final String variable;
    private final boolean path;

    Key(String word, String variable, boolean path) {
      this.word = word;
      this.variable = variable;
      this.path = path;
    }

    /** @return its name in the config file, e.g. {@code force-unit} */
    public String word() {
      return word;
    }

    /** @return its environment variable, e.g. {@code LOADSTONE_PORT} */
    public String variable() {
      return variable;
    }
  }

  /**
   * One effective value.
   *
   * @param key what it sets
   * @param value the value, null when nothing sets it
   * @param source where it came from, in words ("environment LOADSTONE_PORT", "config file F
   *     line 3", "built in", "not set")
   */
  public record Setting(Key key, String value, String source) {}

  /** Copies the collections. */
  public UserConfig {
    Precondition.notNull(file, "file");
    settings = Map.copyOf(settings);
    problems = List.copyOf(problems);
  }

  /** @return the defaults of this process: its environment and the user's home */
  public static UserConfig current() {
    return load(System.getenv(), Path.of(System.getProperty("user.home")));
  }

  /**
   * Reads the defaults from an environment and a home folder.
   *
   * @param env environment variables, not null
   * @param home the user's home folder, not null
   * @throws LoadstoneException when the config file exists but cannot be read
   */
  public static UserConfig load(Map<String, String> env, Path home) {
    Precondition.notNull(env, "env");
    Precondition.notNull(home, "home");
    Path file = configFile(env, home);
    Map<Key, Setting> fromFile = new EnumMap<>(Key.class);
    List<String> problems = new ArrayList<>();
    if (Files.isRegularFile(file)) {
      readFile(file, home, fromFile, problems);
    }
    Map<Key, Setting> out = new EnumMap<>(Key.class);
    for (Key k : Key.values()) {
      String e = env.get(k.variable);
      if (e != null && !e.isBlank()) {
        String v = k.path ? path(e.strip(), home, home).toString() : e.strip();
        out.put(k, new Setting(k, v,
            "environment " + k.variable));
      } else if (fromFile.containsKey(k)) {
        out.put(k, fromFile.get(k));
      } else if (k == Key.ARCHIVE) {
        out.put(k, new Setting(k, home.resolve("loadstone-runs").toString(), "built in"));
      } else {
        out.put(k, new Setting(k, null, "not set"));
      }
    }
    return new UserConfig(file, out, problems);
  }

  /** @return the effective value of a key, null when nothing sets it */
  public String value(Key k) {
    return settings.get(k).value();
  }

  /** @return the effective settings in the order of {@link Key} */
  public List<Setting> list() {
    return java.util.Arrays.stream(Key.values()).map(settings::get).toList();
  }

  private static Path configFile(Map<String, String> env, Path home) {
    String own = env.get("LOADSTONE_CONFIG");
    if (own != null && !own.isBlank()) {
      return path(own.strip(), home, home);
    }
    String xdg = env.get("XDG_CONFIG_HOME");
    Path base = xdg != null && !xdg.isBlank() && Path.of(xdg.strip()).isAbsolute()
        ? Path.of(xdg.strip()) : home.resolve(".config");
    return base.resolve("loadstone").resolve("config.properties");
  }

  private static void readFile(Path file, Path home, Map<Key, Setting> out,
      List<String> problems) {
    String[] lines = TextFiles.read(file, "config file").split("\r?\n", -1);
    for (int i = 0; i < lines.length; i++) {
      String line = lines[i].strip();
      if (line.isEmpty() || line.startsWith("#")) {
        continue;
      }
      String where = "config file " + file + " line " + (i + 1);
      int eq = line.indexOf('=');
      if (eq < 0) {
        problems.add(where + " is not 'key = value': write it so, or start it with # to keep it "
            + "as a comment");
        continue;
      }
      String name = line.substring(0, eq).strip().toLowerCase(Locale.ROOT);
      String v = line.substring(eq + 1).strip();
      Key key = java.util.Arrays.stream(Key.values()).filter(k -> k.word.equals(name))
          .findFirst().orElse(null);
      if (key == null) {
        problems.add(where + ": unknown key '" + name + "'; the keys are " + String.join(", ",
            java.util.Arrays.stream(Key.values()).map(Key::word).toList()));
        continue;
      }
      if (v.isEmpty()) {
        continue;
      }
      try {
        String value = key.path ? path(v, home, file.toAbsolutePath().getParent()).toString() : v;
        out.put(key, new Setting(key, value, where));
      } catch (LoadstoneException e) {
        problems.add(e.getMessage());
      }
    }
  }

  private static Path path(String v, Path home, Path relativeTo) {
    try {
      if (v.equals("~")) {
        return home;
      }
      if (v.startsWith("~/")) {
        return home.resolve(v.substring(2));
      }
      Path p = Path.of(v);
      return p.isAbsolute() ? p : relativeTo.resolve(p);
    } catch (InvalidPathException e) {
      throw new LoadstoneException("'" + v + "' is not a path: give a folder or file name");
    }
  }
}
