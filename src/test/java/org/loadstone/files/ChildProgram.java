package org.loadstone.files;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;

/**
 * A second program for the tests that race two programs: a JVM on the test class path running
 * {@code mainClass}, talked to a line at a time (orders on its standard input, answers on its
 * standard output). It answers {@code ready} first.
 */
public final class ChildProgram implements AutoCloseable {
  private final Process process;
  private final BufferedReader answers;
  private final Writer orders;

  /** Starts the program and waits for its {@code ready}. */
  public ChildProgram(Class<?> mainClass, String... args) throws IOException {
    String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
    String[] cmd = new String[args.length + 4];
    cmd[0] = java;
    cmd[1] = "-cp";
    cmd[2] = System.getProperty("java.class.path");
    cmd[3] = mainClass.getName();
    System.arraycopy(args, 0, cmd, 4, args.length);
    process = new ProcessBuilder(cmd).redirectError(ProcessBuilder.Redirect.INHERIT).start();
    answers = new BufferedReader(new InputStreamReader(process.getInputStream(),
        StandardCharsets.UTF_8));
    orders = new OutputStreamWriter(process.getOutputStream(), StandardCharsets.UTF_8);
    String first = answers.readLine();
    if (!"ready".equals(first)) {
      process.destroyForcibly();
      throw new IllegalStateException(mainClass.getSimpleName() + " answered " + first);
    }
  }

  /**
   * The child's side: answers {@code ready}, then one line per order line until its input ends.
   *
   * @param answer the answer to one order line
   */
  public static void serve(ThrowingFunction answer) throws Exception {
    BufferedReader in = new BufferedReader(new InputStreamReader(System.in,
        StandardCharsets.UTF_8));
    System.out.println("ready");
    System.out.flush();
    for (String line; (line = in.readLine()) != null; ) {
      System.out.println(answer.apply(line));
      System.out.flush();
    }
  }

  /** An answer to an order line, which may fail. */
  public interface ThrowingFunction {
    /** @return the answer line */
    String apply(String order) throws Exception;
  }

  /** Sends one order line. */
  public void send(String line) throws IOException {
    orders.write(line + "\n");
    orders.flush();
  }

  /** @return the next answer line (waits for it) */
  public String answer() throws IOException {
    return answers.readLine();
  }

  /** Ends its input and waits for it to end. @return its exit code */
  public int finish() throws IOException, InterruptedException {
    orders.close();
    return process.waitFor();
  }

  @Override
  public void close() {
    process.destroyForcibly();
  }
}
