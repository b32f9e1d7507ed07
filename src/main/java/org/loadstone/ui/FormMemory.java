package org.loadstone.ui;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.loadstone.files.FileLog;
import org.loadstone.units.LoadstoneException;

/**
 * The run form as it was last used (next specimen id, group, mass, test type and sizes), so a
 * restarted console carries on with the batch. Kept as an append-only log in the console's home
 * folder, one JSON object a line, the last whole line winning: nothing is ever rewritten, and a
 * line cut by a crash is passed over.
 */
final class FormMemory {
  static final String FILE = "console-form.jsonl";
  private static final ObjectMapper JSON = new ObjectMapper();
  private final Path file;

  FormMemory(Path home) {
    this(home, FILE);
  }

  /** A memory of other settings kept the same way, in {@code name} under the home folder. */
  FormMemory(Path home, String name) {
    file = home.resolve(name);
  }

  /** @return the form last remembered, field name to text; empty when none */
  Map<String, String> last() {
    List<String> lines;
    try {
      lines = Files.readAllLines(file, StandardCharsets.UTF_8);
    } catch (IOException | java.io.UncheckedIOException e) {
      return Map.of(); // never remembered, or unreadable: an empty form
    }
    for (int i = lines.size() - 1; i >= 0; i--) {
      try {
        JsonNode n = JSON.readTree(lines.get(i));
        if (n != null && n.isObject()) {
          Map<String, String> m = new LinkedHashMap<>();
          n.fields().forEachRemaining(e -> m.put(e.getKey(), e.getValue().asText()));
          return m;
        }
      } catch (IOException cut) {
        // a line cut by a crash: the one before it holds
      }
    }
    return Map.of();
  }

  /**
   * Remembers the form; a failure to write only means it is not remembered.
   *
   * @return null, or why it could not be remembered
   */
  String remember(Map<String, String> values) {
    try {
      FileLog.append(file, "console form memory",
          (JSON.writeValueAsString(values) + "\n").getBytes(StandardCharsets.UTF_8));
      return null;
    } catch (LoadstoneException | IOException e) {
      return e.getMessage();
    }
  }
}
