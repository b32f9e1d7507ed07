package org.loadstone.cli;

import java.io.PrintWriter;
import java.util.concurrent.Callable;
import org.loadstone.device.PortLister;
import picocli.CommandLine;
import picocli.CommandLine.Command;

/** {@code loadstone ports}: lists the ports a device can be on. */
@Command(name = "ports", description = "List serial ports (and the built-in simulated frame).")
public final class PortsCommand implements Callable<Integer> {
  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public Integer call() {
    PrintWriter out = spec.commandLine().getOut();
    var ports = PortLister.list();
    for (PortLister.PortInfo p : ports) {
      out.printf("%-24s %s%n", p.name(), p.description());
    }
    if (ports.size() == 1) {
      out.println("(no serial ports found: plug the board in; on Linux check 'dmesg' and that "
          + "your user is in the dialout group)");
    }
    out.flush();
    return 0;
  }
}
