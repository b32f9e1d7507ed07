package org.loadstone.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.ByteArrayInputStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;

/** Runs the loadstone command line in memory: answers in, output and error captured. */
record CliRun(int exit, String out, String err) {
  static CliRun run(String answers, String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code = LoadstoneCommand.run(
        new ByteArrayInputStream(answers.getBytes(StandardCharsets.UTF_8)),
        new PrintWriter(out, true), new PrintWriter(err, true), args);
    return new CliRun(code, out.toString(), err.toString());
  }

  /** @return the last line of the output, parsed as JSON */
  JsonNode lastJson() throws Exception {
    String[] lines = out.strip().split("\\R");
    return new ObjectMapper().readTree(lines[lines.length - 1]);
  }

  @Override
  public String toString() {
    return "exit " + exit + "\n--- out\n" + out + "\n--- err\n" + err;
  }
}
