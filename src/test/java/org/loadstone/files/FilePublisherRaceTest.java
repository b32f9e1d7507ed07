package org.loadstone.files;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.stream.Stream;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Two writers racing for one name: exactly one wins, the other is told, nothing is replaced. */
class FilePublisherRaceTest {
  private static final int ROUNDS = 200;
  @TempDir Path tmp;
  private final ExecutorService pool = Executors.newFixedThreadPool(2);

  @AfterEach
  void stop() {
    pool.shutdownNow();
  }

  private static byte[] content(int writer, int round) {
    byte[] b = new byte[8192 + writer * 17]; // different sizes: a mix-up shows in the length
    Arrays.fill(b, (byte) ('a' + writer));
    byte[] tag = ("writer " + writer + " round " + round + "\n").getBytes(StandardCharsets.UTF_8);
    System.arraycopy(tag, 0, b, 0, tag.length);
    return b;
  }

  /** @return per round, which writer won */
  private int[] race(Path dir) throws Exception {
    int[] winners = new int[ROUNDS];
    for (int round = 0; round < ROUNDS; round++) {
      Path target = dir.resolve("race-" + round + ".bin");
      CountDownLatch go = new CountDownLatch(1);
      List<Future<Boolean>> results = new ArrayList<>();
      for (int w = 0; w < 2; w++) {
        byte[] bytes = content(w, round);
        results.add(pool.submit(() -> {
          go.await();
          try {
            FilePublisher.publish(target, "race file", bytes);
            return true;
          } catch (FileExistsException e) {
            assertThat(e.file()).isEqualTo(target);
            assertThat(e.getMessage()).contains(target.toString()).contains("never overwrites");
            return false;
          }
        }));
      }
      go.countDown();
      boolean first = results.get(0).get();
      boolean second = results.get(1).get();
      assertThat(first ^ second).as("exactly one writer wins round %d", round).isTrue();
      winners[round] = first ? 0 : 1;
      assertThat(Files.readAllBytes(target)).isEqualTo(content(winners[round], round));
    }
    return winners;
  }

  private static List<String> names(Path dir) throws IOException {
    try (Stream<Path> s = Files.list(dir)) {
      return s.map(p -> p.getFileName().toString()).sorted().toList();
    }
  }

  @Test
  void twoThreadsRacingForOneNameOneWinsAndItsBytesStay() throws Exception {
    race(tmp);
    assertThat(names(tmp)).hasSize(ROUNDS).allMatch(n -> n.matches("race-\\d+\\.bin"));
  }

  @Test
  void twoThreadsRacingOnADiskWithoutHardLinksAlsoNeverReplace() throws Exception {
    FakeDisk disk = FakeDisk.create().withoutLinks();
    race(disk.path(tmp));
    // every winner went through the fallback after a refused link; a loser may have seen the
    // winner's file before trying one
    assertThat(disk.linksRefused()).isBetween((long) ROUNDS, 2L * ROUNDS);
    assertThat(names(tmp)).hasSize(ROUNDS).allMatch(n -> n.matches("race-\\d+\\.bin"));
  }

  @Test
  void twoProgramsRacingForOneNameOneWinsAndItsBytesStay() throws Exception {
    try (ChildProgram first = new ChildProgram(PublishChild.class, "first");
        ChildProgram second = new ChildProgram(PublishChild.class, "second")) {
      int rounds = 60;
      for (int round = 0; round < rounds; round++) {
        Path target = tmp.resolve("proc-" + round + ".txt");
        first.send(target.toString());
        second.send(target.toString());
        String a = first.answer();
        String b = second.answer();
        assertThat(List.of(a, b)).as("round %d", round).containsExactlyInAnyOrder("won", "lost");
        String winner = a.equals("won") ? "first" : "second";
        assertThat(Files.readString(target)).isEqualTo(winner + " " + target);
      }
      assertThat(first.finish()).isZero();
      assertThat(second.finish()).isZero();
      assertThat(names(tmp)).hasSize(rounds).allMatch(n -> n.matches("proc-\\d+\\.txt"));
    }
  }
}
