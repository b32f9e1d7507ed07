package org.loadstone.archive;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class RunIdsTest {
  @TempDir Path dir;

  @Test
  void idIsUtcBasicFormatToTheMillisecondThenTheSafeSpecimen() {
    // ISO 8601-1:2019 basic format: YYYYMMDDThhmmss,fffZ (a period as decimal sign is allowed)
    assertThat(RunIds.base(Instant.parse("2026-12-02T18:12:33.417Z"), "Balsa core #7"))
        .isEqualTo("20261202T181233.417Z-Balsa_core_7");
    assertThat(RunIds.base(Instant.parse("2026-01-05T03:04:05Z"), "../x"))
        .isEqualTo("20260105T030405.000Z-x");
  }

  @Test
  void idsSortAsTextInStartOrder() {
    Instant t0 = Instant.parse("2026-12-02T09:59:59.999Z");
    List<String> ids = new ArrayList<>();
    List<Instant> times = List.of(t0, t0.plusMillis(1), t0.plusSeconds(3600), t0.plusSeconds(86_400 * 40));
    for (Instant t : times) {
      ids.add(RunIds.base(t, "zzz"));
    }
    List<String> sorted = new ArrayList<>(ids);
    sorted.sort(null);
    assertThat(sorted).containsExactlyElementsOf(ids);
  }

  @Test
  void neverReusesAnIdHeldByARunASidecarOrAJournal() throws Exception {
    Instant t = Instant.parse("2026-12-02T18:12:33.417Z");
    String base = RunIds.newId(dir, t, "p1");
    assertThat(base).isEqualTo("20261202T181233.417Z-p1");
    Files.writeString(dir.resolve(base + ".csv"), "x");
    String second = RunIds.newId(dir, t, "p1");
    assertThat(second).isEqualTo(base + "-2");
    Files.writeString(dir.resolve(second + ".json"), "{}");
    String third = RunIds.newId(dir, t, "p1");
    assertThat(third).isEqualTo(base + "-3");
    Files.createDirectories(JournalFormat.journalDir(dir));
    Files.writeString(JournalFormat.journalFile(dir, third), "");
    String fourth = RunIds.newId(dir, t, "p1");
    assertThat(fourth).isEqualTo(base + "-4");
    Files.createDirectories(JournalFormat.damagedDir(dir));
    Files.writeString(JournalFormat.damagedDir(dir).resolve(fourth + ".journal"), "");
    assertThat(RunIds.newId(dir, t, "p1")).isEqualTo(base + "-5");
  }

  @Test
  void validityRefusesSeparatorsAndHiddenNames() {
    assertThat(RunIds.isValid("20261202T181233.417Z-p1")).isTrue();
    assertThat(RunIds.isValid("../x")).isFalse();
    assertThat(RunIds.isValid("a/b")).isFalse();
    assertThat(RunIds.isValid(".x")).isFalse();
    assertThat(RunIds.isValid("")).isFalse();
    assertThat(RunIds.isValid(null)).isFalse();
    assertThatThrownBy(() -> RunIds.requireValid("a\\b"))
        .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("a\\b");
  }
}
