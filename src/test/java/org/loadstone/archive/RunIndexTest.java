package org.loadstone.archive;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.files.ChildProgram;

/**
 * The archive index (a real SQLite file in the archive folder) against the reference, a scan of
 * every sidecar: the same runs and the same unreadable files after runs are added, amended and
 * removed, after the index is damaged or deleted, and after two programs store runs into one
 * archive at once. Figures kept in it are valid only while the run's files are unchanged.
 */
class RunIndexTest {
  @TempDir Path dir;

  /** Stores a small run of one specimen started {@code second} s after 08:00. */
  static StoredRun store(Path dir, String specimen, int second) {
    RunMetadata m = TestRuns.meta(specimen, second % 2 == 0 ? "foam" : "balsa", TestRuns.panel(),
        50.0).toBuilder().runId("20261202T08" + String.format("%04d", second) + "-" + specimen)
        .startedAt(IndexChild.at(second)).build();
    return RunWriter.write(dir, m, TestRuns.bend(50 + second % 7, 300 + second));
  }

  /** A mixed archive: good runs, a sidecar that is not JSON, one not UTF-8, one without CSV. */
  private void mixed() throws IOException {
    for (int i = 0; i < 6; i++) {
      store(dir, "panel-" + i, i);
    }
    Files.writeString(dir.resolve("20261202T0900-broken.json"), "{\"run_id\": ");
    Files.write(dir.resolve("20261202T0901-latin.json"), new byte[] {'{', '"', (byte) 0xe9, '"',
        ':', '1', '}'});
    StoredRun lone = store(dir, "no-samples", 7);
    Files.delete(lone.csv());
    Files.writeString(dir.resolve("notes.txt"), "not a run");
  }

  private void assertSameAsScan(ArchiveIndex fromIndex) {
    ArchiveIndex scan = ArchiveIndex.scan(dir);
    assertThat(fromIndex.entries()).isEqualTo(scan.entries());
    assertThat(fromIndex.unreadable()).isEqualTo(scan.unreadable());
  }

  @Test
  void listsWhatAScanOfEverySidecarFinds() throws IOException {
    mixed();
    ArchiveIndex first = ArchiveIndex.load(dir);
    assertSameAsScan(first);
    assertThat(first.entries()).hasSize(7);
    assertThat(first.unreadable()).hasSize(2);
    assertThat(first.notes()).isEmpty();
    assertThat(RunIndex.file(dir)).exists();
    // the second time from the rows kept: still the same, unreadable files named again
    ArchiveIndex second = ArchiveIndex.load(dir);
    assertSameAsScan(second);
    assertThat(rows()).isEqualTo(7);
  }

  @Test
  void followsRunsAddedAmendedAndRemoved() throws IOException {
    mixed();
    ArchiveIndex.load(dir);
    StoredRun added = store(dir, "panel-late", 30);
    assertSameAsScan(ArchiveIndex.load(dir));
    // an amended sidecar (same size, so only its content and time tell)
    Path json = dir.resolve("20261202T080002-panel-2.json");
    String text = Files.readString(json);
    Files.writeString(json, text.replace("panel-2", "panel-X"));
    Files.setLastModifiedTime(json, java.nio.file.attribute.FileTime.fromMillis(
        Files.getLastModifiedTime(json).toMillis() + 2000));
    ArchiveIndex amended = ArchiveIndex.load(dir);
    assertSameAsScan(amended);
    assertThat(amended.entries()).anyMatch(e -> e.metadata().specimen().equals("panel-X"));
    // a broken sidecar repaired, and a run removed
    Files.writeString(dir.resolve("20261202T0900-broken.json"), text.replace("panel-2",
        "repaired").replace("20261202T080002-", "20261202T0900-"));
    Files.delete(added.csv());
    Files.delete(added.json());
    ArchiveIndex later = ArchiveIndex.load(dir);
    assertSameAsScan(later);
    assertThat(later.entries()).noneMatch(e -> e.metadata().specimen().equals("panel-late"));
    assertThat(later.entries()).anyMatch(e -> e.metadata().specimen().equals("repaired"));
    assertThat(rows()).isEqualTo(later.entries().size());
  }

  @Test
  void keepsFiguresOnlyWhileTheRunIsUnchanged() throws IOException {
    mixed();
    ArchiveIndex idx = ArchiveIndex.load(dir);
    Map<Path, String> figures = new HashMap<>();
    idx.entries().forEach(e -> figures.put(e.json(), "peak of " + e.metadata().specimen()));
    idx.figures().store("v1", figures);
    ArchiveIndex again = ArchiveIndex.load(dir);
    Map<Path, String> kept = again.figures().load("v1");
    // the run without samples has no content hash: nothing is kept for it
    assertThat(kept).hasSize(6);
    assertThat(again.figures().load("v2")).isEmpty();
    // samples amended: that run's figures are gone, the others stay
    Path csv = dir.resolve("20261202T080003-panel-3.csv");
    Files.writeString(csv, Files.readString(csv).replaceFirst("\n$", "\n"), StandardCharsets.UTF_8);
    Files.write(csv, List.of(), java.nio.file.StandardOpenOption.APPEND);
    Files.setLastModifiedTime(csv, java.nio.file.attribute.FileTime.fromMillis(
        Files.getLastModifiedTime(csv).toMillis() + 2000));
    ArchiveIndex touched = ArchiveIndex.load(dir);
    Map<Path, String> after = touched.figures().load("v1");
    assertThat(after).hasSize(6); // same bytes, new time: same content hash, figures kept
    Files.writeString(csv, "\n", java.nio.file.StandardOpenOption.APPEND);
    after = ArchiveIndex.load(dir).figures().load("v1");
    assertThat(after).hasSize(5).doesNotContainKey(dir.resolve("20261202T080003-panel-3.json"));
  }

  @Test
  void aDamagedIndexIsRebuiltFromTheRunFiles() throws IOException {
    mixed();
    ArchiveIndex.load(dir);
    Files.write(RunIndex.file(dir), "this is not a database, it was overwritten".getBytes(
        StandardCharsets.UTF_8));
    ArchiveIndex rebuilt = ArchiveIndex.load(dir);
    assertSameAsScan(rebuilt);
    assertThat(rebuilt.notes()).singleElement().asString().contains("damaged", "rebuilt");
    ArchiveIndex next = ArchiveIndex.load(dir);
    assertThat(next.notes()).isEmpty();
    assertSameAsScan(next);
  }

  @Test
  void aCutShortIndexIsRebuiltAndADeletedOneToo() throws IOException, SQLException {
    mixed();
    ArchiveIndex.load(dir);
    checkpoint();
    byte[] whole = Files.readAllBytes(RunIndex.file(dir));
    Files.write(RunIndex.file(dir), java.util.Arrays.copyOf(whole, whole.length / 2));
    ArchiveIndex rebuilt = ArchiveIndex.load(dir);
    assertSameAsScan(rebuilt);
    Files.delete(RunIndex.file(dir));
    ArchiveIndex fresh = ArchiveIndex.load(dir);
    assertSameAsScan(fresh);
    assertThat(fresh.notes()).isEmpty();
  }

  @Test
  void anIndexOfANewerVersionIsLeftAloneAndTheFilesAreRead() throws IOException, SQLException {
    mixed();
    ArchiveIndex.load(dir);
    try (Connection c = RunIndex.open(dir); Statement s = c.createStatement()) {
      s.execute("PRAGMA user_version = 7");
    }
    store(dir, "after", 40);
    ArchiveIndex idx = ArchiveIndex.load(dir);
    assertSameAsScan(idx);
    assertThat(idx.notes()).singleElement().asString()
        .contains("newer Loadstone", "index version 7");
    try (Connection c = RunIndex.open(dir); Statement s = c.createStatement();
        ResultSet r = s.executeQuery("PRAGMA user_version")) {
      assertThat(r.getInt(1)).isEqualTo(7);
    }
  }

  @Test
  @Timeout(value = 180, unit = TimeUnit.SECONDS) // a hang guard, not the check
  void twoProgramsStoringIntoOneArchiveLeaveEveryRunListedOnce() throws Exception {
    int each = 8;
    List<String> answers = new ArrayList<>();
    try (ChildProgram one = new ChildProgram(IndexChild.class);
        ChildProgram two = new ChildProgram(IndexChild.class)) {
      for (int i = 0; i < each; i++) {
        one.send(dir + " one-" + i + " " + (2 * i));
        two.send(dir + " two-" + i + " " + (2 * i + 1));
      }
      for (int i = 0; i < each; i++) {
        answers.add(one.answer());
        answers.add(two.answer());
      }
      assertThat(one.finish()).isZero();
      assertThat(two.finish()).isZero();
    }
    // each answer: runs seen, notes; no program ever fell back to reading the files
    assertThat(answers).allSatisfy(a -> assertThat(a).endsWith(" 0"));
    ArchiveIndex idx = ArchiveIndex.load(dir);
    assertSameAsScan(idx);
    assertThat(idx.entries()).hasSize(2 * each);
    assertThat(idx.entries().stream().map(e -> e.metadata().runId()).distinct()).hasSize(2 * each);
    assertThat(rows()).isEqualTo(2 * each);
    Map<Path, String> figures = idx.figures().load("specimen");
    assertThat(figures).hasSize(2 * each);
    idx.entries().forEach(e -> assertThat(figures.get(e.json()))
        .isEqualTo(e.metadata().specimen()));
  }

  private int rows() {
    try (Connection c = RunIndex.open(dir); Statement s = c.createStatement();
        ResultSet r = s.executeQuery("SELECT count(*) FROM runs")) {
      return r.getInt(1);
    } catch (SQLException e) {
      throw new AssertionError(e);
    }
  }

  private void checkpoint() throws SQLException {
    try (Connection c = RunIndex.open(dir); Statement s = c.createStatement()) {
      s.execute("PRAGMA wal_checkpoint(TRUNCATE)");
    }
  }
}
