package org.loadstone.archive;

import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.Collection;
import java.util.HashMap;
import java.util.Map;

/**
 * One run as the archive index keeps it (table {@code runs} of {@link IndexSchema}).
 *
 * @param name the sidecar's file name
 * @param json the sidecar's size and time when it was read
 * @param csv the samples file's, {@link RunIndex.Stat#NONE} when there was none
 * @param jsonSha256 SHA-256 of the sidecar's text
 * @param csvSha256 SHA-256 of the samples file, null when there was none or it was unreadable
 * @param sidecar the sidecar's text
 * @param amend the amendment log's size and time, {@link RunIndex.Stat#NONE} when there was none
 * @param amendSha256 SHA-256 of the amendment log, null when there was none
 * @param amendments the amendment log's text, null when there was none
 * @param samplesProblem null when the samples read; else why not and the fix
 */
record IndexRow(String name, RunIndex.Stat json, RunIndex.Stat csv, String jsonSha256,
    String csvSha256, String sidecar, RunIndex.Stat amend, String amendSha256,
    String amendments, String samplesProblem) {

  /** @return this row with the answer of its samples' check */
  IndexRow withSamplesProblem(String problem) {
    return new IndexRow(name, json, csv, jsonSha256, csvSha256, sidecar, amend, amendSha256,
        amendments, problem);
  }

  /** @return whether the run's files look as they did when the row was made */
  boolean matches(RunIndex.Stat jsonNow, RunIndex.Stat csvNow, RunIndex.Stat amendNow) {
    return json.equals(jsonNow) && csv.equals(csvNow == null ? RunIndex.Stat.NONE : csvNow)
        && amend.equals(amendNow == null ? RunIndex.Stat.NONE : amendNow);
  }

  /** @return the run's content hash: both files' hashes and its amendment log's, if any */
  String contentSha256() {
    return jsonSha256 + ":" + csvSha256 + (amendSha256 == null ? "" : ":" + amendSha256);
  }

  static Map<String, IndexRow> readAll(Connection c) throws SQLException {
    Map<String, IndexRow> rows = new HashMap<>();
    try (Statement s = c.createStatement(); ResultSet r = s.executeQuery("SELECT name, "
        + "json_size, json_mtime_ns, csv_size, csv_mtime_ns, json_sha256, csv_sha256, sidecar, "
        + "amend_size, amend_mtime_ns, amend_sha256, amendments, samples_problem FROM runs")) {
      while (r.next()) {
        IndexRow row = new IndexRow(r.getString(1), new RunIndex.Stat(r.getLong(2), r.getLong(3)),
            new RunIndex.Stat(r.getLong(4), r.getLong(5)), r.getString(6), r.getString(7),
            r.getString(8), new RunIndex.Stat(r.getLong(9), r.getLong(10)), r.getString(11),
            r.getString(12), r.getString(13));
        rows.put(row.name(), row);
      }
    }
    return rows;
  }

  /**
   * Stores new and changed rows and removes those of runs that are gone (with their figures),
   * in one transaction.
   */
  static void write(Connection c, Collection<IndexRow> changed, Collection<String> gone)
      throws SQLException {
    if (changed.isEmpty() && gone.isEmpty()) {
      return;
    }
    try (Statement s = c.createStatement();
        PreparedStatement put = c.prepareStatement("INSERT OR REPLACE INTO runs (name, "
            + "json_size, json_mtime_ns, csv_size, csv_mtime_ns, json_sha256, csv_sha256, "
            + "sidecar, amend_size, amend_mtime_ns, amend_sha256, amendments, samples_problem) "
            + "VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)");
        PreparedStatement stale = c.prepareStatement(
            "DELETE FROM figures WHERE name = ? AND content_sha256 <> ?");
        PreparedStatement dropRun = c.prepareStatement("DELETE FROM runs WHERE name = ?");
        PreparedStatement dropFigures = c.prepareStatement("DELETE FROM figures WHERE name = ?")) {
      s.execute("BEGIN IMMEDIATE");
      try {
        for (IndexRow r : changed) {
          put.setString(1, r.name());
          put.setLong(2, r.json().size());
          put.setLong(3, r.json().mtime_ns());
          put.setLong(4, r.csv().size());
          put.setLong(5, r.csv().mtime_ns());
          put.setString(6, r.jsonSha256());
          put.setString(7, r.csvSha256());
          put.setString(8, r.sidecar());
          put.setLong(9, r.amend().size());
          put.setLong(10, r.amend().mtime_ns());
          put.setString(11, r.amendSha256());
          put.setString(12, r.amendments());
          put.setString(13, r.samplesProblem());
          put.executeUpdate();
          stale.setString(1, r.name());
          stale.setString(2, r.contentSha256());
          stale.executeUpdate();
        }
        for (String name : gone) {
          dropRun.setString(1, name);
          dropRun.executeUpdate();
          dropFigures.setString(1, name);
          dropFigures.executeUpdate();
        }
        s.execute("COMMIT");
      } catch (SQLException | RuntimeException e) {
        s.execute("ROLLBACK");
        throw e;
      }
    }
  }
}
