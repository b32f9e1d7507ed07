package org.loadstone.cli;

import java.io.PrintWriter;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.concurrent.CountDownLatch;
import org.loadstone.acquire.DeviceReader;
import org.loadstone.acquire.SampleRing;
import org.loadstone.device.Transport;
import org.loadstone.protocol.DecoderCounters;
import org.loadstone.protocol.DeviceMessage;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code loadstone monitor}: shows decoded samples live, then the stream's totals. */
@Command(
    name = "monitor",
    description = {
      "Show decoded samples from a device live, then the stream's totals.",
      "",
      "Totals: samples, dropped, checksum errors, resyncs and the measured rate."
    },
    exitCodeListHeading = "%nExit codes:%n",
    exitCodeList = {
      "0:samples came",
      "2:refused or failed: the message names the fault and the fix",
      "3:the device was lost",
      "4:no samples came (a silent port, or bytes that are not samples)",
      "70:internal error (a bug; please report it)"
    })
public final class MonitorCommand implements Callable<Integer> {
  @Mixin DeviceOptions device;

  @Option(names = "--duration-s", paramLabel = "S", description = "Stop after this many seconds (default: until Ctrl-C).")
  Double seconds;

  @Option(names = "--json", description = {"Write JSON Lines on standard output (schema loadstone-monitor): one document per sample (record \"sample\"), unless --quiet, then one with the totals (record \"totals\"); device messages go to standard error."})
  boolean json;

  @Option(names = "--quiet", description = "Do not print each sample, only the totals.")
  boolean quiet;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  private volatile boolean stop;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    PrintWriter err = spec.commandLine().getErr();
    Transport t = device.open();
    SampleRing ring = new SampleRing(1 << 20);
    DeviceReader reader = new DeviceReader(t, ring);
    reader.addListener(new DeviceReader.Listener() {
      @Override
      public void onMessage(DeviceMessage m) {
        synchronized (err) {
          err.println("# " + describe(m));
          err.flush();
        }
      }
    });
    CountDownLatch done = new CountDownLatch(1);
    Thread hook = new Thread(() -> {
      stop = true;
      try {
        done.await();
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
      }
    });
    Runtime.getRuntime().addShutdownHook(hook);
    int exit = 0;
    try {
      reader.start();
      long deadline = seconds == null ? Long.MAX_VALUE
          : System.nanoTime() + (long) (seconds * 1e9);
      SampleRing.Cursor cursor = ring.cursorAtOldest();
      StringBuilder lines = new StringBuilder();
      if (!quiet && !json) {
        out.println("seq\tdevice_us\tcounts\tposition");
      }
      while (!stop && System.nanoTime() < deadline && reader.lostReason().isEmpty()
          && reader.unsupportedVersion().isEmpty()) {
        printWaiting(cursor, lines, out);
        Thread.sleep(20);
      }
      reader.close();
      printWaiting(cursor, lines, out);
      if (reader.unsupportedVersion().isPresent()) {
        err.println("loadstone: " + reader.unsupportedVersion().get());
        exit = LoadstoneCommand.EXIT_USER_ERROR;
      } else if (reader.lostReason().isPresent()) {
        err.println("loadstone: " + reader.lostReason().get());
        exit = LoadstoneCommand.EXIT_DEVICE_LOST;
      } else if (reader.samplesAccepted() == 0) {
        err.println("loadstone: " + silence(device.port, reader.counters()));
        exit = LoadstoneCommand.EXIT_NO_DATA;
      }
      if (cursor.lost() > 0) {
        err.println("# " + cursor.lost() + " samples were not shown (the terminal fell behind); "
            + "they were all received and are in the totals");
      }
      printTotals(reader, out);
    } finally {
      done.countDown();
      try {
        Runtime.getRuntime().removeShutdownHook(hook);
      } catch (IllegalStateException shuttingDown) {
        // Ctrl-C: the hook is running and waits for us
      }
    }
    return exit;
  }

  /** @return why no sample came, from what the decoder saw, with the likely fixes */
  static String silence(String port, DecoderCounters c) {
    String where = "port " + port;
    if (c.bytes() == 0) {
      return "no samples: " + where + " sent nothing. Check that the device is powered and "
          + "connected, that this is its port ('loadstone ports' lists them), and, for a board "
          + "that resets when the port opens, give it time with --reset-wait-ms 2000";
    }
    return "no samples: " + where + " sent " + c.bytes() + " bytes but none could be read as "
        + "samples (" + c.resyncs() + " resyncs, " + c.checksumErrors() + " checksum errors). "
        + "Check the serial speed (--baud) and that the device speaks the Loadstone protocol";
  }

  private void printWaiting(SampleRing.Cursor cursor, StringBuilder lines, PrintWriter out) {
    if (quiet) {
      cursor.drain((i, s, d, tu, c, hp, p) -> { }, Integer.MAX_VALUE);
      return;
    }
    lines.setLength(0);
    String opening = json ? JsonDocument.opening(JsonDocument.Kind.MONITOR)
        + "\"record\":\"sample\",\"seq\":" : null;
    cursor.drain((i, s, d, tu, c, hp, p) -> {
      if (json) {
        lines.append(opening).append(s).append(",\"device_us\":").append(d)
            .append(",\"counts\":").append(c).append(",\"position_counts\":")
            .append(hp ? Integer.toString(p) : "null").append("}\n");
        return;
      }
      lines.append(s).append('\t').append(d).append('\t').append(c).append('\t');
      if (hp) {
        lines.append(p);
      }
      lines.append('\n');
    }, 200_000);
    out.print(lines);
    out.flush();
  }

  private void printTotals(DeviceReader reader, PrintWriter out) throws Exception {
    DecoderCounters c = reader.counters();
    double rate = reader.measuredRateHz();
    if (json) {
      Map<String, Object> m = new LinkedHashMap<>();
      m.put("record", "totals");
      m.put("port", reader.transport().name());
      m.put("sample_count", reader.samplesAccepted());
      m.put("dropped", c.dropped());
      m.put("checksum_errors", c.checksumErrors());
      m.put("resyncs", c.resyncs());
      m.put("unknown_records", c.unknown());
      m.put("sample_rate_hz", Math.round(rate * 1000) / 1000.0);
      m.put("device_lost", reader.lostReason().isPresent());
      JsonDocument.write(out, JsonDocument.Kind.MONITOR, m);
    } else {
      out.printf(Locale.ROOT, "samples %d, dropped %d, checksum errors %d, resyncs %d, "
              + "unknown records %d, measured rate %.2f Hz%n",
          reader.samplesAccepted(), c.dropped(), c.checksumErrors(), c.resyncs(), c.unknown(), rate);
    }
    out.flush();
  }

  static String describe(DeviceMessage m) {
    if (m instanceof DeviceMessage.Identity id) {
      return String.format(Locale.ROOT,
          "device %s: protocol %d, firmware %s, %s at %.0f samples/s, %s%s",
          id.name(), id.protocol(), id.firmware(), id.adc(), id.rateHz(),
          id.channels() >= 2 ? "load and position" : "load only",
          id.channels() >= 2 && id.countsPerMm() > 0
              ? String.format(Locale.ROOT, " (%.0f counts/mm)", id.countsPerMm()) : "");
    }
    return "device says: " + m.body();
  }
}
