package org.loadstone.archive;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.files.ChildProgram;

/** Run ids stay unique when several programs store runs in one archive at the same moment. */
@Tag("fault")
class RunIdClaimTest {
  private static final int WRITERS = 6;
  @TempDir Path archive;
  private final ExecutorService pool = Executors.newFixedThreadPool(WRITERS);

  @AfterEach
  void stop() {
    pool.shutdownNow();
  }

  private static String expectedId(String base, int k) {
    return k == 0 ? base : base + "-" + (k + 1);
  }

  @Test
  void journalsOpenedAtOnceUnderOneIdAllGetTheirOwnId() throws Exception {
    for (int round = 0; round < 40; round++) {
      String base = "20261203T101500.000Z-foam-" + round;
      CountDownLatch go = new CountDownLatch(1);
      List<Future<String>> ids = new ArrayList<>();
      for (int w = 0; w < WRITERS; w++) {
        ids.add(pool.submit(() -> {
          go.await();
          JournalFormat.Opened j = JournalFormat.open(archive,
              RunFixtures.startMetadata(base, false));
          j.channel().close();
          assertThat(JournalRecovery.readJournal(j.file()).startInfo().runId())
              .isEqualTo(j.startInfo().runId());
          return j.startInfo().runId();
        }));
      }
      go.countDown();
      Set<String> got = new HashSet<>();
      for (Future<String> f : ids) {
        got.add(f.get());
      }
      Set<String> expected = new HashSet<>();
      for (int k = 0; k < WRITERS; k++) {
        expected.add(expectedId(base, k));
      }
      assertThat(got).as("round %d", round).isEqualTo(expected);
    }
    assertThat(claimMarkers()).isEmpty();
  }

  @Test
  void importsStoredAtOnceUnderOneIdAllKeepTheirRun() throws Exception {
    String base = "20261203T101500.000Z-balsa-07";
    CountDownLatch go = new CountDownLatch(1);
    List<Future<String>> ids = new ArrayList<>();
    for (int w = 0; w < WRITERS; w++) {
      RunData data = RunFixtures.randomData(w, 10 + w, false);
      ids.add(pool.submit(() -> {
        go.await();
        try (RunIdClaim claim = RunIdClaim.claim(archive, base)) {
          RunWriter.write(archive, RunFixtures.startMetadata(claim.id(), false), data);
          return claim.id();
        }
      }));
    }
    go.countDown();
    Set<String> got = new HashSet<>();
    for (Future<String> f : ids) {
      got.add(f.get());
    }
    assertThat(got).hasSize(WRITERS);
    for (String id : got) {
      Run r = RunReader.read(archive.resolve(id + ".csv"));
      assertThat(r.metadata().runId()).isEqualTo(id);
    }
    assertThat(claimMarkers()).isEmpty();
  }

  @Test
  void anIdCarriedByRunFilesOrHeldByAnotherProgramIsSkipped() throws Exception {
    RunWriter.write(archive, RunFixtures.startMetadata("r", false),
        RunFixtures.randomData(1, 3, false));
    try (RunIdClaim held = RunIdClaim.claim(archive, "r")) {
      assertThat(held.id()).isEqualTo("r-2");
      assertThat(RunIds.taken(archive, "r-2")).isTrue(); // newId proposes past a held id
      assertThat(RunIds.firstFree(archive, "r")).isEqualTo("r-3");
      try (RunIdClaim next = RunIdClaim.claim(archive, "r")) {
        assertThat(next.id()).isEqualTo("r-3");
      }
    }
    assertThat(RunIds.taken(archive, "r-2")).isFalse(); // let go, nothing made: free again
    // a marker left by a program that ended while holding it only makes that id skipped
    Files.createFile(RunIdClaim.markerFor(archive, "s"));
    try (RunIdClaim c = RunIdClaim.claim(archive, "s")) {
      assertThat(c.id()).isEqualTo("s-2");
    }
  }

  @Test
  void twoProgramsOpeningTheSameIdEachKeepTheirRun() throws Exception {
    try (ChildProgram one = new ChildProgram(ClaimChild.class);
        ChildProgram two = new ChildProgram(ClaimChild.class)) {
      for (int round = 0; round < 40; round++) {
        String base = "20261203T101500.000Z-station-" + round;
        one.send(archive + " " + base);
        two.send(archive + " " + base);
        List<String> got = List.of(one.answer(), two.answer());
        assertThat(got).as("round %d", round).containsExactlyInAnyOrder(base, base + "-2");
        for (String id : got) {
          assertThat(JournalRecovery.readJournal(JournalFormat.journalFile(archive, id))
              .startInfo().runId()).isEqualTo(id);
        }
      }
      assertThat(one.finish()).isZero();
      assertThat(two.finish()).isZero();
      assertThat(claimMarkers()).isEmpty();
    }
  }

  private List<Path> claimMarkers() throws Exception {
    try (var s = Files.list(JournalFormat.journalDir(archive))) {
      return s.filter(p -> p.getFileName().toString().endsWith(".claim")).toList();
    }
  }
}
