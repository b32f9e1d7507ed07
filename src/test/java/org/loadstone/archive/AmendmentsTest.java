package org.loadstone.archive;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.Statement;
import java.time.Instant;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.units.LoadstoneException;

/**
 * Amendments: a run's record corrected or the run retired through an append-only log beside it.
 * The run's two files stay byte for byte as recorded; every read (the reader, a scan, the
 * archive index) sees the amended values; the log is only ever appended to.
 */
class AmendmentsTest {
  @TempDir Path dir;

  private static Amendment set(String reason, Map<String, Object> changes) {
    return new Amendment(Instant.parse("2026-12-04T09:00:00Z"), "J. Ruiz", reason, changes, null,
        "test");
  }

  private static Amendment retire(boolean retire, String reason) {
    return new Amendment(Instant.parse("2026-12-04T09:30:00Z"), "", reason, Map.of(), retire,
        "test");
  }

  @Test
  void aCorrectedMassIsReadEverywhereAndTheRunFilesAreUntouched() throws Exception {
    StoredRun s = RunIndexTest.store(dir, "panel-1", 1);
    byte[] csv = Files.readAllBytes(s.csv());
    byte[] json = Files.readAllBytes(s.json());
    ArchiveIndex.load(dir); // the index has seen the run as stored

    RunMetadata after = Amendments.append(s.json(), set("weighed with the tray", Map.of(
        "mass_g", 41.2, "width_mm", 49.5)));

    assertThat(Files.readAllBytes(s.csv())).isEqualTo(csv);
    assertThat(Files.readAllBytes(s.json())).isEqualTo(json);
    assertThat(after.mass_g()).isEqualTo(41.2);
    assertThat(after.geometry().width_mm()).isEqualTo(49.5);
    assertThat(after.geometry().span_mm()).isEqualTo(400.0); // untouched fields as stored
    assertThat(after.amendments().changes()).extracting(RunAmendments.Change::line)
        .containsExactly("mass_g 41.2 (was 50)", "width_mm 49.5 (was 50)");
    assertThat(RunReader.read(s.csv()).metadata()).isEqualTo(after);
    assertThat(RunReader.readStoredMetadata(s.json()).mass_g()).isEqualTo(50.0);
    assertThat(ArchiveIndex.scan(dir).find("panel-1").metadata()).isEqualTo(after);
    assertThat(ArchiveIndex.load(dir).entries()).isEqualTo(ArchiveIndex.scan(dir).entries());
  }

  @Test
  void theLogIsOnlyAppendedToAndALaterAmendmentWins() throws Exception {
    StoredRun s = RunIndexTest.store(dir, "panel-1", 1);
    Amendments.append(s.json(), set("first weighing", Map.of("mass_g", 41.2)));
    Path log = Amendments.file(s.json());
    byte[] first = Files.readAllBytes(log);
    RunMetadata m = Amendments.append(s.json(), set("weighed again", Map.of("mass_g", 41.0,
        "group", "foam-b")));
    byte[] both = Files.readAllBytes(log);
    assertThat(java.util.Arrays.copyOf(both, first.length)).isEqualTo(first);
    assertThat(new String(both, StandardCharsets.UTF_8).lines()).hasSize(2);
    assertThat(m.mass_g()).isEqualTo(41.0);
    assertThat(m.group()).isEqualTo("foam-b");
    assertThat(m.amendments().log()).extracting(Amendment::reason)
        .containsExactly("first weighing", "weighed again");
    // the changes are against the sidecar as stored, not against the previous amendment
    assertThat(m.amendments().changes()).extracting(RunAmendments.Change::line)
        .containsExactly("group foam-b (was balsa)", "mass_g 41 (was 50)");
  }

  @Test
  void aRunIsRetiredAndReinstatedWithItsReasons() {
    StoredRun s = RunIndexTest.store(dir, "panel-1", 1);
    RunMetadata r = Amendments.append(s.json(), retire(true, "cracked before loading"));
    assertThat(r.amendments().retired()).isTrue();
    assertThat(r.amendments().retiredReason()).isEqualTo("cracked before loading");
    assertThat(r.amendments().mark()).isEqualTo("retired");
    assertThatThrownBy(() -> Amendments.append(s.json(), retire(true, "again")))
        .hasMessageContaining("already retired (cracked before loading)");
    RunMetadata back = Amendments.append(s.json(), retire(false, "crack was in the paint"));
    assertThat(back.amendments().retired()).isFalse();
    assertThat(back.amendments().mark()).isEqualTo("amended");
    assertThatThrownBy(() -> Amendments.append(s.json(), retire(false, "twice")))
        .hasMessageContaining("not retired");
  }

  @Test
  void whatWasMeasuredCannotBeAmendedAndBadValuesAreRefused() {
    StoredRun s = RunIndexTest.store(dir, "panel-1", 1);
    assertThatThrownBy(() -> set("x", Map.of("cause", "break")))
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("'cause' cannot be amended");
    assertThatThrownBy(() -> set("x", Map.of("mass_g", -3.0)))
        .hasMessageContaining("mass_g must be a positive number (g)");
    assertThatThrownBy(() -> set(" ", Map.of("mass_g", 3.0))).hasMessageContaining("reason");
    assertThatThrownBy(() -> set("x", Map.of())).hasMessageContaining("changes nothing");
    assertThatThrownBy(() -> Amendments.append(s.json(), set("x", Map.of("mass_g", 50.0))))
        .hasMessageContaining("already has these values");
    assertThatThrownBy(() -> Amendments.append(s.json(), set("x", Map.of("test_type", "bend"))))
        .hasMessageContaining("test type");
    assertThat(Files.exists(Amendments.file(s.json()))).as("nothing refused is kept").isFalse();
  }

  @Test
  void aValueCanBeClearedWhenItIsUnknown() {
    StoredRun s = RunIndexTest.store(dir, "panel-1", 1);
    Map<String, Object> clear = new LinkedHashMap<>();
    clear.put("mass_g", null);
    RunMetadata m = Amendments.append(s.json(), set("the scale was not tared", clear));
    assertThat(m.mass_g()).isNull();
    assertThat(m.amendments().changes()).extracting(RunAmendments.Change::line)
        .containsExactly("mass_g none (was 50)");
  }

  @Test
  void aTornLastLineIsIgnoredAndADamagedLineNamesTheFileAndLine() throws Exception {
    StoredRun s = RunIndexTest.store(dir, "panel-1", 1);
    Amendments.append(s.json(), set("weighed again", Map.of("mass_g", 41.2)));
    Path log = Amendments.file(s.json());
    Files.writeString(log, "{\"amendment_format\":1,\"amended_at\":\"2026-12-04T10:00:00Z\","
        + "\"reason\":\"cut", java.nio.file.StandardOpenOption.APPEND); // power cut mid-line
    assertThat(RunReader.readMetadata(s.json()).mass_g()).isEqualTo(41.2);
    Files.writeString(log, "\nnot json\n", java.nio.file.StandardOpenOption.APPEND);
    assertThatThrownBy(() -> RunReader.readMetadata(s.json()))
        .hasMessageContaining(log.toString() + " line 2 is not JSON");
    // a scan lists the run as unreadable with that reason instead of showing stored values
    assertThat(ArchiveIndex.scan(dir).problems()).singleElement().asString()
        .contains("line 2");
    assertThat(ArchiveIndex.load(dir).unreadable()).isEqualTo(ArchiveIndex.scan(dir)
        .unreadable());
  }

  @Test
  void theArchiveIndexNoticesAnAmendmentAndDropsTheRunsFigures() throws Exception {
    StoredRun a = RunIndexTest.store(dir, "panel-1", 1);
    StoredRun b = RunIndexTest.store(dir, "panel-2", 2);
    ArchiveIndex idx = ArchiveIndex.load(dir);
    Map<Path, String> figures = new HashMap<>();
    figures.put(a.json(), "peak 301");
    figures.put(b.json(), "peak 302");
    idx.figures().store("v1", figures);
    assertThat(ArchiveIndex.load(dir).figures().load("v1")).hasSize(2);

    Amendments.append(a.json(), set("weighed again", Map.of("mass_g", 41.2)));
    ArchiveIndex after = ArchiveIndex.load(dir);
    assertThat(after.find("panel-1").metadata().mass_g()).isEqualTo(41.2);
    assertThat(after.entries()).isEqualTo(ArchiveIndex.scan(dir).entries());
    assertThat(after.figures().load("v1")).containsOnlyKeys(b.json());

    // an index of version 1 (before amendments) is brought up to date and reads the log
    try (Connection c = RunIndex.open(dir); Statement st = c.createStatement()) {
      st.execute("DROP TABLE runs");
      st.execute("DROP TABLE figures");
      st.execute("PRAGMA user_version = 0");
    }
    ArchiveIndex.load(dir);
    assertThat(ArchiveIndex.load(dir).entries()).isEqualTo(ArchiveIndex.scan(dir).entries());
  }

  @Test
  void aRunIsFoundByIdPrefixOrSpecimenAndAnAmbiguityIsListed() {
    RunIndexTest.store(dir, "panel-1", 1);
    RunIndexTest.store(dir, "panel-2", 2);
    StoredRun again = RunIndexTest.store(dir, "panel-1", 3); // the same specimen tested again
    ArchiveIndex idx = ArchiveIndex.scan(dir);
    assertThat(idx.find("panel-2").metadata().specimen()).isEqualTo("panel-2");
    assertThat(idx.find("PANEL-2").metadata().specimen()).isEqualTo("panel-2");
    assertThat(idx.find("20261202T080003").json()).isEqualTo(again.json());
    assertThatThrownBy(() -> idx.find("panel-1"))
        .hasMessageContaining("matches 2 runs")
        .hasMessageContaining("20261202T080001-panel-1")
        .hasMessageContaining("20261202T080003-panel-1");
    assertThatThrownBy(() -> idx.find("oak-9")).hasMessageContaining("no run 'oak-9'");
    // a corrected specimen id is the one that finds the run
    Amendments.append(again.json(), set("label misread", Map.of("specimen", "panel-1b")));
    ArchiveIndex now = ArchiveIndex.scan(dir);
    assertThat(now.find("panel-1b").json()).isEqualTo(again.json());
    assertThat(now.find("panel-1").metadata().runId()).isEqualTo("20261202T080001-panel-1");
    assertThat(List.of(now.find("panel-1b").metadata().amendments().mark()))
        .containsExactly("amended");
  }
}
