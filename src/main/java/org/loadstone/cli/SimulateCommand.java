package org.loadstone.cli;

import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.loadstone.device.FrameSampleSource;
import org.loadstone.device.SampleSource;
import org.loadstone.device.SimSetup;
import org.loadstone.device.SimTransport;
import org.loadstone.sim.Scenario;
import org.loadstone.protocol.Encoding;
import org.loadstone.protocol.WireEncoder;
import org.loadstone.files.FilePublisher;
import org.loadstone.units.LoadstoneException;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code loadstone simulate}: writes the simulated frame's protocol bytes to a file or a port. */
@Command(
    name = "simulate",
    description = {
      "Write the simulated frame's wire bytes to a file, stdout or a serial device.",
      "",
      "The bytes are exactly what the firmware sends. A device path can be one end of a "
          + "pseudo-terminal pair. Output is paced in real time at --rate-hz.",
      "",
      "Scenarios: brittle, four-point, ductile, crush, over-range, rigid-block, panel-foam, "
          + "panel-balsa, panel-board, dead-weight."
    })
public final class SimulateCommand implements Callable<Integer> {
  @Option(names = "--scenario", paramLabel = "NAME", defaultValue = "brittle", description = "What is on the simulated frame (default: ${DEFAULT-VALUE}).")
  String scenario;

  @Option(names = "--rate-hz", paramLabel = "HZ", defaultValue = "80", description = "Samples per second (default: ${DEFAULT-VALUE}).")
  double rateHz;

  @Option(names = "--duration-s", paramLabel = "S", defaultValue = "10", description = "Simulated duration (default: ${DEFAULT-VALUE}).")
  double seconds;

  @Option(names = "--seed", paramLabel = "SEED", defaultValue = "1", description = "Random seed; the same seed gives the same bytes (default: ${DEFAULT-VALUE}).")
  long seed;

  @Option(names = "--binary", description = "Use the binary encoding instead of text.")
  boolean binary;

  @Option(names = "--hand", description = "A hand-operated press instead of a constant crosshead rate.")
  boolean hand;

  @Option(names = "--unpaced", description = "Write as fast as possible instead of in real time.")
  boolean unpaced;

  @Option(names = "--out", required = true, paramLabel = "TARGET", description = "Where the bytes go: a new file, - for standard output, or a device path.")
  String out;

  @Option(names = "--json", description = "Write what was written as one JSON document on standard output (schema loadstone-simulate); not with --out -.")
  boolean json;

  @CommandLine.Mixin SimImperfectionOptions imperfections;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public Integer call() throws IOException {
    Scenario.parse(scenario);
    if (json && out.equals("-")) {
      throw new LoadstoneException("--json and --out - both want standard output: write the "
          + "bytes to a file or device, or drop --json");
    }
    SimSetup setup = new SimSetup(scenario, seed, rateHz, hand, 1, Double.NaN,
        imperfections.imperfections());
    SampleSource source = new FrameSampleSource(setup.buildFrame());
    long total = Math.round(seconds * rateHz);
    WireEncoder enc = new WireEncoder(binary ? Encoding.BINARY : Encoding.TEXT);
    PrintWriter err = spec.commandLine().getErr();
    long started = System.nanoTime();
    Path file = regularFile();
    try {
      if (file != null) {
        // a file appears whole when the stream is complete, and never replaces another
        FilePublisher.publish(file, "simulated device stream",
            os -> stream(os, source, enc, total, started));
      } else {
        try (OutputStream os = openOut()) {
          stream(os, source, enc, total, started);
        }
      }
    } catch (IOException e) {
      throw new LoadstoneException("writing to " + out + " failed: " + e.getMessage()
          + " (was the other end closed?)", e);
    }
    double elapsed = (System.nanoTime() - started) / 1e9;
    err.printf(Locale.ROOT, "simulate: %d samples of %s in %.2f s (%.0f samples/s)%n", total,
        scenario, elapsed, total / Math.max(elapsed, 1e-9));
    err.flush();
    if (json) {
      java.util.Map<String, Object> m = new java.util.LinkedHashMap<>();
      m.put("scenario", scenario);
      m.put("seed", seed);
      m.put("sample_rate_hz", rateHz);
      m.put("sample_count", total);
      m.put("encoding", binary ? "binary" : "text");
      m.put("out_file", out);
      JsonDocument.write(spec.commandLine().getOut(), JsonDocument.Kind.SIMULATE, m);
    }
    return 0;
  }

  private void stream(OutputStream os, SampleSource source, WireEncoder enc, long total,
      long started) throws IOException {
    String id = SimTransport.identityBody(source);
    os.write(enc.body(id));
    byte[] buf = new byte[256 * 1024];
    SampleSource.SampleSlot slot = new SampleSource.SampleSlot();
    long written = 0;
    while (written < total) {
      long due = unpaced ? total
          : Math.min(total, (long) ((System.nanoTime() - started) / 1e9 * rateHz) + 1);
      int w = 0;
      while (written < due && buf.length - w >= WireEncoder.MAX_SAMPLE_BYTES) {
        source.next(slot);
        w += enc.sample(buf, w, slot.seq, slot.deviceUs, slot.counts, source.hasPosition(),
            slot.positionCounts);
        written++;
      }
      if (w > 0) {
        os.write(buf, 0, w);
        os.flush();
      } else {
        sleepQuietly(Math.max(1, Math.min(10, (long) (1000 / rateHz))));
      }
    }
  }

  /** @return the output as a regular file to publish, or null for standard output or a device */
  private Path regularFile() {
    if (out.equals("-")) {
      return null;
    }
    Path p = Path.of(out);
    boolean device = out.startsWith("/dev/") || (Files.exists(p) && !Files.isRegularFile(p));
    return device ? null : p;
  }

  private OutputStream openOut() throws IOException {
    if (out.equals("-")) {
      return new java.io.FilterOutputStream(System.out) {
        @Override
        public void close() throws IOException {
          flush();
        }
      };
    }
    Path p = Path.of(out);
    if (!Files.isWritable(p)) {
      throw new LoadstoneException("cannot write to device " + out + ": check the path and, on "
          + "Linux, membership of the dialout group");
    }
    return Files.newOutputStream(p, java.nio.file.StandardOpenOption.WRITE);
  }

  private static void sleepQuietly(long ms) {
    try {
      Thread.sleep(ms);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    }
  }
}
