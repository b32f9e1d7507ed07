package org.loadstone.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Option spellings of earlier versions, still accepted but shown nowhere: each is rewritten to
 * today's option before parsing, with a one-line note on standard error. Spellings that differ
 * only in case ({@code --capacity-N}) need no entry: options are matched without regard to case.
 */
final class OptionAliases {
  /**
   * An old spelling.
   *
   * @param commands the commands it belongs to; empty for all
   * @param old the old option name
   * @param now what it becomes: the new name, and for a flag that became an option, its value
   */
  private record Alias(Set<String> commands, String old, List<String> now) {}

  private static final List<Alias> ALIASES = List.of(
      new Alias(Set.of(), "--groups", List.of("--group")),
      new Alias(Set.of("import"), "--decimal-comma", List.of("--decimal", ",")),
      new Alias(Set.of("analyze"), "--table-decimal-comma", List.of("--table-decimal", ",")),
      new Alias(Set.of("calibrate", "frame"), "--note", List.of("--notes")),
      new Alias(Set.of("frame"), "--description", List.of("--notes")),
      new Alias(Set.of("calibrate", "frame"), "--save", List.of("--out")),
      new Alias(Set.of("calibrate"), "--from", List.of("--points")),
      new Alias(Set.of("monitor", "simulate"), "--seconds", List.of("--duration-s")),
      new Alias(Set.of("record"), "--max-seconds", List.of("--max-duration-s")),
      new Alias(Set.of(), "--rate", List.of("--rate-hz")),
      new Alias(Set.of("track"), "--fps", List.of("--frame-rate-hz")),
      new Alias(Set.of("analyze"), "--crosshead-rate-mm-min", List.of("--crosshead-rate-mm-per-min")),
      new Alias(Set.of(), "--max-drift", List.of("--max-drift-counts-per-s")),
      new Alias(Set.of("calibrate"), "--g", List.of("--gravity-m-per-s2")),
      new Alias(Set.of("calibrate"), "--latitude", List.of("--latitude-deg")),
      new Alias(Set.of("calibrate"), "--air-density", List.of("--air-density-kg-per-m3")),
      new Alias(Set.of("calibrate"), "--weight-density", List.of("--weight-density-kg-per-m3")));

  private OptionAliases() {}

  /**
   * @param args the command line as typed
   * @param commands the names of the subcommands
   * @param err where the notes go
   * @return the command line with old spellings rewritten
   */
  static String[] rewrite(String[] args, Set<String> commands, PrintWriter err) {
    String command = null;
    List<String> out = new ArrayList<>(args.length);
    boolean optionsEnded = false;
    for (String a : args) {
      if (command == null && commands.contains(a)) {
        command = a;
        out.add(a);
        continue;
      }
      if (a.equals("--")) {
        optionsEnded = true;
      }
      Alias alias = optionsEnded || command == null ? null : find(command, a);
      if (alias == null) {
        out.add(a);
        continue;
      }
      String value = a.contains("=") ? a.substring(a.indexOf('=') + 1) : null;
      out.addAll(alias.now());
      if (value != null && alias.now().size() == 1) {
        out.set(out.size() - 1, out.get(out.size() - 1) + "=" + value);
      }
      err.println("loadstone: note: " + alias.old() + " is now " + String.join(" ", alias.now())
          + "; the old spelling will go");
      err.flush();
    }
    return out.toArray(new String[0]);
  }

  private static Alias find(String command, String arg) {
    String name = arg.contains("=") ? arg.substring(0, arg.indexOf('=')) : arg;
    for (Alias a : ALIASES) {
      if (a.old().equals(name) && (a.commands().isEmpty() || a.commands().contains(command))) {
        return a;
      }
    }
    return null;
  }

  /** @return the old spellings, old name → new, for the contributor guide's table and tests */
  static Map<String, String> table() {
    Map<String, String> m = new java.util.LinkedHashMap<>();
    ALIASES.forEach(a -> m.put(a.old() + (a.commands().isEmpty() ? "" : " (" + String.join(", ",
        new java.util.TreeSet<>(a.commands())) + ")"), String.join(" ", a.now())));
    return m;
  }
}
