package org.loadstone.archive;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.attribute.BasicFileAttributes;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import org.loadstone.units.LoadstoneException;
import org.sqlite.SQLiteConfig;

/**
 * The archive index: a SQLite database in the archive folder ({@value #FILE_NAME}) that keeps
 * what reading every sidecar would give, and the figures computed from each run, so that
 * listing and comparing a large archive reads only what changed.
 *
 * <p>A run's amendment log ({@link Amendments}) is part of its content: it is looked at and
 * hashed with the two files, so an amendment shows at once and invalidates the run's figures.
 *
 * <p>The run files stay the truth; the index is a cache of them and never required:
 *
 * <ul>
 *   <li>Each time it is used it is brought up to date: the folder is listed, each run's two
 *       files are looked at (size and modification time), and only a run that is new or whose
 *       files changed is read again (its sidecar, and the SHA-256 of both files); rows of runs
 *       that are gone are removed. A new or changed run's samples are read once to check them
 *       ({@link RunReader#samplesProblem}); the answer is kept with the row. Unreadable sidecars are not kept: they are read every time,
 *       so they are listed with their reason exactly as by {@link ArchiveIndex#scan}.
 *   <li>A damaged file (not a database, corrupt pages, tables not ours) is deleted and rebuilt
 *       from the run files, with a note saying so. An index written by a newer Loadstone is
 *       left alone and the runs are read from their files, with a note. So are an index busy
 *       past {@value #BUSY_WAIT_MS} ms and a folder where it cannot be written.
 *   <li>Writes are SQLite transactions in write-ahead-log mode (the database's own files beside
 *       it, {@code -wal} and {@code -shm}); two programs updating one index wait for each other.
 * </ul>
 *
 * <p>Amendments (a correction kept beside a run, its raw files untouched): the figures kept by
 * {@code study.ArchiveRuns} carry a hash of the metadata they were computed from and are
 * computed again when the listing hands out other metadata, so an amendment applied where the
 * listing builds each {@link ArchiveIndex.Entry} is followed with nothing more. An amendment
 * file the listing reads must also join the freshness check in {@code refresh} (its size and
 * time beside the sidecar's, {@link IndexRow#matches}) so that a changed amendment is read
 * again: that is the one hook.
 */
public final class RunIndex {
  /** The index file's name inside the archive folder. */
  public static final String FILE_NAME = ".loadstone-index.sqlite";

  /** How long a program waits for another that is writing the index. */
  static final int BUSY_WAIT_MS = 15_000;

  private static final int SQLITE_BUSY = 5;
  private static final int SQLITE_LOCKED = 6;
  private static final int SQLITE_CORRUPT = 11;
  private static final int SQLITE_NOTADB = 26;

  private RunIndex() {}

  /** @return the index file of an archive folder */
  public static Path file(Path dir) {
    return dir.resolve(FILE_NAME);
  }

  /** The runs of a folder from its index, or from a scan when the index cannot be used. */
  static ArchiveIndex listing(Path dir) {
    List<String> notes = new ArrayList<>();
    for (int attempt = 0; attempt < 2; attempt++) {
      try {
        return refresh(dir, notes);
      } catch (IndexSchema.Unusable e) {
        if (!e.damaged) {
          notes.add(e.getMessage());
          break;
        }
        if (attempt > 0 || !remove(dir, e.getMessage(), notes)) {
          break;
        }
      } catch (SQLException e) {
        int code = e.getErrorCode() & 0xff;
        if ((code == SQLITE_CORRUPT || code == SQLITE_NOTADB) && attempt == 0
            && remove(dir, reason(e), notes)) {
          continue;
        }
        notes.add(code == SQLITE_BUSY || code == SQLITE_LOCKED
            ? "the archive index " + file(dir) + " was busy (another program kept it for over "
                + BUSY_WAIT_MS / 1000 + " s), so the runs were read from their files this time"
            : "the archive index " + file(dir) + " cannot be used (" + reason(e) + "), so the "
                + "runs were read from their files, which is slower for a large archive: check "
                + "that the archive folder can be written");
        break;
      }
    }
    return ArchiveIndex.scan(dir, notes);
  }

  /** A connection with the index's settings: waits for other writers, write-ahead log. */
  static Connection open(Path dir) throws SQLException {
    SQLiteConfig cfg = new SQLiteConfig();
    cfg.setBusyTimeout(BUSY_WAIT_MS);
    cfg.setJournalMode(SQLiteConfig.JournalMode.WAL);
    cfg.setSynchronous(SQLiteConfig.SynchronousMode.NORMAL);
    return cfg.createConnection("jdbc:sqlite:" + file(dir).toAbsolutePath());
  }

  private static ArchiveIndex refresh(Path dir, List<String> notes)
      throws SQLException, IndexSchema.Unusable {
    try (Connection c = open(dir)) {
      IndexSchema.prepare(c, file(dir));
      Map<String, IndexRow> rows = IndexRow.readAll(c);
      List<ArchiveIndex.Entry> entries = new ArrayList<>();
      List<ArchiveIndex.Unreadable> problems = new ArrayList<>();
      List<IndexRow> changed = new ArrayList<>();
      Map<Path, String> hashes = new HashMap<>();
      for (Path json : ArchiveIndex.sidecars(dir)) {
        String name = json.getFileName().toString();
        IndexRow row = rows.remove(name);
        Stat js = Stat.of(json);
        Stat cs = Stat.of(csvOf(json));
        Stat as = Stat.of(Amendments.file(json));
        boolean fresh = row == null || !row.matches(js, cs, as);
        try {
          RunMetadata m;
          if (fresh) {
            row = readRun(json, js, cs, as);
            m = metadata(json, row);
            row = row.withSamplesProblem(RunReader.samplesProblem(m, json));
          } else {
            m = metadata(json, row);
          }
          entries.add(ArchiveIndex.entry(json, m, row.samplesProblem()));
        } catch (LoadstoneException e) {
          problems.add(new ArchiveIndex.Unreadable(json, e.getMessage()));
          continue;
        }
        if (fresh) {
          changed.add(row);
        }
        if (row.csvSha256() != null) {
          hashes.put(json, row.contentSha256());
        }
      }
      IndexRow.write(c, changed, rows.keySet());
      return new ArchiveIndex(dir, entries, problems, notes, new Figures(dir, hashes));
    }
  }

  /**
   * Reads one run for the index: its sidecar's text as the scan reads it, and both files'
   * hashes. The files are looked at before they are read, so a change made while reading shows
   * as a change next time.
   *
   * @throws LoadstoneException when the sidecar cannot be read, as {@link RunReader} says it
   */
  private static IndexRow readRun(Path json, Stat js, Stat cs, Stat as) {
    String text = org.loadstone.units.TextFiles.read(json, "run file");
    String amendments = as == null ? null
        : org.loadstone.units.TextFiles.read(Amendments.file(json), "amendment log");
    String csvSha = null;
    if (cs != null) {
      try {
        csvSha = sha256(csvOf(json));
      } catch (IOException e) {
        csvSha = null; // its analysis will name the fault; no figures are kept meanwhile
      }
    }
    return new IndexRow(json.getFileName().toString(), js == null ? Stat.NONE : js,
        cs == null ? Stat.NONE : cs, sha256(text.getBytes(StandardCharsets.UTF_8)), csvSha, text,
        as == null ? Stat.NONE : as,
        amendments == null ? null : sha256(amendments.getBytes(StandardCharsets.UTF_8)),
        amendments, null);
  }

  /** The run's metadata from the row: its sidecar with its amendment log applied. */
  private static RunMetadata metadata(Path json, IndexRow row) {
    RunMetadata stored = RunReader.metadataFromText(json, row.sidecar());
    if (row.amendments() == null) {
      return stored;
    }
    Path log = Amendments.file(json);
    return Amendments.apply(stored, Amendments.parse(log, row.amendments()), log);
  }

  private static Path csvOf(Path json) {
    String n = json.getFileName().toString();
    return json.resolveSibling(n.substring(0, n.length() - ".json".length()) + ".csv");
  }

  private static MessageDigest digest() {
    try {
      return MessageDigest.getInstance("SHA-256");
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("every Java has SHA-256", e);
    }
  }

  private static String sha256(byte[] bytes) {
    return HexFormat.of().formatHex(digest().digest(bytes));
  }

  static String sha256(Path file) throws IOException {
    MessageDigest md = digest();
    byte[] buf = new byte[1 << 16];
    try (InputStream in = Files.newInputStream(file)) {
      for (int n; (n = in.read(buf)) > 0; ) {
        md.update(buf, 0, n);
      }
    }
    return HexFormat.of().formatHex(md.digest());
  }

  private static boolean remove(Path dir, String why, List<String> notes) {
    try {
      for (String suffix : new String[] {"", "-wal", "-shm", "-journal"}) {
        Files.deleteIfExists(dir.resolve(FILE_NAME + suffix));
      }
    } catch (IOException e) {
      notes.add("the archive index " + file(dir) + " is damaged (" + why + ") and could not be "
          + "removed (" + e.getMessage() + "), so the runs were read from their files: delete "
          + "the index file; it is rebuilt from the run files");
      return false;
    }
    notes.add("the archive index " + file(dir) + " was damaged (" + why + "); it was rebuilt "
        + "from the run files, which lose nothing");
    return true;
  }

  private static String reason(SQLException e) {
    String m = e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
    return m.replaceFirst("^\\[SQLITE_[A-Z_]+\\]\\s*", "").replaceFirst("^.*?\\((.*)\\)$", "$1");
  }

  /** A file's size and modification time as the index compares them. */
  record Stat(long size, long mtime_ns) {
    /** No file. */
    static final Stat NONE = new Stat(-1, -1);

    /** @return the file's size and time, null when there is no such file */
    static Stat of(Path file) {
      try {
        BasicFileAttributes a = Files.readAttributes(file, BasicFileAttributes.class);
        return new Stat(a.size(), a.lastModifiedTime().to(TimeUnit.NANOSECONDS));
      } catch (NoSuchFileException e) {
        return null;
      } catch (IOException e) {
        return NONE; // unreadable attributes: never matches a stored row, so read again
      }
    }
  }

  /** The figures kept in the index, for the runs of one listing. */
  private static final class Figures implements FigureCache {
    private final Path dir;
    private final Map<Path, String> hashes;

    Figures(Path dir, Map<Path, String> hashes) {
      this.dir = dir;
      this.hashes = Map.copyOf(hashes);
    }

    @Override
    public Map<Path, String> load(String settingsKey) {
      Map<String, Path> byName = new HashMap<>();
      hashes.keySet().forEach(p -> byName.put(p.getFileName().toString(), p));
      Map<Path, String> found = new HashMap<>();
      try (Connection c = open(dir); PreparedStatement q = c.prepareStatement(
          "SELECT name, content_sha256, figures FROM figures WHERE settings_key = ?")) {
        q.setString(1, settingsKey);
        try (ResultSet r = q.executeQuery()) {
          while (r.next()) {
            Path json = byName.get(r.getString(1));
            if (json != null && r.getString(2).equals(hashes.get(json))) {
              found.put(json, r.getString(3));
            }
          }
        }
      } catch (SQLException e) {
        return Map.of(); // a cache: the figures are computed again
      }
      return found;
    }

    @Override
    public void store(String settingsKey, Map<Path, String> figures) {
      if (figures.isEmpty()) {
        return;
      }
      try (Connection c = open(dir); Statement s = c.createStatement();
          PreparedStatement put = c.prepareStatement("INSERT OR REPLACE INTO figures "
              + "(name, settings_key, content_sha256, figures) VALUES (?, ?, ?, ?)")) {
        s.execute("BEGIN IMMEDIATE");
        for (Map.Entry<Path, String> e : figures.entrySet()) {
          String hash = hashes.get(e.getKey());
          if (hash != null) {
            put.setString(1, e.getKey().getFileName().toString());
            put.setString(2, settingsKey);
            put.setString(3, hash);
            put.setString(4, e.getValue());
            put.executeUpdate();
          }
        }
        s.execute("COMMIT");
      } catch (SQLException e) {
        // a cache: what could not be kept is computed again next time
      }
    }
  }
}
