package org.loadstone.device;

import java.io.IOException;
import java.util.ArrayDeque;
import org.loadstone.protocol.Encoding;
import org.loadstone.protocol.HostCommand;
import org.loadstone.protocol.WireEncoder;
import org.loadstone.units.Precondition;

/**
 * The built-in simulated frame seen as a device: it answers protocol commands and streams samples
 * from a {@link SampleSource} as protocol bytes, paced in real time (or faster, for tests). The
 * bytes go through the same decoder as a real board's.
 */
public final class SimTransport implements Transport {
  /** Firmware version the simulated device reports. */
  public static final String FIRMWARE = "sim-1";

  private final SampleSource source;
  private final double timeScale;
  private final int readTimeoutMs;
  private final ArrayDeque<byte[]> pending = new ArrayDeque<>();
  private final StringBuilder commandLine = new StringBuilder();
  private final SampleSource.SampleSlot slot = new SampleSource.SampleSlot();

  private WireEncoder encoder = new WireEncoder(Encoding.TEXT);
  private volatile boolean open = true;
  private volatile boolean cablePulled;
  private volatile boolean streaming;
  private long streamStartNanos;
  private long emitted;
  private int pendingOffset;
  private volatile Restart restartAsked;
  private boolean held;
  private int seqBase;
  private long usBase;

  /**
   * @param source what the simulated cell measures
   * @param timeScale 1 for real time, 10 for ten times faster, {@code Double.POSITIVE_INFINITY} for
   *     as fast as the reader takes bytes
   * @param readTimeoutMs longest a read waits when nothing is due
   */
  public SimTransport(SampleSource source, double timeScale, int readTimeoutMs) {
    this.source = Precondition.notNull(source, "source");
    if (!(timeScale > 0)) {
      throw new IllegalArgumentException("timeScale must be > 0, was " + timeScale);
    }
    this.timeScale = timeScale;
    this.readTimeoutMs = readTimeoutMs;
    synchronized (pending) {
      pending.add(encoder.body(identityBody()));
    }
  }

  /** A real-time simulated device with a 100 ms read timeout. */
  public SimTransport(SampleSource source) {
    this(source, 1.0, 100);
  }

  private String identityBody() {
    return identityBody(source);
  }

  /** @return the identity record body the simulated frame sends for this source */
  public static String identityBody(SampleSource source) {
    return "I proto=1 fw=" + FIRMWARE + " adc=" + source.adcKind()
        + " rate=" + Math.round(source.rateHz())
        + " ch=" + (source.hasPosition() ? 2 : 1)
        + (source.hasPosition() ? " cpm=" + trim(source.countsPerMm()) : "")
        + " motor=1 name=loadstone-sim"
        + (source.cellFields().isEmpty() ? "" : " " + source.cellFields());
  }

  static String trim(double v) {
    return v == Math.rint(v) ? Long.toString((long) v) : Double.toString(v);
  }

  /**
   * Runs {@code action} on the sample source while no sample is being produced, e.g. to place a
   * mass on the simulated cell from another thread than the reader's.
   *
   * @param action called once, on the caller's thread, holding this transport's lock; not null
   */
  public synchronized void withSource(java.util.function.Consumer<SampleSource> action) {
    Precondition.notNull(action, "action").accept(source);
  }

  /** Simulates pulling the cable: the next read reports the device gone. */
  public void pullCable() {
    cablePulled = true;
  }

  @Override
  public String name() {
    return DeviceOpener.SIM;
  }

  @Override
  public int read(byte[] buf, int off, int len) throws IOException {
    if (!open || cablePulled) {
      open = false;
      return -1;
    }
    long waitMs;
    synchronized (this) {
      int n = drainPending(buf, off, len);
      if (n > 0) {
        return n;
      }
      if (!streaming) {
        waitMs = Math.min(readTimeoutMs, 2);
      } else if (dueSamples() > emitted) {
        return generate(buf, off, len);
      } else {
        waitMs = Math.min(readTimeoutMs, Math.max(1, nanosUntil(emitted + 1) / 1_000_000));
      }
    }
    sleepMs(waitMs);
    synchronized (this) {
      int n = drainPending(buf, off, len);
      return n > 0 || !streaming ? n : generate(buf, off, len);
    }
  }

  private int generate(byte[] buf, int off, int len) {
    long due = dueSamples();
    int w = off;
    int end = off + len;
    while (emitted < due && end - w >= WireEncoder.MAX_SAMPLE_BYTES) {
      if (!held) {
        source.next(slot);
      }
      held = false;
      Restart r = restartAsked;
      if (r != null) {
        restartAsked = null;
        seqBase = slot.seq;
        usBase = r.clock() ? (slot.deviceUs - BOOT_US) & 0xFFFF_FFFFL : 0;
        if (r.identity()) { // the identity goes first; the sample waits for the next read
          reply(identityBody());
          held = true;
          return w - off;
        }
      }
      w += encoder.sample(buf, w, (slot.seq - seqBase) & 0xFFFF,
          (slot.deviceUs - usBase) & 0xFFFF_FFFFL, slot.counts, source.hasPosition(),
          slot.positionCounts);
      emitted++;
    }
    return w - off;
  }

  /** How a simulated restart shows: an identity line, and whether the clock starts over. */
  private record Restart(boolean identity, boolean clock) {}

  /** Device time at the first sample after a simulated restart, µs. */
  private static final long BOOT_US = 2000;

  /**
   * Simulates the board restarting while it streams (a brown-out, a watchdog): before the next
   * sample its sequence starts over at 0 and, when {@code clockRestarts}, its clock at 2 ms;
   * with {@code sendsIdentity} it first sends its identity, as a board does on power-up (without,
   * as if that line were damaged). The load it measures goes on.
   */
  public void restartDevice(boolean sendsIdentity, boolean clockRestarts) {
    restartAsked = new Restart(sendsIdentity, clockRestarts);
  }

  private long dueSamples() {
    if (timeScale == Double.POSITIVE_INFINITY) {
      return Long.MAX_VALUE;
    }
    double elapsed_s = (System.nanoTime() - streamStartNanos) / 1e9 * timeScale;
    return (long) Math.floor(elapsed_s * source.rateHz()) + 1;
  }

  private long nanosUntil(long sampleCount) {
    double t_s = (sampleCount - 1) / source.rateHz() / timeScale;
    return (long) (t_s * 1e9) - (System.nanoTime() - streamStartNanos);
  }

  private int drainPending(byte[] buf, int off, int len) {
    synchronized (pending) {
      int w = off;
      while (!pending.isEmpty() && w < off + len) {
        byte[] head = pending.peek();
        int k = Math.min(head.length - pendingOffset, off + len - w);
        System.arraycopy(head, pendingOffset, buf, w, k);
        w += k;
        pendingOffset += k;
        if (pendingOffset == head.length) {
          pending.poll();
          pendingOffset = 0;
        }
      }
      return w - off;
    }
  }

  private static void sleepMs(long ms) {
    try {
      Thread.sleep(ms);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    }
  }

  @Override
  public void write(byte[] data) throws IOException {
    if (!open || cablePulled) {
      throw new IOException("the simulated frame is disconnected");
    }
    for (byte b : data) {
      if (b == '\n') {
        String line = commandLine.toString().replace("\r", "");
        commandLine.setLength(0);
        if (!line.isBlank()) {
          handle(HostCommand.parse(line));
        }
      } else if (commandLine.length() < 200) {
        commandLine.append((char) (b & 0xFF));
      }
    }
  }

  private synchronized void handle(HostCommand.Parsed parsed) {
    if (parsed instanceof HostCommand.Parsed.Rejected r) {
      reply("N " + r.word() + " " + r.reason());
      return;
    }
    HostCommand c = ((HostCommand.Parsed.Accepted) parsed).command();
    switch (c.verb()) {
      case WHO -> {
        reply(identityBody());
        reply("A WHO");
      }
      case START -> {
        if (!streaming) {
          streaming = true;
          streamStartNanos = System.nanoTime();
          emitted = 0;
        }
        reply("A START");
      }
      case STOP -> {
        streaming = false;
        reply("A STOP");
      }
      case RATE -> {
        int hz = Integer.parseInt(c.argument());
        if (source.setRateHz(hz)) {
          streamStartNanos = System.nanoTime();
          emitted = 0;
          reply("A RATE " + hz);
        } else {
          reply("N RATE unsupported");
        }
      }
      case PING -> reply("A PING " + c.argument());
      case LIGHT -> {
        String a = c.argument().toLowerCase(java.util.Locale.ROOT);
        reply(a.equals("on") || a.equals("off") ? "A LIGHT " + a : "N LIGHT bad-arg");
      }
      case HALT -> {
        source.halt();
        reply("A HALT");
      }
      case MODE -> {
        reply("A MODE " + c.argument());
        encoder = new WireEncoder(Encoding.parse(c.argument()));
      }
      default -> reply("N " + c.verb() + " bad-command");
    }
  }

  private void reply(String body) {
    synchronized (pending) {
      pending.add(encoder.body(body));
    }
  }

  @Override
  public boolean isOpen() {
    return open && !cablePulled;
  }

  @Override
  public void close() {
    open = false;
  }
}
