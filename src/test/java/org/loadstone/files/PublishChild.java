package org.loadstone.files;

import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;

/**
 * A second program for the race tests, run in its own JVM: for each line {@code <file>} read
 * from standard input it publishes {@code <name> <file>} as that file and answers {@code won} or
 * {@code lost} (the name existed) on standard output; it ends at the end of its input.
 *
 * <p>Argument: this writer's name.
 */
public final class PublishChild {
  private PublishChild() {}

  public static void main(String[] args) throws Exception {
    String name = args[0];
    BufferedReader in = new BufferedReader(new InputStreamReader(System.in,
        StandardCharsets.UTF_8));
    System.out.println("ready");
    System.out.flush();
    for (String line; (line = in.readLine()) != null; ) {
      Path target = Path.of(line);
      try {
        FilePublisher.publish(target, "race file",
            (name + " " + target).getBytes(StandardCharsets.UTF_8));
        System.out.println("won");
      } catch (FileExistsException e) {
        System.out.println("lost");
      }
      System.out.flush();
    }
  }
}
