package org.loadstone.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.HangGuard;

/**
 * {@code record} in a JVM given a 32 MiB heap, a quarter of what analysing a 1.5 M-sample run
 * needs: the run (30 s at 50,000 samples/s on the simulator, 20 times faster than real time) is
 * still recorded and stored whole, because storing streams the journal; its figures are refused
 * with a message saying how to get them; the program ends by itself, without a stack trace, and
 * leaves no journal behind.
 */
class RecordSmallHeapTest {
  @TempDir Path archive;

  @Test
  @Timeout(value = HangGuard.TEST_S, unit = TimeUnit.SECONDS) // a hang guard, not the check
  void aRunTooLargeToAnalyseInTheHeapIsStoredWholeAndSaysHowToAnalyseIt() throws Exception {
    String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
    List<String> cmd = new ArrayList<>(List.of(java, "-Xmx32m", "-cp",
        System.getProperty("java.class.path"), "org.loadstone.Main", "record", "--port", "sim",
        "--rate-hz", "50000", "--sim-speed", "20", "--specimen", "small-heap", "--manual-start",
        "--max-duration-s", "30", "--archive", archive.toString()));
    Path out = archive.resolveSibling(archive.getFileName() + ".out");
    Path err = archive.resolveSibling(archive.getFileName() + ".err");
    Process p = new ProcessBuilder(cmd).redirectOutput(out.toFile()).redirectError(err.toFile())
        .start();
    assertThat(p.waitFor(HangGuard.S, TimeUnit.SECONDS)).as("the program ends by itself")
        .isTrue();
    String said = Files.readString(out, StandardCharsets.UTF_8);
    String warned = Files.readString(err, StandardCharsets.UTF_8);
    assertThat(p.exitValue()).as(said + warned).isZero();
    assertThat(said + warned).doesNotContain("\tat ").doesNotContain("Exception");
    assertThat(said).contains("not analysed: the run is stored, but analysing its")
        .contains("needs more memory than the 32 MiB").contains("larger heap");
    Matcher m = Pattern.compile("run (\\S+): time-limit, peak [0-9.]+ N, (\\d+) samples")
        .matcher(said);
    assertThat(m.find()).as(said).isTrue();
    long samples = Long.parseLong(m.group(2));
    assertThat(samples).isGreaterThan(1_000_000); // far beyond what the heap could analyse
    Path csv = archive.resolve(m.group(1) + ".csv");
    assertThat(archive.resolve(m.group(1) + ".json")).exists();
    assertThat(lines(csv) - 1).as("every sample reported is in the stored run")
        .isEqualTo(samples);
    try (Stream<Path> left = Files.list(archive.resolve(".journal"))) {
      assertThat(left.toList()).as("the journal was removed once the run was stored").isEmpty();
    }
  }

  private static long lines(Path csv) throws IOException {
    try (Stream<String> s = Files.lines(csv)) {
      return s.count();
    }
  }
}
