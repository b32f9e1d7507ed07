package org.loadstone.cli;

import java.io.PrintWriter;
import java.util.concurrent.Callable;
import org.loadstone.device.PortLister;
import picocli.CommandLine;
import picocli.CommandLine.Command;

/** {@code loadstone ports}: lists the ports a device can be on. */
@Command(name = "ports", description = "List serial ports (and the built-in simulated frame).")
public final class PortsCommand implements Callable<Integer> {
  @CommandLine.Option(names = "--json", description = "Write the list as one JSON document on standard output (schema loadstone-ports); the text goes to standard error.")
  boolean json;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public Integer call() {
    PrintWriter out = JsonDocument.human(spec, json);
    var ports = PortLister.list();
    for (PortLister.PortInfo p : ports) {
      out.printf("%-24s %s%n", p.name(), p.description());
    }
    if (ports.size() == 1) {
      out.println("(no serial ports found: plug the board in; on Linux check 'dmesg' and that "
          + "your user is in the dialout group)");
    }
    out.flush();
    if (json) {
      java.util.List<java.util.Map<String, Object>> list = new java.util.ArrayList<>();
      for (PortLister.PortInfo p : ports) {
        java.util.Map<String, Object> m = new java.util.LinkedHashMap<>();
        m.put("port", p.name());
        m.put("description", p.description());
        list.add(m);
      }
      JsonDocument.write(spec.commandLine().getOut(), JsonDocument.Kind.PORTS,
          java.util.Map.of("ports", list));
    }
    return 0;
  }
}
