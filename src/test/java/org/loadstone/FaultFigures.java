package org.loadstone;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;

/**
 * Where the fault suite's figures go (samples kept of intact, ms lost, false accepts): printed,
 * and appended to {@code target/fault-figures.txt}, so one run of the suite's command gives the
 * figures the contributor guide quotes.
 */
public final class FaultFigures {
  private FaultFigures() {}

  /** @param line one figure, in words with its numbers */
  public static synchronized void report(String line) {
    System.out.println("fault figure: " + line);
    Path dir = Path.of(System.getProperty("loadstone.projectDir", "."), "target");
    try {
      Files.createDirectories(dir);
      Files.writeString(dir.resolve("fault-figures.txt"), line + "\n", StandardCharsets.UTF_8,
          StandardOpenOption.CREATE, StandardOpenOption.APPEND);
    } catch (IOException e) {
      System.out.println("(not written to target/fault-figures.txt: " + e.getMessage() + ")");
    }
  }
}
