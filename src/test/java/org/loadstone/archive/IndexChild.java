package org.loadstone.archive;

import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.time.Instant;
import java.util.HashMap;
import java.util.Map;

/**
 * A second station for the index test, run in its own JVM: for each line {@code <archive>
 * <specimen> <second>} it stores a small run, then lists the archive through its index and keeps
 * a figure for every run listed (as {@code compare} does), and answers how many runs it saw.
 */
public final class IndexChild {
  private IndexChild() {}

  public static void main(String[] args) throws Exception {
    BufferedReader in = new BufferedReader(new InputStreamReader(System.in,
        StandardCharsets.UTF_8));
    System.out.println("ready");
    System.out.flush();
    for (String line; (line = in.readLine()) != null; ) {
      String[] f = line.split(" ");
      Path dir = Path.of(f[0]);
      RunIndexTest.store(dir, f[1], Integer.parseInt(f[2]));
      ArchiveIndex idx = ArchiveIndex.load(dir);
      Map<Path, String> figures = new HashMap<>();
      idx.entries().forEach(e -> figures.put(e.json(), e.metadata().specimen()));
      idx.figures().store("specimen", figures);
      System.out.println(idx.entries().size() + " " + idx.notes().size());
      System.out.flush();
    }
  }

  static Instant at(int second) {
    return Instant.parse("2026-12-02T08:00:00Z").plusSeconds(second);
  }
}
