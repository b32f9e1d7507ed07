package org.loadstone.archive;

import java.nio.file.Path;
import java.sql.Connection;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.List;

/**
 * The archive index's tables, in one place, with their versioned migrations. The version is the
 * database's {@code user_version}: 0 for a new file, {@link #VERSION} once prepared. A new version
 * adds a step to {@link #STEPS}; an index of a higher version than this program knows is refused
 * (a newer Loadstone wrote it), never changed.
 *
 * <p>{@code runs}: one row per readable sidecar, by file name: the size and modification time
 * (ns) of the sidecar and of the samples file beside it when it was read ({@code csv_size} −1
 * when there was none), the SHA-256 of both files' bytes ({@code csv_sha256} null without a
 * readable samples file) and the sidecar's text; since version 2 also the run's amendment log
 * ({@code amend_size} −1 and the rest null when it has none), its SHA-256 and text; since
 * version 3 {@code samples_problem}: null when the samples read, else why not and the fix.
 * {@code figures}: what the study computed from
 * a run, by file name and settings key, valid while the run's content hash is the one stored
 * with it.
 */
final class IndexSchema {
  /** The version this program writes and reads. */
  static final int VERSION = 3;

  /** Step {@code i} takes an index from version {@code i} to {@code i + 1}. */
  private static final List<List<String>> STEPS = List.of(
      List.of("CREATE TABLE runs (name TEXT PRIMARY KEY, json_size INTEGER NOT NULL, "
              + "json_mtime_ns INTEGER NOT NULL, csv_size INTEGER NOT NULL, "
              + "csv_mtime_ns INTEGER NOT NULL, json_sha256 TEXT NOT NULL, csv_sha256 TEXT, "
              + "sidecar TEXT NOT NULL)",
          "CREATE TABLE figures (name TEXT NOT NULL, settings_key TEXT NOT NULL, "
              + "content_sha256 TEXT NOT NULL, figures TEXT NOT NULL, "
              + "PRIMARY KEY (name, settings_key))"),
      // 2: the run's amendment log, part of its content
      List.of("ALTER TABLE runs ADD COLUMN amend_size INTEGER NOT NULL DEFAULT -1",
          "ALTER TABLE runs ADD COLUMN amend_mtime_ns INTEGER NOT NULL DEFAULT -1",
          "ALTER TABLE runs ADD COLUMN amend_sha256 TEXT",
          "ALTER TABLE runs ADD COLUMN amendments TEXT"),
      // 3: whether the run's samples read (null) or why not; older rows never checked them, so
      // they are dropped and read again from the files (figures stay: they follow the content)
      List.of("ALTER TABLE runs ADD COLUMN samples_problem TEXT", "DELETE FROM runs"));

  private IndexSchema() {}

  /** Why an index file cannot be used as it is. */
  static final class Unusable extends Exception {
    private static final long serialVersionUID = 1L;
    final boolean damaged;

    Unusable(String message, boolean damaged) {
      super(message);
      this.damaged = damaged;
    }
  }

  /**
   * Brings a new or older index to {@link #VERSION} in one transaction (two programs preparing
   * one file at once: the second finds it done).
   *
   * @throws Unusable when the index is newer than this program or its tables are not ours
   */
  static void prepare(Connection c, Path file) throws SQLException, Unusable {
    int v = version(c);
    if (v == VERSION) {
      checkTables(c);
      return;
    }
    refuseNewer(v, file);
    try (Statement s = c.createStatement()) {
      s.execute("BEGIN IMMEDIATE");
      try {
        v = version(c);
        refuseNewer(v, file);
        for (int step = v; step < VERSION; step++) {
          for (String sql : STEPS.get(step)) {
            s.execute(sql);
          }
        }
        s.execute("PRAGMA user_version = " + VERSION);
        s.execute("COMMIT");
      } catch (SQLException | Unusable | RuntimeException e) {
        s.execute("ROLLBACK");
        throw e;
      }
    }
    checkTables(c);
  }

  private static void refuseNewer(int v, Path file) throws Unusable {
    if (v > VERSION) {
      throw new Unusable("the archive index " + file + " was written by a newer Loadstone "
          + "(index version " + v + "; this one knows up to " + VERSION + "), so it was left "
          + "as it is and the runs were read from their files, which is slower for a large "
          + "archive: use the newer Loadstone, or delete the index file to let this one "
          + "rebuild it", false);
    }
    if (v < 0) {
      throw new Unusable("version " + v + " is not an index version", true);
    }
  }

  private static int version(Connection c) throws SQLException {
    try (Statement s = c.createStatement(); ResultSet r = s.executeQuery("PRAGMA user_version")) {
      return r.next() ? r.getInt(1) : 0;
    }
  }

  private static void checkTables(Connection c) throws SQLException, Unusable {
    try (Statement s = c.createStatement(); ResultSet r = s.executeQuery(
        "SELECT count(*) FROM sqlite_master WHERE type = 'table' AND name IN ('runs', 'figures')")) {
      if (!r.next() || r.getInt(1) != 2) {
        throw new Unusable("its tables are missing", true);
      }
    }
  }
}
