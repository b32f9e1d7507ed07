package org.loadstone.archive;

import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;

/**
 * A second station for the run-id test, run in its own JVM: for each line {@code <archive>
 * <run id>} read from standard input it opens a run's journal as a recorder does at the trigger
 * and answers the id the run got; it ends at the end of its input.
 */
public final class ClaimChild {
  private ClaimChild() {}

  public static void main(String[] args) throws Exception {
    BufferedReader in = new BufferedReader(new InputStreamReader(System.in,
        StandardCharsets.UTF_8));
    System.out.println("ready");
    System.out.flush();
    for (String line; (line = in.readLine()) != null; ) {
      String[] f = line.split(" ");
      JournalFormat.Opened j = JournalFormat.open(Path.of(f[0]),
          RunFixtures.startMetadata(f[1], false));
      try (FileChannel ch = j.channel()) {
        System.out.println(j.startInfo().runId());
      }
      System.out.flush();
    }
  }
}
