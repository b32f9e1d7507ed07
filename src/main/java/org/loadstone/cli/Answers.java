package org.loadstone.cli;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.Locale;

/**
 * Questions to the operator: a prompt on the output, one line of answer from the input. Works
 * the same at a terminal and with piped answers (scripts and tests).
 */
final class Answers {
  private final BufferedReader in;
  private final PrintWriter out;
  private final boolean echo;

  /**
   * @param in answers, read as UTF-8 lines; when they do not come from a terminal, each answer
   *     is echoed after its prompt so that the output reads like a session
   * @param out where prompts go
   */
  Answers(InputStream in, PrintWriter out) {
    this.in = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8));
    this.out = out;
    this.echo = in != System.in || System.console() == null;
  }

  /** @return the answer without surrounding spaces, or null when the input has ended */
  String ask(String prompt) {
    out.print(prompt);
    out.flush();
    try {
      String line = in.readLine();
      if (line == null) {
        out.println();
        out.flush();
        return null;
      }
      if (echo) {
        out.println(line.strip());
        out.flush();
      }
      return line.strip();
    } catch (IOException e) {
      throw new UncheckedIOException("cannot read the answer from standard input", e);
    }
  }

  /**
   * Asks what to do after a reading failed to settle.
   *
   * @param skipAllowed whether "skip" is offered
   * @return 'r' (wait again), 's' (skip) or 'q' (quit; also when the input has ended)
   */
  char afterTimeout(boolean skipAllowed) {
    String options = skipAllowed ? "r = wait again, s = skip this step, q = quit" :
        "r = wait again, q = quit";
    while (true) {
      String a = ask("  " + options + " [r]: ");
      if (a == null) {
        return 'q';
      }
      String t = a.toLowerCase(Locale.ROOT);
      if (t.isEmpty() || t.equals("r") || t.equals("retry")) {
        return 'r';
      }
      if (t.equals("q") || t.equals("quit")) {
        return 'q';
      }
      if (skipAllowed && (t.equals("s") || t.equals("skip"))) {
        return 's';
      }
      out.println("  '" + a + "' is not one of the choices");
    }
  }

  /** @return whether {@code answer} asks to stop */
  static boolean isQuit(String answer) {
    String t = answer.toLowerCase(Locale.ROOT);
    return t.equals("q") || t.equals("quit");
  }
}
